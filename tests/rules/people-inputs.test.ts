import {describe, expect, it} from 'vitest';
import {checkResult, evaluateDocument, expectClose, readDemo, shippedRules, withChanges, type Changes} from './bench-answers.js';
import type {Evaluation} from '../../source/rules/evaluate/evaluation.js';

// The people step's inputs: the power the checks assess (issue: worst power), the diameter
// where the beam can reach the eye, and the divergence convention. Every case starts from the
// clearing demo (808 nm beam 1 of 2 W, 3 mm at the exit, 150 mrad; 650 nm aiming beam 2 of
// 1 mW, 2 mm, 1 mrad), worked by hand:
//   limiting aperture 7 mm for 400–1400 nm (IEC 60825-1 / ANSI Z136.1, from memory):
//     A = π × (3.5 mm)² = 3.848451e-5 m²
//   MPE at 808 nm over 10 s = 10·C4, C4 = 10^(0.002 × (808 − 700)) (IEC 60825-1:2014, from
//     memory): 16.443717 W/m²
//   power_at_limit_cold = 1.1 W/A × (2 A − 0.45 A × exp((15 − 25)/140)) = 1.7391239 W
//     (linear light-current model above the T0 threshold, as in default-policy.test.ts)
const rules = shippedRules();
const clear = readDemo('bench3-808nm-clear.yaml');
const aperture = Math.PI * 0.0035 ** 2; // 7 mm aperture, hand arithmetic: 3.848451e-5 m²
const mpe808 = 10 * 10 ** (0.002 * 108); // 10·C4 at 808 nm, 10 s (IEC 60825-1:2014, from memory): 16.443717 W/m²
const coldPower = 1.1 * (2 - 0.45 * Math.exp(-10 / 140)); // hand arithmetic above: 1.7391239 W
const reach = (power: number, mpe: number) => Math.sqrt((4 * power) / (Math.PI * mpe)); // NOHD formula, ANSI Z136.1 App. B (from memory)

function derivedSi(evaluation: Evaluation, id: string): number | undefined {
	const found = evaluation.derived.find((entry) => entry.id === id);
	return found?.status === 'value' ? found.value.si : undefined;
}

describe('worst power: the people checks assess the larger of the typed and the worst-case power', () => {
	type Case = {name: string; inputs: Changes; assessed: number; od: number; nohd: number; classRank: number};
	const cases: Case[] = [
		// typed 2 W ≥ 1.7391239 W: the typed power is assessed.
		// OD = log10(2 / A / 16.443717) = log10(3160.46) = 3.499744; NOHD = (0.393524 − 0.003)/0.15 = 2.603486 m
		{name: 'typed power above the worst case', inputs: {}, assessed: 2, od: Math.log10(2 / aperture / mpe808), nohd: (reach(2, mpe808) - 0.003) / 0.15, classRank: 5},
		// typed 1 W < 1.7391239 W: the worst case is assessed.
		// OD = log10(1.7391239 / A / 16.443717) = log10(2748.21) = 3.439051; NOHD = (0.366955 − 0.003)/0.15 = 2.426366 m
		{name: 'typed power below the worst case', inputs: {beam1_power: '1 W'}, assessed: coldPower, od: Math.log10(coldPower / aperture / mpe808), nohd: (reach(coldPower, mpe808) - 0.003) / 0.15, classRank: 5},
		// constant power, monitor lost: the loop drives the current to the limit, the same 1.7391239 W
		{
			name: 'constant power, typed at the setpoint below the worst case',
			inputs: {control_mode: 'constant_power', current_setpoint: null, modulation_gain: null, modulation_source_peak: null, power_setpoint: '1 W', photodiode_responsivity: '1 mA/W', monitor_input_max: '2 mA', beam1_power: '1 W'},
			assessed: coldPower,
			od: Math.log10(coldPower / aperture / mpe808),
			nohd: (reach(coldPower, mpe808) - 0.003) / 0.15,
			classRank: 5,
		},
		// a lower limit: 1.1 W/A × (0.5 A − 0.4189783 A) = 0.0891239 W, below the typed 0.4 W; 0.4 W is
		// above the 3R limit 5 × 3.9e-4 × C4 W = 3.2 mW and at most 0.5 W: rank 4 (IEC 60825-1 CW AELs, from memory)
		{name: 'a low limit keeps the typed power', inputs: {beam1_power: '0.4 W', current_limit: '0.5 A', current_setpoint: '0.4 A', modulation_source_peak: '0.5 V'}, assessed: 0.4, od: Math.log10(0.4 / aperture / mpe808), nohd: (reach(0.4, mpe808) - 0.003) / 0.15, classRank: 4},
		// typed 0.4 W, but the setup can emit 1.7391239 W > 0.5 W: rank 5 (Class 4), not 4
		{name: 'a typed Class 3B power on a Class 4 setup', inputs: {beam1_power: '0.4 W'}, assessed: coldPower, od: Math.log10(coldPower / aperture / mpe808), nohd: (reach(coldPower, mpe808) - 0.003) / 0.15, classRank: 5},
	];

	it.each(cases)('$name', ({inputs, assessed, od, nohd, classRank}) => {
		const evaluation = evaluateDocument(rules, withChanges(clear, {beam1_divergence_convention: 'one_over_e', ...inputs}, inputs['control_mode'] ? {responsivity_measured: 'yes'} : {}));
		expectClose(derivedSi(evaluation, 'beam1_assessed_power'), assessed, 'beam1_assessed_power');
		expectClose(checkResult(evaluation, 'beam1_eyewear_sufficient').limit?.si, od, 'required OD');
		expectClose(checkResult(evaluation, 'beam1_hazard_distance').value?.si, nohd, 'NOHD');
		expect(checkResult(evaluation, 'label_class_covers_output').value?.si).toBe(classRank);
	});

	it('advises, naming both numbers, when the typed power is below the worst case', () => {
		const evaluation = evaluateDocument(rules, withChanges(clear, {beam1_power: '1 W'}));
		const result = checkResult(evaluation, 'beam1_power_covers_worst_case');
		expect(result.verdict).toBe('advise');
		// 1 W typed against 1.7391239 W at the limit, coldest (hand arithmetic above)
		expect(result.message).toContain('1 W');
		expect(result.message).toContain('1.74 W');
		expect(evaluation.outcome).toBe('clear_to_energize');
	});

	it('leaves beams 2 and 3 at their typed power', () => {
		// beam 2: 1 mW at 650 nm over 0.25 s, MPE 18 × 0.25^0.75 / 0.25 = 25.455844 W/m² (IEC 60825-1:2014,
		// from memory): OD = log10(1 mW / A / 25.455844) = 0.0089265, whatever beam 1's worst case is
		const evaluation = evaluateDocument(rules, withChanges(clear, {beam1_power: '1 W'}));
		expectClose(checkResult(evaluation, 'beam2_eyewear_sufficient').limit?.si, Math.log10(1e-3 / aperture / (18 * 0.25 ** -0.25)), 'beam 2 required OD');
	});
});

