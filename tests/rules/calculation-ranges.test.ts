import {stringify} from 'yaml';
import {describe, expect, it} from 'vitest';
import {evaluate} from '../../source/rules/evaluate.js';
import {loadAnswersFromText} from '../../source/rules/load-answers.js';
import {loadRulesFromText} from '../../source/rules/load.js';
import {checkResult, evaluateDocument, readDemo, shippedRules, withChanges} from './bench-answers.js';

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
