import {describe, expect, it} from 'vitest';
import {heatsink} from '../../source/calculations/heatsink.js';

const kelvin = (celsius: number) => celsius + 273.15;

// A published worked example of transistor heat sinking: θ_jc = 3.125 °C/W, θ_cs + θ_sa = 13 °C/W, T_A = 25 °C;
// P_D = 3.9 W gives T_C = 76 °C and T_J = 88 °C; P_D = 6 W gives T_C = 103 °C.
const cases = [
	{name: 'case at 76 °C with 3.9 W: θ_cs + θ_sa = 13 °C/W', power: 3.9, ambient: kelvin(25), max_temperature: kelvin(76), theta_jc: 0, theta_cs: 0, theta_sa: 13, tolerance: 0.13}, // worked example: T_C = 76 °C at 3.9 W (rounded to 1 °C: ±0.5 K / 3.9 W = ±0.13 K/W)
	{name: 'junction at 88 °C with 3.9 W and θ_jc 3.125', power: 3.9, ambient: kelvin(25), max_temperature: kelvin(88), theta_jc: 3.125, theta_cs: 0, theta_sa: 13, tolerance: 0.13}, // worked example: T_J = 88 °C at 3.9 W (rounded to 1 °C)
	{name: 'case at 103 °C with 6 W', power: 6, ambient: kelvin(25), max_temperature: kelvin(103), theta_jc: 0, theta_cs: 0, theta_sa: 13, tolerance: 0.01}, // worked example: T_C = 103 °C at 6 W
	{name: 'junction limit 150 °C with 3.9 W', power: 3.9, ambient: kelvin(25), max_temperature: kelvin(150), theta_jc: 3.125, theta_cs: 0, theta_sa: 125 / 3.9 - 3.125, tolerance: 1e-9}, // worked example's T_J(max) = 150 °C: (150 − 25)/3.9 − 3.125 = 28.93 K/W
];

describe('heatsink reference values', () => {
	it.each(cases)('$name', ({power, ambient, max_temperature, theta_jc, theta_cs, theta_sa, tolerance}) => {
		const result = heatsink.compute({power, ambient, max_temperature, theta_jc, theta_cs});
		expect(Math.abs(result['theta_sa']! - theta_sa)).toBeLessThanOrEqual(tolerance);
	});

	it('says no heat sink can do it when the case alone is over budget', () => {
		const inputs = {power: 20, ambient: kelvin(40), max_temperature: kelvin(100), theta_jc: 2.5, theta_cs: 0.5}; // common practice: (100 − 40)/20 = 3 K/W, all used by θ_jc + θ_cs
		const result = heatsink.compute(inputs);
		expect(result['theta_sa']).toBeCloseTo(0, 12);
		expect(heatsink.notes?.(inputs, result).join(' ')).toMatch(/No heat sink can do it/);
	});
});
