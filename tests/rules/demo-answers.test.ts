import {readdirSync} from 'node:fs';
import {join} from 'node:path';
import {describe, expect, it} from 'vitest';
import {evaluate} from '../../source/rules/evaluate.js';
import type {Evaluation, Outcome} from '../../source/rules/evaluation.js';
import {loadAnswers} from '../../source/rules/load-answers.js';
import {checkResult, examplesFolder, expectClose, shippedRules} from './bench-answers.js';

const rules = shippedRules();

/** The outcome a demo's file name promises, from its suffix. */
const suffixes: Array<[suffix: string, outcome: Outcome]> = [
	['-clear.yaml', 'clear_to_energize'],
	['-fail.yaml', 'do_not_energize'],
	['-incomplete.yaml', 'incomplete'],
];

const demos = readdirSync(examplesFolder)
	.filter((name) => name.endsWith('.yaml'))
	.map((name) => ({name, outcome: suffixes.find(([suffix]) => name.endsWith(suffix))?.[1]}));

function evaluateDemo(name: string): Evaluation {
	const answers = loadAnswers(join(examplesFolder, name), rules);
	if (!answers.ok) throw new Error(`${name} was refused: ${answers.errors.map((found) => `${found.code} at ${found.field ?? '?'}`).join(', ')}`);
	return evaluate(rules, answers.value);
}

const ids = (evaluation: Evaluation, verdict: string) => evaluation.checks.filter((check) => check.verdict === verdict).map((check) => check.id);

describe('the demo answers files', () => {
	it('has one demo of each outcome', () => {
		expect(demos.map(({outcome}) => outcome).sort()).toEqual(['clear_to_energize', 'do_not_energize', 'incomplete']);
	});

	it.each(demos)('$name ends in its outcome ($outcome)', ({name, outcome}) => {
		expect(outcome, `${name} needs a suffix -clear, -fail or -incomplete`).toBeDefined();
		expect(evaluateDemo(name).outcome).toBe(outcome);
	});

	it('clears the 808 nm bench with every stop check holding; the short circuit and the aiming beam advise', () => {
		const evaluation = evaluateDemo('bench3-808nm-clear.yaml');
		expect(ids(evaluation, 'fail')).toEqual([]);
		expect(ids(evaluation, 'open')).toEqual([]);
		// the aiming beam (1 mW, 2 mm, 1 mrad at 1/e² = 0.707 mrad at 1/e) stays above the MPE for 7.17 m, past 4 m
		expect(ids(evaluation, 'advise')).toEqual(['short_circuit_dissipation', 'beam2_hazard_distance']);
		expect(ids(evaluation, 'skip').sort()).toEqual(['beam3_eyewear_sufficient', 'beam3_hazard_distance', 'monitor_current_within_input', 'monitor_loss_contained', 'power_setpoint_below_maximum']);
		expect(evaluation.missingInputs).toEqual([]);
	});

	it('stops the rack-supply bench on driver dissipation alone', () => {
		const evaluation = evaluateDemo('bench5-rack-supply-dissipation-fail.yaml');
		expect(ids(evaluation, 'fail')).toEqual(['dissipation_within_rating']);
		// supply high 28 V × 1.05 = 29.4 V; I* = (29.4 − 1.8)/(2 × 0.2) = 69 A > 1 A, so at the
		// limit: (29.4 − 1.8 − 0.2 × 1) × 1 A = 27.4 W. Ambient 25 degC = rated ambient: 9 W.
		// Margin 9 − 27.4 = −18.4 W, −18.4/9 = −2.0444444.
		const dissipation = checkResult(evaluation, 'dissipation_within_rating');
		expectClose(dissipation.value?.si, 27.4, 'value');
		expectClose(dissipation.limit?.si, 9, 'limit');
		expectClose(dissipation.margin?.si, -18.4, 'margin');
		expectClose(dissipation.margin?.fraction, -18.4 / 9, 'margin fraction');
		// short circuit: 29.4 V × 1 A = 29.4 W against 9 W
		expectClose(checkResult(evaluation, 'short_circuit_dissipation').value?.si, 29.4, 'short-circuit value');
	});

	it('leaves the constant-power bench incomplete with nothing failing', () => {
		const evaluation = evaluateDemo('bench3-808nm-incomplete.yaml');
		expect(ids(evaluation, 'fail')).toEqual([]);
		expect(evaluation.missingInputs.sort()).toEqual(['beam1_eyewear_od', 'brownout_trip', 'photodiode_responsivity']);
		expect(ids(evaluation, 'open').sort()).toEqual(['beam1_eyewear_sufficient', 'brownout_before_control_lost', 'brownout_clear_of_service_supply', 'monitor_current_within_input']);
		const unanswered = evaluation.confirmations.filter(({status}) => status === 'unanswered').map(({id}) => id);
		expect(unanswered.sort()).toEqual(['interlock_loop_tested', 'responsivity_measured']);
	});
});
