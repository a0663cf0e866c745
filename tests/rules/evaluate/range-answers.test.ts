import {readFileSync} from 'node:fs';
import {join} from 'node:path';
import {describe, expect, it} from 'vitest';
import {evaluate} from '../../../source/rules/evaluate/evaluate.js';
import {loadAnswers} from '../../../source/rules/evaluate/load-answers.js';
import {checkResult, evaluateDocument, examplesFolder, readAnswers, readDemo, shippedRules, withChanges} from '../bench-answers.js';

const rules = shippedRules();
const demo = readDemo('bench3-808nm-clear.yaml');

/** Verdict, value and limit of every check, for comparing two evaluations. */
const verdicts = (document: ReturnType<typeof readDemo>) =>
	evaluateDocument(rules, document).checks.map(({id, verdict, value, limit, corner}) => ({id, verdict, value: value?.si ?? null, limit: limit?.si ?? null, corner: corner?.inputs.map(({id: input, end}) => `${input} ${end}`) ?? []}));

describe('the same range in other units gives the same verdicts', () => {
	// SI prefixes (SI Brochure, 9th ed. (2019), table 7); t/°C = T/K − 273.15 (SI Brochure 2.3.1)
	it.each([
		{input: 'diode_knee_voltage', a: '1.5 V .. 1.7 V', b: '1500 mV .. 1700 mV'}, // m = 1e-3
		{input: 'diode_knee_voltage', a: '1.6 V ± 0.1 V', b: '1600 mV +/- 100 mV'}, // m = 1e-3
		{input: 'current_limit', a: '1.9 A .. 2 A', b: '1900 mA .. 2000 mA'}, // m = 1e-3
		{input: 'ambient_max', a: '25 degC .. 45 degC', b: '298.15 K .. 318.15 K'}, // 25 + 273.15, 45 + 273.15
		{input: 'ambient_max', a: '35 degC ± 10 K', b: '308.15 K ± 10 degC'}, // a Celsius interval is a kelvin interval
		{input: 'beam1_wavelength', a: '800 nm .. 810 nm', b: '0.8 um .. 0.81 um'}, // n = 1e-9, u = 1e-6
	])('$input: "$a" and "$b"', ({input, a, b}) => {
		const first = verdicts(withChanges(demo, {[input]: a}));
		const second = verdicts(withChanges(demo, {[input]: b}));
		expect(second.map(({id, verdict, corner}) => ({id, verdict, corner}))).toEqual(first.map(({id, verdict, corner}) => ({id, verdict, corner})));
		for (const [index, entry] of first.entries()) {
			if (entry.value !== null) expect(second[index]!.value, entry.id).toBeCloseTo(entry.value, 9);
			if (entry.limit !== null) expect(second[index]!.limit, entry.id).toBeCloseTo(entry.limit, 9);
		}
		expect(first.some(({corner}) => corner.some((text) => text.startsWith(input)))).toBe(true);
	});
});

describe('the record keeps exactly what was typed', () => {
	it('keeps the range text as entered and its ends in SI', () => {
		const answers = readAnswers(rules, withChanges(demo, {diode_knee_voltage: '1.6 V ± 0.1 V'}));
		expect(answers.ok).toBe(true);
		if (!answers.ok) return;
		const knee = answers.value.inputs.get('diode_knee_voltage');
		expect(knee?.entered).toBe('1.6 V ± 0.1 V');
		// hand arithmetic: 1.6 ∓ 0.1 = 1.5 and 1.7
		expect(knee?.kind === 'quantity' && knee.range?.low).toBeCloseTo(1.5, 12); // hand arithmetic in the comment above
		expect(knee?.kind === 'quantity' && knee.range?.high).toBeCloseTo(1.7, 12); // hand arithmetic in the comment above
	});
});

