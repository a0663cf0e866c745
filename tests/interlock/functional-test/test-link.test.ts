import {copyFileSync, mkdtempSync, readFileSync, renameSync, rmSync, writeFileSync} from 'node:fs';
import {tmpdir} from 'node:os';
import {join} from 'node:path';
import {afterEach, beforeEach, describe, expect, it} from 'vitest';
import {analysePlan} from '../../../source/interlock/analysis/analyse.js';
import {loadResults} from '../../../source/interlock/functional-test/load-results.js';
import {addDays, answerFromInterlockTest, interlockLink, type LinkContext} from '../../../source/interlock/functional-test/test-link.js';
import {buildTestBody, testOutcome} from '../../../source/interlock/functional-test/test-record.js';
import {testSheet} from '../../../source/interlock/functional-test/test-sheet.js';
import {fingerprint, generateKeyPair, rawPublicKey} from '../../../source/records/key-material.js';
import type {InterlockTestBody} from '../../../source/records/record-schema.js';
import {signRecord} from '../../../source/records/sign.js';
import {writeRecord} from '../../../source/records/store.js';
import {evaluate} from '../../../source/rules/evaluate/evaluate.js';
import {loadAnswers} from '../../../source/rules/evaluate/load-answers.js';
import {loadRules, shippedRulesPath} from '../../../source/rules/load.js';
import {demoPlanFile, loadPlanUnderShippedPolicy} from '../plan-fixture.js';

const rulesLoaded = loadRules(shippedRulesPath());
if (!rulesLoaded.ok) throw new Error('the shipped rules must load');
const rules = rulesLoaded.value;
const ours = generateKeyPair().privateKey;
const stranger = generateKeyPair().privateKey;
const fingerprintOf = (key: typeof ours) => fingerprint(rawPublicKey(key));

let folder: string;
let planPath: string;
const now = new Date('2026-12-01T12:00:00');

beforeEach(() => {
	folder = mkdtempSync(join(tmpdir(), 'prelase-link-'));
	planPath = join(folder, 'plan.yaml');
	copyFileSync(demoPlanFile, planPath);
});
afterEach(() => rmSync(folder, {recursive: true, force: true}));

/** A demo test body, tested on `testedOn`, with the given step failed (if any). */
function testBody(testedOn: string, failedStep?: number, createdAt = new Date('2026-12-01T09:00:00')): InterlockTestBody {
	const plan = loadPlanUnderShippedPolicy();
	const sheet = testSheet(plan);
	const results = loadResults('docs/examples/interlock/bench3-interlock-test-results.yaml', sheet, now);
	if (!results.ok) throw new Error(JSON.stringify(results.errors));
	const steps = results.value.steps.map((entry) => (entry.step === failedStep ? {...entry, result: 'fail' as const} : entry));
	const body = buildTestBody({plan, planFile: planPath, planText: readFileSync(planPath, 'utf8'), rules, analysis: analysePlan(plan), sheet, results: {...results.value, tested_on: testedOn, steps}, now: createdAt});
	expect(body.outcome).toBe(testOutcome(0, steps));
	return body;
}

function store(body: InterlockTestBody, key = ours): string {
	return writeRecord(join(folder, 'records'), signRecord(body, [{signer: {name: 'Ines Marlow', role: 'photonics engineer', meaning: 'performed'}, key}]));
}

/** The demo's location, as its plan and its bench check give it. */
const bench3 = 'Room B.112, bench 3';

const context = (at: Date = now): LinkContext => ({base: folder, folder: join(folder, 'records'), trusted: new Set([fingerprintOf(ours)]), now: at});

describe('addDays', () => {
	it.each([
		// hand arithmetic: June 30 + July 31 + August 31 + September 30 + October 31 = 153 days to 1 November, +27 = 180
		['2026-06-01', 180, '2026-11-28'],
		['2026-11-30', 180, '2027-05-29'],
		['2028-02-28', 1, '2028-02-29'], // 2028 is a leap year (Gregorian rule: divisible by 4, not a century)
		['2027-02-28', 1, '2027-03-01'],
		['2026-12-31', 1, '2027-01-01'],
		['2026-12-01', 0, '2026-12-01'],
	])('%s + %i days = %s', (day, days, expected) => {
		expect(addDays(day, days)).toBe(expected);
	});
});

