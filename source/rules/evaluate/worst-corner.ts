import {isQuantity} from '../../quantities/engine.js';
import {asDeclared} from '../../quantities/dimension-value.js';
import type {Dimension} from '../../quantities/dimensions.js';
import {formatQuantity} from '../../quantities/format.js';
import type {Answers} from './answers.js';
import type {CompiledCheck, CompiledDerived, CompiledRules} from '../compile/compiled-rules.js';
import type {CompiledFormula} from '../compile/formula.js';
import {toFormulaValue} from '../compile/sample-values.js';
import type {CheckResult, Corner, CornerInput, Verdict} from './evaluation.js';
import {shownSi} from './shown-value.js';
import {inputsOfCheck, inputsOfDerived} from './input-dependencies.js';

/** Past this many ranged inputs in one check, its 2^k corners are not all tried (2^8 = 256). */
export const maxCornerInputs = 8;
/** Points tried inside each range, as fractions of the way from its low end, to find a worse point than any corner. */
const insideProbes = [0.25, 0.5, 0.75];
const goldenSteps = 24;

type Computed = {ok: true; value: unknown} | {ok: false; needs: string[]} | {ok: false; error: string; needs?: undefined};
type Compute = (formula: CompiledFormula) => Computed;

/** What the evaluation hands over: its scope at the middle values, and how to judge a check (passed in, so the two files import one way). */
export type CornerContext = {
	scope: Map<string, unknown>;
	missing: ReadonlyMap<string, string[]>;
	failedDerived: ReadonlyMap<string, string>;
	judge: (compiled: CompiledCheck, compute: Compute, scope: Map<string, unknown>, failedDerived: Map<string, string>) => CheckResult;
	makeCompute: (scope: Map<string, unknown>, missing: ReadonlyMap<string, string[]>) => Compute;
};

/** A ranged input: its id, ends in SI and dimension. */
export type Ranged = {id: string; low: number; high: number; dimension: Dimension};
type Judged = {result: CheckResult; point: number[]};

/**
 * Judges each check that uses a ranged input at the point of the ranges worst for it. Only the
 * ranged inputs the check depends on (through derived values and tables) are varied. "Worst":
 * fail over advise over open over pass over skip; between equal verdicts, the smaller margin
 * (value against limit, as the check defines it); between equal margins, the first corner tried
 * (every input low first). A check none of whose inputs is ranged keeps its result as it is.
 */
export function atWorstCorners(rules: CompiledRules, answers: Answers, checks: CheckResult[], context: CornerContext): CheckResult[] {
	const ranged = rangedInputs(rules, answers, context.scope);
	if (ranged.size === 0) return checks;
	const order = [...rules.inputs.keys()];
	return checks.map((middle, index) => {
		const compiled = rules.checks[index]!;
		const varied = order.filter((id) => ranged.has(id) && inputsOfCheck(rules, index).has(id)).map((id) => ranged.get(id)!);
		if (varied.length === 0 || middle.verdict === 'open') return middle;
		return worstFor(rules, compiled, varied, context);
	});
}

/** The inputs entered as a range of more than one value that are asked (their condition holds). */
export function rangedInputs(rules: CompiledRules, answers: Answers, scope: ReadonlyMap<string, unknown>): Map<string, Ranged> {
	const ranged = new Map<string, Ranged>();
	for (const [id, answer] of answers.inputs) {
		if (answer.kind !== 'quantity' || !answer.range || !(answer.range.high > answer.range.low)) continue;
		if (!rules.inputs.has(id) || !scope.has(id)) continue;
		ranged.set(id, {id, ...answer.range, dimension: answer.dimension});
	}
	return ranged;
}

function worstFor(rules: CompiledRules, compiled: CompiledCheck, varied: Ranged[], context: CornerContext): CheckResult {
	const recompute = rules.derived.filter((entry) => varied.some(({id}) => inputsOfDerived(rules, entry.derived.id).has(id)));
	const judgeAt = (point: number[]): Judged => ({result: judgePoint(compiled, varied, point, recompute, context), point});
	if (varied.length > maxCornerInputs) return capped(varied, judgeAt);

	let worst: Judged | undefined;
	for (let mask = 0; mask < 1 << varied.length; mask += 1) {
		const judged = judgeAt(varied.map((input, bit) => (mask & (1 << bit) ? input.high : input.low)));
		if (!worst || isWorse(judged.result, worst.result)) worst = judged;
	}
	let method: Corner['method'] = 'corners';
	// A value need not be monotone in an input (a dissipation peaks inside a current range):
	// try points inside each range with the others at the worst corner, and refine around the worst.
	for (const [position, input] of varied.entries()) {
		const at = (fraction: number) => judgeAt(worst!.point.map((value, other) => (other === position ? input.low + fraction * (input.high - input.low) : value)));
		const probes = insideProbes.map((fraction) => ({fraction, judged: at(fraction)}));
		const inside = probes.reduce((a, b) => (isWorse(b.judged.result, a.judged.result) ? b : a));
		if (!isWorse(inside.judged.result, worst!.result)) continue;
		const refined = goldenSection(Math.max(0, inside.fraction - 0.25), Math.min(1, inside.fraction + 0.25), at);
		worst = isWorse(refined.result, inside.judged.result) ? refined : inside.judged;
		method = 'searched';
	}
	// An input whose other end gives the same verdict and margin does not decide this check: say "either end".
	const either = varied.map((input, position) => {
		const value = worst!.point[position];
		if (value !== input.low && value !== input.high) return false;
		const other = judgeAt(worst!.point.map((at, index) => (index === position ? (value === input.low ? input.high : input.low) : at))).result;
		return !isWorse(other, worst!.result) && !isWorse(worst!.result, other);
	});
	return withCorner(worst!.result, varied, worst!.point, method, either);
}

