import type {CompoundUnit, TemperatureScale} from './units.js';

/**
 * Turning typed decimals into SI doubles without binary rounding on the way, so every spelling
 * of the same value (`700 nm`, `0.7 um`, `7e-7 m`, `700e-9 m`) lands on the same double: the
 * decimal's digits and exponent are shifted in text and parsed once by Number(), which rounds
 * the exact decimal value correctly. Multiplying by 1e-9 would round twice (700 × 1e-9 ≠ 7e-7).
 */

/** How a temperature typed in degC or degF is read: a point on the scale, or a step on it. */
export type TemperatureReading = 'absolute' | 'difference';

type Decimal = {negative: boolean; digits: string; exponent: number};

/** Splits a decimal's text into its digits and a power of ten: "-0.0007" → -00007 × 10^-4. */
function decimal(text: string): Decimal | undefined {
	const match = /^([-+]?)(\d*)(?:\.(\d*))?(?:[eE]([-+]?\d+))?$/.exec(text.trim());
	if (!match) return undefined;
	const [whole = '', fraction = ''] = [match[2], match[3]];
	if (whole === '' && fraction === '') return undefined;
	return {negative: match[1] === '-', digits: whole + fraction, exponent: Number(match[4] ?? 0) - fraction.length};
}

/** The double nearest to (decimal text) × 10^decade, from one correctly rounded parse. */
export function scaledDecimal(text: string, decade: number): number {
	const parts = decimal(text);
	if (!parts) return Number(text) * Number(`1e${decade}`);
	return Number(`${parts.negative ? '-' : ''}${parts.digits}e${parts.exponent + decade}`);
}

// Kelvin from a temperature scale: K = (t + offset) × numerator / denominator, with the offset
// in hundredths (SI Brochure 2.3.1: T/K = t/°C + 273.15; NIST SP 811 B.9: T/K = (t/°F + 459.67)/1.8).
const scales: Record<TemperatureScale, {hundredths: bigint; numerator: bigint; denominator: bigint}> = {
	degC: {hundredths: 27_315n, numerator: 1n, denominator: 1n},
	degF: {hundredths: 45_967n, numerator: 5n, denominator: 9n},
};

/** Significant digits kept when a degF value has no terminating decimal in kelvin. */
const extraDigits = 40;

/**
 * Kelvin for a value typed on a temperature scale, worked out in exact integer arithmetic and
 * parsed once: 25 degC, 298.15 K and 77 degF give the same double. When the kelvin value does
 * not terminate in decimal (most degF values), 40 significant digits and a sticky last digit go
 * to Number(), which rounds correctly unless the exact value lies within 1e-40 (relative) of a
 * point halfway between two doubles.
 */
export function scaledTemperature(text: string, scale: TemperatureScale, reading: TemperatureReading): number {
	const parts = decimal(text);
	const {hundredths, numerator, denominator} = scales[scale];
	if (!parts || Math.abs(parts.exponent) > 400) {
		const value = Number(text);
		return reading === 'absolute' ? ((value * 100 + Number(hundredths)) / 100) * (Number(numerator) / Number(denominator)) : (value * Number(numerator)) / Number(denominator);
	}
	const power = Math.min(parts.exponent, -2);
	let scaled = BigInt(parts.digits) * 10n ** BigInt(parts.exponent - power);
	if (parts.negative) scaled = -scaled;
	if (reading === 'absolute') scaled += hundredths * 10n ** BigInt(-2 - power);
	scaled *= numerator;
	if (scaled % denominator === 0n) return Number(`${scaled / denominator}e${power}`);
	const widen = BigInt(extraDigits) + BigInt(String(denominator).length);
	const quotient = (scaled * 10n ** widen) / denominator;
	// The remainder is not zero, so the exact value lies strictly beyond the truncated digits.
	const sticky = quotient * 10n + (scaled < 0n ? -1n : 1n);
	return Number(`${sticky}e${power - Number(widen) - 1}`);
}

/** A typed number in a unit, as its SI value: exact decimal scaling where the unit allows it. */
export function siFromDecimal(text: string, unit: CompoundUnit, reading: TemperatureReading = 'absolute'): number {
	if (unit.scale) return scaledTemperature(text, unit.scale, reading);
	if (unit.decade !== undefined) return scaledDecimal(text, unit.decade);
	return Number(text) * unit.factor + unit.offset;
}
