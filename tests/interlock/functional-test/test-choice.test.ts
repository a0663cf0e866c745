import {describe, expect, it} from 'vitest';
import {compareTests, futureAllowanceMs, futureDated, instantOf, latestTest, normaliseLocation} from '../../../source/interlock/functional-test/test-choice.js';
import type {InterlockTestBody} from '../../../source/records/record-schema.js';

describe('instantOf: the absolute instant of a date-time with its UTC offset (ISO 8601 / RFC 3339)', () => {
	it.each([
		// RFC 3339 §5.8: 1990-12-31T15:59:60-08:00 and 1990-12-31T23:59:60Z are the same instant; here without the leap second
		['2026-12-01T10:00:00+02:00', Date.UTC(2026, 11, 1, 8, 0, 0)], // hand arithmetic: 10:00 at +02:00 is 08:00 UTC
		['2026-12-01T03:00:02-05:00', Date.UTC(2026, 11, 1, 8, 0, 2)], // hand arithmetic: 03:00:02 at −05:00 is 08:00:02 UTC
		['2026-12-01T08:00:00Z', Date.UTC(2026, 11, 1, 8, 0, 0)],
		['2026-12-01T08:00:00.250+00:00', Date.UTC(2026, 11, 1, 8, 0, 0, 250)],
	])('%s is %i ms', (text, ms) => {
		expect(instantOf(text)).toBe(ms);
	});

	it.each(['2026-12-01T08:00:00', '2026-12-01', 'yesterday', '2026-12-01 08:00:00+00:00'])('"%s" (no offset, or not a date-time) has no instant', (text) => {
		expect(instantOf(text)).toBeNaN();
	});
});

type Dated = Pick<InterlockTestBody, 'createdAt' | 'testedOn' | 'outcome'>;
const dated = (testedOn: string, createdAt: string, outcome: 'passed' | 'failed'): Dated => ({testedOn, createdAt, outcome});

describe('compareTests and latestTest', () => {
	it.each([
		{
			// text order puts the pass last ("10:00" > "03:00"); the instants put the failure 2 s later (hand arithmetic above)
			name: 'a failure 2 s after a pass, written with another offset',
			tests: [dated('2026-12-01', '2026-12-01T10:00:00+02:00', 'passed'), dated('2026-12-01', '2026-12-01T03:00:02-05:00', 'failed')],
			latest: 'failed',
		},
		{name: 'a pass 2 s after a failure, written with another offset', tests: [dated('2026-12-01', '2026-12-01T03:00:02-05:00', 'passed'), dated('2026-12-01', '2026-12-01T10:00:00+02:00', 'failed')], latest: 'passed'},
		{name: 'the same instant: the failure counts (the safe side)', tests: [dated('2026-12-01', '2026-12-01T08:00:00Z', 'failed'), dated('2026-12-01', '2026-12-01T10:00:00+02:00', 'passed')], latest: 'failed'},
		{name: 'a later test day wins over a later recording', tests: [dated('2026-12-02', '2026-12-02T08:00:00Z', 'passed'), dated('2026-12-01', '2026-12-03T08:00:00Z', 'failed')], latest: 'passed'},
	])('$name: the latest $latest', ({tests, latest}) => {
		expect(latestTest(tests.map((body) => ({body: body as InterlockTestBody})))?.body.outcome).toBe(latest);
		expect(Math.sign(compareTests(tests[0]!, tests[1]!))).toBe(latest === tests[0]!.outcome ? 1 : -1);
	});
});

describe('futureDated: beyond the allowance of 5 minutes after now', () => {
	const now = new Date(Date.UTC(2026, 11, 1, 12, 0, 0));
	it.each([
		{name: 'an hour ago', createdAt: '2026-12-01T11:00:00Z', testedOn: '2026-11-30', future: false},
		{name: '4 min 59 s ahead', createdAt: '2026-12-01T12:04:59Z', testedOn: '2026-11-30', future: false},
		{name: 'exactly 5 min ahead', createdAt: '2026-12-01T12:05:00Z', testedOn: '2026-11-30', future: false},
		{name: '5 min 1 s ahead', createdAt: '2026-12-01T12:05:01Z', testedOn: '2026-11-30', future: true},
		{name: 'five years ahead', createdAt: '2031-12-01T12:00:00Z', testedOn: '2031-12-01', future: true},
		{name: 'ahead as +14:00 text, but an hour ago as an instant', createdAt: '2026-12-02T01:00:00+14:00', testedOn: '2026-11-30', future: false},
		{name: 'a test day a year ahead, recorded now', createdAt: '2026-12-01T12:00:00Z', testedOn: '2027-12-01', future: true},
		{name: 'no offset: cannot be placed in time', createdAt: '2026-12-01T11:00:00', testedOn: '2026-11-30', future: true},
	])('$name: set aside $future', ({createdAt, testedOn, future}) => {
		expect(futureDated({createdAt, testedOn}, now) !== undefined).toBe(future);
	});

	it('the allowance is a named 5 minutes', () => {
		expect(futureAllowanceMs).toBe(300_000); // 5 × 60 × 1000 ms
	});
});

describe('normaliseLocation: case and whitespace do not matter, anything else does', () => {
	it.each([
		['Room B.112, bench 3', '  room b.112,   BENCH 3 ', true],
		['Room B.112, bench 3', 'Room B.112,\tbench 3', true],
		['Room B.112, bench 3', 'Room B.112, bench 4', false],
		['Room B.112, bench 3', 'Room B.114, bench 3', false],
		['Room B.112, bench 3', 'Room B.112 bench 3', false],
	])('"%s" and "%s": the same %s', (a, b, same) => {
		expect(normaliseLocation(a) === normaliseLocation(b)).toBe(same);
	});
});
