import {readFileSync} from 'node:fs';
import fc from 'fast-check';
import {describe, expect, it} from 'vitest';
import {loadResults, loadResultsFromText, resultsAgainstSheet} from '../../../source/interlock/functional-test/load-results.js';
import {testSheet} from '../../../source/interlock/functional-test/test-sheet.js';
import {loadPlanUnderShippedPolicy} from '../plan-fixture.js';

const resultsFile = 'docs/examples/interlock/bench3-interlock-test-results.yaml';
const demo = readFileSync(resultsFile, 'utf8');
const sheet = testSheet(loadPlanUnderShippedPolicy());
/** Noon, local time, on the day after the demo test. */
const now = new Date(2026, 11, 1, 12, 0, 0);

/** The demo results with one piece of text replaced; fails when the text is not there, so a case cannot pass by changing nothing. */
function edit(from: string, to: string): string {
	if (!demo.includes(from)) throw new Error(`the demo results no longer contain ${JSON.stringify(from)}`);
	return demo.replace(from, to);
}

/** The 1-based line of the first occurrence of `needle` in `text`. */
function lineOf(text: string, needle: string): number {
	const index = text.indexOf(needle);
	if (index === -1) throw new Error(`no ${JSON.stringify(needle)} in the text`);
	return text.slice(0, index).split('\n').length;
}

describe('the demo results', () => {
	it('load against the demo test sheet, every step once, quantities in SI', () => {
		const loaded = loadResults(resultsFile, sheet, now);
		if (!loaded.ok) throw new Error(JSON.stringify(loaded.errors));
		expect(loaded.warnings).toEqual([]);
		const results = loaded.value;
		expect(results.tested_on).toBe('2026-11-30');
		expect(results.tested_by).toEqual({name: 'Ines Marlow', role: 'photonics engineer'});
		expect(results.witness).toEqual({name: 'Tomas Reyes', role: 'deputy laser safety officer'});
		expect(results.steps.map((entry) => entry.step)).toEqual([1, 2, 3, 4, 5, 6, 7, 8, 9]);
		expect(results.steps.map((entry) => entry.concerns)).toEqual(sheet.steps.map((step) => step.subject));
		expect(results.steps.every((entry) => entry.result === 'pass')).toBe(true);
		// 9 ms and 16 ms in seconds.
		expect(results.steps[0]!.stopped_in).toBeCloseTo(0.009, 12);
		expect(results.steps[4]!.stopped_in).toBeCloseTo(0.016, 12);
		expect(results.steps[7]!.stopped_in).toBeUndefined();
		expect(results.steps[8]!.note).toBe('key returned to the lock box at the end of the 8 h window');
	});

	it('the sheet they are held against is the shipped policy\'s: 9 steps, 20 ms', () => {
		expect(sheet.steps).toHaveLength(9);
		expect(sheet.limit).toBe('20 ms');
		expect(sheet.limitSeconds).toBe(0.02);
	});
});

const step5 = '{step: 5, concerns: chiller_flow, result: pass, stopped_in: 16 ms}';
const step8 = '{step: 8, concerns: power interruption, result: pass}';
const lastLine = 'note: key returned to the lock box at the end of the 8 h window\n';

const valid = [
	{name: 'a pass exactly at the 20 ms limit', text: edit(step5, '{step: 5, concerns: chiller_flow, result: pass, stopped_in: 20 ms}'), at: now},
	{name: 'a slow step marked fail', text: edit(step5, '{step: 5, concerns: chiller_flow, result: fail, stopped_in: 25 ms}'), at: now},
	{name: 'not_applicable with a note', text: edit(step8, '{step: 8, concerns: power interruption, result: not_applicable, note: "driver on a bench supply with no mains switch, accepted by the LSO"}'), at: now},
	{name: 'tested today', text: demo, at: new Date(2026, 10, 30, 0, 0, 1)},
	{name: 'the steps in another order', text: edit(`  - ${step5}\n`, '').replace(lastLine, `${lastLine}  - ${step5}\n`), at: now},
	{name: 'no witness', text: edit('witness: {name: Tomas Reyes, role: deputy laser safety officer}\n', ''), at: now},
];

describe('results that load', () => {
	it.each(valid)('$name', ({text, at}) => {
		const loaded = loadResultsFromText(text, 'results.yaml', sheet, at);
		expect(loaded.ok ? [] : loaded.errors).toEqual([]);
	});
});

type Case = {name: string; text: string; at?: Date; code: string; field: string; needle: string; data: Record<string, unknown>};

