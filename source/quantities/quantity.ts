/** Exponents of the base dimensions: metre, kilogram, second, ampere, kelvin, radian. */
export type Exponents = readonly [number, number, number, number, number, number];

const baseSymbols = ['m', 'kg', 's', 'A', 'K', 'rad'] as const;

/** Exponents of a dimensionless value. */
export const dimensionless: Exponents = [0, 0, 0, 0, 0, 0];

/**
 * What a value in kelvin stands for: a point on the temperature scale (`absolute`), or a step
 * between two points (`difference`). Absent when the formula cannot tell (a value typed in K,
 * the sum of two absolute temperatures).
 */
export type TemperatureKind = 'absolute' | 'difference';

/**
 * A physical quantity: its value in coherent SI units and the exponents of its dimension. A
 * temperature also carries its kind; a number typed in degC or degF inside a formula carries
 * both readings (`value` as a point, `asDifference` as a step) until what it meets decides.
 */
export class Quantity {
	/** Marks quantities without instanceof across bundles. */
	readonly type = 'Quantity';

	constructor(
		readonly value: number,
		readonly exponents: Exponents,
		readonly kind?: TemperatureKind,
		readonly asDifference?: number,
	) {}

	/** True when both have the same dimension (the same exponents). */
	equalBase(other: Quantity): boolean {
		return sameExponents(this.exponents, other.exponents);
	}

	/** The SI unit of this quantity's dimension, e.g. "kg m^2 s^-3 A^-1". */
	formatUnits(): string {
		return formatExponents(this.exponents);
	}
}

/** True for a Quantity. */
export function isQuantity(value: unknown): value is Quantity {
	return value instanceof Quantity;
}

/** True when two exponent lists are equal (to a small tolerance, for fractional powers). */
export function sameExponents(a: Exponents, b: Exponents): boolean {
	return a.every((exponent, index) => Math.abs(exponent - b[index]!) < 1e-9);
}

/** True when every exponent is zero. */
export function isDimensionless(exponents: Exponents): boolean {
	return exponents.every((exponent) => Math.abs(exponent) < 1e-9);
}

/** Adds (for products) or subtracts (for quotients) exponent lists. */
export function combine(a: Exponents, b: Exponents, sign: 1 | -1): Exponents {
	return a.map((exponent, index) => exponent + sign * b[index]!) as unknown as Exponents;
}

/** Multiplies exponents by a power. */
export function scale(a: Exponents, power: number): Exponents {
	return a.map((exponent) => exponent * power) as unknown as Exponents;
}

/** A quantity, or a plain number when the dimension cancels out. */
export function quantityOrNumber(value: number, exponents: Exponents): Quantity | number {
	return isDimensionless(exponents) ? value : new Quantity(value, exponents);
}

/** Writes exponents as SI base units: "kg m^2 s^-3 A^-1"; "" when dimensionless. */
export function formatExponents(exponents: Exponents): string {
	return exponents
		.map((exponent, index) => (Math.abs(exponent) < 1e-9 ? '' : exponent === 1 ? baseSymbols[index]! : `${baseSymbols[index]!}^${Number(exponent.toFixed(6))}`))
		.filter(Boolean)
		.join(' ');
}
