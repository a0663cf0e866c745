import {above, between, type Calculation} from './calculation.js';
import {benchRanges} from './bench-ranges.js';

/** Peak output current from a modulation source into the driver's modulation input. */
export const modulation: Calculation = {
	name: 'modulation',
	summary: 'Peak modulation current from the transfer gain and a source loaded by the input impedance, with the single-pole roll-off',
	inputs: {
		transfer_gain: {dimension: 'transconductance', description: 'Output current per volt at the modulation input', range: between(0, 1000)},
		source_amplitude: {dimension: 'voltage', description: "Source's open-circuit peak amplitude", range: benchRanges.voltage},
		source_impedance: {dimension: 'resistance', description: "Source's output impedance", range: benchRanges.resistance, default: 50},
		input_impedance: {dimension: 'resistance', description: "Driver's modulation input impedance", range: above(0, 1e9), default: 50},
		frequency: {dimension: 'frequency', description: 'Modulation frequency', range: benchRanges.frequency, default: 0},
		bandwidth: {dimension: 'frequency', description: 'Modulation −3 dB bandwidth (single pole)', range: benchRanges.bandwidth, optional: true},
	},
	outputs: {
		peak_current: {dimension: 'current', description: 'Peak output current at that frequency'},
		worst_case_current: {dimension: 'current', description: 'Peak output current if the input were unloaded (gain × open-circuit amplitude)'},
		loaded_amplitude: {dimension: 'voltage', description: 'Amplitude at the input after the source-input divider'},
		reflection: {dimension: 'number', description: 'Reflection coefficient (Z_in − Z_s)/(Z_in + Z_s)'},
		rolloff: {dimension: 'number', description: 'Single-pole amplitude factor at the frequency (1 when no bandwidth is given)'},
	},
	main: 'peak_current',
	formula: 'V_in = V_s·Z_in/(Z_in + Z_s); Γ = (Z_in − Z_s)/(Z_in + Z_s); |H| = 1/√(1 + (f/f_c)²); I_peak = G·V_in·|H|',
	basis: [
		'Voltage divider V_out = V_in·Z2/(Z1 + Z2): any circuits text',
		'Reflection coefficient Γ = (Z_L − Z_0)/(Z_L + Z_0): D. M. Pozar, Microwave Engineering, 4th ed. (2012), §2.3 (from memory)',
		'Single-pole magnitude 1/√(1 + (f/f_c)²): Sedra & Smith, Microelectronic Circuits (from memory)',
	],
	compute: ({transfer_gain, source_amplitude, source_impedance, input_impedance, frequency, bandwidth}) => {
		const loaded = (source_amplitude! * input_impedance!) / (input_impedance! + source_impedance!);
		const rolloff = bandwidth === undefined ? 1 : 1 / Math.sqrt(1 + (frequency! / bandwidth) ** 2);
		return {
			peak_current: transfer_gain! * loaded * rolloff,
			worst_case_current: transfer_gain! * source_amplitude!,
			loaded_amplitude: loaded,
			reflection: (input_impedance! - source_impedance!) / (input_impedance! + source_impedance!),
			rolloff,
		};
	},
};
