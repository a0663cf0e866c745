import type {Calculation} from './calculation.js';

/** Diode forward voltage from the knee-plus-series-resistance model. */
export const forwardVoltage: Calculation = {
	name: 'forward-voltage',
	summary: 'Diode forward voltage at a current from its knee voltage and series resistance',
	inputs: {
		knee: {dimension: 'voltage', description: 'Knee (turn-on) voltage of the diode'},
		series_resistance: {dimension: 'resistance', description: 'Differential series resistance above the knee'},
		current: {dimension: 'current', description: 'Forward current'},
	},
	outputs: {forward_voltage: {dimension: 'voltage', description: 'Forward voltage at that current'}},
	main: 'forward_voltage',
	formula: 'V_F = V_knee + R_s × I',
	basis: ['Piecewise-linear diode model: Sedra & Smith, Microelectronic Circuits, diode modelling chapter (from memory)'],
	compute: ({knee, series_resistance, current}) => ({forward_voltage: knee! + series_resistance! * current!}),
};
