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

	it.each([170, 2e6])('does not guess at %d nm, outside 180 nm–1 mm', (wavelength) => {
		expect(() => hazardClass.compute({power: 0.01, wavelength: wavelength * nm})).toThrow(CalculationInputError);
	});
});

// Areas by hand: 1 mm aperture π(0.5 mm)² = 7.853982×10⁻⁷ m²; 3.5 mm aperture π(1.75 mm)² = 9.621128×10⁻⁶ m².
const area1mm = 7.853982e-7;
const area3p5mm = 9.621128e-6;

describe('hazard-class over 180 nm–1 mm', () => {
	// prettier-ignore
	it.each([
		{wavelength: 300, class1: (30 * area1mm) / 3e4, class3r: (5 * 30 * area1mm) / 3e4, class3b: 1.5e-3}, // IEC 60825-1:2007 Table 4 180–302.5 nm 2.4×10⁻⁵ J over 3×10⁴ s = 8×10⁻¹⁰ W (from memory; 30 J/m² × 1 mm aperture = 7.854×10⁻¹⁰ W by hand); 3B 1.5×10⁻³ W (Table 6, from memory, medium)
		{wavelength: 310, class1: (1000 * area1mm) / 3e4, class3r: (5 * 1000 * area1mm) / 3e4, class3b: 0.05}, // C2(310) = 10^(0.2·15) = 1000 J/m² (IEC-2007 handout, seen) × 1 mm aperture / 3×10⁴ s = 2.618×10⁻⁸ W by hand; 3B 5×10⁻⁵·C2 = 0.05 W (from memory, medium)
		{wavelength: 375, class1: (1e4 * area1mm) / 3e4, class3r: (5 * 1e4 * area1mm) / 3e4, class3b: 0.5}, // 10⁴ J/m² held to 3×10⁴ s (DGUV Information 203-042 Annex 6) × 1 mm aperture / 3×10⁴ s = 2.618×10⁻⁷ W by hand; 3B 0.5 W (IEC Table 6, from memory, high)
		{wavelength: 905, class1: 3.9e-4 * 10 ** 0.41, class3r: 5 * 3.9e-4 * 10 ** 0.41, class3b: 0.5}, // IEC 3.9×10⁻⁴·C4 W, C4 = 10^(0.002·205) = 10^0.41: 1.0025 mW at 905 nm (from memory, high); 3R 5× (medium)
		{wavelength: 1310, class1: 1000 * area3p5mm, class3r: 5 * 1000 * area3p5mm, class3b: 0.5}, // 3.9×10⁻⁴·5·(8 + 10^2.4) = 0.505 W (2014 C7, from memory) is capped at the 1400 nm value 1000 W/m² × 3.5 mm = 9.621 mW (by hand)
		{wavelength: 1550, class1: 1000 * area3p5mm, class3r: 5 * 1000 * area3p5mm, class3b: 0.5}, // 1000 W/m² (10 s–3×10⁴ s, from memory, high) × 3.5 mm aperture = 9.621 mW, "about 10 mW" (IEC Table 3, from memory, medium); 3R ≈ 48 mW
		{wavelength: 10600, class1: 1000 * area3p5mm, class3r: 5 * 1000 * area3p5mm, class3b: 0.5}, // same rows to 0.1 mm (from memory, medium)
		{wavelength: 5e5, class1: 1e-2, class3r: 5e-2, class3b: 0.5}, // 0.1–1 mm: 11 mm aperture gives 95 mW, above the table's 10 mW (from memory, medium), which applies
	])('$wavelength nm: Class 1 $class1 W, 3R $class3r W, 3B $class3b W', ({wavelength, class1, class3r, class3b}) => {
		const limits = continuousLimits(wavelength);
		expect(limits.class1 / class1).toBeCloseTo(1, 5);
		expect(limits.class3r / class3r).toBeCloseTo(1, 5);
		expect(limits.class3b / class3b).toBeCloseTo(1, 5);
		expect(limits.class2).toBeUndefined(); // Class 2 exists only for 400–700 nm (IEC 60825-1, from memory, high)
	});

	it('takes the 180–302.5 nm Class 1 within 2 % of the printed 8×10⁻¹⁰ W (2.4×10⁻⁵ J over 3×10⁴ s, from memory)', () => {
		expect(continuousLimits(300).class1 / 8e-10).toBeGreaterThan(0.98);
		expect(continuousLimits(300).class1 / 8e-10).toBeLessThanOrEqual(1);
	});

	// prettier-ignore
	it.each([
		{power: 5e-3, wavelength: 1550, rank: 1}, // below 9.62 mW (by hand, above)
		{power: 20e-3, wavelength: 1550, rank: 3}, // between 9.62 mW and 48.1 mW: 3R
		{power: 0.1, wavelength: 1550, rank: 4}, // up to 0.5 W: 3B (from memory, high)
		{power: 1, wavelength: 1550, rank: 5}, // above 0.5 W: Class 4
		{power: 5e-3, wavelength: 1310, rank: 1}, // below the capped 9.62 mW
		{power: 1e-3, wavelength: 375, rank: 4}, // 1 mW is far above 5 × 2.618×10⁻⁷ W, below 0.5 W: 3B
		{power: 0.05, wavelength: 375, rank: 4}, // the 50 mW 375 nm beam of the eyewear example: 3B
		{power: 1e-6, wavelength: 300, rank: 4}, // above 3.9×10⁻⁹ W, below 1.5 mW: 3B
		{power: 2e-3, wavelength: 300, rank: 5}, // above 1.5 mW at 300 nm: Class 4
		{power: 1e-7, wavelength: 375, rank: 1}, // below 2.618×10⁻⁷ W: Class 1
		{power: 45e-3, wavelength: 10600, rank: 3}, // ≤ 5 × 9.621 mW = 48.1 mW: 3R (by hand)
		{power: 50e-3, wavelength: 10600, rank: 4}, // 50 mW > 48.1 mW: 3B
	])('$power W at $wavelength nm is rank $rank', ({power, wavelength, rank}) => {
		expect(hazardClass.compute({power, wavelength: wavelength * nm})['class_rank']).toBe(rank);
	});
});
