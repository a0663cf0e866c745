import type {Problem} from '../shared/problems.js';
import {failure, type Result} from '../shared/result.js';
import {readTextFile, type YamlSource} from '../shared/yaml-source.js';
import {compileRules} from './compile/compile.js';
import type {CompiledRules} from './compile/compiled-rules.js';
import {extendsBase, mergedSource, resolveRules} from './file/extends.js';
import {parseRuleText, ruleFileExpected} from './file/rule-source.js';
import {ruleFileSchema, type RuleFile} from './file/schema.js';
import {shippedValidatedRules} from './file/shipped-rules.js';
import {problemsOfGoodParts} from './compile/good-parts.js';

export {ruleFileNamed, shippedRulesPath} from './file/rule-source.js';
export {schemaProblems} from './file/schema-problems.js';

/** Reads, validates, compiles and lints a rule file; every problem names file:line:column. */
export function loadRules(file: string): Result<CompiledRules, Problem> {
	const text = readTextFile(file, ruleFileExpected);
	if (!text.ok) return text;
	return loadRulesFromText(text.value, file);
}

/**
 * The same as loadRules, for text already in hand. A site file that `extends` a base is
 * resolved first (a base path is relative to `file`); its compiled rules hold the resolved
 * text, which loads on its own to the same rules.
 */
export function loadRulesFromText(text: string, file: string): Result<CompiledRules, Problem> {
	const parsed = parseRuleText(text, file);
	if (!parsed.ok) return parsed;
	const {source, sha256} = parsed.value;
	// Every problem that can be found is reported in one run: keys written twice, the schema, then what the parts the schema accepts still hold.
	const twice = source.duplicateKeys ?? [];
	if (extendsBase(source.data) !== undefined) {
		const loaded = loadExtending(source, sha256, parsed.warnings);
		return twice.length === 0 ? loaded : failure([...twice, ...(loaded.ok ? [] : loaded.errors)]);
	}
	const prechecked = shippedValidatedRules(sha256) as RuleFile | undefined;
	const validated = prechecked === undefined ? ruleFileSchema.safeParse(source.data) : {success: true as const, data: prechecked};
	if (!validated.success) return failure([...twice, ...problemsOfGoodParts(source, validated.error.issues, sha256)]);
	const compiled = compileRules(validated.data, source, sha256);
	if (!compiled.ok || twice.length > 0) return failure([...twice, ...(compiled.ok ? [] : compiled.errors)]);
	return {ok: true, value: compiled.value, warnings: [...parsed.warnings, ...compiled.warnings]};
}

/** Resolves a site file's chain, then compiles the merged rules; every problem found is reported together. */
function loadExtending(source: YamlSource, sha256: string, warnings: Problem[]): Result<CompiledRules, Problem> {
	const resolved = resolveRules(source, sha256);
	if (!resolved.value) return failure(resolved.problems);
	const merged = mergedSource(resolved.value, source);
	const compiled = compileRules(resolved.value.rules, merged, undefined, resolved.value.provenance());
	const problems = [...resolved.problems, ...(compiled.ok ? [] : compiled.errors)];
	if (problems.length > 0 || !compiled.ok) return failure(problems);
	return {ok: true, value: compiled.value, warnings: [...warnings, ...resolved.warnings, ...compiled.warnings]};
}
