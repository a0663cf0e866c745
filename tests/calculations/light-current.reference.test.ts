import {describe, expect, it} from 'vitest';
import {lightCurrent} from '../../source/calculations/light-current.js';

// P = S·(I − I_th) above threshold, S = η_d·hν/q with hν/q [V] = 1239.842/λ[nm]
// (Coldren et al., 2nd ed., ch. 2; Saleh & Teich, semiconductor-laser chapter; from memory).
type Case = {name: string; slope_efficiency: number; threshold: number; current: number; power: number};

const idealSlopeAt808 = 1239.842 / 808; // η_d = 1 at 808 nm: hν/q = 1.5344579 W/A

const cases: Case[] = [
	{name: 'below threshold', slope_efficiency: 1.1, threshold: 0.45, current: 0.3, power: 0}, // linear L-I model: no stimulated emission below threshold (from memory)
	{name: 'at threshold', slope_efficiency: 1.1, threshold: 0.45, current: 0.45, power: 0}, // linear L-I model: P = S × 0
	{name: 'no current', slope_efficiency: 1.1, threshold: 0.45, current: 0, power: 0}, // linear L-I model: P = 0
	{name: '1 A above threshold, ideal 808 nm diode', slope_efficiency: idealSlopeAt808, threshold: 0.5, current: 1.5, power: 1.5344579}, // Coldren ch. 2 (from memory): η_d = 1, hν/q = 1239.842/808 V → 1.5344579 W
	{name: 'cold threshold at the limit', slope_efficiency: 1.1, threshold: 0.4189783, current: 2, power: 1.7391239}, // hand arithmetic: 1.1 W/A × (2 − 0.4189783) A = 1.7391239 W
	{name: 'zero threshold', slope_efficiency: 0.35, threshold: 0, current: 1, power: 0.35}, // hand arithmetic: 0.35 W/A × 1 A
];

/** The output the policy's formulas use: optical power at a current. */
const powerAt = (slope_efficiency: number, threshold: number, current: number) => lightCurrent.compute({slope_efficiency, threshold, current})[lightCurrent.main]!;

describe('light-current reference values', () => {
	it.each(cases)('$name', ({slope_efficiency, threshold, current, power}) => {
		expect(powerAt(slope_efficiency, threshold, current)).toBeCloseTo(power, 6);
	});

	it('is linear above threshold: twice the excess current gives twice the power', () => {
		const once = powerAt(1.1, 0.45, 0.95); // linear L-I model: 1.1 × 0.5 = 0.55 W
		const twice = powerAt(1.1, 0.45, 1.45); // linear L-I model: 1.1 × 1.0 = 1.1 W
		expect(once).toBeCloseTo(0.55, 9);
		expect(twice).toBeCloseTo(2 * once, 9);
	});

	it.each([
		{power: 1.1, current: 1.45}, // hand arithmetic: 0.45 A + 1.1 W / 1.1 W/A = 1.45 A
		{power: 0, current: 0.45}, // linear L-I model: zero power at threshold
	])('needs $current A for $power W (the inverse)', ({power, current}) => {
		const result = lightCurrent.compute({slope_efficiency: 1.1, threshold: 0.45, power});
		expect(result['current_for_power']).toBeCloseTo(current, 9);
		expect(powerAt(1.1, 0.45, result['current_for_power']!)).toBeCloseTo(power, 9);
	});
});
