import {above, type Calculation} from './calculation.js';
import {benchRanges} from './bench-ranges.js';

/** Threshold current at a temperature from the characteristic-temperature model. */
export const threshold: Calculation = {
	name: 'threshold',
	summary: 'Laser threshold current at a temperature from the characteristic temperature T0',
	inputs: {
		threshold_ref: {dimension: 'current', description: 'Threshold current at the reference temperature', range: benchRanges.current},
		temperature_ref: {dimension: 'temperature', description: 'Reference temperature of that threshold', range: benchRanges.temperature},
		t0: {dimension: 'temperature_difference', description: 'Characteristic temperature T0 of the diode', range: above(0, 1000)},
		temperature: {dimension: 'temperature', description: 'Temperature of interest', range: benchRanges.temperature},
	},
	outputs: {threshold: {dimension: 'current', description: 'Threshold current at that temperature'}},
	main: 'threshold',
	formula: 'I_th(T) = I_th(T_ref) × exp((T − T_ref)/T0)',
	basis: ['Coldren, Corzine & Mašanović, Diode Lasers and Photonic Integrated Circuits, 2nd ed. (2012), ch. 2 (from memory)'],
	compute: ({threshold_ref, temperature_ref, t0, temperature}) => ({threshold: threshold_ref! * Math.exp((temperature! - temperature_ref!) / t0!)}),
};
