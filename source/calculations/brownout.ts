import type {Calculation} from './calculation.js';
import {benchRanges} from './bench-ranges.js';

/** The window a brownout trip must sit in: above the regulation floor, below the service minimum. */
export const brownout: Calculation = {
	name: 'brownout',
	summary: 'Window between the lowest supply at which the driver still regulates the limit current and the lowest supply expected in service',
	inputs: {
		forward_voltage: {dimension: 'voltage', description: 'Diode forward voltage at the limit current', range: benchRanges.voltage},
		current: {dimension: 'current', description: 'Limit current', range: benchRanges.current},
		cable_resistance: {dimension: 'resistance', description: 'Cable resistance, both conductors', range: benchRanges.resistance},
		sense_resistance: {dimension: 'resistance', description: 'Current-sense resistance', range: benchRanges.resistance},
		driver_drop: {dimension: 'voltage', description: "Driver's own drop (dropout) at the limit", range: benchRanges.voltage},
		supply: {dimension: 'voltage', description: 'Supply voltage, nominal', range: benchRanges.supply},
		tolerance: {dimension: 'ratio', description: 'Supply tolerance each way', range: benchRanges.tolerance, default: 0},
	},
	outputs: {
		regulation_floor: {dimension: 'voltage', description: 'Lowest supply at which the limit current is still regulated'},
		service_minimum: {dimension: 'voltage', description: 'Lowest supply expected in service (nominal less tolerance)'},
		window: {dimension: 'voltage', description: 'Room for the brownout trip between the two (negative: no room)'},
	},
	main: 'regulation_floor',
	formula: 'V_floor = V_F + I·(R_cable + R_sense) + V_driver; V_service = V_supply·(1 − tol); window = V_service − V_floor',
	basis: ["Kirchhoff's voltage law around the output loop (common practice)"],
	compute: ({forward_voltage, current, cable_resistance, sense_resistance, driver_drop, supply, tolerance}) => {
		const floor = forward_voltage! + current! * (cable_resistance! + sense_resistance!) + driver_drop!;
		const service = supply! * (1 - tolerance!);
		return {regulation_floor: floor, service_minimum: service, window: service - floor};
	},
	notes: (_inputs, outputs) => (outputs['window']! <= 0 ? ['No room for a brownout trip: the supply at its low tolerance cannot regulate the limit current.'] : []),
};
