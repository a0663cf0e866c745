import {stringify} from 'yaml';
import {describe, expect, it} from 'vitest';
import {evaluate} from '../../../source/rules/evaluate/evaluate.js';
import {loadAnswersFromText} from '../../../source/rules/evaluate/load-answers.js';
import {loadRulesFromText} from '../../../source/rules/load.js';
import {checkResult, evaluateDocument, readDemo, shippedRules, withChanges} from '../bench-answers.js';

// A rule formula that calls a calculation with values outside the calculation's range never
// passes: the check fails (stop) or advises, and says which key and range were refused.
const fixture = `format: 1
name: range fixture
caution: Test fixture only.
steps:
  - id: wiring
    title: Wiring
    inputs:
      - id: gauge
        kind: quantity
        label: Conductor gauge
        dimension: number
        range: [-100, 100]
      - id: run
        label: Conductor length
        dimension: length
        range: [0 m, 100 m]
checks:
  - id: conductor_small_enough
    step: wiring
    title: Conductor resistance at most 1 ohm
    holds: not (wire(gauge, run) > 1 ohm)
    severity: stop
    explanation: fixture
    basis: common practice
  - id: conductor_advice
    step: wiring
    title: Conductor resistance at most 1 ohm (advice)
    value: wire(gauge, run)
    at_most: 1 ohm
    severity: advise
    explanation: fixture
    basis: common practice
`;

describe('calculations called from rule formulas with values outside their range', () => {
	const loaded = loadRulesFromText(fixture, 'fixture.yaml');
	if (!loaded.ok) throw new Error(loaded.errors.map((found) => found.code).join(', '));
	const rules = loaded.value;
	const run = (gauge: number) => {
		const answers = loadAnswersFromText(stringify({inputs: {gauge: String(gauge), run: '1 m'}, confirmations: {}}), 'case.yaml', rules);
		if (!answers.ok) throw new Error(answers.errors.map((found) => found.code).join(', '));
		return evaluate(rules, answers.value);
	};

	it.each([
		{gauge: 100, name: 'gauge 100'}, // NBS Handbook 100 AWG tables end at 40 (and 4/0 = −3)
		{gauge: -50, name: 'gauge −50'}, // NBS Handbook 100: nothing beyond 4/0 (−3)
		{gauge: 24.5, name: 'gauge 24.5'}, // NBS Handbook 100: whole gauges only
	])('$name fails the stop check and advises, naming the range', ({gauge}) => {
		const evaluation = run(gauge);
		const stop = checkResult(evaluation, 'conductor_small_enough');
		expect(stop.verdict).toBe('fail');
		expect(stop.error).toMatch(/awg must be/);
		expect(checkResult(evaluation, 'conductor_advice').verdict).toBe('advise');
		expect(evaluation.outcome).toBe('do_not_energize');
	});

	it('passes a gauge inside the range', () => {
		// NBS Handbook 100 (from memory): 1 m of 18 AWG at 20 °C is about 0.021 Ω
		expect(checkResult(run(18), 'conductor_small_enough').verdict).toBe('pass');
	});
});

describe('the shipped policy with a derating line that rises', () => {
	it('does not pass the dissipation check when the zero-dissipation temperature is below the rated ambient', () => {
		// common practice: a derating line falls from the rated ambient to a higher zero point;
		// 30 °C below a 40 °C rated ambient is a typing mistake, not a full rating at 35 °C
		const evaluation = evaluateDocument(shippedRules(), withChanges(readDemo('bench3-808nm-clear.yaml'), {driver_rated_ambient: '40 degC', driver_max_temperature: '30 degC', ambient_max: '35 degC'}));
		const result = checkResult(evaluation, 'dissipation_within_rating');
		expect(result.verdict).toBe('fail');
		expect(result.error).toMatch(/max_temperature/);
		expect(evaluation.outcome).toBe('do_not_energize');
	});
});

