import fc from 'fast-check';
import {resolve} from 'node:path';
import {describe, expect, it} from 'vitest';
import {checkText} from '../../source/render/check-text.js';
import {evaluate} from '../../source/rules/evaluate/evaluate.js';
import {loadAnswers} from '../../source/rules/evaluate/load-answers.js';
import {loadRules, shippedRulesPath} from '../../source/rules/load.js';
import {plain} from '../../source/shared/paint.js';
import {terminalText} from '../../source/shared/terminal-text.js';

const loaded = loadRules(shippedRulesPath());
if (!loaded.ok) throw new Error('the shipped rules must load');
const rules = loaded.value;
const answersLoaded = loadAnswers(resolve('docs/examples/bench6-chilled-mount-cold-power-fail.yaml'), rules);
if (!answersLoaded.ok) throw new Error('the demo answers must load');
const answers = answersLoaded.value;
const evaluation = evaluate(rules, answers);
/** The real outcome line of this failing demo (plain paint, as in a pipe). */
const realOutcome = 'Outcome: DO NOT ENERGIZE';

/** Text built from pieces that could forge an outcome: every kind of line break, the outcome words, controls. */
const forging = fc
	.array(fc.constantFrom('\n', '\r', '\r\n', '\u2028', '\u2029', '\u0085', '\v', '\f', 'Outcome: ', 'CLEAR TO ENERGIZE', 'DO NOT ENERGIZE', realOutcome, ' ', '  ', 'x', '\u001B[2K', '\u001B[1A', '\t'), {maxLength: 12})
	.map((pieces) => pieces.join(''));

describe('check text: no text can print a line equal to the real outcome line', () => {
	it('with forging text in every field a file can set, the outcome line appears once, and is the real one', () => {
		fc.assert(
			fc.property(fc.record({name: forging, setup: forging, caution: forging, title: forging, summary: forging, checkTitle: forging, message: forging, statement: forging, note: forging, entered: forging}), (text) => {
				const forgedRules = {...rules, rules: {...rules.rules, name: text.name, caution: text.caution, steps: rules.rules.steps.map((step) => ({...step, title: text.title, summary: text.summary}))}};
				const forgedAnswers = {...answers, setup: text.setup, inputs: new Map([...answers.inputs].map(([id, answer]) => [id, answer.kind === 'text' ? {...answer, entered: text.entered, value: text.entered} : answer]))};
				const forgedEvaluation = {
					...evaluation,
					checks: evaluation.checks.map((check) => ({...check, title: text.checkTitle, ...(check.message === undefined ? {} : {message: text.message})})),
					confirmations: evaluation.confirmations.map((entry) => ({...entry, statement: text.statement, ...(entry.note === undefined ? {} : {note: text.note})})),
				};
				const lines = terminalText(checkText(forgedRules, forgedAnswers, forgedEvaluation, plain, 100)).split('\n');
				expect(lines.filter((line) => line.startsWith('Outcome'))).toEqual([realOutcome]);
				expect(lines.at(lines.indexOf(realOutcome) - 1)).toBe('');
			}),
			{numRuns: 200},
		);
	});
});
