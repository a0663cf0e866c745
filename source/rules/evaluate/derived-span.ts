import type {Answers} from './answers.js';
import type {CompiledRules} from '../compile/compiled-rules.js';
import type {DerivedResult} from './evaluation.js';
import {inputsOfDerived} from './input-dependencies.js';
import {shownSi, toShown} from './shown-value.js';
import {maxCornerInputs} from './worst-corner.js';
import {pointScopes, type CornerContext} from './point-scopes.js';

/**
 * Gives each derived value that uses a ranged input its span over the corners of those ranges
 * (the value itself stays the one at the middle of every range). A derived value is shown, not
 * judged: its span is taken over the corners only, and each check still finds its own worst point.
 */
export function withDerivedSpans(rules: CompiledRules, answers: Answers, derived: DerivedResult[], context: CornerContext): DerivedResult[] {
	const scopes = pointScopes(rules, answers, context);
	if (scopes.ranged.size === 0) return derived;
	return derived.map((entry) => {
		if (entry.status !== 'value') return entry;
		const uses = inputsOfDerived(rules, entry.id);
		const varied = [...scopes.ranged.values()].filter(({id}) => uses.has(id));
		if (varied.length === 0 || varied.length > maxCornerInputs) return entry;
		let [low, high] = [entry.value.si, entry.value.si];
		for (let mask = 0; mask < 1 << varied.length; mask += 1) {
			const {scope} = scopes.at(varied, varied.map(({low: bottom, high: top}, bit) => (mask & (1 << bit) ? top : bottom)));
			if (!scope.has(entry.id)) continue;
			const {si} = toShown(scope.get(entry.id), entry.value.dimension);
			[low, high] = [Math.min(low, si), Math.max(high, si)];
		}
		if (low === high) return entry;
		return {...entry, span: {low: shownSi(low, entry.value.dimension), high: shownSi(high, entry.value.dimension)}};
	});
}
