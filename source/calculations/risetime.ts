import type {Calculation} from './calculation.js';
import {benchRanges} from './bench-ranges.js';

/** 10–90 % rise time of a single-pole response. */
export const risetime: Calculation = {
	name: 'risetime',
	summary: '10–90 % rise time of a single-pole response from its −3 dB bandwidth',
	inputs: {bandwidth: {dimension: 'frequency', description: '−3 dB bandwidth', range: benchRanges.bandwidth}},
	outputs: {rise_time: {dimension: 'time', description: '10–90 % rise time'}},
	main: 'rise_time',
	formula: 't_r = ln 9/(2π·f_c) ≈ 0.3497/f_c',
	basis: ['H. Johnson & M. Graham, High-Speed Digital Design (1993), ch. 1; Horowitz & Hill, The Art of Electronics, 3rd ed., §1.4 (from memory)'],
	compute: ({bandwidth}) => ({rise_time: Math.log(9) / (2 * Math.PI * bandwidth!)}),
};
