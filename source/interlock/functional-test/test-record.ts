import {sha256Hex} from '../../shared/sha256.js';
import {deferral} from '../../shared/deferral.js';
import {displayPath} from '../../shared/display-path.js';
import {formatQuantity} from '../../quantities/format.js';
import type {CompiledRules} from '../../rules/compile/compiled-rules.js';
import {interlockTestBodySchema, type InterlockTestBody} from '../../records/record-schema.js';
import {isoWithOffset} from '../../shared/iso-time.js';
import {version} from '../../shared/version.js';
import type {PlanAnalysis} from '../analysis/analyse.js';
import {durationText} from '../analysis/duration-text.js';
import type {Plan} from '../plan/plan-schema.js';
import type {InterlockPolicy} from '../plan/policy.js';
import type {TestResults} from './results-schema.js';
import type {TestSheet} from './test-sheet.js';

/** Shown on every interlock test record and wherever one is used. */
export const interlockTestCaution =
	'A functional test shows that the loop worked as built on the day it was tested. Test again after any change to the loop, its wiring or the driver, and within the policy\'s test interval.';

/** The outcome of a test: passed only when every step passed (or was accepted as not applicable) and the plan had no stop finding. */
export function testOutcome(stops: number, results: ReadonlyArray<{result: string}>): 'passed' | 'failed' {
	return stops === 0 && results.every((entry) => entry.result !== 'fail') ? 'passed' : 'failed';
}

/** The outcome in words, naming the failed steps and the plan's stop findings. */
export function testOutcomeText(stops: number, results: ReadonlyArray<{number: number; subject: string; result: string}>): string {
	const failed = results.filter((entry) => entry.result === 'fail');
	if (failed.length === 0 && stops === 0) return 'Passed: every step of the functional test passed, and the plan has no stop finding.';
	const parts = [
		...(failed.length > 0 ? [`step${failed.length === 1 ? '' : 's'} ${failed.map((entry) => `${entry.number} (${entry.subject})`).join(', ')} failed`] : []),
		...(stops > 0 ? [`the plan has ${stops} stop finding${stops === 1 ? '' : 's'}`] : []),
	];
	return `Failed: ${parts.join('; ')}. Tag the loop out of service and tell the laser safety officer.`;
}

/** A policy value as a record shows it. */
function shownTime(si: number) {
	return {si, unit: 's', text: durationText(si)};
}

/** The interlock policy as it is written into a record. */
export function recordedPolicy(policy: InterlockPolicy, rules: CompiledRules): InterlockTestBody['policy'] {
	return {
		rules: {name: rules.rules.name, file: displayPath(rules.file), sha256: rules.sha256},
		maxResponseTime: {si: policy.max_response_time, unit: 's', text: formatQuantity(policy.max_response_time, 'time')},
		resistanceMargin: {si: policy.resistance_margin, unit: '', text: formatQuantity(policy.resistance_margin, 'ratio')},
		testInterval: shownTime(policy.test_interval),
		longestBypass: shownTime(policy.longest_bypass),
	};
}

/** The policy of a record back as SI values, for re-analysing its plan. */
export function policyFromRecord(recorded: InterlockTestBody['policy']): InterlockPolicy {
	return {max_response_time: recorded.maxResponseTime.si, resistance_margin: recorded.resistanceMargin.si, test_interval: recorded.testInterval.si, longest_bypass: recorded.longestBypass.si};
}

/** Builds the body of an interlock test record from the plan as tested, its analysis, its sheet and the results; validated before anyone signs it. */
export function buildTestBody(input: {plan: Plan; planFile: string; planText: string; rules: CompiledRules; analysis: PlanAnalysis; sheet: TestSheet; results: TestResults; now?: Date}): InterlockTestBody {
	const {plan, analysis, sheet, results} = input;
	const byStep = new Map(results.steps.map((entry) => [entry.step, entry]));
	const steps = sheet.steps.map((step) => {
		const entry = byStep.get(step.number)!;
		return {
			number: step.number,
			subject: step.subject,
			action: step.action,
			expect: step.expect,
			result: entry.result,
			...(entry.stopped_in === undefined ? {} : {stoppedIn: {si: entry.stopped_in, unit: 's', text: formatQuantity(entry.stopped_in, 'time')}}),
			...(entry.note === undefined ? {} : {note: entry.note}),
		};
	});
	const body = {
		kind: 'interlock-test' as const,
		tool: {name: 'prelase' as const, version},
		createdAt: isoWithOffset(input.now ?? new Date()),
		testedOn: results.tested_on,
		tester: {name: results.tested_by.name, role: results.tested_by.role},
		...(results.witness ? {witness: {name: results.witness.name, role: results.witness.role}} : {}),
		...(plan.location === undefined ? {} : {location: plan.location}),
		plan: {name: plan.name, file: displayPath(input.planFile), sha256: sha256Hex(input.planText), text: input.planText},
		policy: recordedPolicy(plan.policy, input.rules),
		planFindings: {stops: analysis.stops, advises: analysis.advises, codes: analysis.findings.map((entry) => entry.code)},
		outcome: testOutcome(analysis.stops, steps),
		outcomeText: testOutcomeText(analysis.stops, steps),
		steps,
		caution: interlockTestCaution,
		deferral,
	};
	return interlockTestBodySchema.parse(JSON.parse(JSON.stringify(body)));
}
