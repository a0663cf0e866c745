import {describe, expect, it} from 'vitest';
import type {Dimension} from '../../source/quantities/dimensions.js';
import {looksLikeNumericRange, parseRange, parseTolerance} from '../../source/quantities/range-entry.js';

// The ends in SI: SI prefixes m = 1e-3, u = 1e-6, n = 1e-9 (SI Brochure, 9th ed. (2019), table 7);
// t/°C = T/K − 273.15 (SI Brochure 2.3.1); a Celsius interval equals a kelvin interval.
const valid: Array<{entry: string; dimension: Dimension; low: number; high: number; middle: number}> = [
	{entry: '1.6 V .. 2.0 V', dimension: 'voltage', low: 1.6, high: 2, middle: 1.8}, // hand arithmetic: (1.6 + 2.0)/2 = 1.8
	{entry: '1.6..2.0 V', dimension: 'voltage', low: 1.6, high: 2, middle: 1.8}, // the low end borrows the high end's unit
	{entry: '1.8 V ± 0.2 V', dimension: 'voltage', low: 1.6, high: 2, middle: 1.8}, // 1.8 − 0.2, 1.8 + 0.2 (hand arithmetic)
	{entry: '1.8 V +/- 0.2 V', dimension: 'voltage', low: 1.6, high: 2, middle: 1.8}, // the same, for keyboards without ±
	{entry: '1.8 V +- 0.2 V', dimension: 'voltage', low: 1.6, high: 2, middle: 1.8}, // the same
	{entry: '1.8 ± 0.2 V', dimension: 'voltage', low: 1.6, high: 2, middle: 1.8}, // the middle borrows the tolerance's unit
	{entry: '12 V ± 5 %', dimension: 'voltage', low: 11.4, high: 12.6, middle: 12}, // 12 × 0.05 = 0.6 (hand arithmetic)
	{entry: '1800 mV ± 200 mV', dimension: 'voltage', low: 1.6, high: 2, middle: 1.8}, // 1800 mV = 1.8 V (SI prefix m)
	{entry: '25 degC .. 35 degC', dimension: 'temperature', low: 298.15, high: 308.15, middle: 303.15}, // SI Brochure 2.3.1
	{entry: '30 degC ± 5 K', dimension: 'temperature', low: 298.15, high: 308.15, middle: 303.15}, // 303.15 K ∓ 5 K (SI Brochure 2.3.1)
	{entry: '30 °C ± 5 degC', dimension: 'temperature', low: 298.15, high: 308.15, middle: 303.15}, // a 5 °C spread is a 5 K difference
	{entry: '10 % ± 1 %', dimension: 'ratio', low: 0.09, high: 0.11, middle: 0.1}, // on a ratio, one percentage point each way
	{entry: '2 V .. 2 V', dimension: 'voltage', low: 2, high: 2, middle: 2}, // equal ends: a range of one value
];

const invalid: Array<{entry: string; dimension: Dimension; code: string; end?: string}> = [
	{entry: '2.0 V .. 1.6 V', dimension: 'voltage', code: 'range-reversed'}, // low above high
	{entry: '1.8 V ± -0.2 V', dimension: 'voltage', code: 'range-reversed'}, // a negative spread
	{entry: '1.6 V ..', dimension: 'voltage', code: 'range-empty-end', end: 'high end'},
	{entry: '.. 2 V', dimension: 'voltage', code: 'range-empty-end', end: 'low end'},
	{entry: '1.8 V ±', dimension: 'voltage', code: 'range-empty-end', end: 'tolerance'},
	{entry: '1.6 V .. 2 A', dimension: 'voltage', code: 'range-mixed-dimensions', end: 'high end'},
	{entry: '1.6 A .. 2 V', dimension: 'voltage', code: 'range-mixed-dimensions', end: 'low end'},
	{entry: '1.8 V ± 0.2 A', dimension: 'voltage', code: 'range-mixed-dimensions', end: 'tolerance'},
	{entry: '25 degC ± 10 %', dimension: 'temperature', code: 'range-percent-temperature'},
	{entry: '1.6 V .. 2 zz', dimension: 'voltage', code: 'range-end-refused', end: 'high end'},
];

describe('a range entered for a quantity', () => {
	it.each(valid)('$entry reads as $low .. $high (middle $middle)', ({entry, dimension, low, high, middle}) => {
		const read = parseRange(entry, dimension);
		expect(read.ok).toBe(true);
		if (!read.ok) return;
		expect(read.value.low).toBeCloseTo(low, 12);
		expect(read.value.high).toBeCloseTo(high, 12);
		expect(read.value.middle).toBeCloseTo(middle, 12);
	});

	it.each(invalid)('$entry is refused: $code', ({entry, dimension, code, end}) => {
		const read = parseRange(entry, dimension);
		expect(read.ok ? 'accepted' : read.problem.code).toBe(code);
		if (!read.ok && end !== undefined) expect((read.problem as {end?: string}).end).toBe(end);
	});

	it.each([
		{entry: '1.6 V .. 2 V', range: true},
		{entry: '5 ± 1 mA', range: true},
		{entry: 'SN..1234', range: false}, // a serial number with two dots is text, not a range
		{entry: 'rev C', range: false},
	])('"$entry" reads as a numeric range: $range', ({entry, range}) => {
		expect(looksLikeNumericRange(entry)).toBe(range);
	});
});

describe("a rule file's default tolerance", () => {
	it.each([
		{text: '5 %', dimension: 'voltage' as Dimension, tolerance: {relative: 0.05}}, // 5 % = 0.05 (ISO 80000-1 on %)
		{text: '0.1 V', dimension: 'voltage' as Dimension, tolerance: {absolute: 0.1}},
		{text: '2 K', dimension: 'temperature' as Dimension, tolerance: {absolute: 2}}, // a temperature's tolerance is a difference
		{text: '2 degC', dimension: 'temperature' as Dimension, tolerance: {absolute: 2}}, // SI Brochure 2.3.1: 1 °C interval = 1 K
	])('$text on a $dimension', ({text, dimension, tolerance}) => {
		const read = parseTolerance(text, dimension);
		expect(read.ok && read.value).toEqual(tolerance);
	});

	it('refuses a percentage of a temperature', () => {
		const read = parseTolerance('5 %', 'temperature');
		expect(read.ok ? 'accepted' : read.problem.code).toBe('entry-wrong-dimension');
	});
});
