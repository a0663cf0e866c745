import {createHash} from 'node:crypto';
import {readFileSync} from 'node:fs';
import fc from 'fast-check';
import {beforeAll, describe, expect, it} from 'vitest';
import {analysePlan} from '../../../source/interlock/analysis/analyse.js';
import {loadResults} from '../../../source/interlock/functional-test/load-results.js';
import {loadPlanAndText} from '../../../source/interlock/plan/plan-and-text.js';
import type {Plan} from '../../../source/interlock/plan/plan-schema.js';
import {buildTestBody, interlockTestCaution, policyFromRecord, recordedPolicy, testOutcome, testOutcomeText} from '../../../source/interlock/functional-test/test-record.js';
import {testSheet} from '../../../source/interlock/functional-test/test-sheet.js';
import {deferral} from '../../../source/shared/deferral.js';
import type {InterlockTestBody} from '../../../source/records/record-schema.js';
import type {CompiledRules} from '../../../source/rules/compile/compiled-rules.js';
import {loadRules, shippedRulesPath} from '../../../source/rules/load.js';
import {demoPlanFile, shippedPolicy, testPolicy} from '../plan-fixture.js';

const resultsFile = 'docs/examples/interlock/bench3-interlock-test-results.yaml';
const sha256Of = (bytes: Buffer) => createHash('sha256').update(bytes).digest('hex');

/** Sheet rows with the results given, in order from step 1. */
const rows = (...results: string[]) => results.map((result, index) => ({number: index + 1, subject: ['lid_switch', 'fibre_sense', 'estop_bench', 'door_switch', 'chiller_flow', 'key_switch'][index]!, result}));
const tagOut = 'Tag the loop out of service and tell the laser safety officer.';

describe('the outcome of a test', () => {
	it.each([
		{name: 'every step passed, no stop finding', stops: 0, steps: rows('pass', 'pass', 'pass', 'pass', 'pass', 'pass'), outcome: 'passed', text: 'Passed: every step of the functional test passed, and the plan has no stop finding.'},
		{name: 'a step accepted as not applicable', stops: 0, steps: rows('pass', 'not_applicable', 'pass'), outcome: 'passed', text: 'Passed: every step of the functional test passed, and the plan has no stop finding.'},
		{name: 'one step failed', stops: 0, steps: rows('pass', 'pass', 'pass', 'pass', 'fail', 'pass'), outcome: 'failed', text: `Failed: step 5 (chiller_flow) failed. ${tagOut}`},
		{name: 'two steps failed', stops: 0, steps: rows('pass', 'pass', 'fail', 'pass', 'fail', 'pass'), outcome: 'failed', text: `Failed: steps 3 (estop_bench), 5 (chiller_flow) failed. ${tagOut}`},
		{name: 'every step passed but the plan has a stop finding', stops: 1, steps: rows('pass', 'pass', 'pass'), outcome: 'failed', text: `Failed: the plan has 1 stop finding. ${tagOut}`},
		{name: 'every step passed but the plan has two stop findings', stops: 2, steps: rows('pass', 'pass', 'pass'), outcome: 'failed', text: `Failed: the plan has 2 stop findings. ${tagOut}`},
		{name: 'a failed step and a stop finding', stops: 1, steps: rows('fail', 'not_applicable'), outcome: 'failed', text: `Failed: step 1 (lid_switch) failed; the plan has 1 stop finding. ${tagOut}`},
	])('$name: $outcome', ({stops, steps, outcome, text}) => {
		expect(testOutcome(stops, steps)).toBe(outcome);
		expect(testOutcomeText(stops, steps)).toBe(text);
	});
});

let rules: CompiledRules;
let plan: Plan;
let planText: string;
let body: InterlockTestBody;
const now = new Date(2026, 11, 1, 9, 30, 0);

beforeAll(() => {
	const loadedRules = loadRules(shippedRulesPath());
	if (!loadedRules.ok) throw new Error(JSON.stringify(loadedRules.errors));
	rules = loadedRules.value;
	const loaded = loadPlanAndText(demoPlanFile, rules);
	if (!loaded.ok) throw new Error(JSON.stringify(loaded.errors));
	({plan, text: planText} = loaded.value);
	const sheet = testSheet(plan);
	const results = loadResults(resultsFile, sheet, now);
	if (!results.ok) throw new Error(JSON.stringify(results.errors));
	body = buildTestBody({plan, planFile: demoPlanFile, planText, rules, analysis: analysePlan(plan), sheet, results: results.value, now});
});

