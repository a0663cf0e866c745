import {builtinFunctions} from './expression-evaluate.js';
import {isQuantity, quantityOrNumber, sameExponents, type Quantity} from './quantity.js';
import {isUnitName, parseUnitExpression} from './units.js';

/**
 * The unit-aware value layer that formulas, calculations and entries share: quantities in
 * coherent SI units with the exponents of their dimension.
 */

const cache = new Map<string, ReturnType<typeof parseUnitExpression>>();
function unitOf(text: string) {
	let found = cache.get(text);
	if (found === undefined && !cache.has(text)) {
		found = text === '' ? {factor: 1, exponents: [0, 0, 0, 0, 0, 0], offset: 0} : parseUnitExpression(text);
		cache.set(text, found);
	}
	if (!found) throw new Error(`unknown unit "${text}"`);
	return found;
}

/** A value in a unit (`quantity(0.25, 'A')`, `quantity(25, 'degC')`) as an SI quantity, or a plain number. */
export function quantity(value: number, unitText: string): Quantity | number {
	const unit = unitOf(unitText);
	return quantityOrNumber(value * unit.factor + unit.offset, unit.exponents);
}

/** A quantity's value in a unit of the same dimension (`toUnit(q, 'mA')`); throws on a dimension clash. */
export function toUnit(value: Quantity | number, unitText: string): number {
	const unit = unitOf(unitText);
	const exponents = typeof value === 'number' ? ([0, 0, 0, 0, 0, 0] as const) : value.exponents;
	if (!sameExponents(exponents, unit.exponents)) throw new Error(`cannot express this value in ${unitText}`);
	const si = typeof value === 'number' ? value : value.value;
	return (si - unit.offset) / unit.factor;
}

/** True when a value has the dimension of a unit (`hasUnitDimension(q, 'A')`). */
export function hasUnitDimension(value: unknown, unitText: string): boolean {
	const unit = unitOf(unitText);
	if (typeof value === 'number') return unit.exponents.every((exponent) => exponent === 0);
	return isQuantity(value) && sameExponents(value.exponents, unit.exponents);
}

/** Names of the math functions that rule formulas may call. */
export const mathFunctions: ReadonlySet<string> = builtinFunctions;

/** Constants that rule formulas may name. */
export const mathConstants: ReadonlySet<string> = new Set(['pi']);

export {isQuantity, isUnitName};
export type {Quantity};