const invalid: Case[] = (() => {
	const extraStep = `${demo}  - {step: 10, concerns: lid_switch, result: pass}\n`;
	const repeated = `${demo}  - {step: 3, concerns: estop_bench, result: pass, stopped_in: 6 ms}  # again\n`;
	return [
		{name: 'an unknown step number', text: extraStep, code: 'interlock-results-step-unknown', field: 'steps.9.step', needle: 'step: 10', data: {step: 10, count: 9}},
		{
			name: 'a step given twice',
			text: repeated,
			code: 'interlock-results-step-twice',
			field: 'steps.9.step',
			needle: '# again',
			// The first step 3 is on the demo's own line for it.
			data: {step: 3, first: `line ${lineOf(demo, '{step: 3,')}`},
		},
		// The step list is where a missing step is reported: its first entry.
		{name: 'a missing step', text: edit(`  - ${step8}\n`, ''), code: 'interlock-results-step-missing', field: 'steps', needle: '- {step: 1,', data: {step: 8, subject: 'power interruption'}},
		{name: '`concerns` naming another subject', text: edit('{step: 4, concerns: door_switch,', '{step: 4, concerns: room_door,'), code: 'interlock-results-concerns', field: 'steps.3.concerns', needle: 'room_door', data: {step: 4, expected: 'door_switch', given: 'room_door'}},
		{name: 'a pass slower than the 20 ms limit', text: edit(step5, '{step: 5, concerns: chiller_flow, result: pass, stopped_in: 25 ms}'), code: 'interlock-results-too-slow', field: 'steps.4.stopped_in', needle: '25 ms', data: {step: 5, measured: '25 ms', limit: '20 ms'}},
		{name: 'not_applicable without a note', text: edit(step8, '{step: 8, concerns: power interruption, result: not_applicable}'), code: 'interlock-results-na-note', field: 'steps.7.result', needle: 'not_applicable}', data: {step: 8}},
		{name: 'tested_on after today', text: demo, at: new Date(2026, 10, 29, 23, 59, 0), code: 'interlock-results-future', field: 'tested_on', needle: '2026-11-30', data: {date: '2026-11-30', today: '2026-11-29'}},
		{name: 'a date that is not on the calendar', text: edit('tested_on: 2026-11-30', 'tested_on: 2026-02-30'), code: 'schema', field: 'tested_on', needle: '2026-02-30', data: {detail: 'not a calendar date'}},
		{name: 'a date not written YYYY-MM-DD', text: edit('tested_on: 2026-11-30', 'tested_on: 30.11.2026'), code: 'schema', field: 'tested_on', needle: '30.11.2026', data: {detail: 'write the date as YYYY-MM-DD, e.g. 2026-11-30'}},
		// A missing field has no place of its own: it is reported where the mapping starts.
		{name: 'a missing tested_by', text: edit('tested_by: {name: Ines Marlow, role: photonics engineer}\n', ''), code: 'schema', field: 'tested_by', needle: 'format: 1', data: {detail: 'required field missing: expected object'}},
		{name: 'an unknown field in a step', text: edit('{step: 1, concerns: lid_switch, result: pass, stopped_in: 9 ms}', '{step: 1, concerns: lid_switch, result: pass, stoped_in: 9 ms}'), code: 'schema', field: 'steps.0', needle: 'stoped_in', data: {detail: expect.stringContaining('unknown field "stoped_in"')}},
		{name: 'an unknown top-level field', text: edit('format: 1\n', 'format: 1\nroom_temperature: 21 degC\n'), code: 'schema', field: '(top level)', needle: 'room_temperature', data: {detail: expect.stringContaining('unknown field "room_temperature"')}},
		{name: 'a result that is not pass, fail or not_applicable', text: edit(step8, '{step: 8, concerns: power interruption, result: ok}'), code: 'schema', field: 'steps.7.result', needle: 'result: ok', data: {detail: 'expected one of "pass", "fail", "not_applicable"'}},
	];
})();

describe('results that are refused', () => {
	it.each(invalid)('$name: exactly one problem, $code at $field', ({text, at, code, field, needle, data}) => {
		const loaded = loadResultsFromText(text, 'results.yaml', sheet, at ?? now);
		expect(loaded.ok).toBe(false);
		if (loaded.ok) return;
		expect(loaded.errors.map((found) => ({code: found.code, field: found.field, line: found.line, file: found.file, data: found.data}))).toEqual([
			{code, field, line: lineOf(text, needle), file: 'results.yaml', data},
		]);
	});

	it('reports every problem of a file at once, each where it is', () => {
		const text = edit(step5, '{step: 5, concerns: flow_switch, result: pass, stopped_in: 25 ms}').replace(step8, '{step: 8, concerns: power interruption, result: not_applicable}');
		const loaded = loadResultsFromText(text, 'results.yaml', sheet, now);
		expect(loaded.ok ? [] : loaded.errors.map((found) => [found.code, found.line])).toEqual([
			['interlock-results-concerns', lineOf(text, 'flow_switch')],
			['interlock-results-too-slow', lineOf(text, 'flow_switch')],
			['interlock-results-na-note', lineOf(text, 'not_applicable}')],
		]);
	});

	it('refuses a file that is not there, naming it', () => {
		const loaded = loadResults('no-such-results.yaml', sheet, now);
		expect(loaded.ok ? [] : loaded.errors.map((found) => [found.code, found.file])).toEqual([['file-unreadable', 'no-such-results.yaml']]);
	});
});

describe('the results loader on mutated files', () => {
	it('never throws: a cut, spliced or garbled file is refused with located problems, or loads with every step once', () => {
		const mutated = fc.tuple(fc.nat(demo.length), fc.nat(40), fc.string({maxLength: 12})).map(([start, cut, insert]) => demo.slice(0, start) + insert + demo.slice(start + cut));
		fc.assert(
			fc.property(mutated, (text) => {
				const result = loadResultsFromText(text, 'results.yaml', sheet, now);
				if (result.ok) return [...result.value.steps.map((entry) => entry.step)].sort((a, b) => a - b).join(',') === '1,2,3,4,5,6,7,8,9';
				return result.errors.length > 0 && result.errors.every((found) => found.file === 'results.yaml' && typeof found.line === 'number' && found.line >= 1);
			}),
			{numRuns: 300},
		);
	});
});

describe('results held in memory (the screen)', () => {
	it('a step given twice names where it was first given by its place in the list', () => {
		const steps = sheet.steps.map((step) => ({step: step.number, concerns: step.subject, result: 'pass' as const}));
		const results = {format: 1 as const, tested_on: '2026-11-30', tested_by: {name: 'Ines Marlow', role: ''}, steps: [...steps, steps[2]!]};
		expect(resultsAgainstSheet(results, sheet, new Date('2026-12-01T12:00:00'))).toEqual([
			{code: 'interlock-results-step-twice', severity: 'error', data: {step: 3, first: 'steps.2'}, field: `steps.${steps.length}.step`},
		]);
	});
});
