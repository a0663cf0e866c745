import {describe, expect, it} from 'vitest';
import {derating} from '../../source/calculations/derating.js';

const kelvin = (celsius: number) => celsius + 273.15;

type Case = {name: string; rated_power: number; rated_ambient: number; max_temperature: number; ambient: number; allowed_power: number};

const cases: Case[] = [
	{name: 'below the rated ambient', rated_power: 10, rated_ambient: kelvin(25), max_temperature: kelvin(125), ambient: kelvin(20), allowed_power: 10}, // common practice: manufacturers' curves are flat up to the rated ambient
	{name: 'at the rated ambient', rated_power: 10, rated_ambient: kelvin(25), max_temperature: kelvin(125), ambient: kelvin(25), allowed_power: 10}, // common practice: the full rating applies at the rated ambient
	{name: '10 K above the rated ambient', rated_power: 10, rated_ambient: kelvin(25), max_temperature: kelvin(125), ambient: kelvin(35), allowed_power: 9}, // hand arithmetic: 10 W × (125 − 35)/(125 − 25) = 9 W
	{name: 'halfway to the maximum', rated_power: 10, rated_ambient: kelvin(25), max_temperature: kelvin(125), ambient: kelvin(75), allowed_power: 5}, // hand arithmetic: 10 W × 50/100 = 5 W
	{name: 'at the maximum temperature', rated_power: 10, rated_ambient: kelvin(25), max_temperature: kelvin(125), ambient: kelvin(125), allowed_power: 0}, // common practice: a linear derating reaches zero at the maximum temperature
	{name: 'above the maximum temperature', rated_power: 10, rated_ambient: kelvin(25), max_temperature: kelvin(125), ambient: kelvin(140), allowed_power: 0}, // common practice: no dissipation is allowed above the maximum
];

// Published heat-sink worked example: θ_jc = 3.125 °C/W, T_J(max) = 150 °C, θ_cs + θ_sa = 13 °C/W,
// P_D = 3.9 W, T_A = 25 °C → T_C = 76 °C, T_J = 88 °C; with P_D = 6 W, T_C = 103 °C.
// Linear derating P_max(T) = (T_J(max) − T)/θ with θ = θ_jc + θ_cs + θ_sa = 16.125 °C/W.
const thetaJunctionCase = 3.125; // published worked example
const thetaCaseAmbient = 13; // published worked example (θ_cs + θ_sa)
const thetaTotal = thetaJunctionCase + thetaCaseAmbient; // hand arithmetic: 16.125 °C/W
const junctionMax = 150; // published worked example, °C
const ratingAt25 = (junctionMax - 25) / thetaTotal; // hand arithmetic: 125/16.125 = 7.7519380 W

const allowedInExample = (ambient: number) =>
	derating.compute({rated_power: ratingAt25, rated_ambient: kelvin(25), max_temperature: kelvin(junctionMax), ambient: kelvin(ambient)})['allowed_power']!;

describe('derating reference values', () => {
	it.each(cases)('$name', ({rated_power, rated_ambient, max_temperature, ambient, allowed_power}) => {
		expect(derating.compute({rated_power, rated_ambient, max_temperature, ambient})['allowed_power']).toBeCloseTo(allowed_power, 9);
	});

	it('agrees with the heat-sink worked example at 3.9 W and 25 °C', () => {
		const allowed = allowedInExample(25); // P_max(25 °C) = 125/16.125 = 7.7519 W (linear derating, hand arithmetic)
		expect(allowed).toBeCloseTo(7.751938, 5);
		expect(allowed).toBeGreaterThan(3.9); // published worked example: 3.9 W keeps T_J = 88 °C below 150 °C
		const junction = junctionMax - (allowed - 3.9) * thetaTotal; // 150 − (7.7519 − 3.9) × 16.125 = 87.89 °C
		expect(Math.abs(junction - 88)).toBeLessThan(0.5); // published worked example: T_J = 88 °C
		expect(Math.abs(junction - 3.9 * thetaJunctionCase - 76)).toBeLessThan(0.5); // published worked example: T_C = 76 °C
	});

	it('agrees with the heat-sink worked example at 6 W and 25 °C', () => {
		const junction = junctionMax - (allowedInExample(25) - 6) * thetaTotal; // 150 − (7.7519 − 6) × 16.125 = 121.75 °C
		expect(Math.abs(junction - 6 * thetaJunctionCase - 103)).toBeLessThan(0.5); // published worked example: T_C = 103 °C
	});

	it('allows exactly 3.9 W at the ambient where 3.9 W brings the junction to its maximum', () => {
		const ambient = junctionMax - 3.9 * thetaTotal; // hand arithmetic from the worked example: 150 − 62.8875 = 87.1125 °C
		expect(allowedInExample(ambient)).toBeCloseTo(3.9, 9);
	});
});
