import type {Dimension} from '../../quantities/dimensions.js';
import {formatQuantity} from '../../quantities/format.js';
import type {Answers} from './answers.js';
import type {CompiledCheck, CompiledRules} from '../compile/compiled-rules.js';
import type {CheckResult, Corner, CornerInput, Verdict} from './evaluation.js';
import {shownSi} from './shown-value.js';
import {inputsOfCheck} from './input-dependencies.js';
import {pointScopes, type CornerContext, type PointScopes, type Ranged} from './point-scopes.js';

export type {CornerContext} from './point-scopes.js';

/** Past this many ranged inputs in one check, its 2^k corners are not all tried (2^8 = 256). */
export const maxCornerInputs = 8;
/** The step inward from a range's worst end that tells whether a worse point lies inside, as a fraction of the range. */
export const inwardStep = 1e-4;
/** Golden-section steps: each narrows the bracket to 0.618 of itself, 24 to about 1e-5 of the range. */
const goldenSteps = 24;

type Judged = {result: CheckResult; point: number[]};

/**
 * Judges each check that uses a ranged input at the point of the ranges worst for it. Only the
 * ranged inputs the check depends on (through derived values and tables) are varied. "Worst":
 * fail over advise over open over pass over skip; between equal verdicts, the smaller margin
 * (value against limit, as the check defines it); between equal margins, the first corner tried
 * (every input low first). A check none of whose inputs is ranged keeps its result as it is.
 */
export function atWorstCorners(rules: CompiledRules, answers: Answers, checks: CheckResult[], context: CornerContext): CheckResult[] {
	const scopes = pointScopes(rules, answers, context);
	if (scopes.ranged.size === 0) return checks;
	return checks.map((middle, index) => {
		const uses = inputsOfCheck(rules, index);
		const varied = [...scopes.ranged.values()].filter(({id}) => uses.has(id));
		if (varied.length === 0 || middle.verdict === 'open') return middle;
		return worstFor(rules.checks[index]!, varied, scopes, context);
	});
}

function worstFor(compiled: CompiledCheck, varied: Ranged[], scopes: PointScopes, context: CornerContext): CheckResult {
	const seen = new Map<string, Judged>();
	const judgeAt = (point: number[]): Judged => {
		const key = point.join('|');
		const known = seen.get(key);
		if (known) return known;
		const at = scopes.at(varied, point);
		const made = {result: context.judge(compiled, at.compute, at.scope, at.failed), point};
		seen.set(key, made);
		return made;
	};
	if (varied.length > maxCornerInputs) return capped(varied, judgeAt);

	let worst: Judged | undefined;
	for (let mask = 0; mask < 1 << varied.length; mask += 1) {
		const judged = judgeAt(varied.map((input, bit) => (mask & (1 << bit) ? input.high : input.low)));
		if (!worst || isWorse(judged.result, worst.result)) worst = judged;
	}
	let method: Corner['method'] = 'corners';
	// A value need not be monotone in an input (a dissipation peaks inside a current range). One
	// small step inward from the worst end tells: if it is worse, the worst point lies inside, and a
	// golden-section search over the range finds it (exact for a value with one peak in the range).
	for (const [position, input] of varied.entries()) {
		const at = (fraction: number) => judgeAt(worst!.point.map((value, other) => (other === position ? input.low + fraction * (input.high - input.low) : value)));
		const step = at(worst!.point[position] === input.low ? inwardStep : 1 - inwardStep);
		if (!isWorse(step.result, worst!.result)) continue;
		const refined = goldenSection(0, 1, at);
		worst = isWorse(refined.result, step.result) ? refined : step;
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
	const middle = varied.map(({middle: value}) => value);
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
