import type {CompiledRules} from '../compile/compiled-rules.js';
import type {CompiledFormula} from '../compile/formula.js';

type Dependencies = {derived: Map<string, ReadonlySet<string>>; checks: Array<ReadonlySet<string>>};

const cache = new WeakMap<CompiledRules, Dependencies>();
const none: ReadonlySet<string> = new Set();

/** The inputs a derived value depends on, directly or through other derived values and tables. */
export function inputsOfDerived(rules: CompiledRules, id: string): ReadonlySet<string> {
	return dependencies(rules).derived.get(id) ?? none;
}

/** The inputs the check at this index of `rules.checks` depends on, through its condition, value, limit or holds. */
export function inputsOfCheck(rules: CompiledRules, index: number): ReadonlySet<string> {
	return dependencies(rules).checks[index] ?? none;
}

/** Worked out once per compiled rules: derived values come in dependency order, so one pass suffices. */
function dependencies(rules: CompiledRules): Dependencies {
	const known = cache.get(rules);
	if (known) return known;
	const derived = new Map<string, ReadonlySet<string>>();
	const of = (formulas: ReadonlyArray<CompiledFormula | undefined>): Set<string> => {
		const found = new Set<string>();
		for (const formula of formulas) {
			for (const name of formula?.names ?? []) {
				if (rules.inputs.has(name)) found.add(name);
				for (const input of derived.get(name) ?? []) found.add(input);
				const table = rules.tables.get(name);
				if (table) for (const key of [table.key, table.value]) if (rules.inputs.has(key)) found.add(key);
			}
		}
		return found;
	};
	for (const {derived: entry, formula} of rules.derived) derived.set(entry.id, of([formula]));
	const checks = rules.checks.map((compiled) => of([compiled.when, compiled.holds, compiled.value, compiled.limit]));
	const made = {derived, checks};
	cache.set(rules, made);
	return made;
}
