import {dimensions, type Dimension} from './dimensions.js';
import {describeValue} from './describe-value.js';
import {hasUnitDimension, quantity} from './engine.js';
import {siFromDecimal} from './exact-scale.js';
import {normaliseEntry} from './normalise-entry.js';
import {isQuantity} from './quantity.js';
import {parseUnitExpression} from './units.js';

/** Why an entry could not be read as a quantity of the expected dimension. */
export type QuantityProblem =
	| {code: 'entry-empty'}
	| {code: 'entry-not-a-number'; entered: string}
	| {code: 'entry-missing-unit'; entered: string; expected: Dimension}
	| {code: 'entry-unknown-unit'; entered: string; expected: Dimension}
	| {code: 'entry-wrong-dimension'; entered: string; expected: Dimension; received: string}
	| {code: 'entry-not-finite'; entered: string}
	| {code: 'entry-too-long'; length: number; max: number};

/**
 * The longest entry read as a quantity, in characters (spaces included). A value with its unit
 * is a few dozen characters at most; a longer one is refused before it is read, so no step of
 * reading it can take long and no message echoes it.
 */
export const maxQuantityEntryLength = 100;

/** A quantity read from an entry: its value in the coherent SI unit of its dimension. */
export type ParsedQuantity = {si: number; dimension: Dimension; entered: string};

const leadingNumber = /^[-+]?(?:\d+\.?\d*|\.\d+)(?:[eE][-+]?\d+)?/;

/**
 * True when a value (a quantity, or a plain number for ratio and number) has the given
 * dimension. A temperature difference is not an absolute temperature, nor the other way round;
 * a value in K of no particular kind is either.
 */
export function hasDimension(value: unknown, dimension: Dimension): boolean {
	const si = dimensions[dimension].si;
	if (si === '') return typeof value === 'number';
	if (!isQuantity(value) || !hasUnitDimension(value, si)) return false;
	if (dimension === 'temperature') return value.kind !== 'difference';
	if (dimension === 'temperature_difference') return value.kind !== 'absolute';
	return true;
}

/**
 * Reads an operator's entry (`250 mA`, `0.25A`, `25 degC`, `10 %`, `1.2 Ω`) as a quantity of
 * the expected dimension. Bare numbers are accepted only for plain numbers and ratios. A
 * temperature difference typed in degC or degF is a difference (50 degC = 50 K, 90 degF = 50 K).
 * Power-of-ten units are applied to the decimal text, so every spelling of a value gives the
 * same double (`700 nm`, `0.7 um`, `7e-7 m`).
 */
export function parseQuantity(entered: string, expected: Dimension): {ok: true; value: ParsedQuantity} | {ok: false; problem: QuantityProblem} {
	if (entered.length > maxQuantityEntryLength) return {ok: false, problem: {code: 'entry-too-long', length: entered.length, max: maxQuantityEntryLength}};
	const text = normaliseEntry(entered);
	if (text === '') return {ok: false, problem: {code: 'entry-empty'}};
	const number = leadingNumber.exec(text);
	if (!number) return {ok: false, problem: {code: 'entry-not-a-number', entered}};
	const numberText = number[0];
	const value = Number(numberText);
	const unitText = text.slice(number[0].length).trim();
	const plain = expected === 'ratio' || expected === 'number';
	if (unitText === '%') {
		if (expected !== 'ratio') return {ok: false, problem: {code: 'entry-wrong-dimension', entered, expected, received: 'a percentage'}};
		return finite(siFromDecimal(numberText, {factor: 0.01, exponents: [0, 0, 0, 0, 0, 0], offset: 0, decade: -2}), expected, entered);
	}
	if (unitText === '') {
		if (!plain) return {ok: false, problem: {code: 'entry-missing-unit', entered, expected}};
		return finite(value, expected, entered);
	}
	const unit = parseUnitExpression(unitText);
	if (!unit) return {ok: false, problem: {code: 'entry-unknown-unit', entered, expected}};
	const read = quantity(value, unitText);
	if (!hasDimension(read, expected)) {
		return {ok: false, problem: {code: 'entry-wrong-dimension', entered, expected, received: describeValue(read)}};
	}
	// Every dimension's SI unit has a factor of one, so the SI value is the entry's in that unit.
	return finite(siFromDecimal(numberText, unit, expected === 'temperature_difference' ? 'difference' : 'absolute'), expected, entered);
}

function finite(si: number, dimension: Dimension, entered: string) {
	if (!Number.isFinite(si)) return {ok: false as const, problem: {code: 'entry-not-finite' as const, entered}};
	return {ok: true as const, value: {si, dimension, entered}};
}
