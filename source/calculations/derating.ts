import type {Calculation} from './calculation.js';
import {benchRanges} from './bench-ranges.js';

/** Linear derating of a dissipation rating above its rated ambient. */
export const derating: Calculation = {
	name: 'derating',
	summary: 'A dissipation rating derated linearly from its rated ambient to zero at the maximum temperature',
	inputs: {
		rated_power: {dimension: 'power', description: 'Dissipation rating at or below the rated ambient', range: benchRanges.power},
		rated_ambient: {dimension: 'temperature', description: 'Ambient temperature up to which the full rating applies', range: benchRanges.temperature},
		max_temperature: {dimension: 'temperature', description: 'Temperature at which the allowed dissipation reaches zero', range: benchRanges.temperature},
		ambient: {dimension: 'temperature', description: 'Actual (highest) ambient temperature', range: benchRanges.temperature},
	},
	conditions: [
		{
			keys: ['max_temperature', 'rated_ambient'],
			holds: ({max_temperature, rated_ambient}) => max_temperature! > rated_ambient!,
			description: 'above rated_ambient: a derating line falls from the rated ambient to zero at a higher temperature',
		},
	],
	outputs: {allowed_power: {dimension: 'power', description: 'Dissipation allowed at that ambient'}},
	main: 'allowed_power',
	formula: 'P_allowed = P_rated × (T_max − T_ambient)/(T_max − T_rated), clamped to 0…P_rated',
	basis: ['Linear derating P_max(T) = (T_j,max − T)/θ: Sedra & Smith, power-amplifier chapter (from memory); manufacturer derating curves (common practice)'],
	compute: ({rated_power, rated_ambient, max_temperature, ambient}) => {
		if (ambient! <= rated_ambient!) return {allowed_power: rated_power!};
		const fraction = (max_temperature! - ambient!) / (max_temperature! - rated_ambient!);
		return {allowed_power: rated_power! * Math.min(1, Math.max(0, fraction))};
	},
};
