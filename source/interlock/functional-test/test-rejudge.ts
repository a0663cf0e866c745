import type {InterlockTestBody} from '../../records/record-schema.js';
import {formatQuantity} from '../../quantities/format.js';
import {describeProblem, formatProblem} from '../../shared/problems.js';
import {analysePlan} from '../analysis/analyse.js';
import {subjectText} from '../analysis/finding.js';
import {loadPlanFromText} from '../plan/load-plan.js';
import type {InterlockPolicy} from '../plan/policy.js';

/**
 * Why a recorded test would not pass under `policy` (the policy in force), whatever policy it
 * was recorded under: a step passed slower than the policy's largest response time, or the
 * recorded plan has a stop finding under the policy. Empty when it would pass today.
 */
export function reasonsUnderPolicy(body: InterlockTestBody, policy: InterlockPolicy): string[] {
	const reasons: string[] = [];
	const limit = formatQuantity(policy.max_response_time, 'time');
	for (const step of body.steps) {
		if (step.result === 'pass' && step.stoppedIn !== undefined && step.stoppedIn.si > policy.max_response_time) {
			reasons.push(`step ${step.number} (${step.subject}) stopped in ${step.stoppedIn.text}, above the ${limit} of the policy in force`);
		}
	}
	const loaded = loadPlanFromText(body.plan.text, body.plan.file);
	if (!loaded.ok) {
		reasons.push(`the recorded plan does not load, so it cannot be judged under the policy in force: ${loaded.errors.map(formatProblem).join('; ')}`);
		return reasons;
	}
	const analysis = analysePlan({...loaded.value, policy});
	for (const found of analysis.findings.filter((entry) => entry.severity === 'stop')) {
		reasons.push(`the plan has the stop finding ${found.code} (${subjectText(found.subject)}: ${describeProblem(found)}) under the policy in force`);
	}
	return reasons;
}
