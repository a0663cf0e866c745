import type {Calculation} from './calculation.js';
import {benchRanges} from './bench-ranges.js';

/** Diode forward voltage from the knee-plus-series-resistance model. */
export const forwardVoltage: Calculation = {
	name: 'forward-voltage',
	summary: 'Diode forward voltage at a current from its knee voltage and series resistance',
	inputs: {
		knee: {dimension: 'voltage', description: 'Knee (turn-on) voltage of the diode', range: benchRanges.voltage},
		series_resistance: {dimension: 'resistance', description: 'Differential series resistance above the knee', range: benchRanges.resistance},
		current: {dimension: 'current', description: 'Forward current', range: benchRanges.current},
	},
	outputs: {forward_voltage: {dimension: 'voltage', description: 'Forward voltage at that current'}},
	main: 'forward_voltage',
	formula: 'V_F = V_knee + R_s × I',
	basis: ['Piecewise-linear diode model: Sedra & Smith, Microelectronic Circuits, diode modelling chapter (from memory)'],
	compute: ({knee, series_resistance, current}) => ({forward_voltage: knee! + series_resistance! * current!}),
};
