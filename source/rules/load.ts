import {createHash} from 'node:crypto';
import {existsSync} from 'node:fs';
import {dirname, join, resolve} from 'node:path';
import {fileURLToPath} from 'node:url';
import type {z} from 'zod';
import {problem, type Problem} from '../problems.js';
import {failure, success, type Result} from '../result.js';
import {parseYamlSource, preparsedYamlSource, readTextFile, type YamlSource} from '../yaml-source.js';
import {shippedRulesData} from './shipped-rules.js';
import {compileRules} from './compile.js';
import type {CompiledRules} from './compiled-rules.js';
import {ruleFileSchema} from './schema.js';

const expected = 'a prelase rule file (YAML)';

/** The shipped bench policy, found beside the program (dist/) or the sources. */
export function shippedRulesPath(): string {
	let folder = dirname(fileURLToPath(import.meta.url));
	for (let depth = 0; depth < 5; depth += 1) {
		const candidate = join(folder, 'rules', 'default.yaml');
		if (existsSync(candidate) && existsSync(join(folder, 'package.json'))) return candidate;
		folder = dirname(folder);
	}
	return resolve('rules', 'default.yaml');
}

/** Reads, validates, compiles and lints a rule file; every problem names file:line:column. */
export function loadRules(file: string): Result<CompiledRules, Problem> {
	const text = readTextFile(file, expected);
	if (!text.ok) return text;
	return loadRulesFromText(text.value, file);
}

/** The same as loadRules, for text already in hand. */
export function loadRulesFromText(text: string, file: string): Result<CompiledRules, Problem> {
	const sha256 = createHash('sha256').update(text).digest('hex');
	const shipped = shippedRulesData(sha256);
	const parsed = shipped === undefined ? parseYamlSource(text, file, expected) : success<YamlSource, Problem>(preparsedYamlSource(text, file, shipped));
	if (!parsed.ok) return parsed;
	const source = parsed.value;
	const validated = ruleFileSchema.safeParse(source.data);
	if (!validated.success) return failure(schemaProblems(validated.error.issues, source));
	const compiled = compileRules(validated.data, source, sha256);
	if (!compiled.ok) return compiled;
	return {ok: true, value: compiled.value, warnings: [...parsed.warnings, ...compiled.warnings]};
}

/** Turns zod issues into problems located in the YAML source. */
export function schemaProblems(issues: readonly z.core.$ZodIssue[], source: YamlSource): Problem[] {
	return issues.map((issue) => {
		const path = issue.path.filter((part): part is string | number => typeof part !== 'symbol');
		// An unknown field is best shown where it is written, not where its mapping starts.
		const at = issue.code === 'unrecognized_keys' && issue.keys[0] !== undefined ? [...path, issue.keys[0]] : path;
		const where = {file: source.file, ...source.locate(at), field: path.join('.') || '(top level)'};
		return problem('schema', {detail: schemaDetail(issue, source, path)}, where);
	});
}

function schemaDetail(issue: z.core.$ZodIssue, source: YamlSource, path: Array<string | number>): string {
	switch (issue.code) {
		case 'unrecognized_keys':
			return `unknown field${issue.keys.length > 1 ? 's' : ''} ${issue.keys.map((key) => `"${key}"`).join(', ')}; check the spelling (see prelase rules schema)`;
		case 'invalid_type': {
			const present = path.reduce<unknown>((value, key) => (value && typeof value === 'object' ? (value as Record<string | number, unknown>)[key] : undefined), source.data);
			if (present === undefined) return `required field missing: expected ${issue.expected}`;
			return `expected ${issue.expected}, got ${describe(present)}`;
		}
		case 'invalid_value':
			return `expected one of ${issue.values.map((value) => JSON.stringify(value)).join(', ')}`;
		case 'invalid_union':
			return 'kind must be one of "quantity", "choice", "yes_no", "text" (with the fields that kind needs)';
		default:
			return issue.message;
	}
}

function describe(value: unknown): string {
	if (value === null) return 'nothing (null)';
	if (Array.isArray(value)) return 'a list';
	if (typeof value === 'object') return 'a mapping';
	return `${typeof value} ${JSON.stringify(value)}`;
}
