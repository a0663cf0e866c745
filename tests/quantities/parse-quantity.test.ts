import {describe, expect, it} from 'vitest';
import {parseQuantity} from '../../source/quantities/parse-quantity.js';
import type {Dimension} from '../../source/quantities/dimensions.js';

const valid: Array<{name: string; entry: string; dimension: Dimension; si: number}> = [
	{name: 'milliamperes with a space', entry: '250 mA', dimension: 'current', si: 0.25},
	{name: 'amperes without a space', entry: '0.25A', dimension: 'current', si: 0.25},
	{name: 'volts', entry: '2.1 V', dimension: 'voltage', si: 2.1},
	{name: 'degrees Celsius as kelvin', entry: '25 degC', dimension: 'temperature', si: 298.15},
	{name: 'degree sign', entry: '25 °C', dimension: 'temperature', si: 298.15},
	{name: 'nanometres', entry: '905 nm', dimension: 'length', si: 905e-9},
	{name: 'ohm spelled out', entry: '1.2 ohm', dimension: 'resistance', si: 1.2},
	{name: 'ohm sign', entry: '1.2 Ω', dimension: 'resistance', si: 1.2},
	{name: 'milliohm', entry: '50 mohm', dimension: 'resistance', si: 0.05},
	{name: 'milliohm with the ohm sign', entry: '50 mΩ', dimension: 'resistance', si: 0.05},
	{name: 'kilohm with the ohm sign, no space', entry: '4.7kΩ', dimension: 'resistance', si: 4700},
	{name: 'percent', entry: '10 %', dimension: 'ratio', si: 0.1},
	{name: 'percent without space', entry: '5%', dimension: 'ratio', si: 0.05},
	{name: 'plain fraction', entry: '0.1', dimension: 'ratio', si: 0.1},
	{name: 'thermal resistance', entry: '3 K/W', dimension: 'thermal_resistance', si: 3},
	{name: 'micro sign', entry: '5 µA', dimension: 'current', si: 5e-6},
	{name: 'Greek mu', entry: '5 μA', dimension: 'current', si: 5e-6},
	{name: 'u for micro', entry: '5 uA', dimension: 'current', si: 5e-6},
	{name: 'exponent', entry: '1e-3 A', dimension: 'current', si: 1e-3},
	{name: 'irradiance', entry: '1 mW/cm^2', dimension: 'irradiance', si: 10},
	{name: 'slope efficiency', entry: '1.1 W/A', dimension: 'slope_efficiency', si: 1.1},
	{name: 'temperature difference', entry: '60 K', dimension: 'temperature_difference', si: 60},
	{name: 'negative temperature', entry: '-10 degC', dimension: 'temperature', si: 263.15},
	{name: 'unicode minus', entry: '−10 degC', dimension: 'temperature', si: 263.15},
	{name: 'kilohm', entry: '4.7 kohm', dimension: 'resistance', si: 4700},
];

const invalid: Array<{name: string; entry: string; dimension: Dimension; code: string}> = [
	{name: 'current entered as a voltage', entry: '250 mV', dimension: 'current', code: 'entry-wrong-dimension'},
	{name: 'no unit for a current', entry: '250', dimension: 'current', code: 'entry-missing-unit'},
	{name: 'empty', entry: '', dimension: 'current', code: 'entry-empty'},
	{name: 'blank', entry: '   ', dimension: 'current', code: 'entry-empty'},
	{name: 'units are case-sensitive', entry: '250 ma', dimension: 'current', code: 'entry-unknown-unit'},
	{name: '25 C is coulomb, not Celsius', entry: '25 C', dimension: 'temperature', code: 'entry-wrong-dimension'},
	{name: 'words', entry: 'two amps', dimension: 'current', code: 'entry-not-a-number'},
	{name: 'NaN', entry: 'NaN', dimension: 'ratio', code: 'entry-not-a-number'},
	{name: 'Infinity', entry: 'Infinity A', dimension: 'current', code: 'entry-not-a-number'},
	{name: 'huge exponent', entry: '1e999 A', dimension: 'current', code: 'entry-not-finite'},
	{name: 'percent for a current', entry: '10 %', dimension: 'current', code: 'entry-wrong-dimension'},
	{name: 'unit for a ratio', entry: '5 V', dimension: 'ratio', code: 'entry-wrong-dimension'},
	{name: 'an expression', entry: '2+3 V', dimension: 'voltage', code: 'entry-unknown-unit'},
];

describe('parseQuantity', () => {
	it.each(valid)('reads $name', ({entry, dimension, si}) => {
		const parsed = parseQuantity(entry, dimension);
		expect(parsed.ok).toBe(true);
		if (parsed.ok) expect(parsed.value.si).toBeCloseTo(si, 12);
	});

	it.each(invalid)('refuses $name', ({entry, dimension, code}) => {
		const parsed = parseQuantity(entry, dimension);
		expect(parsed.ok).toBe(false);
		if (!parsed.ok) expect(parsed.problem.code).toBe(code);
	});

	it('names what it received when the dimension is wrong', () => {
		const parsed = parseQuantity('250 mV', 'current');
		expect(parsed).toMatchObject({ok: false, problem: {received: 'a voltage', expected: 'current'}});
	});
});
