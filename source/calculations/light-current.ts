import {CalculationInputError, between, type Calculation} from './calculation.js';
import {benchRanges} from './bench-ranges.js';

/** Optical power above threshold from the linear light-current model, and its inverse. */
export const lightCurrent: Calculation = {
	name: 'light-current',
	summary: 'Optical power at a current, and the current needed for a power (linear L-I model above threshold)',
	inputs: {
		slope_efficiency: {dimension: 'slope_efficiency', description: 'Slope efficiency above threshold', range: between(0, 100)},
		threshold: {dimension: 'current', description: 'Threshold current at the operating temperature', range: benchRanges.current},
		current: {dimension: 'current', description: 'Forward current (for the power at that current)', range: benchRanges.current, optional: true},
		power: {dimension: 'power', description: 'Optical power (for the current needed to reach it)', range: benchRanges.power, optional: true},
	},
	outputs: {
		power_at_current: {dimension: 'power', description: 'Optical output power at the current (zero below threshold)'},
		current_for_power: {dimension: 'current', description: 'Current needed for the power'},
	},
	main: 'power_at_current',
	formula: 'P = S·max(0, I − I_th); I = I_th + P/S',
	basis: ['Coldren, Corzine & Mašanović, Diode Lasers and Photonic Integrated Circuits, 2nd ed. (2012), ch. 2; Saleh & Teich, Fundamentals of Photonics (from memory)'],
	compute: ({slope_efficiency, threshold, current, power}) => {
		if (current === undefined && power === undefined) throw new CalculationInputError('light-current', 'current or power', 'given (at least one of them)');
		const outputs: Record<string, number> = {};
		if (current !== undefined) outputs['power_at_current'] = slope_efficiency! * Math.max(0, current - threshold!);
		if (power !== undefined) {
			if (!(slope_efficiency! > 0)) throw new CalculationInputError('light-current', 'slope_efficiency', 'greater than zero to find a current');
			outputs['current_for_power'] = threshold! + power / slope_efficiency!;
		}
		return outputs;
	},
};
