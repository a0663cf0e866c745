import {problem, type Problem} from '../../shared/problems.js';
import {failure, success, type Result} from '../../shared/result.js';
import {schemaProblems} from '../../rules/file/schema-problems.js';
import {parseYamlSourceSteps, readTextFile, type YamlSource} from '../../shared/yaml-source.js';
import {finish, type Steps} from '../../shared/steps.js';
import {planSchema, type PlanFile} from './plan-schema.js';

/** What a plan file is, for messages about the wrong kind of file. */
export const planFileExpected = 'a prelase interlock plan (YAML)';

/** Reads and validates an interlock plan; every problem names file:line:column. */
export function loadPlan(file: string): Result<PlanFile, Problem> {
	const text = readTextFile(file, planFileExpected);
	if (!text.ok) return text;
	return loadPlanFromText(text.value, file);
}

/** The same as loadPlan, for text already in hand. */
export function loadPlanFromText(text: string, file: string): Result<PlanFile, Problem> {
	return finish(loadPlanFromTextSteps(text, file));
}

/** The same, in two steps: parsing the YAML, then validating it (each is long for a plan near the size limit). */
export function* loadPlanFromTextSteps(text: string, file: string): Steps<Result<PlanFile, Problem>> {
	const parsed = yield* parseYamlSourceSteps(text, file, planFileExpected);
	if (!parsed.ok) return parsed;
	yield;
	const source = parsed.value;
	// A plan written before the policy moved to the rule file (a rule file given as a plan has no devices).
	if (source.data && typeof source.data === 'object' && Object.hasOwn(source.data, 'policy') && Object.hasOwn(source.data, 'devices')) {
		return failure([problem('interlock-plan-policy', {}, {file: source.file, ...source.locate(['policy']), field: 'policy'})]);
	}
	const validated = planSchema.safeParse(source.data);
	if (!validated.success) return failure(schemaProblems(validated.error.issues, source, 'docs/interlock.md'));
	const duplicates = duplicateIds(validated.data, source);
	if (duplicates.length > 0) return failure(duplicates);
	return success(validated.data, parsed.warnings);
}

/** Device and access point ids share one name space, so a finding's subject is never ambiguous. */
function duplicateIds(plan: PlanFile, source: YamlSource): Problem[] {
	const seen = new Map<string, string>();
	const problems: Problem[] = [];
	const entries = [...plan.access_points.map((point, index) => ({id: point.id, path: ['access_points', index, 'id']})), ...plan.devices.map((device, index) => ({id: device.id, path: ['devices', index, 'id']}))];
	for (const {id, path} of entries) {
		const first = seen.get(id);
		if (first === undefined) seen.set(id, path.slice(0, 2).join('.'));
		else problems.push(problem('interlock-duplicate-id', {id, first}, {file: source.file, ...source.locate(path), field: path.join('.')}));
	}
	return problems;
}
