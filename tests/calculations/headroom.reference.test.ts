import fc from 'fast-check';
import {describe, expect, it} from 'vitest';
import {brownout} from '../../source/calculations/brownout.js';
import {headroom} from '../../source/calculations/headroom.js';

// Kirchhoff's voltage law around the output loop (common practice):
// V_available = V_supply·(1 − tol) − I·(R_cable + R_sense) − V_driver; margin = V_available − V_F.
type Case = {name: string; supply: number; tolerance: number; cable_resistance: number; sense_resistance: number; driver_drop: number; forward_voltage: number; current: number; supply_low: number; available: number; margin: number};

const cases: Case[] = [
	{name: '808 nm bench at 2 A', supply: 5, tolerance: 0.05, cable_resistance: 0.05, sense_resistance: 0.1, driver_drop: 0.8, forward_voltage: 1.9, current: 2, supply_low: 4.75, available: 3.65, margin: 1.75}, // common practice (Kirchhoff's voltage law), worked by hand: 4.75 − 2 × 0.15 − 0.8 = 3.65 V; 3.65 − 1.9 = 1.75 V
	{name: 'no tolerance', supply: 12, tolerance: 0, cable_resistance: 0.5, sense_resistance: 0.5, driver_drop: 1, forward_voltage: 2, current: 2, supply_low: 12, available: 9, margin: 7}, // common practice (Kirchhoff's voltage law), worked by hand: 12 − 2 × 1 − 1 = 9 V; 9 − 2 = 7 V
	{name: 'out of compliance', supply: 3, tolerance: 0.05, cable_resistance: 0.05, sense_resistance: 0.1, driver_drop: 0.8, forward_voltage: 1.9, current: 2, supply_low: 2.85, available: 1.75, margin: -0.15}, // common practice (Kirchhoff's voltage law), worked by hand: 2.85 − 1.1 = 1.75 V; 1.75 − 1.9 = −0.15 V
	{name: 'no current', supply: 5, tolerance: 0.1, cable_resistance: 1, sense_resistance: 1, driver_drop: 0.5, forward_voltage: 1.6, current: 0, supply_low: 4.5, available: 4, margin: 2.4}, // common practice (Kirchhoff's voltage law), worked by hand: 4.5 − 0 − 0.5 = 4 V; 4 − 1.6 = 2.4 V
];

describe('headroom reference values', () => {
	it.each(cases)('$name', ({name: _name, supply_low, available, margin, ...inputs}) => {
		const result = headroom.compute(inputs);
		expect(result['supply_low']).toBeCloseTo(supply_low, 9);
		expect(result['available']).toBeCloseTo(available, 9);
		expect(result['margin']).toBeCloseTo(margin, 9);
	});

	it('leaves the same room as the brownout window for the same loop', () => {
		// both are KVL around one loop: (V·(1 − tol) − drops) − V_F = V·(1 − tol) − (V_F + drops)
		const volts = fc.double({min: 0, max: 20, noNaN: true});
		const ohms = fc.double({min: 0, max: 10, noNaN: true});
		fc.assert(
			fc.property(fc.double({min: 1, max: 100, noNaN: true}), fc.double({min: 0, max: 0.3, noNaN: true}), ohms, ohms, volts, volts, fc.double({min: 0, max: 10, noNaN: true}), (supply, tolerance, cable_resistance, sense_resistance, driver_drop, forward_voltage, current) => {
				const margin = headroom.compute({supply, tolerance, cable_resistance, sense_resistance, driver_drop, forward_voltage, current})['margin']!;
				const window = brownout.compute({forward_voltage, current, cable_resistance, sense_resistance, driver_drop, supply, tolerance})['window']!;
				return Math.abs(margin - window) <= 1e-9 * Math.max(1, Math.abs(margin));
			}),
		);
	});
});
