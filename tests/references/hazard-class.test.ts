import {describe, expect, it} from 'vitest';
import {CalculationInputError} from '../../source/calculations/calculation.js';
import {continuousLimits, hazardClass} from '../../source/calculations/hazard-class.js';

const nm = 1e-9;

describe('hazard-class accessible emission limits', () => {
	it.each([
		{wavelength: 650, class1: 0.39e-3}, // IEC 60825-1:2007 Table 4 / 2014 Table 3 (from memory, high): 3.9×10⁻⁴ W, 400–700 nm, time base 100 s
		{wavelength: 808, class1: 0.6413e-3}, // same rows, 3.9×10⁻⁴·C4 W; computed 0.6413 mW at 808 nm
		{wavelength: 850, class1: 0.7782e-3}, // same: 0.7782 mW at 850 nm
		{wavelength: 905, class1: 1.0025e-3}, // same: 1.0025 mW at 905 nm
		{wavelength: 980, class1: 1.416e-3}, // same: 1.4160 mW at 980 nm
		{wavelength: 1064, class1: 1.95e-3}, // same: 1.95 mW at 1064 nm (C4 = 5)
		{wavelength: 430, class1: 39e-6}, // IEC photochemical Class 1 row (from memory, medium): 3.9×10⁻⁵·C3 W, 39 µW at 405–450 nm
	])('Class 1 at $wavelength nm is $class1 W', ({wavelength, class1}) => {
		expect(continuousLimits(wavelength).class1 / class1).toBeCloseTo(1, 3);
	});

	it.each([
		{wavelength: 808, class3r: 3.21e-3}, // IEC 3R = 5 × Class 1 outside 400–700 nm (from memory, medium): 808 nm 3.21 mW
		{wavelength: 905, class3r: 5.01e-3}, // same: 905 nm 5.01 mW
		{wavelength: 980, class3r: 7.08e-3}, // same: 980 nm 7.08 mW
		{wavelength: 1064, class3r: 9.75e-3}, // same: 1064 nm 9.75 mW
		{wavelength: 532, class3r: 5e-3}, // IEC Class 3R visible (from memory, medium): 5 mW, 5× Class 2
	])('Class 3R at $wavelength nm is $class3r W', ({wavelength, class3r}) => {
		expect(continuousLimits(wavelength).class3r / class3r).toBeCloseTo(1, 2);
	});

	it.each([
		{power: 0.3e-3, wavelength: 650, rank: 1}, // below 0.39 mW (IEC Class 1, from memory, high)
		{power: 0.8e-3, wavelength: 650, rank: 2}, // IEC Class 2 up to 1 mW, visible only (from memory, high)
		{power: 3e-3, wavelength: 650, rank: 3}, // US legacy IIIa / IEC 3R: 1–5 mW visible (health-physics list, 2000, seen)
		{power: 2e-3, wavelength: 808, rank: 3}, // above 0.64 mW, below 3.21 mW at 808 nm: 3R (no Class 2 outside 400–700 nm)
		{power: 0.1, wavelength: 532, rank: 4}, // IEC 3B up to 0.5 W (from memory, high)
		{power: 0.5, wavelength: 980, rank: 4}, // exactly 0.5 W is still 3B (from memory, high)
		{power: 2, wavelength: 808, rank: 5}, // above 0.5 W: Class 4 (from memory, high)
	])('$power W at $wavelength nm is rank $rank', ({power, wavelength, rank}) => {
		expect(hazardClass.compute({power, wavelength: wavelength * nm})['class_rank']).toBe(rank);
	});

	it('names the class in words and says the manufacturer’s classification counts', () => {
		const outputs = hazardClass.compute({power: 2, wavelength: 808 * nm});
		expect(hazardClass.notes!({}, outputs).join(' ')).toContain('Class 4');
		expect(hazardClass.caution).toMatch(/manufacturer's classification/);
	});

	it.each([380, 1310, 1550])('does not guess at %d nm', (wavelength) => {
		expect(() => hazardClass.compute({power: 0.01, wavelength: wavelength * nm})).toThrow(CalculationInputError);
	});
});
