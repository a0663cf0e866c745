import fc from 'fast-check';
import {describe, expect, it} from 'vitest';
import {dissipation} from '../../source/calculations/dissipation.js';

type Case = {name: string; supply: number; knee: number; series_resistance: number; limit: number; worst_power: number; worst_current: number; fault_power: number};

const cases: Case[] = [
	{name: '2 V diode at 1 A from 28 V', supply: 28, knee: 2, series_resistance: 0, limit: 1, worst_power: 26, worst_current: 1, fault_power: 28}, // common practice: a linear driver running a 2 V diode at 1 A from 28 V dissipates 26 W
	{name: 'rack supply at its high tolerance', supply: 29.4, knee: 1.8, series_resistance: 0.2, limit: 1, worst_power: 27.4, worst_current: 1, fault_power: 29.4}, // hand arithmetic: I* = (29.4 − 1.8)/(2 × 0.2) = 69 A > 1 A, so (29.4 − 1.8 − 0.2 × 1) × 1 A = 27.4 W
	{name: 'peak inside the range', supply: 28, knee: 2, series_resistance: 1, limit: 20, worst_power: 169, worst_current: 13, fault_power: 560}, // closed form: I* = (V − knee)/(2R) = 26/2 = 13 A, P* = (V − knee)²/(4R) = 676/4 = 169 W
	{name: 'peak just past the limit', supply: 28, knee: 2, series_resistance: 1, limit: 12, worst_power: 168, worst_current: 12, fault_power: 336}, // hand arithmetic: I* = 13 A > 12 A, so (28 − 2 − 12) × 12 = 168 W
	{name: 'low-voltage bench supply', supply: 5.25, knee: 1.6, series_resistance: 0.15, limit: 2, worst_power: 6.7, worst_current: 2, fault_power: 10.5}, // hand arithmetic: I* = 3.65/0.3 = 12.2 A > 2 A, so (5.25 − 1.6 − 0.3) × 2 = 6.7 W
	{name: 'knee above the supply', supply: 1, knee: 2, series_resistance: 0.1, limit: 1, worst_power: 0, worst_current: 1, fault_power: 1}, // common practice: below the knee no forward current flows, so the driver passes none
];

/** P(I) = (V − knee − R·I)·I, zero where the supply cannot push that current. */
const powerAt = (supply: number, knee: number, resistance: number, current: number) => Math.max(0, (supply - knee - resistance * current) * current);

describe('dissipation reference values', () => {
	it.each(cases)('$name', ({supply, knee, series_resistance, limit, worst_power, worst_current, fault_power}) => {
		const result = dissipation.compute({supply, knee, series_resistance, limit});
		expect(result['worst_power']).toBeCloseTo(worst_power, 9);
		expect(result['worst_current']).toBeCloseTo(worst_current, 9);
		expect(result['fault_power']).toBeCloseTo(fault_power, 9);
	});

	it('puts the 26 W of a 2 V diode at 1 A from 28 V far above a 9 W rating', () => {
		const worst = dissipation.compute({supply: 28, knee: 2, series_resistance: 0, limit: 1})['worst_power']!; // common practice: (28 V − 2 V) × 1 A = 26 W
		expect(worst).toBeCloseTo(26, 9);
		expect(worst).toBeGreaterThan(9); // common practice: a 9 W driver rating
	});
});

describe('dissipation properties', () => {
	const setups = fc.record({
		supply: fc.double({min: 0, max: 100, noNaN: true}),
		knee: fc.double({min: 0, max: 20, noNaN: true}),
		series_resistance: fc.double({min: 0, max: 100, noNaN: true}),
		limit: fc.double({min: 0, max: 200, noNaN: true}),
	});

	it('never gives a worst case below the dissipation at any current from 0 to the limit', () => {
		fc.assert(
			fc.property(setups, fc.double({min: 0, max: 1, noNaN: true}), (setup, fraction) => {
				const current = fraction * setup.limit;
				const worst = dissipation.compute(setup)['worst_power']!;
				const there = powerAt(setup.supply, setup.knee, setup.series_resistance, current);
				return worst >= there - 1e-9 * Math.max(1, Math.abs(there));
			}),
		);
	});

	it('finds its worst case at a current inside the range, where the dissipation is that worst case', () => {
		fc.assert(
			fc.property(setups, (setup) => {
				const result = dissipation.compute(setup);
				const current = result['worst_current']!;
				const worst = result['worst_power']!;
				const there = powerAt(setup.supply, setup.knee, setup.series_resistance, current);
				return current >= 0 && current <= setup.limit && Math.abs(worst - there) <= 1e-9 * Math.max(1, there);
			}),
		);
	});

	it('never exceeds the closed-form maximum (V − knee)²/(4R)', () => {
		fc.assert(
			fc.property(setups, (setup) => {
				fc.pre(setup.series_resistance > 1e-6 && setup.supply > setup.knee);
				const peak = (setup.supply - setup.knee) ** 2 / (4 * setup.series_resistance);
				// relative and absolute slack: near 1e-300 the squares underflow to subnormal numbers
				return dissipation.compute(setup)['worst_power']! <= peak * (1 + 1e-9) + 1e-12;
			}),
		);
	});
});
