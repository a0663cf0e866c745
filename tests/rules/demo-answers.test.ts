import {readdirSync, readFileSync} from 'node:fs';
import {join} from 'node:path';
import {describe, expect, it} from 'vitest';
import {evaluate} from '../../source/rules/evaluate/evaluate.js';
import type {Evaluation, Outcome} from '../../source/rules/evaluate/evaluation.js';
import {loadAnswers} from '../../source/rules/evaluate/load-answers.js';
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

	it('stops the chilled-mount bench on the cold power at the limit alone', () => {
		const evaluation = evaluateDemo('bench6-chilled-mount-cold-power-fail.yaml');
		expect(ids(evaluation, 'fail')).toEqual(['cold_power_at_limit']);
		// the typed 2.4 W is below the 2.62 W the diode can emit at the limit when cold: the people
		// checks use 2.62 W and say so
		expect(ids(evaluation, 'advise')).toEqual(['short_circuit_dissipation', 'beam1_power_covers_worst_case']);
		// Coldren et al. T0 model (from memory), hand arithmetic:
		// threshold_cold = 0.6 A × exp((5 − 25)/110) = 0.6 × 0.83375292 = 0.50025175 A
		// power_at_limit_cold = 1.05 W/A × (3 A − 0.50025175 A) = 2.62473566 W against 2.5 W
		// margin 2.5 − 2.62473566 = −0.12473566 W, −0.12473566/2.5 = −0.04989427
		const cold = checkResult(evaluation, 'cold_power_at_limit');
		const power = 1.05 * (3 - 0.6 * Math.exp(-20 / 110));
		expectClose(power, 2.6247356616, 'hand arithmetic');
		expectClose(cold.value?.si, power, 'value');
		expectClose(cold.limit?.si, 2.5, 'limit');
		expectClose(cold.margin?.si, 2.5 - power, 'margin');
		expectClose(cold.margin?.fraction, (2.5 - power) / 2.5, 'margin fraction');
		// the electrical side holds: 6 V × 1.05 = 6.3 V; at the 3 A limit (6.3 − 1.5 − 0.12 × 3) × 3 = 13.32 W;
		// allowed 18 W × (125 − 28)/(125 − 25) = 17.46 W (common practice, linear derating); shorted
		// output 6.3 V × 3 A = 18.9 W above it: advice only
		expectClose(checkResult(evaluation, 'dissipation_within_rating').value?.si, 13.32, 'dissipation');
		expectClose(checkResult(evaluation, 'dissipation_within_rating').limit?.si, 17.46, 'derated rating');
		expectClose(checkResult(evaluation, 'short_circuit_dissipation').value?.si, 18.9, 'short-circuit value');
	});

	it('keeps every demo its own: no demo or README uses the textbook 28 V supply with a 9 W driver', () => {
		// common practice: the 28 V / 1 A / 9 W linear-driver example belongs in tests, not in the demo
		for (const file of [...readdirSync(examplesFolder).filter((name) => /\.ya?ml$/.test(name)).map((name) => join(examplesFolder, name)), 'README.md']) {
			const text = readFileSync(file, 'utf8');
			expect(/(^|[^0-9.])28 V/.test(text) && /(^|[^0-9.])9 W/.test(text), file).toBe(false);
		}
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
