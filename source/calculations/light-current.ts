import type {Calculation} from './calculation.js';

/** Optical power above threshold from the linear light-current model. */
export const lightCurrent: Calculation = {
	name: 'light-current',
	summary: 'Optical output power at a current from slope efficiency and threshold (linear L-I model)',
	inputs: {
		slope_efficiency: {dimension: 'slope_efficiency', description: 'Slope efficiency above threshold'},
		threshold: {dimension: 'current', description: 'Threshold current at the operating temperature'},
		current: {dimension: 'current', description: 'Forward current'},
	},
	outputs: {power: {dimension: 'power', description: 'Optical output power (zero below threshold)'}},
	main: 'power',
	formula: 'P = S × max(0, I − I_th)',
	basis: ['Coldren, Corzine & Mašanović, 2nd ed., ch. 2; Saleh & Teich, Fundamentals of Photonics (from memory)'],
	compute: ({slope_efficiency, threshold, current}) => ({power: slope_efficiency! * Math.max(0, current! - threshold!)}),
};
