import {CalculationInputError, between, type Calculation} from './calculation.js';
import {benchRanges} from './bench-ranges.js';

/** Monitor photodiode current from responsivity, and optical power from monitor current. */
export const photodiode: Calculation = {
	name: 'photodiode',
	summary: 'Monitor photodiode current at an optical power, and power from monitor current, from the measured responsivity',
	inputs: {
		responsivity: {dimension: 'responsivity', description: 'Monitor current per optical output power, measured for this unit', range: between(0, 100)},
		power: {dimension: 'power', description: 'Optical output power (for the monitor current)', range: benchRanges.power, optional: true},
		monitor_current: {dimension: 'current', description: 'Monitor current (for the optical power)', range: between(0, 10), optional: true},
	},
	outputs: {
		current_at_power: {dimension: 'current', description: 'Monitor photodiode current at the power'},
		power_at_current: {dimension: 'power', description: 'Optical power giving the monitor current'},
	},
	main: 'current_at_power',
	formula: 'I_PD = R·P; P = I_PD/R',
	basis: ['Photodiode responsivity R = I_PD/P: Saleh & Teich, Fundamentals of Photonics, photodetector chapter (from memory)'],
	compute: ({responsivity, power, monitor_current}) => {
		if (power === undefined && monitor_current === undefined) throw new CalculationInputError('photodiode', 'power or monitor_current', 'given (at least one of them)');
		const outputs: Record<string, number> = {};
		if (power !== undefined) outputs['current_at_power'] = responsivity! * power;
		if (monitor_current !== undefined) {
			if (!(responsivity! > 0)) throw new CalculationInputError('photodiode', 'responsivity', 'greater than zero to find a power');
			outputs['power_at_current'] = monitor_current / responsivity!;
		}
		return outputs;
	},
};
