import {describe, expect, it} from 'vitest';
import {forwardVoltage} from '../../source/calculations/forward-voltage.js';

// V_F = V_knee + R_s·I: piecewise-linear diode model (Sedra & Smith, diode modelling chapter, from memory).
type Case = {name: string; knee: number; series_resistance: number; current: number; forward_voltage: number};

const cases: Case[] = [
	{name: 'no current', knee: 1.6, series_resistance: 0.15, current: 0, forward_voltage: 1.6}, // piecewise-linear model: V_F(0) = knee
	{name: 'no series resistance', knee: 2.2, series_resistance: 0, current: 3, forward_voltage: 2.2}, // common practice: a datasheet maximum V_F entered as the knee with R_s = 0
	{name: '808 nm bench at 2 A', knee: 1.6, series_resistance: 0.15, current: 2, forward_voltage: 1.9}, // piecewise-linear diode model (Sedra & Smith, from memory), worked by hand: 1.6 V + 0.15 Ω × 2 A = 1.9 V
	{name: 'rack bench at 1 A', knee: 1.8, series_resistance: 0.2, current: 1, forward_voltage: 2.0}, // piecewise-linear diode model (Sedra & Smith, from memory), worked by hand: 1.8 V + 0.2 Ω × 1 A = 2.0 V
	{name: 'milliampere diode', knee: 2.0, series_resistance: 10, current: 0.05, forward_voltage: 2.5}, // piecewise-linear diode model (Sedra & Smith, from memory), worked by hand: 2.0 V + 10 Ω × 50 mA = 2.5 V
];

describe('forward-voltage reference values', () => {
	it.each(cases)('$name', ({knee, series_resistance, current, forward_voltage}) => {
		expect(forwardVoltage.compute({knee, series_resistance, current})['forward_voltage']).toBeCloseTo(forward_voltage, 9);
	});
});
