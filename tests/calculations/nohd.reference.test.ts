import fc from 'fast-check';
import {describe, expect, it} from 'vitest';
import {nohd} from '../../source/calculations/nohd.js';

const nm = 1e-9;

describe('nohd reference values', () => {
	it('puts a 1 W visible beam of 1 mrad at about 225 m', () => {
		// training booklet "Fundamentals of Medical/Aesthetic Lasers and IPLs" v1.2, ch. 1 (seen):
		// 1 W visible, φ = 1 mrad, a ≈ 0, t = 0.25 s → NOHD ≈ 225 m (its MPE rounded to 2.5 mW/cm²)
		const result = nohd.compute({power: 1, diameter: 0, divergence: 1e-3, wavelength: 532 * nm, duration: 0.25, edition: 2014});
		expect(Math.abs(result['nohd']! / 225 - 1)).toBeLessThan(0.01);
		// with the unrounded MPE, 25.4558 W/m²: √(4/(π·25.4558))/0.001 = 223.6 m
		expect(result['nohd']).toBeCloseTo(223.6, 1);
	});

	it.each([
		// ANSI Z136.1 Appendix B formula (from memory) as given by the University of Chicago guide (seen), worked by hand:
		// 5 mW at 633 nm, a = 1 mm, φ = 1 mrad: (√(4 × 0.005/(π × 25.4558)) − 0.001)/0.001 = 14.815 m
		{power: 5e-3, diameter: 1e-3, divergence: 1e-3, wavelength: 633 * nm, duration: 0.25, expected: 14.8142},
		// same formula (from memory), worked by hand: 808 nm, 10 s → MPE 16.4437 W/m²; 2 W, a = 3 mm, φ = 150 mrad → 2.6035 m
		{power: 2, diameter: 3e-3, divergence: 0.15, wavelength: 808 * nm, duration: 10, expected: 2.6035},
		// UChicago guide (seen): NOHD is 0 once √(4P/(π·MPE)) ≤ a: 1 mW in a 10 mm beam, √ term 7.07 mm
		{power: 1e-3, diameter: 10e-3, divergence: 1e-3, wavelength: 633 * nm, duration: 0.25, expected: 0},
	])('$power W, a = $diameter m, φ = $divergence rad → $expected m', ({power, diameter, divergence, wavelength, duration, expected}) => {
		const result = nohd.compute({power, diameter, divergence, wavelength, duration, edition: 2014});
		expect(result['nohd']).toBeCloseTo(expected, 3);
	});

	it('grows with power and shrinks with divergence', () => {
		fc.assert(
			fc.property(fc.double({min: 1e-3, max: 100, noNaN: true}), fc.double({min: 1e-4, max: 1, noNaN: true}), (power, divergence) => {
				const at = (p: number, phi: number) => nohd.compute({power: p, diameter: 0, divergence: phi, wavelength: 905 * nm, duration: 10, edition: 2014})['nohd']!;
				return at(power * 2, divergence) > at(power, divergence) && at(power, divergence * 2) < at(power, divergence);
			}),
		);
	});
});
