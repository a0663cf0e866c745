import {describe, expect, it} from 'vitest';
import {findCalculation} from '../../source/calculations/registry.js';
import {runCalculation} from '../../source/calculations/run-calculation.js';
import type {Dimension} from '../../source/quantities/dimensions.js';
import {parseQuantity} from '../../source/quantities/parse-quantity.js';
import {evaluate} from '../../source/rules/evaluate/evaluate.js';
import {loadAnswersFromText} from '../../source/rules/evaluate/load-answers.js';
import {loadRulesFromText} from '../../source/rules/load.js';
import {checkResult, readDemo, shippedRules, withChanges, evaluateDocument} from '../rules/bench-answers.js';
import {stringify} from 'yaml';

// A step of one kelvin is a step of one degree Celsius and of 9/5 degree Fahrenheit (SI Brochure,
// 9th ed. (2019), section 2.3.1 and note on the degree Celsius; NIST SP 811 (2008), 4.2.1.1).
const entries: Array<{entry: string; dimension: Dimension; si: number}> = [
	{entry: '50 degC', dimension: 'temperature_difference', si: 50}, // SI Brochure 2.3.1: a Celsius interval equals a kelvin interval
	{entry: '50 °C', dimension: 'temperature_difference', si: 50}, // SI Brochure 2.3.1
	{entry: '90 degF', dimension: 'temperature_difference', si: 50}, // NIST SP 811 B.9: 1 °F interval = 5/9 K; 90 × 5/9 = 50
	{entry: '-18 degF', dimension: 'temperature_difference', si: -10}, // NIST SP 811 B.9: −18 × 5/9 = −10
	{entry: '60 K', dimension: 'temperature_difference', si: 60}, // SI base unit
	{entry: '25 degC', dimension: 'temperature', si: 298.15}, // SI Brochure 2.3.1: t/°C = T/K − 273.15
	{entry: '77 degF', dimension: 'temperature', si: 298.15}, // NIST SP 811 B.9: T/K = (t/°F + 459.67)/1.8; 536.67/1.8 = 298.15
];

describe('temperature differences typed in degC or degF', () => {
	it.each(entries)('$entry as $dimension is $si K', ({entry, dimension, si}) => {
		const parsed = parseQuantity(entry, dimension);
		expect(parsed.ok && parsed.value.si).toBe(si);
	});

	it('calc threshold reads t0=50degC as 50 K and echoes it in kelvin', () => {
		const threshold = findCalculation('threshold')!;
		const run = runCalculation(threshold, ['threshold_ref=10mA', 'temperature_ref=25degC', 't0=50degC', 'temperature=85degC']);
		expect(run.ok).toBe(true);
		if (!run.ok) return;
		// hand arithmetic: 10 mA × exp((85 − 25)/50) = 10 mA × exp(1.2) = 33.2012 mA
		expect(run.value.outputs['threshold']!.si).toBeCloseTo(0.0332012, 6);
		expect(run.value.inputs['t0']!.text).toBe('50 K');
	});

	it('the shipped rules read diode_t0 = 60 degC as 60 K, the same verdicts as 60 K', () => {
		const rules = shippedRules();
		const demo = readDemo('bench3-808nm-clear.yaml');
		// The coldest case at −30 °C with T0 = 60 K: 450 mA × exp(−55/60) ≈ 180 mA at the cold (hand arithmetic).
		const kelvin = evaluateDocument(rules, withChanges(demo, {diode_t0: '60 K', diode_temperature_min: '-30 degC'}));
		const celsius = evaluateDocument(rules, withChanges(demo, {diode_t0: '60 degC', diode_temperature_min: '-30 degC'}));
		// hand arithmetic: I_th(−30 °C) = 450 mA × exp(−55/60) = 179.9 mA; P = 1.1 W/A × (2 A − 0.1799 A) = 2.002 W > 2 W,
		// so the cold-power check stops; T0 misread as 333.15 K gave 1.1 × (2 − 0.3816) = 1.78 W and cleared.
		expect(checkResult(kelvin, 'cold_power_at_limit').verdict).toBe('fail');
		expect(kelvin.outcome).toBe('do_not_energize');
		expect(celsius.outcome).toBe(kelvin.outcome);
		expect(celsius.checks.map((check) => check.verdict)).toEqual(kelvin.checks.map((check) => check.verdict));
	});
});

/** A site file with the check from the issue: the spread between the hottest ambient and the coldest case. */
const site = (limit: string, value = 'ambient_max - diode_temperature_min') => `format: 1
extends: shipped
add_checks:
  - id: temperature_spread
    step: driver
    title: Spread between the hottest ambient and the coldest case
    value: ${value}
    at_most: ${limit}
    severity: stop
    explanation: A wide spread stresses the solder joints.
    message: The spread {{value}} is above {{limit}}.
    basis: site policy (invented for this test)
`;

