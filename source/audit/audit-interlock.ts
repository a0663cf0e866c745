import {sha256Hex} from '../shared/sha256.js';
import {analysePlan} from '../interlock/analysis/analyse.js';
import {loadPlanFromText} from '../interlock/plan/load-plan.js';
import {interlockPolicy} from '../interlock/plan/policy.js';
import {futureAllowanceMs, futureDated, normaliseLocation} from '../interlock/functional-test/test-choice.js';
import {reasonsUnderPolicy} from '../interlock/functional-test/test-rejudge.js';
import {policyFromRecord, testOutcome} from '../interlock/functional-test/test-record.js';
import {testSheet} from '../interlock/functional-test/test-sheet.js';
import {formatProblem} from '../shared/problems.js';
import type {CompiledRules} from '../rules/compile/compiled-rules.js';
import {isoWithOffset} from '../shared/iso-time.js';
import {finding, type Finding} from '../records/findings.js';
import type {InterlockTestBody} from '../records/record-schema.js';

/** The facts of an interlock test record an auditor reads first. */
export type InterlockTestSummary = {
	createdAt: string;
	tool: InterlockTestBody['tool'];
	testedOn: string;
	tester: InterlockTestBody['tester'];
	witness: InterlockTestBody['tester'] | null;
	plan: {name: string; file: string; sha256: string};
	/** The loop's location the test was recorded for; null in records made before tests carried it. */
	location: string | null;
	outcome: InterlockTestBody['outcome'];
	outcomeText: string;
	/** Steps that failed or were accepted as not applicable, with their notes. */
	exceptions: Array<{number: number; subject: string; result: string; note?: string}>;
};

/** The summary of an interlock test record. */
export function summariseInterlockTest(body: InterlockTestBody): InterlockTestSummary {
	return {
		createdAt: body.createdAt,
		tool: body.tool,
		testedOn: body.testedOn,
		tester: body.tester,
		witness: body.witness ?? null,
		plan: {name: body.plan.name, file: body.plan.file, sha256: body.plan.sha256},
		location: body.location ?? null,
		outcome: body.outcome,
		outcomeText: body.outcomeText,
		exceptions: body.steps.filter((step) => step.result !== 'pass').map((step) => ({number: step.number, subject: step.subject, result: step.result, ...(step.note ? {note: step.note} : {})})),
	};
}

const stopsText = (stops: number) => `${stops} stop finding${stops === 1 ? '' : 's'}`;

/**
 * Whether an interlock test record's conclusions follow from what it holds: the embedded plan
 * text has the stated hash; re-worked under the recorded policy it gives the recorded stop
 * findings and the recorded test sheet; and the steps and findings give the recorded outcome.
 */
export function interlockTestConsistency(body: InterlockTestBody): {reevaluated: boolean; findings: Finding[]} {
	const findings: Finding[] = [];
	const actual = sha256Hex(body.plan.text);
	if (actual !== body.plan.sha256) findings.push(finding('consistency', 'audit-plan-hash-mismatch', {stated: body.plan.sha256, actual}));
	const loaded = loadPlanFromText(body.plan.text, body.plan.file);
	if (!loaded.ok) {
		findings.push(finding('consistency', 'audit-plan-does-not-load', {detail: loaded.errors.map(formatProblem).join('; ')}));
	} else {
		const plan = {...loaded.value, policy: policyFromRecord(body.policy)};
		const analysis = analysePlan(plan);
		if (analysis.stops !== body.planFindings.stops) findings.push(finding('consistency', 'audit-plan-findings-mismatch', {recorded: stopsText(body.planFindings.stops), computed: stopsText(analysis.stops)}));
		const planLocation = loaded.value.location;
		if ((body.location ?? planLocation) !== undefined && (body.location === undefined || planLocation === undefined || normaliseLocation(body.location) !== normaliseLocation(planLocation))) {
			findings.push(finding('consistency', 'audit-interlock-location-mismatch', {recorded: body.location ?? '(none)', plan: planLocation ?? '(none)'}));
		}
		const expected = testSheet(plan).steps.map((step) => `${step.number} ${step.subject}`);
		const recorded = body.steps.map((step) => `${step.number} ${step.subject}`);
		if (expected.join('\n') !== recorded.join('\n')) {
			const first = expected.findIndex((entry, index) => entry !== recorded[index]);
			findings.push(finding('consistency', 'audit-test-steps-mismatch', {detail: `step ${first === -1 ? expected.length + 1 : first + 1}: the sheet has "${expected[first] ?? '(no step)'}", the record "${recorded[first === -1 ? expected.length : first] ?? '(no step)'}"`}));
		}
	}
	for (const step of body.steps) {
		if (step.result === 'pass' && step.stoppedIn !== undefined && step.stoppedIn.si > body.policy.maxResponseTime.si) {
			findings.push(finding('consistency', 'audit-test-step-too-slow', {step: step.number, measured: step.stoppedIn.text, limit: body.policy.maxResponseTime.text}));
		}
	}
	const computed = testOutcome(body.planFindings.stops, body.steps);
	if (computed !== body.outcome) findings.push(finding('consistency', 'audit-test-outcome-mismatch', {recorded: body.outcome, computed}));
	return {reevaluated: loaded.ok, findings};
}

/**
 * What an interlock test record answers today: a record dated after `now` (beyond the allowance
 * for a fast clock) answers nothing; a test that passed under its recorded policy but would
 * not under the current rules' interlock policy answers no bench check. The second is asked
 * only of a `consistent` record: an inconsistent one is already a finding, whatever the policy.
 */
export function interlockTestToday(body: InterlockTestBody, current: CompiledRules, now: Date, consistent: boolean): Finding[] {
	const findings: Finding[] = [];
	const ahead = futureDated(body, now);
	if (ahead !== undefined) findings.push(finding('history', 'audit-record-from-future', {dated: ahead, now: isoWithOffset(now), allowance: `${futureAllowanceMs / 60_000} min`}));
	const policy = interlockPolicy(current);
	if (consistent && body.outcome === 'passed' && policy.ok) {
		const reasons = reasonsUnderPolicy(body, policy.value);
		if (reasons.length > 0) findings.push(finding('policy', 'audit-interlock-test-policy', {rules: `${current.rules.name}, ${current.file}`, reasons: reasons.join('; ')}));
	}
	return findings;
}