/** Too many ranged inputs for every corner: each input at its worse end with the others in the middle, then all together. */
function capped(varied: Ranged[], judgeAt: (point: number[]) => Judged): CheckResult {
	const middle = varied.map(({low, high}) => (low + high) / 2);
	const point = varied.map((input, position) => {
		const low = judgeAt(middle.map((value, other) => (other === position ? input.low : value)));
		const high = judgeAt(middle.map((value, other) => (other === position ? input.high : value)));
		return isWorse(high.result, low.result) ? input.high : input.low;
	});
	const {result} = judgeAt(point);
	const judged = withCorner(result, varied, point, 'capped');
	// Not every corner was tried, so a pass is not shown to hold over the ranges: the protective reading leaves it open.
	if (judged.verdict !== 'pass') return judged;
	const {value: _value, limit: _limit, margin: _margin, relation: _relation, ...rest} = judged;
	return {...rest, verdict: 'open', needs: varied.map(({id}) => id)};
}

/** Golden-section search for the worst point between two fractions of a range (the function is judged, not assumed smooth). */
function goldenSection(from: number, to: number, at: (fraction: number) => Judged): Judged {
	const ratio = (Math.sqrt(5) - 1) / 2;
	let [a, b] = [from, to];
	let c = b - ratio * (b - a);
	let d = a + ratio * (b - a);
	let [atC, atD] = [at(c), at(d)];
	for (let step = 0; step < goldenSteps; step += 1) {
		if (isWorse(atC.result, atD.result)) {
			[b, d, atD] = [d, c, atC];
			c = b - ratio * (b - a);
			atC = at(c);
		} else {
			[a, c, atC] = [c, d, atD];
			d = a + ratio * (b - a);
			atD = at(d);
		}
	}
	return isWorse(atD.result, atC.result) ? atD : atC;
}

function judgePoint(compiled: CompiledCheck, varied: Ranged[], point: number[], recompute: readonly CompiledDerived[], context: CornerContext): CheckResult {
	const at = scopeAt(varied, point, recompute, context);
	return context.judge(compiled, at.compute, at.scope, at.failed);
}

/** The scope with the ranged inputs set to a point and the derived values that use them computed again. */
export function scopeAt(varied: readonly Ranged[], point: readonly number[], recompute: readonly CompiledDerived[], context: CornerContext) {
	const scope = new Map(context.scope);
	const missing = new Map(context.missing);
	const failed = new Map(context.failedDerived);
	varied.forEach(({id, dimension}, position) => scope.set(id, toFormulaValue({si: point[position]!, dimension})));
	const compute = context.makeCompute(scope, missing);
	for (const {derived, formula} of recompute) {
		const result = compute(formula);
		failed.delete(derived.id);
		missing.delete(derived.id);
		if (result.ok && isFiniteValue(result.value)) {
			scope.set(derived.id, asDeclared(result.value, derived.dimension));
			continue;
		}
		scope.delete(derived.id);
		if (!result.ok && result.needs) missing.set(derived.id, result.needs);
		else {
			missing.set(derived.id, []);
			failed.set(derived.id, result.ok ? 'the result is not a finite number' : result.error);
		}
	}
	return {scope, missing, failed, compute};
}

function withCorner(result: CheckResult, varied: Ranged[], point: number[], method: Corner['method'], either: readonly boolean[] = []): CheckResult {
	const inputs = varied.map(({id, low, high, dimension}, position): CornerInput => {
		const si = point[position]!;
		return {id, end: either[position] ? 'either' : si === low ? 'low' : si === high ? 'high' : 'inside', value: shownSi(si, dimension)};
	});
	return {...result, corner: {inputs, method}};
}

const verdictRank: Record<Verdict, number> = {fail: 5, advise: 4, open: 3, pass: 2, skip: 1};

/** True when a is worse than b: a worse verdict, or the same verdict with a clearly smaller margin. */
export function isWorse(a: CheckResult, b: CheckResult): boolean {
	const [rankA, rankB] = [verdictRank[a.verdict], verdictRank[b.verdict]];
	if (rankA !== rankB) return rankA > rankB;
	const [marginA, marginB] = [marginOf(a), marginOf(b)];
	if (marginA === marginB) return false;
	return marginA < marginB - 1e-12 * Math.max(Math.abs(marginA), Math.abs(marginB));
}

/** A check that could not be computed ranks below every margin: it is the worst of its verdict. */
function marginOf(result: CheckResult): number {
	if (result.error !== undefined) return -Infinity;
	return result.margin?.si ?? 0;
}

function isFiniteValue(value: unknown): boolean {
	if (typeof value === 'number') return Number.isFinite(value);
	if (typeof value === 'boolean' || typeof value === 'string') return true;
	return isQuantity(value) && Number.isFinite(value.value);
}

/** The words of a corner: "judged at diode_knee_voltage 2 V (high end), ambient_max 35 °C (high end)". */
export function cornerWords(corner: Corner): string {
	const ends = corner.inputs.map(({id, end, value}) => (end === 'either' ? `${id} either end (the same result)` : `${id} ${value.text} (${end === 'inside' ? 'inside its range' : `${end} end`})`)).join(', ');
	const how = corner.method === 'searched' ? '; the inside of a range was searched' : corner.method === 'capped' ? `; more than ${maxCornerInputs} ranged inputs, so not every corner was tried` : '';
	return `judged at ${ends}${how}`;
}

/** A range as shown: `11.4 V .. 12.6 V`. */
export function rangeText(range: {low: number; high: number}, dimension: Dimension): string {
	return `${formatQuantity(range.low, dimension)} .. ${formatQuantity(range.high, dimension)}`;
}
