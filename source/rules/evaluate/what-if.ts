import type {Dimension} from '../../quantities/dimensions.js';
import {formatQuantity} from '../../quantities/format.js';
import {parseQuantity} from '../../quantities/parse-quantity.js';
import type {CompiledRules} from '../compile/compiled-rules.js';
import type {Answers} from './answers.js';
import type {Evaluation, Shown} from './evaluation.js';
import {findFlips, makeProbe, type FlipMethod} from './flip-search.js';
import {numericInputsOf, rulesForCheck} from './what-if-scope.js';

/** One input's flip point for one check, in the input's own unit. */
export type FlipPoint = {
	input: string;
	dimension: Dimension;
	/** Which way the input moves to reach the flip. */
	direction: 'up' | 'down';
	/** The verdict the check turns to there: a pass turns to a fail, a fail to a pass. */
	becomes: 'fail' | 'pass';
	now: Shown;
	/** The boundary: the last value on the passing side, shown rounded toward the passing side. */
	at: Shown;
	/** The next value tried beyond it, on the failing side (SI). */
	beyond: number;
	/** How far the input moves, in its unit (a temperature moves by a difference). */
	change: Shown;
	/** The change as a fraction of the current value (of the absolute temperature for a temperature); null at zero. */
	fraction: number | null;
	method: FlipMethod;
};

/** A check's flip points, one or two per input it depends on (none when no value in range flips it). */
export type CheckFlips = {check: string; title: string; verdict: 'pass' | 'fail' | 'advise'; flips: FlipPoint[]};

/** A call and the flip that makes it close: the check, and its nearest flip point. */
export type CloseCall = {check: string; title: string; flip: FlipPoint};

/** The whole what-if analysis: each judged check's flips, the three closest passing calls, and for each fail the smallest changes that clear it. */
export type WhatIf = {
	checks: CheckFlips[];
	/** For each passing check with a flip, its nearest one (smallest fraction), closest first. */
	nearest: CloseCall[];
	/** The three closest passing calls. */
	closest: CloseCall[];
	/** For each failing check, its single changes that clear it, smallest fraction first. */
	fixes: Array<{check: string; title: string; verdict: 'fail' | 'advise'; options: FlipPoint[]}>;
};

/**
 * For every judged check and every numeric input it depends on, the value inside the input's
 * declared range at which the verdict changes, found on the pure evaluator with that one input
 * changed. Inputs without an answer or a declared range are left out.
 */
export function analyseWhatIf(rules: CompiledRules, answers: Answers, evaluation: Evaluation): WhatIf {
	const checks: CheckFlips[] = [];
	for (const compiled of rules.checks) {
		const result = evaluation.checks.find((entry) => entry.id === compiled.check.id);
		if (!result || (result.verdict !== 'pass' && result.verdict !== 'fail' && result.verdict !== 'advise')) continue;
		const verdict = result.verdict;
		const reduced = rulesForCheck(rules, compiled);
		const flips: FlipPoint[] = [];
		for (const input of numericInputsOf(rules, compiled)) {
			const answer = answers.inputs.get(input);
			const range = rules.inputs.get(input)?.range;
			if (answer?.kind !== 'quantity' || !range) continue;
			const probe = makeProbe(reduced, answers, input, answer.dimension);
			for (const raw of findFlips(probe, answer.si, range.min, range.max)) {
				flips.push(flipPoint(input, answer.dimension, answer.si, raw, verdict === 'pass' ? 'fail' : 'pass'));
			}
		}
		checks.push({check: compiled.check.id, title: compiled.check.title, verdict, flips});
	}
	const nearest = checks
		.filter((entry) => entry.verdict === 'pass')
		.flatMap((entry) => {
			const flip = smallest(entry.flips);
			return flip ? [{check: entry.check, title: entry.title, flip}] : [];
		})
		.sort((a, b) => a.flip.fraction! - b.flip.fraction!);
	const fixes = checks.flatMap((entry) =>
		entry.verdict === 'pass' ? [] : [{check: entry.check, title: entry.title, verdict: entry.verdict, options: [...entry.flips].sort(byFraction)}],
	);
	return {checks, nearest, closest: nearest.slice(0, 3), fixes};
}

function byFraction(a: FlipPoint, b: FlipPoint): number {
	return (a.fraction ?? Infinity) - (b.fraction ?? Infinity);
}

function smallest(flips: readonly FlipPoint[]): FlipPoint | undefined {
	return [...flips].filter((flip) => flip.fraction !== null).sort(byFraction)[0];
}

function flipPoint(input: string, dimension: Dimension, now: number, raw: {direction: 'up' | 'down'; at: number; beyond: number; method: FlipMethod}, becomes: 'fail' | 'pass'): FlipPoint {
	const atText = safeText(raw.at, raw.beyond, dimension);
	const changeDimension: Dimension = dimension === 'temperature' ? 'temperature_difference' : dimension;
	const change = Math.abs(atText.si - now);
	return {
		input,
		dimension,
		direction: raw.direction,
		becomes,
		now: {si: now, dimension, text: formatQuantity(now, dimension)},
		at: {si: raw.at, dimension, text: atText.text},
		beyond: raw.beyond,
		change: {si: change, dimension: changeDimension, text: formatQuantity(change, changeDimension)},
		fraction: now === 0 ? null : Math.abs(raw.at - now) / Math.abs(now),
		method: raw.method,
	};
}

/**
 * The boundary as text, rounded toward the passing side: the fewest significant figures (from
 * three) at which the nearest rounding, or one step of the last figure toward the passing side,
 * stays on the passing side. Read back, the text never claims a pass the check would not give.
 * Returns the text and the value it reads as.
 */
export function safeText(at: number, beyond: number, dimension: Dimension): {text: string; si: number} {
	const towardPass = beyond > at ? -1 : 1;
	const shown = dimension === 'temperature' ? at - 273.15 : at;
	for (let digits = 3; digits <= 8; digits++) {
		// Temperatures are shown with one figure more (see formatQuantity).
		const figures = dimension === 'temperature' ? digits + 1 : digits;
		const step = shown === 0 ? 0 : 10 ** (Math.floor(Math.log10(Math.abs(shown))) - figures + 1);
		for (const candidate of [at, at + towardPass * step]) {
			const text = formatQuantity(candidate, dimension, digits);
			const parsed = parseQuantity(text, dimension);
			if (parsed.ok && (parsed.value.si - at) * (beyond - at) <= 0) return {text, si: parsed.value.si};
		}
	}
	return {text: formatQuantity(at, dimension, 12), si: at};
}
