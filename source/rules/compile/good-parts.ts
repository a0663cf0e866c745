import type {z} from 'zod';
import type {Problem} from '../../shared/problems.js';
import type {YamlSource} from '../../shared/yaml-source.js';
import {ruleFileSchema, type RuleFile} from '../file/schema.js';
import {schemaProblems} from '../file/schema-problems.js';
import {compileRules} from './compile.js';

type Path = Array<string | number>;

/** Codes of problems that only follow from a part left out (a name, step or placeholder it defined). */
const cascades = new Set(['unknown-name', 'unknown-placeholder', 'missing-step', 'table-input', 'policy-options-of', 'unknown-option']);

/** The part of the file a schema problem at `path` belongs to, which can be left out on its own. */
function partOf(path: Path): Path | undefined {
	const [head, index, list, inner] = path;
	if (head === 'steps' && typeof index === 'number' && (list === 'inputs' || list === 'confirmations') && typeof inner === 'number') return path.slice(0, 4);
	if ((head === 'steps' || head === 'derived' || head === 'checks') && typeof index === 'number') return path.slice(0, 2);
	if ((head === 'policy' || head === 'tables') && typeof index === 'string') return path.slice(0, 2);
	return undefined;
}

/** A copy of the data with some parts left out, and the way back from a path in the copy to the path in the file. */
function without(data: unknown, parts: Path[], keys: Array<{at: Path; key: string}>): {data: unknown; original(path: Path): Path} {
	const copy = structuredClone(data) as Record<string, unknown>;
	const get = (path: Path) => path.reduce<unknown>((value, key) => (value && typeof value === 'object' ? (value as Record<string | number, unknown>)[key] : undefined), copy);
	for (const {at, key} of keys) {
		const holder = get(at);
		if (holder && typeof holder === 'object') delete (holder as Record<string, unknown>)[key];
	}
	// Array elements are left out last to first, so that the places of the others hold while removing; each list keeps its new → old index map.
	const maps = new Map<string, number[]>();
	const sorted = [...parts].sort((a, b) => b.length - a.length || Number(b.at(-1)) - Number(a.at(-1)));
	for (const part of sorted) {
		const holder = get(part.slice(0, -1));
		const last = part.at(-1)!;
		if (Array.isArray(holder) && typeof last === 'number') {
			const key = part.slice(0, -1).join('.');
			const map = maps.get(key) ?? holder.map((_, index) => index);
			holder.splice(last, 1);
			map.splice(last, 1);
			maps.set(key, map);
		} else if (holder && typeof holder === 'object') delete (holder as Record<string, unknown>)[String(last)];
	}
	// Nested lists are keyed by their parent's place in the file, so map the parent first.
	const original = (path: Path): Path => {
		const out: Path = [];
		for (const part of path) out.push(typeof part === 'number' ? (maps.get(out.join('.'))?.[part] ?? part) : part);
		return out;
	};
	return {data: copy, original};
}

/** Every id defined inside a part left out (a step's inputs too), and its key for policy values and tables. */
function idsIn(value: unknown, out: Set<string>): void {
	if (Array.isArray(value)) for (const entry of value) idsIn(entry, out);
	else if (value && typeof value === 'object') {
		const id = (value as Record<string, unknown>)['id'];
		if (typeof id === 'string') out.add(id);
		for (const entry of Object.values(value)) idsIn(entry, out);
	}
}

/**
 * The schema's problems, and then what the later checks (references, formulas, units, cycles)
 * find in the parts the schema accepts: each part with a schema problem is left out (a field
 * it does not know, only that field) and the rest is compiled, its problems located in the
 * file as written. A problem that only follows from a part left out is not reported.
 */
export function problemsOfGoodParts(source: YamlSource, issues: readonly z.core.$ZodIssue[], sha256: string): Problem[] {
	const first = schemaProblems(issues, source);
	const parts: Path[] = [];
	const keys: Array<{at: Path; key: string}> = [];
	let pending = issues;
	let map = (path: Path) => path;
	// A few rounds: leaving a part out can show a problem zod did not reach before (a union, a refinement).
	for (let round = 0; round < 3; round += 1) {
		let added = false;
		for (const issue of pending) {
			const path = map(issue.path.filter((part): part is string | number => typeof part !== 'symbol'));
			if (issue.code === 'unrecognized_keys') {
				for (const key of issue.keys) keys.push({at: path, key});
				added = true;
				continue;
			}
			const part = partOf(path);
			if (part && !parts.some((known) => known.join('.') === part.join('.'))) {
				parts.push(part);
				added = true;
			}
		}
		if (!added) return first;
		const pruned = without(source.data, parts, keys);
		const validated = ruleFileSchema.safeParse(pruned.data);
		map = pruned.original;
		if (!validated.success) {
			pending = validated.error.issues;
			continue;
		}
		const left = new Set<string>();
		for (const part of parts) {
			idsIn(part.reduce<unknown>((value, key) => (value && typeof value === 'object' ? (value as Record<string | number, unknown>)[key] : undefined), source.data), left);
			if (part[0] === 'policy' || part[0] === 'tables' || part[0] === 'steps') left.add(String(part[1]));
		}
		const compiled = compileRules(validated.data as RuleFile, {...source, origin: (path: Path) => ({source, path: pruned.original(path)})}, sha256);
		const later = compiled.ok ? [] : compiled.errors.filter((found) => !(cascades.has(found.code) && Object.values(found.data).some((value) => typeof value === 'string' && left.has(value))));
		return [...first, ...later];
	}
	return first;
}
