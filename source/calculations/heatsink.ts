import {above, type Calculation} from './calculation.js';
import {benchRanges} from './bench-ranges.js';

/** Largest heat-sink thermal resistance that keeps a junction or case within its maximum. */
export const heatsink: Calculation = {
	name: 'heatsink',
	summary: 'Largest heat-sink-to-ambient thermal resistance that keeps the junction (or case) within its maximum',
	inputs: {
		power: {dimension: 'power', description: 'Dissipated power', range: above(0, 1e5)},
		ambient: {dimension: 'temperature', description: 'Highest ambient temperature', range: benchRanges.temperature},
		max_temperature: {dimension: 'temperature', description: 'Maximum junction (or case) temperature', range: benchRanges.temperature},
		theta_jc: {dimension: 'thermal_resistance', description: 'Junction-to-case thermal resistance (0 when the maximum is a case temperature)', range: benchRanges.thermalResistance, default: 0},
		theta_cs: {dimension: 'thermal_resistance', description: 'Case-to-sink thermal resistance (interface material)', range: benchRanges.thermalResistance, default: 0},
	},
	outputs: {
		theta_sa: {dimension: 'thermal_resistance', description: 'Largest allowed sink-to-ambient thermal resistance (zero or negative: no heat sink can do it)'},
		theta_total: {dimension: 'thermal_resistance', description: 'Largest allowed total junction-to-ambient thermal resistance'},
	},
	main: 'theta_sa',
	formula: 'θ_sa = (T_max − T_ambient)/P − θ_jc − θ_cs',
	basis: ['T_j = T_a + P·(θ_jc + θ_cs + θ_sa): Sedra & Smith, Microelectronic Circuits, power-amplifier chapter (from memory); a published worked example of transistor heat sinking'],
	compute: ({power, ambient, max_temperature, theta_jc, theta_cs}) => {
		const total = (max_temperature! - ambient!) / power!;
		return {theta_sa: total - theta_jc! - theta_cs!, theta_total: total};
	},
	notes: (_inputs, outputs) => (outputs['theta_sa']! <= 0 ? ['No heat sink can do it: the case and interface alone already exceed the temperature budget. Reduce the power or the ambient.'] : []),
};
