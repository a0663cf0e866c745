import type {Calculation} from './calculation.js';

/** Monitor photodiode current from responsivity. */
export const photodiode: Calculation = {
	name: 'photodiode',
	summary: 'Monitor photodiode current at an optical power from the measured responsivity',
	inputs: {
		responsivity: {dimension: 'responsivity', description: 'Monitor current per optical output power, measured for this unit'},
		power: {dimension: 'power', description: 'Optical output power'},
	},
	outputs: {monitor_current: {dimension: 'current', description: 'Monitor photodiode current'}},
	main: 'monitor_current',
	formula: 'I_PD = R × P',
	basis: ['Photodiode responsivity definition: Saleh & Teich, Fundamentals of Photonics, photodetector chapter (from memory)'],
	compute: ({responsivity, power}) => ({monitor_current: responsivity! * power!}),
};