describe('the body of the demo test record', () => {
	it('holds the plan as tested: its exact text and the SHA-256 of the file bytes', () => {
		const bytes = readFileSync(demoPlanFile);
		expect(body.plan.sha256).toBe(sha256Of(bytes));
		expect(body.plan.text).toBe(bytes.toString('utf8'));
		expect(body.plan.name).toBe('Fenwick Hollow B.112 bench 3 — enclosure and room loop');
		expect(body.plan.file).toBe(demoPlanFile);
	});

	it('says what it is, who tested and witnessed, and when', () => {
		expect(body.kind).toBe('interlock-test');
		expect(body.tool.name).toBe('prelase');
		expect(body.testedOn).toBe('2026-11-30');
		expect(body.createdAt).toMatch(/^2026-12-01T09:30:00[+-]\d{2}:\d{2}$/);
		expect(body.tester).toEqual({name: 'Ines Marlow', role: 'photonics engineer'});
		expect(body.witness).toEqual({name: 'Tomas Reyes', role: 'deputy laser safety officer'});
		expect(body.caution).toBe(interlockTestCaution);
		expect(body.deferral).toBe(deferral);
	});

	it('has the 9 steps in sheet order, each with its result, time and note', () => {
		expect(body.steps.map((step) => [step.number, step.subject, step.result])).toEqual([
			[1, 'lid_switch', 'pass'],
			[2, 'fibre_sense', 'pass'],
			[3, 'estop_bench', 'pass'],
			[4, 'door_switch', 'pass'],
			[5, 'chiller_flow', 'pass'],
			[6, 'key_switch', 'pass'],
			[7, 'loop wire break', 'pass'],
			[8, 'power interruption', 'pass'],
			[9, 'bypass time-out: alignment_bypass', 'pass'],
		]);
		expect(body.steps.map((step) => step.stoppedIn?.text)).toEqual(['9 ms', '4 ms', '6 ms', '8 ms', '16 ms', '5 ms', '2 ms', undefined, undefined]);
		expect(body.steps[0]!.stoppedIn).toEqual({si: expect.closeTo(0.009, 12) as number, unit: 's', text: '9 ms'});
		expect(body.steps[8]!.note).toBe('key returned to the lock box at the end of the 8 h window');
		expect(body.steps.filter((step) => step.note !== undefined)).toHaveLength(1);
		expect(body.steps[0]!.action).toBe('With emission on, open lid_switch (FH-LS2 tongue switch on the enclosure lid), then close it again.');
		expect(body.steps[0]!.expect).toBe('Emission stops within 20 ms. After closing, emission stays off until the reset is pressed.');
	});

	it('records the policy it was held to and the rule file it came from', () => {
		expect(body.policy.maxResponseTime).toEqual({si: 0.02, unit: 's', text: '20 ms'});
		expect(body.policy.resistanceMargin).toEqual({si: 0.25, unit: '', text: '25 %'});
		// hand arithmetic: 180 days × 86 400 s = 15 552 000 s; 8 h × 3600 s = 28 800 s.
		expect(body.policy.testInterval).toEqual({si: expect.closeTo(15_552_000, 3) as number, unit: 's', text: '180 days'});
		expect(body.policy.longestBypass).toEqual({si: expect.closeTo(28_800, 6) as number, unit: 's', text: '8 h'});
		expect(body.policy.rules).toEqual({name: rules.rules.name, file: 'rules/default.yaml', sha256: sha256Of(readFileSync('rules/default.yaml'))});
	});

	it('has no plan finding and passed', () => {
		expect(body.planFindings).toEqual({stops: 0, advises: 0, codes: []});
		expect(body.outcome).toBe('passed');
		expect(body.outcomeText).toBe('Passed: every step of the functional test passed, and the plan has no stop finding.');
	});
});

describe('the recorded policy', () => {
	it.each([
		{name: 'the shipped policy', policy: shippedPolicy()},
		{name: 'the tests\' policy', policy: testPolicy()},
		{name: 'no bypass allowed', policy: testPolicy({longest_bypass: 0})},
		{name: 'odd values', policy: testPolicy({max_response_time: 0.0125, resistance_margin: 0.333, test_interval: 90.5 * 86_400, longest_bypass: 90})},
	])('round-trips: $name', ({policy}) => {
		expect(policyFromRecord(recordedPolicy(policy, rules))).toEqual(policy);
	});

	it('round-trips through the record body as written (JSON)', () => {
		const written = JSON.parse(JSON.stringify(body)) as InterlockTestBody;
		expect(policyFromRecord(written.policy)).toEqual(plan.policy);
	});

	it('round-trips for any non-negative values, and never throws while writing them as text', () => {
		const value = fc.double({min: 0, max: 1e9, noNaN: true, noDefaultInfinity: true});
		fc.assert(
			fc.property(value, value, value, value, (max_response_time, resistance_margin, test_interval, longest_bypass) => {
				const policy = {max_response_time, resistance_margin, test_interval, longest_bypass};
				const recorded = recordedPolicy(policy, rules);
				expect(policyFromRecord(JSON.parse(JSON.stringify(recorded)) as InterlockTestBody['policy'])).toEqual(policy);
				expect([recorded.maxResponseTime, recorded.resistanceMargin, recorded.testInterval, recorded.longestBypass].every((shown) => shown.text.length > 0)).toBe(true);
			}),
			{numRuns: 200},
		);
	});
});