describe('diameter at the eye: eyewear is sized where the beam can reach the eye', () => {
	// 808 nm, 1 W typed, 10 mm at the exit; a limit of 1 A keeps the worst case below 1 W:
	// 1.1 W/A × (1 A − 0.4189783 A) = 0.6391239 W. Assessed 1 W.
	const wide: Changes = {beam1_power: '1 W', beam1_diameter: '10 mm', current_limit: '1 A', current_setpoint: '0.8 A', modulation_source_peak: '1 V'};
	const cases = [
		// default 0: the whole 1 W through the 7 mm aperture: E₀ = 1 W / 3.848451e-5 m² = 25 984.48 W/m²;
		// OD = log10(25 984.48 / 16.443717) = log10(1580.21) = 3.198714
		{name: 'focused into the aperture (0, the default)', eye: '0 mm', od: Math.log10(1 / aperture / mpe808)},
		// 10 mm at the eye: E₀ = 1 W / (π × (5 mm)²) = 12 732.40 W/m²; OD = log10(774.30) = 2.888914,
		// 0.309804 = log10((10/7)²) less than over the aperture
		{name: 'still 10 mm wide at the eye', eye: '10 mm', od: Math.log10(1 / (Math.PI * 0.005 ** 2) / mpe808)},
		// 5 mm at the eye is inside the 7 mm aperture: the aperture average again, 3.198714
		{name: '5 mm at the eye, smaller than the aperture', eye: '5 mm', od: Math.log10(1 / aperture / mpe808)},
	];

	it.each(cases)('$name', ({eye, od}) => {
		const evaluation = evaluateDocument(rules, withChanges(clear, {...wide, beam1_eye_diameter: eye}));
		expectClose(checkResult(evaluation, 'beam1_eyewear_sufficient').limit?.si, od, 'required OD');
	});

	it('keeps the exit diameter for the hazard distance', () => {
		// NOHD = (√(4 × 1 W/(π × 16.443717)) − 10 mm)/0.15 rad, 1/e as typed: (0.278262 − 0.01)/0.15 = 1.788414 m
		const evaluation = evaluateDocument(rules, withChanges(clear, {...wide, beam1_eye_diameter: '0 mm', beam1_divergence_convention: 'one_over_e'}));
		expectClose(checkResult(evaluation, 'beam1_hazard_distance').value?.si, (reach(1, mpe808) - 0.01) / 0.15, 'NOHD');
	});

	it('sizes the eyewear of beams 2 and 3 at their own diameter at the eye', () => {
		// beam 3, 1064 nm, 0.5 W, 20 mm at the eye: MPE 10·C_A·C_C = 50 W/m² over 10 s (IEC 60825-1:2014,
		// from memory); E₀ = 0.5 W / (π × (10 mm)²) = 1591.55 W/m²; OD = log10(31.831) = 1.502850
		const three = withChanges(clear, {third_beam: 'yes', beam3_wavelength: '1064 nm', beam3_power: '0.5 W', beam3_diameter: '20 mm', beam3_eye_diameter: '20 mm', beam3_divergence: '10 mrad', beam3_divergence_convention: 'one_over_e', beam3_eyewear_od: '4'});
		const evaluation = evaluateDocument(rules, three);
		expectClose(checkResult(evaluation, 'beam3_eyewear_sufficient').limit?.si, Math.log10(0.5 / (Math.PI * 0.01 ** 2) / 50), 'beam 3 required OD');
	});
});

