import {describe, expect, it} from 'vitest';
import {evaluationToJson} from '../../../source/rules/evaluate/evaluation-json.js';
import {evaluate} from '../../../source/rules/evaluate/evaluate.js';
import {loadAnswersFromText} from '../../../source/rules/evaluate/load-answers.js';
import {loadRulesFromText} from '../../../source/rules/load.js';

// A rule file whose wavelength range is wider than the class tables (a copy a site widened): the
// class check is skipped there with its reason, never left as an advice that can never clear.
const ruleText = `format: 1
name: skip reason fixture
caution: Test fixture only.
steps:
  - id: people
    title: People
    inputs:
      - id: wavelength
        label: Wavelength
        dimension: length
        range: [100 nm, 1 mm]
      - id: power
        label: Power
        dimension: power
        range: [0 W, 1 kW]
derived:
  - id: indicated
    label: Indicative class rank
    dimension: number
    formula: hazard_class(power, wavelength)
checks:
  - id: class_at_most_3r
    step: people
    title: Indicative class at most 3R
    when: wavelength >= 180 nm and wavelength <= 1 mm
    skip_reason: No class can be indicated outside 180 nm to 1 mm; ask the laser safety officer.
    value: indicated
    at_most: "3"
    dimension: number
    severity: advise
    explanation: Fixture.
    basis: common practice
`;

function evaluateAt(wavelength: string) {
	const rules = loadRulesFromText(ruleText, 'fixture.yaml');
	if (!rules.ok) throw new Error(JSON.stringify(rules.errors));
	const answers = loadAnswersFromText(`inputs:\n  wavelength: ${wavelength}\n  power: 1 mW\n`, 'answers.yaml', rules.value);
	if (!answers.ok) throw new Error(JSON.stringify(answers.errors));
	return {rules: rules.value, answers: answers.value, evaluation: evaluate(rules.value, answers.value)};
}

describe('a check skipped by its condition says why', () => {
	it('skips with the rule file’s reason where no class can be indicated (150 nm)', () => {
		const {evaluation} = evaluateAt('150 nm');
		const check = evaluation.checks[0]!;
		expect(check.verdict).toBe('skip');
		expect(check.reason).toContain('outside 180 nm to 1 mm');
	});

	it('is evaluated, with no reason, inside the tables (1550 nm, 1 mW is Class 1: 9.62 mW limit by hand)', () => {
		const {evaluation} = evaluateAt('1550 nm');
		expect(evaluation.checks[0]!.verdict).toBe('pass');
		expect(evaluation.checks[0]!.reason).toBeUndefined();
	});

	it('carries the reason into the JSON evaluation (and so into the record)', () => {
		const {rules, answers, evaluation} = evaluateAt('150 nm');
		const json = evaluationToJson(rules, answers, evaluation) as {checks: Array<{reason?: string}>};
		expect(json.checks[0]!.reason).toContain('ask the laser safety officer');
	});
});

describe('the shipped class check at 1550 nm', () => {
	it('is judged, not left as an advice that can never clear', async () => {
		const {checkResult, evaluateDocument, readDemo, shippedRules, withChanges} = await import('../bench-answers.js');
		// the clearing demo's 2 W output moved to 1550 nm: above 0.5 W is Class 4 (IEC 60825-1, from memory, high),
		// and the label says Class 4
		const evaluation = evaluateDocument(shippedRules(), withChanges(readDemo('bench3-808nm-clear.yaml'), {beam1_wavelength: '1550 nm'}));
		const check = checkResult(evaluation, 'label_class_covers_output');
		expect(check.error).toBeUndefined();
		expect(check.verdict).toBe('pass');
		expect(check.value?.si).toBe(5);
	});
});
