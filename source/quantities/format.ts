import {dimensions, type Dimension} from './dimensions.js';
import {quantity, toUnit} from './engine.js';

const prefixes: Record<number, string> = {
	[-15]: 'f',
	[-12]: 'p',
	[-9]: 'n',
	[-6]: 'µ',
	[-3]: 'm',
	0: '',
	3: 'k',
	6: 'M',
	9: 'G',
	12: 'T',
};

/** Rounds to `digits` significant figures and drops trailing zeros: 26.0 → "26", 0.2400 → "0.24". */
export function roundedText(value: number, digits = 3): string {
	if (value === 0) return '0';
	const fixed = Number(value.toPrecision(digits));
	const magnitude = Math.abs(fixed);
	if (magnitude >= 1e6 || magnitude < 1e-4) return fixed.toExponential(digits - 1).replace(/\.?0+e/, 'e');
	return String(fixed);
}

function withPrefix(value: number, symbol: string, digits: number): string {
	if (value === 0) return `0 ${symbol}`;
	let exponent = Math.floor(Math.log10(Math.abs(value)) / 3) * 3;
	exponent = Math.min(12, Math.max(-15, exponent));
	let scaled = value / 10 ** exponent;
	// 999.96 mA rounds to "1000 mA"; step up a prefix so it reads "1 A".
	if (Math.abs(Number(scaled.toPrecision(digits))) >= 1000 && exponent < 12) {
		exponent += 3;
		scaled = value / 10 ** exponent;
	}
	return `${roundedText(scaled, digits)} ${prefixes[exponent] ?? ''}${symbol}`;
}

/**
 * Formats a value held in coherent SI units for a person to read: engineering prefixes,
 * three significant figures, temperatures in °C, irradiance in mW/cm^2, ratios in %.
 */
export function formatQuantity(si: number, dimension: Dimension, digits = 3): string {
	if (Number.isNaN(si)) return 'not a number';
	if (!Number.isFinite(si)) return si > 0 ? '∞' : '−∞';
	const info = dimensions[dimension];
	switch (dimension) {
		case 'temperature':
			return `${roundedText(Number((si - 273.15).toFixed(2)), digits + 1)} °C`;
		case 'ratio':
			return `${roundedText(si * 100, digits)} %`;
		case 'number':
			// Whole numbers (a gauge, an edition year, a count) are shown as they are.
			return Number.isInteger(si) && Math.abs(si) < 1e6 ? String(si) : roundedText(si, digits);
		default:
			break;
	}
	if (info.prefixed) return withPrefix(si, info.display, digits);
	const shown = info.display === info.si ? si : toUnit(quantity(si, info.si), info.display);
	return `${roundedText(shown, digits)} ${info.display}`;
}
