import {describe, expect, it} from 'vitest';
import {formatQuantity, roundedText} from '../../source/quantities/format.js';
import type {Dimension} from '../../source/quantities/dimensions.js';

const cases: Array<{si: number; dimension: Dimension; text: string}> = [
	{si: 26, dimension: 'power', text: '26 W'},
	{si: 0.24, dimension: 'current', text: '240 mA'},
	{si: 18, dimension: 'irradiance', text: '1.8 mW/cm^2'},
	{si: 10, dimension: 'irradiance', text: '1 mW/cm^2'},
	{si: 298.15, dimension: 'temperature', text: '25 °C'},
	{si: 263.15, dimension: 'temperature', text: '-10 °C'},
	{si: 60, dimension: 'temperature_difference', text: '60 K'},
	{si: 0.1, dimension: 'ratio', text: '10 %'},
	{si: 0.15, dimension: 'resistance', text: '150 mΩ'},
	{si: 4700, dimension: 'resistance', text: '4.7 kΩ'},
	{si: 5e-6, dimension: 'current', text: '5 µA'},
	{si: 905e-9, dimension: 'length', text: '905 nm'},
	{si: 0, dimension: 'voltage', text: '0 V'},
	{si: 0.99996, dimension: 'current', text: '1 A'},
	{si: 1.23456, dimension: 'voltage', text: '1.23 V'},
	{si: -1.5, dimension: 'voltage', text: '-1.5 V'},
	{si: 3, dimension: 'thermal_resistance', text: '3 K/W'},
	{si: 4.25, dimension: 'number', text: '4.25'},
	{si: Number.POSITIVE_INFINITY, dimension: 'power', text: '∞'},
	{si: Number.NaN, dimension: 'power', text: 'not a number'},
];

describe('formatQuantity', () => {
	it.each(cases)('shows $si in $dimension as "$text"', ({si, dimension, text}) => {
		expect(formatQuantity(si, dimension)).toBe(text);
	});

	it.each([
		[26.0, '26'],
		[0.2400, '0.24'],
		[123456, '123000'],
		[1234567, '1.23e+6'],
		[0.00001234, '1.23e-5'],
	])('rounds %d to "%s"', (value, text) => {
		expect(roundedText(value)).toBe(text);
	});
});
