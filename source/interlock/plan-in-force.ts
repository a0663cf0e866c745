import type {Problem} from '../problems.js';
import {success, type Result} from '../result.js';
import type {CompiledRules} from '../rules/compiled-rules.js';
import {loadPlan} from './load-plan.js';
import type {Plan} from './plan-schema.js';
import {interlockPolicy} from './policy.js';

/** A plan file read and validated, under the interlock policy of the rule file in force. */
export function loadPlanInForce(file: string, rules: CompiledRules): Result<Plan, Problem> {
	const policy = interlockPolicy(rules);
	if (!policy.ok) return policy;
	const loaded = loadPlan(file);
	if (!loaded.ok) return loaded;
	return success({...loaded.value, policy: policy.value}, loaded.warnings);
}
