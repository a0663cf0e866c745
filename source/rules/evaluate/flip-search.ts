import type {Dimension} from '../../quantities/dimensions.js';
import {dimensions} from '../../quantities/dimensions.js';
import {looksLikeRange, type Tolerance} from '../../quantities/range-entry.js';
import type {CompiledRules} from '../compile/compiled-rules.js';
import type {Answers, InputAnswer} from './answers.js';
import {evaluate} from './evaluate.js';
import type {CheckResult, Verdict} from './evaluation.js';

/** How a flip point was found: by the linear closed form between two evaluations, or by bisection. */
export type FlipMethod = 'closed_form' | 'bisection';

/**
 * Where one input, moved on its own in one direction, turns a check's verdict: `at` is the last
 * value that still passes (the boundary itself passes, as the check's comparison includes it) and
 * `beyond` the next value tried on the failing side, within a relative 1e-11 of it.
 */
export type RawFlip = {direction: 'up' | 'down'; at: number; beyond: number; method: FlipMethod};

/** Grid points tried in each direction before narrowing: a change of side between two of them brackets a flip. */
const gridSteps = 8;
const relativeTolerance = 1e-11;
const maxIterations = 200;

/** True when a verdict sits on the passing side: a pass, or a check that no longer applies. */
export function onPassingSide(verdict: Verdict): boolean {
	return verdict === 'pass' || verdict === 'skip';
}

/**
 * A probe that judges one check with one quantity input set to an SI value, everything else as
 * answered. It runs the pure evaluator on the rules cut down to that check.
 */
export function makeProbe(rules: CompiledRules, answers: Answers, input: string, dimension: Dimension): (si: number) => CheckResult {
	const inputs = new Map(answers.inputs);
	const changed: Answers = {...answers, inputs};
	const unit = dimensions[dimension].si;
	const given = answers.inputs.get(input);
	const spread = given?.kind === 'quantity' && given.range ? rangeSpread(given.si, given.range, dimension, relativeRange(given.entered, rules.inputs.get(input)?.tolerance)) : undefined;
	const written = (value: number) => (unit === '' ? String(value) : `${value} ${unit}`);
	return (si) => {
		// The value replaces whatever was entered for this input: one input changes at a time. An input
		// entered as a range moves as a whole, `si` its middle (see rangeSpread).
		const range = spread?.(si);
		const answer: InputAnswer = range ? {kind: 'quantity', entered: `${written(range.low)} .. ${written(range.high)}`, si, dimension, range} : {kind: 'quantity', entered: written(si), si, dimension};
		inputs.set(input, answer);
		return evaluate(rules, changed).checks[0]!;
	};
}

/**
 * Whether a range was given as a fraction of its middle: typed with a percentage (`12 V ± 5 %`),
 * or a single value widened by the rules' default tolerance in percent. A range typed with two
 * ends or an amount each way (`1.6 V .. 2.0 V`, `1.8 V ± 0.2 V`) keeps its width instead.
 */
function relativeRange(entered: string, tolerance: Tolerance | undefined): boolean {
	if (looksLikeRange(entered)) return entered.includes('%');
	return tolerance !== undefined && 'relative' in tolerance;
}

/**
 * How a range entered around `middle` is carried to another middle, as the operator would enter
 * it there: the same fraction of the middle each way when it was given as one (`relative`), else
 * the same amounts below and above. A temperature keeps its amounts (a fraction of a temperature
 * has no meaning, and the rules refuse one).
 */
function rangeSpread(middle: number, range: {low: number; high: number}, dimension: Dimension, relative: boolean): (at: number) => {low: number; high: number} {
	const below = middle - range.low;
	const above = range.high - middle;
	const factor = relative && dimension !== 'temperature' && middle !== 0 ? (at: number) => Math.abs(at / middle) : () => 1;
	return (at) => ({low: at - below * factor(at), high: at + above * factor(at)});
}

/**
 * The nearest flip in each direction from `now` inside [min, max], if any. Each direction is
 * sampled on a grid; the first change of side brackets the flip, which the linear closed form
 * (from the margins at the bracket's ends) tries first and bisection finishes when the check is
 * not linear there. A flip narrower than one grid step can be missed; the grid is dense enough for
 * the monotone and single-humped formulas of a bench policy.
 */
export function findFlips(probe: (si: number) => CheckResult, now: number, min: number, max: number): RawFlip[] {
	const start = probe(now);
	const startSide = onPassingSide(start.verdict);
	const flips: RawFlip[] = [];
	for (const [direction, end] of [['down', min], ['up', max]] as const) {
		if (end === now) continue;
		let previous = {x: now, result: start};
		for (let step = 1; step <= gridSteps; step++) {
			const x = step === gridSteps ? end : now + ((end - now) * step) / gridSteps;
			const result = probe(x);
			if (onPassingSide(result.verdict) !== startSide) {
				flips.push({direction, ...narrow(probe, previous, {x, result}, startSide)});
				break;
			}
			previous = {x, result};
		}
	}
	return flips;
}

type Point = {x: number; result: CheckResult};

/** Narrows a bracket [same side as now, other side] to the flip; reports the passing end as `at`. */
function narrow(probe: (si: number) => CheckResult, near: Point, far: Point, nearPasses: boolean): {at: number; beyond: number; method: FlipMethod} {
	let inside = near.x;
	let outside = far.x;
	let method: FlipMethod = 'bisection';
	const tolerance = (a: number, b: number) => relativeTolerance * Math.max(Math.abs(a), Math.abs(b), Math.abs(near.x - far.x) * 1e-3);
	const guess = linearGuess(near, far);
	if (guess !== undefined) {
		const gap = tolerance(guess, guess);
		const toward = Math.sign(outside - inside);
		const a = guess - toward * gap;
		const b = guess + toward * gap;
		if (isBetween(a, inside, outside) && isBetween(b, inside, outside)) {
			const aSame = onPassingSide(probe(a).verdict) === nearPasses;
			const bSame = onPassingSide(probe(b).verdict) === nearPasses;
			if (aSame && !bSame) {
				inside = a;
				outside = b;
				method = 'closed_form';
			} else if (aSame) inside = b;
			else outside = a;
		}
	}
	for (let iteration = 0; iteration < maxIterations && Math.abs(outside - inside) > tolerance(inside, outside); iteration++) {
		const middle = inside + (outside - inside) / 2;
		if (middle === inside || middle === outside) break;
		if (onPassingSide(probe(middle).verdict) === nearPasses) inside = middle;
		else outside = middle;
	}
	return nearPasses ? {at: inside, beyond: outside, method} : {at: outside, beyond: inside, method};
}

/** Where the margin reaches zero if it is linear between the bracket's ends (needs a margin at both). */
function linearGuess(near: Point, far: Point): number | undefined {
	const m0 = near.result.margin?.si;
	const m1 = far.result.margin?.si;
	if (m0 === undefined || m1 === undefined || m0 === m1 || Math.sign(m0) === Math.sign(m1)) return undefined;
	const guess = near.x + ((far.x - near.x) * m0) / (m0 - m1);
	return Number.isFinite(guess) ? guess : undefined;
}

function isBetween(x: number, a: number, b: number): boolean {
	return x >= Math.min(a, b) && x <= Math.max(a, b);
}
