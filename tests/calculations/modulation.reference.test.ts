import {describe, expect, it} from 'vitest';
import {modulation} from '../../source/calculations/modulation.js';

type Inputs = {transfer_gain: number; source_amplitude: number; source_impedance: number; input_impedance: number; frequency: number; bandwidth?: number};
const at = (inputs: Inputs) => modulation.compute(inputs);
const base: Inputs = {transfer_gain: 0.1, source_amplitude: 2, source_impedance: 50, input_impedance: 50, frequency: 0};

describe('modulation reference values', () => {
	it.each([
		{name: '50 Ω source into 50 Ω halves the amplitude', inputs: base, loaded: 1, peak: 0.1, worst: 0.2}, // voltage divider (any circuits text): 50/(50 + 50) = ½; 0.1 A/V × 1 V = 0.1 A
		{name: '0 Ω source keeps the open-circuit amplitude', inputs: {...base, source_impedance: 0}, loaded: 2, peak: 0.2, worst: 0.2}, // voltage divider: 50/(50 + 0) = 1; 0.1 A/V × 2 V = 0.2 A
		{name: '50 Ω source into 1 kΩ', inputs: {...base, input_impedance: 1000}, loaded: 2 * (1000 / 1050), peak: 0.1 * 2 * (1000 / 1050), worst: 0.2}, // voltage divider: 1000/1050 = 0.952381
	])('$name', ({inputs, loaded, peak, worst}) => {
		const result = at(inputs);
		expect(result['loaded_amplitude']).toBeCloseTo(loaded, 9);
		expect(result['peak_current']).toBeCloseTo(peak, 9);
		expect(result['worst_case_current']).toBeCloseTo(worst, 9);
	});

	it.each([
		{name: '75 Ω on 50 Ω', input_impedance: 75, reflection: 0.2}, // Pozar, Microwave Engineering, 4th ed., §2.3, eq. (2.35): Γ = 25/125 = 0.2
		{name: '25 Ω on 50 Ω', input_impedance: 25, reflection: -1 / 3}, // Pozar §2.3: Γ = −25/75 = −1/3
		{name: '100 Ω on 50 Ω', input_impedance: 100, reflection: 1 / 3}, // Pozar §2.3: Γ = 50/150 = +1/3
		{name: '5 Ω on 50 Ω', input_impedance: 5, reflection: -0.81818182}, // Pozar §2.3: Γ = −45/55 = −0.81818 (VSWR 10)
		{name: 'matched', input_impedance: 50, reflection: 0}, // Pozar §2.3: matched load, Γ = 0
	])('reflection coefficient, $name', ({input_impedance, reflection}) => {
		expect(at({...base, input_impedance})['reflection']).toBeCloseTo(reflection, 7);
	});

	it.each([
		{ratio: 0.5, rolloff: 0.894427}, // single-pole magnitude 1/√(1 + 0.25) = 0.894427 (Sedra & Smith, from memory)
		{ratio: 1, rolloff: 0.707107}, // single-pole magnitude at f_c: 1/√2 = 0.707107, −3.0103 dB (Sedra & Smith, from memory)
		{ratio: 2, rolloff: 0.447214}, // single-pole magnitude 1/√5 = 0.447214 (Sedra & Smith, from memory)
		{ratio: 3, rolloff: 0.316228}, // single-pole magnitude 1/√10 = 0.316228, −10.000 dB (Sedra & Smith, from memory)
		{ratio: 10, rolloff: 0.099504}, // single-pole magnitude 1/√101 = 0.099504 (Sedra & Smith, from memory)
	])('single-pole roll-off at f/f_c = $ratio', ({ratio, rolloff}) => {
		const result = at({...base, frequency: ratio * 1e6, bandwidth: 1e6});
		expect(result['rolloff']).toBeCloseTo(rolloff, 6);
		expect(result['peak_current']).toBeCloseTo(0.1 * 1 * rolloff, 6); // 0.1 A/V × 1 V loaded × roll-off
	});

	it('has no roll-off when no bandwidth is given', () => {
		expect(at({...base, frequency: 1e9})['rolloff']).toBe(1); // common practice: a flat response is assumed without a bandwidth
	});
});
