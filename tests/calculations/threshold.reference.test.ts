import fc from 'fast-check';
import {describe, expect, it} from 'vitest';
import {threshold} from '../../source/calculations/threshold.js';

const kelvin = (celsius: number) => celsius + 273.15;

// I_th(T) = I_th(T_ref)·exp((T − T_ref)/T0): characteristic-temperature model (Coldren, Corzine &
// Mašanović, 2nd ed., ch. 2, from memory; J_th ∝ exp(T/T0) for double-heterojunction lasers, "The temperature dependence of threshold current for double-heterojunction lasers", 1979).
type Case = {name: string; threshold_ref: number; temperature_ref: number; t0: number; temperature: number; expected: number};

const cases: Case[] = [
	{name: 'at the reference temperature', threshold_ref: 0.45, temperature_ref: kelvin(25), t0: 140, temperature: kelvin(25), expected: 0.45}, // characteristic-temperature model: exp(0) = 1
	{name: 'one T0 above the reference', threshold_ref: 0.45, temperature_ref: kelvin(25), t0: 140, temperature: kelvin(165), expected: 1.2232268}, // characteristic-temperature model: 0.45 A × e = 1.2232268 A
	{name: 'T0·ln 2 above the reference doubles it', threshold_ref: 0.12, temperature_ref: kelvin(25), t0: 60, temperature: kelvin(25) + 60 * Math.LN2, expected: 0.24}, // T0 = 60 K typical of InGaAsP/InP (typical range for the material, photonics glossary); exp(ln 2) = 2
	{name: '10 K colder with T0 = 60 K', threshold_ref: 0.12, temperature_ref: kelvin(25), t0: 60, temperature: kelvin(15), expected: 0.12 * 0.8464817}, // T0 = 60 K typical of InGaAsP/InP (typical range for the material, photonics glossary); exp(−10/60) = 0.8464817
	{name: '20 K hotter with T0 = 160 K', threshold_ref: 0.03, temperature_ref: kelvin(25), t0: 160, temperature: kelvin(45), expected: 0.03 * 1.1331485}, // T0 = 160 K for an AlGaAs/GaAs DH laser (a textbook exercise value); exp(20/160) = 1.1331485
	{name: '10 K colder with T0 = 140 K', threshold_ref: 0.45, temperature_ref: kelvin(25), t0: 140, temperature: kelvin(15), expected: 0.4189783}, // T0 = 140 K inside 120–160 K for AlGaAs/GaAs (typical range for the material, photonics glossary); 0.45 × exp(−1/14) = 0.4189783 A
];

describe('threshold reference values', () => {
	it.each(cases)('$name', ({threshold_ref, temperature_ref, t0, temperature, expected}) => {
		expect(threshold.compute({threshold_ref, temperature_ref, t0, temperature})['threshold']).toBeCloseTo(expected, 6);
	});
});

describe('threshold properties', () => {
	const temperatures = fc.double({min: 200, max: 400, noNaN: true});
	const t0s = fc.double({min: 10, max: 1000, noNaN: true});

	it('depends only on the temperature difference: I(T1)/I(T2) = exp((T1 − T2)/T0)', () => {
		fc.assert(
			fc.property(temperatures, temperatures, temperatures, t0s, (reference, first, second, t0) => {
				const at = (temperature: number) => threshold.compute({threshold_ref: 0.1, temperature_ref: reference, t0, temperature})['threshold']!;
				const ratio = at(first) / at(second);
				return Math.abs(ratio / Math.exp((first - second) / t0) - 1) < 1e-9;
			}),
		);
	});

	it('never gives a colder diode a higher threshold', () => {
		fc.assert(
			fc.property(temperatures, temperatures, t0s, (first, second, t0) => {
				const at = (temperature: number) => threshold.compute({threshold_ref: 0.1, temperature_ref: 298.15, t0, temperature})['threshold']!;
				return first <= second ? at(first) <= at(second) : at(first) >= at(second);
			}),
		);
	});
});