describe('temperatures inside formulas', () => {
	const demo = withChanges(readDemo('bench3-808nm-clear.yaml'), {ambient_max: '85 degC', diode_temperature_min: '-40 degC'});

	it('the difference of two absolute temperatures against a 20 degC limit is 125 K against 20 K, and fails', () => {
		const loaded = loadRulesFromText(site('20 degC'), 'site.yaml');
		expect(loaded.ok ? [] : loaded.errors.map((found) => found.code)).toEqual([]);
		if (!loaded.ok) return;
		const answers = loadAnswersFromText(stringify(demo), 'case.yaml', loaded.value);
		if (!answers.ok) throw new Error('answers refused');
		const check = checkResult(evaluate(loaded.value, answers.value), 'temperature_spread');
		// hand arithmetic: 85 °C − (−40 °C) = 125 K; 125 K > 20 K
		expect(check.verdict).toBe('fail');
		expect(check.value?.text).toBe('125 K');
		expect(check.limit?.text).toBe('20 K');
		expect(check.margin?.text).toBe('-105 K');
	});

	it.each([
		{limit: '20 K', verdict: 'fail'}, // 125 K > 20 K (hand arithmetic)
		{limit: '36 degF', verdict: 'fail'}, // 36 °F interval = 20 K (NIST SP 811 B.9)
		{limit: '130 degC', verdict: 'pass'}, // 125 K ≤ 130 K (hand arithmetic)
	])('a limit of $limit against the spread gives $verdict', ({limit, verdict}) => {
		const loaded = loadRulesFromText(site(limit), 'site.yaml');
		if (!loaded.ok) throw new Error(loaded.errors.map((found) => found.code).join(', '));
		const answers = loadAnswersFromText(stringify(demo), 'case.yaml', loaded.value);
		if (!answers.ok) throw new Error('answers refused');
		expect(checkResult(evaluate(loaded.value, answers.value), 'temperature_spread').verdict).toBe(verdict);
	});

	it('an absolute temperature plus a difference is absolute, shown in degC', () => {
		const loaded = loadRulesFromText(site('100 degC', 'ambient_max + (ambient_max - diode_temperature_min) / 5'), 'site.yaml');
		if (!loaded.ok) throw new Error(loaded.errors.map((found) => found.code).join(', '));
		const answers = loadAnswersFromText(stringify(demo), 'case.yaml', loaded.value);
		if (!answers.ok) throw new Error('answers refused');
		const check = checkResult(evaluate(loaded.value, answers.value), 'temperature_spread');
		// hand arithmetic: 85 °C + 125 K / 5 = 110 °C > 100 °C
		expect(check.value?.text).toBe('110 °C');
		expect(check.limit?.text).toBe('100 °C');
		expect(check.verdict).toBe('fail');
	});

	it('an absolute temperature compared with a computed difference is a load-time error at its line', () => {
		const text = site('ambient_max - diode_temperature_min', 'ambient_max');
		const loaded = loadRulesFromText(text, 'site.yaml');
		expect(loaded.ok).toBe(false);
		if (loaded.ok) return;
		const found = loaded.errors.find((entry) => entry.code === 'temperature-kind-mismatch');
		expect(found, loaded.errors.map((entry) => entry.code).join(', ')).toBeDefined();
		expect(found!.file).toBe('site.yaml');
		expect(found!.line).toBe(text.split('\n').findIndex((line) => line.includes('at_most:')) + 1);
	});

	it('comparing an absolute temperature with a computed difference inside a condition is a load-time error', () => {
		const text = site('20 K', '"ambient_max > (ambient_max - diode_temperature_min) ? 1 K : 2 K"');
		const loaded = loadRulesFromText(text, 'site.yaml');
		expect(loaded.ok).toBe(false);
		if (loaded.ok) return;
		expect(loaded.errors.map((entry) => entry.code)).toContain('temperature-kind-mismatch');
	});

	it('a derived temperature difference and a placeholder of one are shown in kelvin', () => {
		const text = `format: 1
extends: shipped
add_derived:
  - id: spread
    label: Spread
    dimension: temperature_difference
    formula: ambient_max - diode_temperature_min
add_checks:
  - id: temperature_spread
    step: driver
    title: Spread
    holds: spread < 20 degC
    severity: stop
    explanation: A wide spread stresses the solder joints.
    message: The spread {{spread}} is too wide.
    basis: site policy (invented for this test)
`;
		const loaded = loadRulesFromText(text, 'site.yaml');
		if (!loaded.ok) throw new Error(loaded.errors.map((found) => `${found.code} ${JSON.stringify(found.data)}`).join(', '));
		const answers = loadAnswersFromText(stringify(demo), 'case.yaml', loaded.value);
		if (!answers.ok) throw new Error('answers refused');
		const evaluation = evaluate(loaded.value, answers.value);
		expect(evaluation.derived.find((entry) => entry.id === 'spread')).toMatchObject({status: 'value', value: {text: '125 K'}});
		const check = checkResult(evaluation, 'temperature_spread');
		expect(check.verdict).toBe('fail'); // 125 K is not below 20 K (hand arithmetic)
		expect(check.message).toBe('The spread 125 K is too wide.');
	});
});

describe('branches and calls that mix points and steps', () => {
	it('a ? b : c with an absolute temperature in one branch and a difference in the other is a load-time error', () => {
		const loaded = loadRulesFromText(site('20 K', '"ambient_max > diode_temperature_min ? ambient_max - diode_temperature_min : ambient_max"'), 'site.yaml');
		expect(loaded.ok).toBe(false);
		if (!loaded.ok) expect(loaded.errors.map((entry) => entry.code)).toContain('dimension-mismatch');
	});

	it('a calculation refuses a difference where it needs an absolute temperature, naming what it got', () => {
		const text = `format: 1
extends: shipped
add_derived:
  - id: cold_threshold
    label: Threshold with a spread passed as the temperature
    dimension: current
    formula: threshold(diode_threshold, diode_threshold_temperature, diode_t0, ambient_max - diode_temperature_min)
`;
		const loaded = loadRulesFromText(text, 'site.yaml');
		expect(loaded.ok).toBe(false);
		if (!loaded.ok) expect(loaded.errors.map((entry) => String(entry.data?.['detail']))).toEqual([expect.stringContaining('must be a temperature')]);
	});
});
