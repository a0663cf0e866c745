import type {Dimension} from './dimensions.js';
import {maxQuantityEntryLength, parseQuantity, type QuantityProblem} from './parse-quantity.js';

/** A range read from an entry: its two ends and its middle (the value shown as "the" value), in SI. */
export type ParsedRange = {low: number; high: number; middle: number};

/** Why a range entry was refused (the caller adds the field's words). */
export type RangeProblem =
	| {code: 'range-reversed'; low: string; high: string}
	| {code: 'range-empty-end'; end: string}
	| {code: 'range-mixed-dimensions'; end: string; received: string}
	| {code: 'range-end-refused'; end: string; problem: QuantityProblem}
	| {code: 'range-percent-temperature'};

/** A tolerance that applies to a single entered value: a fraction of it, or a fixed amount in SI. */
export type Tolerance = {relative: number} | {absolute: number};

// "±" is written as an escape: the bundle stays pure ASCII.
const plusMinus = /\u00B1|\+\/-|\+-(?=\s*[\d.])/;
const between = /\.\./;
const leadingNumber = /^\s*[-+]?(?:\d+\.?\d*|\.\d+)(?:[eE][-+]?\d+)?/;

/** True when the entry is written as a range (`a .. b`, `a ± d`, `a +/- d`). */
export function looksLikeRange(entered: string): boolean {
	return /\u00B1|\+\/-|\+-(?=\s*[\d.])|\.\./.test(entered);
}

/** True when a text or choice entry reads as a range of numbers (`1.6 V .. 2 V`), not merely holding two dots. */
export function looksLikeNumericRange(entered: string): boolean {
	return /^\s*[-+]?(?:\d|\.\d)/.test(entered) && /\d[^\d]*(?:\.\.|\u00B1|\+\/-)\s*[-+]?\.?\d/.test(entered);
}

/** The unit written after an entry's number, or '' (for borrowing it: `1.6 .. 2.0 V`). */
function unitOf(text: string): string {
	const number = leadingNumber.exec(text);
	return number ? text.slice(number[0].length).trim() : '';
}

function readEnd(text: string, dimension: Dimension, borrowUnit: string) {
	const trimmed = text.trim();
	const parsed = parseQuantity(trimmed, dimension);
	if (!parsed.ok && parsed.problem.code === 'entry-missing-unit' && borrowUnit !== '') return parseQuantity(`${trimmed} ${borrowUnit}`, dimension);
	return parsed;
}

function endProblem(end: string, problem: QuantityProblem): RangeProblem {
	if (problem.code === 'entry-empty') return {code: 'range-empty-end', end};
	if (problem.code === 'entry-wrong-dimension') return {code: 'range-mixed-dimensions', end, received: problem.received};
	return {code: 'range-end-refused', end, problem};
}

/**
 * Reads a range of the given dimension: `1.6 V .. 2.0 V` (low, then high), `1.8 V ± 0.2 V`,
 * `1.8 V +/- 0.2 V` or `1.8 V ± 10 %` (a fraction of the middle value). A number without a unit
 * takes the other part's unit (`1.6 .. 2.0 V`). On a temperature the spread is a difference
 * (`25 degC ± 5 K`); a percentage of a temperature is refused, as its meaning is unclear. On a
 * ratio, `10 % ± 1 %` is one percentage point each way. Ends that are equal give a range of
 * one value; a low end above the high end is refused, never swapped.
 */
export function parseRange(entered: string, dimension: Dimension): {ok: true; value: ParsedRange} | {ok: false; problem: RangeProblem} {
	const pm = plusMinus.exec(entered);
	if (pm) {
		const centreText = entered.slice(0, pm.index).trim();
		const spreadText = entered.slice(pm.index + pm[0].length).trim();
		const centre = readEnd(centreText, dimension, unitOf(spreadText));
		if (!centre.ok) return {ok: false, problem: endProblem('middle value', centre.problem)};
		if (spreadText === '') return {ok: false, problem: {code: 'range-empty-end', end: 'tolerance'}};
		let spread: number;
		if (unitOf(spreadText) === '%' && dimension !== 'ratio') {
			if (dimension === 'temperature') return {ok: false, problem: {code: 'range-percent-temperature'}};
			const fraction = parseQuantity(spreadText, 'ratio');
			if (!fraction.ok) return {ok: false, problem: endProblem('tolerance', fraction.problem)};
			spread = Math.abs(centre.value.si) * fraction.value.si;
		} else {
			const spreadDimension: Dimension = dimension === 'temperature' ? 'temperature_difference' : dimension;
			const read = readEnd(spreadText, spreadDimension, unitOf(centreText));
			if (!read.ok) return {ok: false, problem: endProblem('tolerance', read.problem)};
			spread = read.value.si;
		}
		if (spread < 0) return {ok: false, problem: {code: 'range-reversed', low: centreText, high: spreadText}};
		return {ok: true, value: {low: centre.value.si - spread, high: centre.value.si + spread, middle: centre.value.si}};
	}
	const dots = between.exec(entered);
	if (!dots) return {ok: false, problem: {code: 'range-empty-end', end: 'high end'}};
	const lowText = entered.slice(0, dots.index).trim();
	const highText = entered.slice(dots.index + 2).trim();
	if (lowText === '') return {ok: false, problem: {code: 'range-empty-end', end: 'low end'}};
	if (highText === '') return {ok: false, problem: {code: 'range-empty-end', end: 'high end'}};
	const low = readEnd(lowText, dimension, unitOf(highText));
	if (!low.ok) return {ok: false, problem: endProblem('low end', low.problem)};
	const high = readEnd(highText, dimension, unitOf(lowText));
	if (!high.ok) return {ok: false, problem: endProblem('high end', high.problem)};
	if (low.value.si > high.value.si) return {ok: false, problem: {code: 'range-reversed', low: lowText, high: highText}};
	return {ok: true, value: {low: low.value.si, high: high.value.si, middle: (low.value.si + high.value.si) / 2}};
}

/** Applies a rule file's default tolerance to a single value. */
export function withTolerance(si: number, tolerance: Tolerance): ParsedRange {
	const spread = 'relative' in tolerance ? Math.abs(si) * tolerance.relative : tolerance.absolute;
	return {low: si - spread, high: si + spread, middle: si};
}

/**
 * Reads a rule file's default tolerance for an input of the given dimension: `5 %` (of the
 * value) or an amount of the input's own kind (`0.1 V`; a difference in K for a temperature).
 */
export function parseTolerance(text: string, dimension: Dimension): {ok: true; value: Tolerance} | {ok: false; problem: QuantityProblem} {
	if (text.length > maxQuantityEntryLength) return {ok: false, problem: {code: 'entry-too-long', length: text.length, max: maxQuantityEntryLength}};
	if (unitOf(text) === '%' && dimension !== 'ratio') {
		const read = parseQuantity(text, 'ratio');
		if (!read.ok) return read;
		if (dimension === 'temperature') return {ok: false, problem: {code: 'entry-wrong-dimension', entered: text, expected: 'temperature_difference', received: 'a percentage'}};
		return {ok: true, value: {relative: Math.abs(read.value.si)}};
	}
	const read = parseQuantity(text, dimension === 'temperature' ? 'temperature_difference' : dimension);
	if (!read.ok) return read;
	return {ok: true, value: {absolute: Math.abs(read.value.si)}};
}

