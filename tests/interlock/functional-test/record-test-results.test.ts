import {mkdtempSync, readdirSync, readFileSync} from 'node:fs';
import {tmpdir} from 'node:os';
import {join} from 'node:path';
import {describe, expect, it} from 'vitest';
import {recordTestResults} from '../../../source/services/record-functional-test.js';
import type {TestResults} from '../../../source/interlock/functional-test/results-schema.js';
import {sha256Hex} from '../../../source/shared/sha256.js';
import {readRecord} from '../../../source/records/read-record.js';
import type {InterlockTestRecord} from '../../../source/records/record-schema.js';
import {UsageError, valueOrUsageError} from '../../../source/cli/usage-error.js';
import {shippedRules} from '../../helpers/screen-driver.js';
import {demoPlanFile, loadPlanUnderShippedPolicy} from '../plan-fixture.js';

const plan = loadPlanUnderShippedPolicy();
const text = readFileSync(demoPlanFile, 'utf8');
const subjects = ['lid_switch', 'fibre_sense', 'estop_bench', 'door_switch', 'chiller_flow', 'key_switch', 'loop wire break', 'power interruption', 'bypass time-out: alignment_bypass'];
const now = new Date(2026, 11, 1, 10, 0, 0);

/** Results as the screen holds them once validated: times in seconds, every step passed unless changed. */
function results(changes: Record<number, Partial<TestResults['steps'][number]>> = {}): TestResults {
	return {
		format: 1,
		tested_on: '2026-11-30',
		tested_by: {name: 'Orla Penhaligon', role: 'laser technician'},
		steps: subjects.map((concerns, index) => ({step: index + 1, concerns, result: 'pass' as const, stopped_in: 0.005, ...changes[index + 1]})),
	};
}

function record(given: TestResults) {
	const home = mkdtempSync(join(tmpdir(), 'prelase-record-results-'));
	const env = {PRELASE_HOME: home};
	const recorded = valueOrUsageError(recordTestResults({plan, file: demoPlanFile, text}, shippedRules(), given, {now}, env));
	const read = readRecord(recorded.path);
	if (!read.ok) throw new Error(read.reason);
	return {recorded, body: (read.record as InterlockTestRecord).body, home};
}

describe('recordTestResults (results held in memory)', () => {
	it('writes a signed record of the plan text that passed, with every step as given', () => {
		const {recorded, body, home} = record(results());
		expect(recorded.outcome).toBe('passed');
		expect(recorded.path.startsWith(join(home, 'records'))).toBe(true);
		expect(body.kind).toBe('interlock-test');
		expect(body.plan.sha256).toBe(sha256Hex(text));
		expect(body.steps.map((step) => step.subject)).toEqual(subjects);
		expect(body.steps[0]?.stoppedIn?.text).toBe('5 ms');
		expect(body.tester).toEqual({name: 'Orla Penhaligon', role: 'laser technician'});
		expect(body.witness).toBeUndefined();
	});

	it('records a failed step as a failed test naming it', () => {
		const {recorded} = record(results({5: {result: 'fail', stopped_in: 0.03}}));
		expect(recorded.outcome).toBe('failed');
		expect(recorded.outcomeText).toBe('Failed: step 5 (chiller_flow) failed. Tag the loop out of service and tell the laser safety officer.');
	});

	it.each([
		{name: 'a pass slower than the policy', given: results({5: {stopped_in: 0.025}}), code: 'interlock-results-too-slow', field: 'steps.4.stopped_in', data: {step: 5, measured: '25 ms', limit: '20 ms'}},
		{name: 'not applicable without a note', given: results({8: {result: 'not_applicable', stopped_in: undefined}}), code: 'interlock-results-na-note', field: 'steps.7.result', data: {step: 8}},
		{name: 'a step missing', given: {...results(), steps: results().steps.slice(0, 8)}, code: 'interlock-results-step-missing', field: 'steps', data: {step: 9, subject: 'bypass time-out: alignment_bypass'}},
		{name: 'a test day after today', given: {...results(), tested_on: '2026-12-02'}, code: 'interlock-results-future', field: 'tested_on', data: {date: '2026-12-02', today: '2026-12-01'}},
	])('refuses $name with the same problem a file gets, and writes nothing', ({given, code, field, data}) => {
		const home = mkdtempSync(join(tmpdir(), 'prelase-record-results-'));
		let thrown: unknown;
		try {
			valueOrUsageError(recordTestResults({plan, file: demoPlanFile, text}, shippedRules(), given, {now}, {PRELASE_HOME: home}));
		} catch (error) {
			thrown = error;
		}
		expect(thrown).toBeInstanceOf(UsageError);
		expect((thrown as UsageError).problems).toEqual([{code, severity: 'error', field, data}]);
		expect(readdirSync(home)).toEqual([]);
	});
});