describe('divergence convention: the hazard distance uses the 1/e full angle', () => {
	// Gaussian beam, irradiance ∝ exp(−θ²/θₑ²) with θₑ the 1/e half angle (Siegman, Lasers, 1986, ch. 17;
	// hand derivation): half maximum at θ = θₑ·√(ln 2), so FWHM = √(ln 2) × (1/e full angle) and
	// 1/e = FWHM / √(ln 2) = 1.201122 × FWHM; 1/e² at θ = √2·θₑ, so 1/e = 1/e² / √2.
	const cases = [
		// 150 mrad read as 1/e: NOHD (0.393524 − 0.003)/0.15 = 2.603486 m
		{convention: 'one_over_e', oneOverE: 0.15},
		// 150 mrad FWHM → 0.15 / √(ln 2) = 0.180168 rad; NOHD = 0.390524/0.180168 = 2.167538 m
		{convention: 'fwhm', oneOverE: 0.15 / Math.sqrt(Math.LN2)},
		// 150 mrad at 1/e² → 0.15 / √2 = 0.106066 rad; NOHD = 0.390524/0.106066 = 3.681898 m (√2 × 2.603486)
		{convention: 'one_over_e_squared', oneOverE: 0.15 / Math.SQRT2},
	];

	it.each(cases)('$convention', ({convention, oneOverE}) => {
		const evaluation = evaluateDocument(rules, withChanges(clear, {beam1_divergence_convention: convention}));
		expectClose(derivedSi(evaluation, 'beam1_divergence_1e'), oneOverE, 'beam1_divergence_1e');
		expectClose(checkResult(evaluation, 'beam1_hazard_distance').value?.si, (reach(2, mpe808) - 0.003) / oneOverE, 'NOHD');
	});

	it('checks the 1.201 factor: 1/√(ln 2) = 1.2011224 (hand arithmetic)', () => {
		const evaluation = evaluateDocument(rules, withChanges(clear, {beam1_divergence: '1 rad', beam1_divergence_convention: 'fwhm'}));
		expect(derivedSi(evaluation, 'beam1_divergence_1e')).toBeCloseTo(1.2011224, 7);
	});

	it('reads a 1/e² figure typed as 1/e to a hazard distance √2 shorter', () => {
		const asTyped = evaluateDocument(rules, withChanges(clear, {beam1_divergence_convention: 'one_over_e'}));
		const asLabelled = evaluateDocument(rules, withChanges(clear, {beam1_divergence_convention: 'one_over_e_squared'}));
		const ratio = checkResult(asLabelled, 'beam1_hazard_distance').value!.si / checkResult(asTyped, 'beam1_hazard_distance').value!.si;
		expectClose(ratio, Math.SQRT2, 'NOHD ratio'); // hand arithmetic: 1/e = 1/e² / √2
	});

	it('converts beams 2 and 3 by their own convention', () => {
		// beam 2: 1 mrad FWHM → 1.2011224 mrad; NOHD = (7.072310 − 2) mm / 1.2011224 mrad = 4.222976 m
		const evaluation = evaluateDocument(rules, withChanges(clear, {beam2_divergence_convention: 'fwhm'}));
		const mpe650 = 18 * 0.25 ** -0.25; // 25.455844 W/m² (IEC 60825-1:2014, from memory)
		expectClose(checkResult(evaluation, 'beam2_hazard_distance').value?.si, (reach(1e-3, mpe650) - 0.002) / (1e-3 / Math.sqrt(Math.LN2)), 'beam 2 NOHD');
	});

	it('pre-selects the 1/e² reading, which gives the longest hazard distance', () => {
		const input = rules.rules.steps.flatMap((step) => step.inputs).find((entry) => entry.id === 'beam1_divergence_convention');
		expect(input?.kind === 'choice' ? input.default : undefined).toBe('one_over_e_squared');
	});

	it('leaves the hazard distance open until the convention is given', () => {
		const evaluation = evaluateDocument(rules, withChanges(clear, {beam1_divergence_convention: null}));
		expect(checkResult(evaluation, 'beam1_hazard_distance')).toMatchObject({verdict: 'open', needs: ['beam1_divergence_convention']});
	});
});
