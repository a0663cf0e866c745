import type {z} from 'zod';
import {problem, type Problem} from '../../shared/problems.js';
import type {YamlSource} from '../../shared/yaml-source.js';

/** Turns zod issues into problems located in the YAML source. */
export function schemaProblems(issues: readonly z.core.$ZodIssue[], source: YamlSource, reference = 'prelase rules schema'): Problem[] {
	return issues.map((issue) => {
		const path = issue.path.filter((part): part is string | number => typeof part !== 'symbol');
		// An unknown field is best shown where it is written, not where its mapping starts.
		const at = issue.code === 'unrecognized_keys' && issue.keys[0] !== undefined ? [...path, issue.keys[0]] : path;
		const where = {file: source.file, ...source.locate(at), field: path.join('.') || '(top level)'};
		return problem('schema', {detail: schemaDetail(issue, source, path, reference)}, where);
	});
}

function schemaDetail(issue: z.core.$ZodIssue, source: YamlSource, path: Array<string | number>, reference: string): string {
	switch (issue.code) {
		case 'unrecognized_keys':
			return `unknown field${issue.keys.length > 1 ? 's' : ''} ${issue.keys.map((key) => `"${key}"`).join(', ')}; check the spelling (see ${reference})`;
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
