import {isQuantity} from '../../quantities/engine.js';
import {asDeclared} from '../../quantities/dimension-value.js';
import type {Dimension} from '../../quantities/dimensions.js';
import type {Answers} from './answers.js';
import type {CompiledCheck, CompiledDerived, CompiledRules} from '../compile/compiled-rules.js';
import type {CompiledFormula} from '../compile/formula.js';
import {toFormulaValue} from '../compile/sample-values.js';
import type {CheckResult} from './evaluation.js';
import {inputsOfDerived} from './input-dependencies.js';

type Computed = {ok: true; value: unknown} | {ok: false; needs: string[]} | {ok: false; error: string; needs?: undefined};
/** Evaluates a formula over one scope. */
export type Compute = (formula: CompiledFormula) => Computed;

/** What the evaluation hands over: its scope at the middle values, and how to judge a check (passed in, so the files import one way). */
export type CornerContext = {
	scope: Map<string, unknown>;
	missing: ReadonlyMap<string, string[]>;
	failedDerived: ReadonlyMap<string, string>;
	judge: (compiled: CompiledCheck, compute: Compute, scope: Map<string, unknown>, failedDerived: Map<string, string>) => CheckResult;
	makeCompute: (scope: Map<string, unknown>, missing: ReadonlyMap<string, string[]>) => Compute;
};

/** A ranged input: its id, ends and middle in SI, and dimension. */
export type Ranged = {id: string; low: number; high: number; middle: number; dimension: Dimension};

/** The scope at one point of the ranges, with the derived values that use a ranged input computed again. */
export type PointScope = {scope: Map<string, unknown>; failed: Map<string, string>; compute: Compute};

/** The ranged inputs of one evaluation, and the scope at any point of their ranges (each point computed once). */
export type PointScopes = {ranged: ReadonlyMap<string, Ranged>; /** The scope with these ranged inputs at these values, the others at their middle. */ at(inputs: readonly Ranged[], values: readonly number[]): PointScope};

const made = new WeakMap<CornerContext, PointScopes>();

/**
 * The scopes of one evaluation's points, shared by every check and derived value: a point sets
 * each ranged input (the middle where a check does not vary it), so two checks that try the
 * same corner share its derived values. Kept for as long as the evaluation's context lives.
 */
export function pointScopes(rules: CompiledRules, answers: Answers, context: CornerContext): PointScopes {
	const known = made.get(context);
	if (known) return known;
	const ranged = rangedInputs(rules, answers, context.scope);
	const all = [...ranged.values()];
	const position = new Map(all.map(({id}, index) => [id, index]));
	// Only the derived values that use an input the point moves from its middle are computed again: the rest are the evaluation's own.
	const chains = new Map<string, CompiledDerived[]>();
	const chainFor = (moved: readonly Ranged[]) => {
		const key = moved.map(({id}) => id).join('|');
		let chain = chains.get(key);
		if (!chain) chains.set(key, (chain = rules.derived.filter((entry) => moved.some(({id}) => inputsOfDerived(rules, entry.derived.id).has(id)))));
		return chain;
	};
	const points = new Map<string, PointScope>();
	const scopes: PointScopes = {
		ranged,
		at(inputs, values) {
			const point = all.map(({middle}) => middle);
			inputs.forEach(({id}, index) => (point[position.get(id)!] = values[index]!));
			const key = point.join('|');
			const found = points.get(key);
			if (found) return found;
			const moved = all.filter((input, position) => point[position] !== input.middle);
			const computed = scopeAt(moved, moved.map(({id}) => point[position.get(id)!]!), chainFor(moved), context);
			points.set(key, computed);
			return computed;
		},
	};
	made.set(context, scopes);
	return scopes;
}

/** The inputs entered as a range of more than one value that are asked (their condition holds). */
function rangedInputs(rules: CompiledRules, answers: Answers, scope: ReadonlyMap<string, unknown>): Map<string, Ranged> {
	const ranged = new Map<string, Ranged>();
	for (const id of rules.inputs.keys()) {
		const answer = answers.inputs.get(id);
		if (answer?.kind !== 'quantity' || !answer.range || !(answer.range.high > answer.range.low) || !scope.has(id)) continue;
		ranged.set(id, {id, ...answer.range, middle: answer.si, dimension: answer.dimension});
	}
	return ranged;
}

/**
 * The scope at a point. The derived values that use a moved input are computed when first read,
 * not all at once: a check reads the few it needs, and a point is shared by checks that need others.
 */
function scopeAt(varied: readonly Ranged[], point: readonly number[], recompute: readonly CompiledDerived[], context: CornerContext): PointScope {
	const pending = new Map(recompute.map((entry) => [entry.derived.id, entry]));
	const resolve = (id: string) => {
		const entry = pending.get(id);
		if (!entry) return;
		pending.delete(id);
		const {derived, formula} = entry;
		const result = compute(formula);
		failed.delete(derived.id);
		missing.delete(derived.id);
		if (result.ok && isFiniteValue(result.value)) {
			scope.set(derived.id, asDeclared(result.value, derived.dimension));
			return;
		}
		scope.delete(derived.id);
		if (!result.ok && result.needs) missing.set(derived.id, result.needs);
		else {
			missing.set(derived.id, []);
			failed.set(derived.id, result.ok ? 'the result is not a finite number' : result.error);
		}
	};
	const scope = new Overlay(context.scope, resolve);
	const missing = new Overlay(context.missing, resolve);
	const failed = new Overlay(context.failedDerived, resolve);
	varied.forEach(({id, dimension}, position) => scope.set(id, toFormulaValue({si: point[position]!, dimension})));
	const compute = context.makeCompute(scope, missing);
	return {scope, failed, compute};
}

function isFiniteValue(value: unknown): boolean {
	if (typeof value === 'number') return Number.isFinite(value);
	if (typeof value === 'boolean' || typeof value === 'string') return true;
	return isQuantity(value) && Number.isFinite(value.value);
}

/**
 * A map read through to the evaluation's own, holding only what a point changes: copying the
 * whole scope for every point cost more than computing the point. Only get, has, set and
 * delete are used on a scope (formulas read names; nothing lists them), and only they are kept
 * true here; iterating an overlay gives its own entries alone.
 */
class Overlay<V> extends Map<string, V> {
	private removed: Set<string> | undefined;

	/** `resolve` computes a value the point has not computed yet, before it is read. */
	constructor(
		private readonly base: ReadonlyMap<string, V>,
		private readonly resolve: (key: string) => void,
	) {
		super();
	}

	override get(key: string): V | undefined {
		this.resolve(key);
		if (super.has(key)) return super.get(key);
		return this.removed?.has(key) ? undefined : this.base.get(key);
	}

	override has(key: string): boolean {
		this.resolve(key);
		return super.has(key) || (!this.removed?.has(key) && this.base.has(key));
	}

	override set(key: string, value: V): this {
		this.removed?.delete(key);
		return super.set(key, value);
	}

	override delete(key: string): boolean {
		const had = this.has(key);
		super.delete(key);
		(this.removed ??= new Set()).add(key);
		return had;
	}
}
