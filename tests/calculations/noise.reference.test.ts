import {describe, expect, it} from 'vitest';
import {noise} from '../../source/calculations/noise.js';

const cases = [
	{name: '10 nA/√Hz over 1 MHz', density: 10e-9, bandwidth: 1e6, rms: 10e-6, singlePole: 12.533e-6}, // Horowitz & Hill, 3rd ed., ch. 8: e_n·√B, 10 nV/√Hz over 1 MHz → 10 µV; noise bandwidth of a single pole = (π/2)·f_c → 12.533 µV
	{name: 'shot noise of 1 mA over 1 Hz', density: 17.901e-12, bandwidth: 1, rms: 17.901e-12, singlePole: 17.901e-12 * Math.sqrt(Math.PI / 2)}, // Horowitz & Hill, ch. 8: i_n = √(2qI) = 17.901 pA/√Hz at 1 mA
	{name: '1 pA/√Hz over 10 kHz', density: 1e-12, bandwidth: 1e4, rms: 100e-12, singlePole: 125.33e-12}, // Motchenbacher & Connelly, Low-Noise Electronic System Design (1993): √B scaling, √(10⁴) = 100
];

describe('noise reference values', () => {
	it.each(cases)('$name', ({density, bandwidth, rms, singlePole}) => {
		const result = noise.compute({noise_density: density, bandwidth});
		expect(result['rms']! / rms).toBeCloseTo(1, 4);
		expect(result['rms_single_pole']! / singlePole).toBeCloseTo(1, 4);
		expect(result['fraction']).toBeUndefined();
	});

	it('gives the fraction of the setpoint when one is given', () => {
		const result = noise.compute({noise_density: 10e-9, bandwidth: 1e6, setpoint: 0.1}); // common practice: 10 µA rms on 100 mA is 1e-4
		expect(result['fraction']).toBeCloseTo(1e-4, 12);
	});
});
