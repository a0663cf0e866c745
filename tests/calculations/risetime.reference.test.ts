import fc from 'fast-check';
import {describe, expect, it} from 'vitest';
import {risetime} from '../../source/calculations/risetime.js';

const cases = [
	{bandwidth: 1e6, rise: 349.699e-9}, // H. Johnson & M. Graham, High-Speed Digital Design (1993), ch. 1: t_r·f_c = ln 9/(2π) = 0.349699; 1 MHz → 349.70 ns
	{bandwidth: 100e6, rise: 3.49699e-9}, // same source: 100 MHz → 3.4970 ns
	{bandwidth: 1 / (2 * Math.PI), rise: Math.log(9)}, // Horowitz & Hill, The Art of Electronics, 3rd ed., §1.4: t_r = τ·ln 9 = 2.1972·τ with τ = 1 s
	{bandwidth: 350e6, rise: 0.999140e-9}, // Johnson & Graham rule of thumb 0.35/f: 350 MHz ≈ 1 ns (exact 0.99914 ns)
];

describe('risetime reference values', () => {
	it.each(cases)('$bandwidth Hz → $rise s', ({bandwidth, rise}) => {
		expect(risetime.compute({bandwidth})['rise_time']! / rise).toBeCloseTo(1, 5);
	});

	it('keeps rise time × bandwidth constant at ln 9/(2π)', () => {
		fc.assert(
			fc.property(fc.double({min: 1, max: 1e12, noNaN: true}), (bandwidth) => {
				const product = risetime.compute({bandwidth})['rise_time']! * bandwidth;
				return Math.abs(product - 0.3496991526) < 1e-9;
			}),
		);
	});
});
