import type {CompiledCheck, CompiledRules} from '../compile/compiled-rules.js';
import type {CompiledFormula} from '../compile/formula.js';

/**
 * The numeric inputs a check depends on, through the derived values it reads (their formulas,
 * transitively) and its own condition, value, limit or holds formula. In the order of the rule file.
 */
export function numericInputsOf(rules: CompiledRules, compiled: CompiledCheck): string[] {
	const names = namesReached(rules, compiled);
	return [...rules.inputs.entries()].filter(([id, input]) => input.input.kind === 'quantity' && names.has(id)).map(([id]) => id);
}

/**
 * The rules cut down to one check and the inputs and derived values it reads: the same pure evaluator then
 * judges only that check, so a search that evaluates it hundreds of times stays fast.
 */
export function rulesForCheck(rules: CompiledRules, compiled: CompiledCheck): CompiledRules {
	const names = namesReached(rules, compiled);
	return {
		...rules,
		rules: {...rules.rules, steps: rules.rules.steps.map((step) => ({...step, confirmations: []}))},
		inputs: new Map([...rules.inputs].filter(([id]) => names.has(id))),
		derived: rules.derived.filter((entry) => names.has(entry.derived.id)),
		checks: [compiled],
	};
}

function namesReached(rules: CompiledRules, compiled: CompiledCheck): Set<string> {
	const formulas = [compiled.when, compiled.holds, compiled.value, compiled.limit].filter((formula): formula is CompiledFormula => formula !== undefined);
	const byId = new Map(rules.derived.map((entry) => [entry.derived.id, entry.formula]));
	const tableOf = new Map([...rules.tables].map(([id, table]) => [id, [table.key, table.value]]));
	const reached = new Set<string>();
	const pending = formulas.flatMap((formula) => [...formula.names]);
	while (pending.length > 0) {
		const name = pending.pop()!;
		if (reached.has(name)) continue;
		reached.add(name);
		const derived = byId.get(name);
		if (derived) pending.push(...derived.names);
		pending.push(...(tableOf.get(name) ?? []));
		// An input asked only under a condition depends on that condition's names too.
		const when = rules.inputs.get(name)?.when;
		if (when) pending.push(...when.names);
	}
	return reached;
}
