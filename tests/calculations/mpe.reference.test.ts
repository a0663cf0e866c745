import {describe, expect, it} from 'vitest';
import {CalculationInputError} from '../../source/calculations/calculation.js';
import {mpe} from '../../source/calculations/mpe.js';

const nm = 1e-9;

// The calculation as `calc mpe` and rule formulas call it; tests/calculations/mpe-table.reference.test.ts
// walks the whole table, its boundaries and its monotonicity.
const cases = [
	{name: '532 nm, 0.25 s', wavelength: 532 * nm, duration: 0.25, edition: 2014, irradiance: 25.4558, exposure: 6.36396}, // FoS-2015 and IEC-2007 handout (seen): H = 18·t^0.75 J/m², the well-known ≈25 W/m² (2.55 mW/cm²)
	{name: '1064 nm, 2 ns, 2007 edition', wavelength: 1064 * nm, duration: 2e-9, edition: 2007, irradiance: 2.5e7, exposure: 0.05}, // training booklet OD example (seen): MPE 5×10⁻⁶ J/cm² = 0.05 J/m² (IEC 60825-1:2007), its 10⁻⁹–5×10⁻⁵ s row taken inside, at 2 ns
	{name: '450 nm, 1000 s, photochemical', wavelength: 450 * nm, duration: 1000, edition: 2014, irradiance: 1, exposure: 1000}, // IEC-2007 handout (seen): E = 1·C_B W/m², C_B = 1 at 450 nm
	{name: '633 nm, 1000 s, thermal', wavelength: 633 * nm, duration: 1000, edition: 2014, irradiance: 10, exposure: 1e4}, // EU-AOR Table 2.3 / ANSI Z136.1-2014 (from memory, high): 1.0 mW/cm²
	{name: '1064 nm, 100 s', wavelength: 1064 * nm, duration: 100, edition: 2014, irradiance: 50, exposure: 5000}, // ANSI Z136.1 (from memory, high): 5.0·C_C mW/cm² for 1050–1400 nm
];

describe('mpe reference values', () => {
	it.each(cases)('$name', ({wavelength, duration, edition, irradiance, exposure}) => {
		const result = mpe.compute({wavelength, duration, edition});
		expect(result['irradiance']! / irradiance).toBeCloseTo(1, 5);
		expect(result['radiant_exposure']! / exposure).toBeCloseTo(1, 5);
	});

	it('says which limit applied and which edition', () => {
		const notes = mpe.notes!({wavelength: 488 * nm, duration: 100, edition: 2014}, {}).join(' ');
		expect(notes).toMatch(/photochemical/);
		expect(notes).toMatch(/IEC 60825-1:2014/);
	});

	it.each<{name: string; inputs: Record<string, number>; key: string}>([
		{name: 'below 180 nm', inputs: {wavelength: 100 * nm, duration: 1, edition: 2014}, key: 'wavelength'},
		{name: 'beyond 1 mm', inputs: {wavelength: 2e-3, duration: 1, edition: 2014}, key: 'wavelength'},
		{name: 'longer than 3×10⁴ s', inputs: {wavelength: 532 * nm, duration: 4e4, edition: 2014}, key: 'duration'},
		{name: 'an edition that is not implemented', inputs: {wavelength: 532 * nm, duration: 1, edition: 2010}, key: 'edition'},
		{name: 'for a pulse train (repetitive pulses are not covered)', inputs: {wavelength: 1064 * nm, duration: 1e-8, edition: 2014, repetition_rate: 1e4}, key: 'repetition_rate'},
	])('refuses a value $name rather than guessing', ({inputs, key}) => {
		expect(() => mpe.compute(inputs)).toThrow(CalculationInputError);
		try {
			mpe.compute(inputs);
		} catch (error) {
			expect((error as CalculationInputError).key).toBe(key);
		}
	});
});
