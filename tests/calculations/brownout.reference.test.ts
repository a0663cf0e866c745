import {describe, expect, it} from 'vitest';
import {brownout} from '../../source/calculations/brownout.js';

// Kirchhoff's voltage law around the output loop (common practice):
// V_floor = V_F + I·(R_cable + R_sense) + V_driver; V_service = V_supply·(1 − tol); window = V_service − V_floor.
type Case = {name: string; forward_voltage: number; current: number; cable_resistance: number; sense_resistance: number; driver_drop: number; supply: number; tolerance: number; regulation_floor: number; service_minimum: number; window: number};

const cases: Case[] = [
	{name: '808 nm bench at 2 A', forward_voltage: 1.9, current: 2, cable_resistance: 0.05, sense_resistance: 0.1, driver_drop: 0.8, supply: 5, tolerance: 0.05, regulation_floor: 3, service_minimum: 4.75, window: 1.75}, // common practice (Kirchhoff's voltage law), worked by hand: 1.9 + 2 × 0.15 + 0.8 = 3.0 V; 5 × 0.95 = 4.75 V
	{name: 'rack bench at 1 A', forward_voltage: 2, current: 1, cable_resistance: 0.08, sense_resistance: 0.1, driver_drop: 1.2, supply: 28, tolerance: 0.05, regulation_floor: 3.38, service_minimum: 26.6, window: 23.22}, // common practice (Kirchhoff's voltage law), worked by hand: 2.0 + 0.18 + 1.2 = 3.38 V; 28 × 0.95 = 26.6 V
	{name: 'no room for a trip', forward_voltage: 1.9, current: 2, cable_resistance: 0.05, sense_resistance: 0.1, driver_drop: 0.8, supply: 3, tolerance: 0, regulation_floor: 3, service_minimum: 3, window: 0}, // common practice (Kirchhoff's voltage law), worked by hand: floor 3.0 V = service 3.0 V
];

describe('brownout reference values', () => {
	it.each(cases)('$name', ({name: _name, regulation_floor, service_minimum, window, ...inputs}) => {
		const result = brownout.compute(inputs);
		expect(result['regulation_floor']).toBeCloseTo(regulation_floor, 9);
		expect(result['service_minimum']).toBeCloseTo(service_minimum, 9);
		expect(result['window']).toBeCloseTo(window, 9);
	});
});
