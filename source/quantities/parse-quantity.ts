import {dimensions, type Dimension} from './dimensions.js';
import {isUnit, unit, type Unit} from './engine.js';
import {normaliseEntry} from './normalise-entry.js';

/** Why an entry could not be read as a quantity of the expected dimension. */
export type QuantityProblem =
	| {code: 'entry-empty'}
	| {code: 'entry-not-a-number'; entered: string}
	| {code: 'entry-missing-unit'; entered: string; expected: Dimension}
	| {code: 'entry-unknown-unit'; entered: string; expected: Dimension}
	| {code: 'entry-wrong-dimension'; entered: string; expected: Dimension; received: string}
	| {code: 'entry-not-finite'; entered: string};

/** A quantity read from an entry: its value in the coherent SI unit of its dimension. */
export type ParsedQuantity = {si: number; dimension: Dimension; entered: string};

const plainNumber = /^[-+]?(?:\d+\.?\d*|\.\d+)(?:[eE][-+]?\d+)?$/;
const percentage = /^([-+]?(?:\d+\.?\d*|\.\d+)(?:[eE][-+]?\d+)?)\s*%$/;

/** Names the dimension of a unit value in words, for error messages. */
export function describeDimension(value: Unit): string {
	for (const info of Object.values(dimensions)) {
		if (info.si !== '' && value.equalBase(unit(1, info.si))) return info.noun;
	}
	if (value.equalBase(unit(1, 'C'))) return 'a charge';
	if (value.equalBase(unit(1, 'kg'))) return 'a mass';
	return `a quantity in ${value.formatUnits() || 'no unit'}`;
}

/** True when a mathjs unit value has the given dimension. */
export function hasDimension(value: Unit, dimension: Dimension): boolean {
	const si = dimensions[dimension].si;
	if (si === '') return false;
	return value.equalBase(unit(1, si));
}

/**
 * Reads an operator's entry (`250 mA`, `0.25A`, `25 degC`, `10 %`, `1.2 Ω`) as a quantity of
 * the expected dimension. Bare numbers are accepted only for plain numbers and ratios.
 */
export function parseQuantity(entered: string, expected: Dimension): {ok: true; value: ParsedQuantity} | {ok: false; problem: QuantityProblem} {
	const text = normaliseEntry(entered);
	if (text === '') return {ok: false, problem: {code: 'entry-empty'}};
	const plain = expected === 'ratio' || expected === 'number';
	const percent = percentage.exec(text);
	if (percent) {
		if (expected !== 'ratio') return {ok: false, problem: {code: 'entry-wrong-dimension', entered, expected, received: 'a percentage'}};
		return finite(Number(percent[1]) / 100, expected, entered);
	}
	if (plainNumber.test(text)) {
		if (!plain) return {ok: false, problem: {code: 'entry-missing-unit', entered, expected}};
		return finite(Number(text), expected, entered);
	}
	if (!/^[-+]?(?:\d|\.\d)/.test(text)) return {ok: false, problem: {code: 'entry-not-a-number', entered}};
	let value: Unit;
	try {
		const parsed: unknown = unit(text);
		if (!isUnit(parsed)) return {ok: false, problem: {code: 'entry-not-a-number', entered}};
		value = parsed;
	} catch {
		return {ok: false, problem: {code: 'entry-unknown-unit', entered, expected}};
	}
	if (value.value === null) return {ok: false, problem: {code: 'entry-not-a-number', entered}};
	if (plain) {
		return {ok: false, problem: {code: 'entry-wrong-dimension', entered, expected, received: describeDimension(value)}};
	}
	if (!hasDimension(value, expected)) {
		return {ok: false, problem: {code: 'entry-wrong-dimension', entered, expected, received: describeDimension(value)}};
	}
	return finite(value.toNumber(dimensions[expected].si), expected, entered);
}

function finite(si: number, dimension: Dimension, entered: string) {
	if (!Number.isFinite(si)) return {ok: false as const, problem: {code: 'entry-not-finite' as const, entered}};
	return {ok: true as const, value: {si, dimension, entered}};
}
