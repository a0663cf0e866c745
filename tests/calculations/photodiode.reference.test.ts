import {describe, expect, it} from 'vitest';
import {photodiode} from '../../source/calculations/photodiode.js';

// I_PD = R·P; an ideal detector has R = η·qλ/(hc) = λ[nm]/1239.842 A/W
// (Saleh & Teich, photodetector chapter, from memory).
type Case = {name: string; responsivity: number; power: number; monitor_current: number};

const cases: Case[] = [
	{name: 'no light', responsivity: 1e-3, power: 0, monitor_current: 0}, // responsivity definition (Saleh & Teich, from memory): no light, no photocurrent
	{name: '1 mA/W at 1.5 W', responsivity: 1e-3, power: 1.5, monitor_current: 1.5e-3}, // responsivity definition (Saleh & Teich, from memory), worked by hand: 1 mA/W × 1.5 W = 1.5 mA
	{name: 'ideal detector at 808 nm, 1 mW', responsivity: 808 / 1239.842, power: 1e-3, monitor_current: 0.6516959e-3}, // Saleh & Teich (from memory): η = 1, R = 808/1239.842 = 0.6516959 A/W
	{name: '2 mA/W at 1.5 W', responsivity: 2e-3, power: 1.5, monitor_current: 3e-3}, // responsivity definition (Saleh & Teich, from memory), worked by hand: 2 mA/W × 1.5 W = 3 mA
];

describe('photodiode reference values', () => {
	it.each(cases)('$name', ({responsivity, power, monitor_current}) => {
		const current = photodiode.compute({responsivity, power})[photodiode.main]!;
		// seven significant figures, as the hand values are written
		expect(Math.abs(current - monitor_current)).toBeLessThanOrEqual(Math.max(1e-15, 1e-7 * monitor_current));
	});

	it('finds the optical power from a monitor current (the inverse)', () => {
		const result = photodiode.compute({responsivity: 1e-3, monitor_current: 1.5e-3});
		expect(result['power_at_current']).toBeCloseTo(1.5, 9); // responsivity definition (Saleh & Teich, from memory), worked by hand: 1.5 mA / (1 mA/W) = 1.5 W
	});
});