// The optical calculations' ranges are at least as wide as the shipped rule file's beam inputs
// (after the divergence conversion), so a beam typed at any edge the rule file allows gets a
// number from every people check, never a refusal.
describe('the shipped policy with beam 1 at the edges of its input ranges', () => {
	const peopleChecks = ['beam1_eyewear_sufficient', 'beam1_hazard_distance', 'label_class_covers_output', 'slope_efficiency_within_photon_limit'];
	it.each([
		{name: '180 nm typed as 0.18 um', changes: {beam1_wavelength: '0.18 um'}}, // IEC 60825-1:2014 Annex A tables start at 180 nm (from memory)
		{name: '1 mm typed as 1000 um', changes: {beam1_wavelength: '1000 um'}}, // IEC 60825-1:2014 Annex A tables end at 1 mm (from memory)
		{name: 'a 1 kW beam', changes: {beam1_power: '1 kW'}}, // common practice: the rule file's beam power range ends at 1 kW
		{name: 'a 0.3 m beam at the exit and at the eye', changes: {beam1_diameter: '30 cm', beam1_eye_diameter: '300 mm'}}, // common practice: the rule file's diameter range ends at 0.3 m
		{name: '3 rad FWHM', changes: {beam1_divergence: '3 rad', beam1_divergence_convention: 'fwhm'}}, // hand arithmetic: 3 rad / √(ln 2) = 3.60 rad at the 1/e points, below 2π
		{name: '0.01 mrad at 1/e²', changes: {beam1_divergence: '0.01 mrad', beam1_divergence_convention: 'one_over_e_squared'}}, // hand arithmetic: 0.01 mrad / √2 = 7.07 µrad, above 1 µrad
	])('$name: every people check is evaluated', ({changes}) => {
		const evaluation = evaluateDocument(shippedRules(), withChanges(readDemo('bench3-808nm-clear.yaml'), changes));
		for (const id of peopleChecks) expect(checkResult(evaluation, id).error, id).toBeUndefined();
	});
});

describe('an optical calculation called from a rule formula outside its range', () => {
	const optical = `format: 1
name: optical range fixture
caution: Test fixture only.
steps:
  - id: people
    title: People
    inputs:
      - id: spot
        label: Beam diameter at the eye
        dimension: length
        range: [0 m, 10 m]
      - id: eyewear
        label: Eyewear optical density
        dimension: number
        range: [0, 15]
checks:
  - id: eyewear_enough
    step: people
    title: Eyewear at or above the required optical density
    value: eyewear
    at_least: od(1 W, spot, 808 nm, 10 s)
    dimension: number
    severity: stop
    explanation: fixture
    basis: common practice
`;
	const loaded = loadRulesFromText(optical, 'optical.yaml');
	if (!loaded.ok) throw new Error(loaded.errors.map((found) => found.code).join(', '));
	const rules = loaded.value;
	const run = (spot: string) => {
		const answers = loadAnswersFromText(stringify({inputs: {spot, eyewear: '5'}, confirmations: {}}), 'case.yaml', rules);
		if (!answers.ok) throw new Error(answers.errors.map((found) => found.code).join(', '));
		return evaluate(rules, answers.value);
	};

	it('fails the check, naming the key and the range', () => {
		// common practice: a bench beam is far narrower than 1 m; 2 m is a unit slip
		const result = checkResult(run('2 m'), 'eyewear_enough');
		expect(result.verdict).toBe('fail');
		expect(result.error).toMatch(/diameter must be between 0 m and 1 m/);
	});

	it('passes inside the range', () => {
		// hand arithmetic: 1 W over a 1 m beam is 1.27 W/m², below the 808 nm MPE at 10 s,
		// 18·C_A·t^0.75/t = 16.6 W/m² with C_A = 10^(0.002·108) (IEC 60825-1:2014 Table A.1), so OD 0 < 5
		expect(checkResult(run('1 m'), 'eyewear_enough').verdict).toBe('pass');
	});
});
