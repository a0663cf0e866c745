import {parseQuantity} from '../../quantities/parse-quantity.js';
import {looksLikeRange} from '../../quantities/range-entry.js';
import type {CompiledInput, CompiledRules} from '../compile/compiled-rules.js';
import type {EntryProblem} from './input-entry.js';

/** What folding older tolerance inputs did: the entries to read, and a problem per refused tolerance, by the id it was given under. */
export type FoldedTolerances = {entries: Record<string, unknown>; problems: Array<{id: string; problem: EntryProblem}>};

/**
 * Older rules asked for a value's tolerance as an input of its own (`supply_tolerance: 5 %`
 * beside `supply_nominal: 12 V`). Where the rules now say an input's tolerance used to be such
 * an input (`tolerance_input_was`) and no longer have it, an answers file, saved setup or draft
 * that still gives it is read as that input's range: `12 V` and `5 %` become `12 V ± 5 %`, the
 * text the record then keeps. A value already entered as a range keeps its own range.
 */
export function foldLegacyTolerances(entries: Record<string, unknown>, rules: CompiledRules): FoldedTolerances {
	const problems: FoldedTolerances['problems'] = [];
	const folding = foldingInputs(rules);
	if (folding.length === 0) return {entries, problems};
	const folded: Record<string, unknown> = {...entries};
	for (const [id, compiled] of folding) {
		const {input} = compiled;
		if (input.kind !== 'quantity' || !input.tolerance_input_was) continue;
		const old = input.tolerance_input_was;
		if (rules.inputs.has(old) || !Object.hasOwn(entries, old)) continue;
		const tolerance = entries[old];
		delete folded[old];
		const value = entries[id];
		if (tolerance === null || tolerance === undefined || tolerance === '') continue;
		if ((typeof value !== 'string' && typeof value !== 'number') || String(value).trim() === '' || looksLikeRange(String(value))) continue;
		const read = parseQuantity(String(tolerance), 'ratio');
		if (!read.ok) {
			problems.push({id: old, problem: {code: read.problem.code, data: {...read.problem, label: `the tolerance of ${id} (${old})`, noun: 'a ratio', example: '5 %', hint: ''}}});
			continue;
		}
		if (read.value.si < 0 || read.value.si > 1) {
			problems.push({id: old, problem: {code: 'answers-out-of-range', data: {entered: String(tolerance), label: `the tolerance of ${id} (${old})`, min: '0 %', max: '100 %'}}});
			continue;
		}
		folded[id] = `${String(value).trim()} \u00B1 ${percentText(String(tolerance).trim(), read.value.si)}`;
	}
	return {entries: folded, problems};
}

/** The tolerance as a percentage: as written when it was written in %, else its fraction times 100. */
function percentText(written: string, fraction: number): string {
	if (written.endsWith('%')) return written;
	return `${Number((fraction * 100).toPrecision(12))} %`;
}

const folders = new WeakMap<CompiledRules, Array<[string, CompiledInput]>>();

/** The inputs whose tolerance older rules asked for separately (most rules have none: then nothing is copied). */
function foldingInputs(rules: CompiledRules): Array<[string, CompiledInput]> {
	let found = folders.get(rules);
	if (!found) folders.set(rules, (found = [...rules.inputs].filter(([, {input}]) => input.kind === 'quantity' && input.tolerance_input_was !== undefined)));
	return found;
}

/** True when the rules fold an older separate tolerance input into a value's range. */
export function foldsTolerances(rules: CompiledRules): boolean {
	return foldingInputs(rules).length > 0;
}