describe('bad ranges are refused with the field and its line', () => {
	it.each([
		{name: 'reversed', inputs: {diode_knee_voltage: '2.0 V .. 1.6 V'}, code: 'range-reversed', field: 'inputs.diode_knee_voltage'},
		{name: 'a missing end', inputs: {diode_knee_voltage: '1.6 V ..'}, code: 'range-empty-end', field: 'inputs.diode_knee_voltage'},
		{name: 'ends of different dimensions', inputs: {diode_knee_voltage: '1.6 V .. 2 A'}, code: 'range-mixed-dimensions', field: 'inputs.diode_knee_voltage'},
		{name: 'a range on a choice', inputs: {control_mode: '1 .. 2'}, code: 'range-not-numeric', field: 'inputs.control_mode'},
		{name: 'a range on a text field', inputs: {location: '1.6 V .. 2 V'}, code: 'range-not-numeric', field: 'inputs.location'},
		{name: 'a range on a yes/no field', inputs: {reverse_protection: '1 .. 2'}, code: 'range-not-numeric', field: 'inputs.reverse_protection'},
		{name: 'a range the rules refuse', inputs: {diode_max_current: '2.4 A .. 2.6 A'}, code: 'range-not-allowed', field: 'inputs.diode_max_current'},
		{name: 'an end outside the allowed range', inputs: {diode_knee_voltage: '0.1 V .. 2 V'}, code: 'answers-out-of-range', field: 'inputs.diode_knee_voltage'},
	])('$name: $code at $field', ({inputs, code, field}) => {
		const answers = readAnswers(rules, withChanges(demo, inputs));
		expect(answers.ok).toBe(false);
		if (answers.ok) return;
		expect(answers.errors.map((found) => ({code: found.code, field: found.field, hasLine: typeof found.line === 'number'}))).toEqual([{code, field, hasLine: true}]);
	});
});

describe('answers files from before ranges', () => {
	const before = JSON.parse(readFileSync(join('tests', 'rules', 'evaluate', 'fixtures', 'demo-verdicts-before-ranges.json'), 'utf8')) as Record<string, {outcome: string; checks: Record<string, [string, number | null, number | null]>}>;

	// The fixture is the shipped demos' check results from the version before ranges (supply_tolerance an input of its own).
	it.each(Object.keys(before))('%s gives the same outcome, verdicts, values and limits', (name) => {
		const answers = loadAnswers(join(examplesFolder, name), rules);
		expect(answers.ok ? [] : answers.errors.map((found) => found.code)).toEqual([]);
		if (!answers.ok) return;
		const evaluation = evaluate(rules, answers.value);
		const expected = before[name]!;
		expect(evaluation.outcome).toBe(expected.outcome);
		expect(evaluation.checks.map(({id}) => id)).toEqual(Object.keys(expected.checks));
		for (const check of evaluation.checks) {
			const [verdict, value, limit] = expected.checks[check.id]!;
			expect(check.verdict, check.id).toBe(verdict);
			if (value === null) expect(check.value, check.id).toBeUndefined();
			else expect(check.value?.si, check.id).toBeCloseTo(value, 9);
			if (limit === null) expect(check.limit, check.id).toBeUndefined();
			else expect(check.limit?.si, check.id).toBeCloseTo(limit, 9);
		}
	});

	it.each([
		// hand arithmetic: 5 V × (1 − 0.03) = 4.85 V; 4.85 − 2 × 0.15 − 0.8 = 3.75 V available
		{tolerance: '3 %', entered: '5 V ± 3 %', available: 3.75},
		{tolerance: 0.03, entered: '5 V ± 3 %', available: 3.75}, // a bare fraction, 0.03 = 3 %
		// hand arithmetic: 5 V × (1 − 0.05) = 4.75 V; 4.75 − 0.3 − 0.8 = 3.65 V
		{tolerance: null, entered: '5 V', available: 3.65}, // none given: the rules' default 5 %
	])('supply_tolerance: $tolerance is read as the tolerance of the supply range', ({tolerance, entered, available}) => {
		const answers = readAnswers(rules, withChanges(demo, {supply_tolerance: tolerance}));
		expect(answers.ok).toBe(true);
		if (!answers.ok) return;
		expect(answers.value.inputs.get('supply_nominal')?.entered).toBe(entered);
		expect(answers.value.inputs.has('supply_tolerance')).toBe(false);
		expect(checkResult(evaluate(rules, answers.value), 'compliance_headroom').value?.si).toBeCloseTo(available, 12);
	});

	it('refuses a bad old tolerance at its own line', () => {
		const answers = readAnswers(rules, withChanges(demo, {supply_tolerance: '5 V'}));
		expect(answers.ok ? [] : answers.errors.map((found) => [found.code, found.field])).toEqual([['entry-wrong-dimension', 'inputs.supply_tolerance']]);
	});
});