describe('the bench check and the interlock test record', () => {
	it('within the interval: current, and the record is named', () => {
		const path = store(testBody('2026-11-30'));
		const link = interlockLink(planPath, rules, context(), bench3);
		expect(link.status).toBe('current');
		expect(link.record).toMatchObject({file: expect.stringContaining('interlock-test-fenwick-hollow') as string, testedOn: '2026-11-30', outcome: 'passed', dueBy: '2027-05-29'});
		expect(link.text).toContain(path.split('/').at(-1)!);
	});

	it('a test record renamed by hand is still found, by its content and kind', () => {
		const path = store(testBody('2026-11-30'));
		const renamed = join(folder, 'records', 'bench3-loop-check.json');
		renameSync(path, renamed);
		const link = interlockLink(planPath, rules, context(), bench3);
		expect(link.status).toBe('current'); // tested 2026-11-30, due by 2027-05-29 (180 days, hand arithmetic below)
		expect(link.record).toMatchObject({file: expect.stringContaining('bench3-loop-check.json') as string, testedOn: '2026-11-30'});
	});

	it('a test record with its names in another order is still found (only a file that starts as a bench check is passed over unread)', () => {
		const path = store(testBody('2026-11-30'));
		const record = JSON.parse(readFileSync(path, 'utf8')) as Record<string, unknown>;
		// The signature covers the canonical form (RFC 8785 sorts names), so the order in the file does not matter to it.
		writeFileSync(path, JSON.stringify({signatures: record['signatures'], body: record['body'], version: record['version'], format: record['format']}, null, 2));
		expect(interlockLink(planPath, rules, context(), bench3).status).toBe('current');
	});

	it.each([
		// the shipped interval is 180 days: tested 2026-06-01 is due again by 2026-11-28 (hand arithmetic above)
		{name: 'on the last day of the interval', at: '2026-11-28T23:00:00', status: 'current'},
		{name: 'the day after the interval', at: '2026-11-29T00:30:00', status: 'overdue'},
		{name: 'long overdue', at: '2027-06-01T12:00:00', status: 'overdue'},
	])('$name: $status', ({at, status}) => {
		// recorded on the test day: a record dated after the check's time would answer nothing
		store(testBody('2026-06-01', undefined, new Date('2026-06-01T17:00:00')));
		const link = interlockLink(planPath, rules, context(new Date(at)), bench3);
		expect(link.status).toBe(status);
		expect(link.record?.dueBy).toBe('2026-11-28');
		if (status === 'overdue') expect(link.text).toContain('OVERDUE');
	});

	it.each([
		{name: 'a failed test', tests: [{on: '2026-11-30', failed: 5}], status: 'failed'},
		{name: 'a failed test after a passing one', tests: [{on: '2026-11-20'}, {on: '2026-11-30', failed: 3}], status: 'failed'},
		{name: 'a passing test after a failed one', tests: [{on: '2026-11-20', failed: 3}, {on: '2026-11-30'}], status: 'current'},
		{name: 'two tests on one day: the later recorded counts', tests: [{on: '2026-11-30', at: '2026-11-30T10:00:00'}, {on: '2026-11-30', failed: 2, at: '2026-11-30T15:00:00'}], status: 'failed'},
		{name: 'no test at all', tests: [], status: 'untested'},
	])('$name: $status', ({tests, status}) => {
		for (const test of tests as Array<{on: string; failed?: number; at?: string}>) store(testBody(test.on, test.failed, test.at ? new Date(test.at) : undefined));
		const link = interlockLink(planPath, rules, context(), bench3);
		expect(link.status).toBe(status);
		if (status === 'failed') expect(link.text).toMatch(/FAILED: Failed: step \d \(/);
	});

	it('a test of the plan before it changed does not count', () => {
		store(testBody('2026-11-30'));
		writeFileSync(planPath, `${readFileSync(planPath, 'utf8')}\n# a comment added after the test\n`);
		const link = interlockLink(planPath, rules, context(), bench3);
		expect(link.status).toBe('untested');
		expect(link.text).toContain('the plan has changed since its last test');
	});

	it('a test signed with a key the operator does not trust is passed over, and said so', () => {
		store(testBody('2026-11-30'), stranger);
		const link = interlockLink(planPath, rules, context(), bench3);
		expect(link.status).toBe('untested');
		expect(link.text).toContain('1 test record signed with keys you do not trust were passed over');
	});

	it('a plan that cannot be read', () => {
		const link = interlockLink(join(folder, 'no-such-plan.yaml'), rules, context(), bench3);
		expect(link).toMatchObject({status: 'unreadable', record: null, plan: {sha256: null}});
	});
});

describe('answering the confirmations', () => {
	function answers(withPlan: boolean) {
		const text = readFileSync('docs/examples/interlock/bench3-808nm-linked.yaml', 'utf8').replace('interlock_plan: bench3-interlock-plan.yaml', withPlan ? `interlock_plan: ${planPath}` : '');
		const file = join(folder, 'answers.yaml');
		writeFileSync(file, text);
		const loaded = loadAnswers(file, rules);
		if (!loaded.ok) throw new Error(JSON.stringify(loaded.errors));
		return loaded.value;
	}
	const linked = ['interlock_loop_tested', 'manual_reset_after_interruption'];

	it.each([
		{name: 'a current test clears', tests: [{on: '2026-11-30'}], answer: 'yes', outcome: 'clear_to_energize'},
		{name: 'an overdue test blocks', tests: [{on: '2026-05-01'}], answer: 'no', outcome: 'do_not_energize'},
		{name: 'a failed test blocks', tests: [{on: '2026-11-30', failed: 1}], answer: 'no', outcome: 'do_not_energize'},
		{name: 'no test blocks', tests: [], answer: 'no', outcome: 'do_not_energize'},
	])('$name', ({tests, answer, outcome}) => {
		for (const test of tests as Array<{on: string; failed?: number}>) store(testBody(test.on, test.failed));
		const result = answerFromInterlockTest(rules, answers(true), context());
		for (const id of linked) expect(result.answers.confirmations.get(id)).toEqual({answer, note: result.link!.text});
		// the rule file answers only these two from the record
		const fromRecord = [...rules.confirmations].filter(([, compiled]) => compiled.confirmation.answered_by === 'interlock_test').map(([id]) => id);
		expect(fromRecord.sort()).toEqual([...linked].sort());
		expect(evaluate(rules, result.answers).outcome).toBe(outcome);
	});

	it('without an interlock plan the answers are left as they are (the operator answers)', () => {
		store(testBody('2026-11-30'));
		const given = answers(false);
		const result = answerFromInterlockTest(rules, given, context());
		expect(result.link).toBeNull();
		expect(result.answers).toBe(given);
		expect(evaluate(rules, given).outcome).toBe('incomplete');
	});
});
