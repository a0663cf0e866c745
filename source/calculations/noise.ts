import {above, between, type Calculation} from './calculation.js';
import {benchRanges} from './bench-ranges.js';

/** RMS current noise from a white noise density over a bandwidth. */
export const noise: Calculation = {
	name: 'noise',
	summary: 'RMS current noise from a noise density over a bandwidth, and as a fraction of the setpoint',
	inputs: {
		noise_density: {dimension: 'current_noise_density', description: 'Output current noise density (white)', range: between(0, 1)},
		bandwidth: {dimension: 'frequency', description: 'Measurement bandwidth (brick-wall)', range: benchRanges.bandwidth},
		setpoint: {dimension: 'current', description: 'Current setpoint', range: above(0, 1000), optional: true},
	},
	outputs: {
		rms: {dimension: 'current', description: 'RMS noise current over the bandwidth (brick-wall)'},
		rms_single_pole: {dimension: 'current', description: 'RMS noise if the bandwidth is a single-pole −3 dB point (noise bandwidth π/2·f_c)'},
		fraction: {dimension: 'ratio', description: 'RMS noise as a fraction of the setpoint'},
	},
	main: 'rms',
	formula: 'i_rms = i_n·√B; single pole: i_n·√(π/2·f_c); fraction = i_rms/I_set',
	basis: ['Horowitz & Hill, The Art of Electronics, 3rd ed., ch. 8; Motchenbacher & Connelly, Low-Noise Electronic System Design (1993) (from memory)'],
	compute: ({noise_density, bandwidth, setpoint}) => {
		const rms = noise_density! * Math.sqrt(bandwidth!);
		const outputs: Record<string, number> = {rms, rms_single_pole: noise_density! * Math.sqrt((Math.PI / 2) * bandwidth!)};
		if (setpoint !== undefined) outputs['fraction'] = rms / setpoint;
		return outputs;
	},
};
