import type {Calculation} from './calculation.js';
import {benchRanges} from './bench-ranges.js';

/** Compliance headroom at the limit current with the supply at its low tolerance. */
export const headroom: Calculation = {
	name: 'headroom',
	summary: 'Voltage left for the diode at the limit current with the supply low, and the margin over its forward voltage',
	inputs: {
		supply: {dimension: 'voltage', description: 'Supply voltage, nominal', range: benchRanges.supply},
		tolerance: {dimension: 'ratio', description: 'Supply tolerance each way (5 % = 0.05)', range: benchRanges.tolerance, default: 0},
		cable_resistance: {dimension: 'resistance', description: 'Cable resistance, both conductors', range: benchRanges.resistance},
		sense_resistance: {dimension: 'resistance', description: 'Current-sense resistance in the output path', range: benchRanges.resistance},
		driver_drop: {dimension: 'voltage', description: "Driver's own drop (dropout) at the limit current", range: benchRanges.voltage},
		forward_voltage: {dimension: 'voltage', description: 'Diode forward voltage at the limit current', range: benchRanges.voltage},
		current: {dimension: 'current', description: 'Limit current', range: benchRanges.current},
	},
	outputs: {
		supply_low: {dimension: 'voltage', description: 'Supply at its low tolerance'},
		available: {dimension: 'voltage', description: 'Voltage available across the diode at the limit'},
		margin: {dimension: 'voltage', description: 'Available voltage less the forward voltage (negative: the driver leaves regulation)'},
	},
	main: 'available',
	formula: 'V_available = V_supply·(1 − tol) − I·(R_cable + R_sense) − V_driver; margin = V_available − V_F',
	basis: ["Kirchhoff's voltage law around the output loop (common practice)"],
	compute: ({supply, tolerance, cable_resistance, sense_resistance, driver_drop, forward_voltage, current}) => {
		const supplyLow = supply! * (1 - tolerance!);
		const available = supplyLow - current! * (cable_resistance! + sense_resistance!) - driver_drop!;
		return {supply_low: supplyLow, available, margin: available - forward_voltage!};
	},
	notes: (_inputs, outputs) => (outputs['margin']! < 0 ? ['Negative margin: at the limit the driver runs out of compliance voltage and stops regulating.'] : []),
};
