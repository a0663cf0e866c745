import type {Problem} from '../../shared/problems.js';
import {success, type Result} from '../../shared/result.js';
import type {CompiledRules} from '../../rules/compile/compiled-rules.js';
import {readTextFile} from '../../shared/yaml-source.js';
import {loadPlanFromText, planFileExpected} from './load-plan.js';
import type {Plan} from './plan-schema.js';
import {interlockPolicy} from './policy.js';

/**
 * A plan file read and validated under the interlock policy of the rule file in force, with the
 * exact text read (a test record holds it and its hash).
 */
export function loadPlanAndText(file: string, rules: CompiledRules): Result<{plan: Plan; text: string}, Problem> {
	const policy = interlockPolicy(rules);
	if (!policy.ok) return policy;
	const text = readTextFile(file, planFileExpected);
	if (!text.ok) return text;
	const loaded = loadPlanFromText(text.value, file);
	if (!loaded.ok) return loaded;
	return success({plan: {...loaded.value, policy: policy.value}, text: text.value}, loaded.warnings);
}
