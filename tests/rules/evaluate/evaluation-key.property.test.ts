import fc from 'fast-check';
import {describe, expect, it} from 'vitest';
import {evaluate} from '../../../source/rules/evaluate/evaluate.js';
import {evaluationKey} from '../../../source/rules/evaluate/evaluation-key.js';
import {parseInputEntry} from '../../../source/rules/evaluate/input-entry.js';
import type {Answers} from '../../../source/rules/evaluate/answers.js';
import {sampleAnswers, sampleRules} from '../../helpers/sample-record.js';

/**
 * The audit evaluates records that share an evaluation key once: two sets of answers with one
 * key must get the same evaluation (evaluate is pure), and answers that change a value the
 * evaluation reads must get another key. Checked on the clear demo (docs/examples/bench3-808nm-clear.yaml).
 */
const rules = sampleRules();
const demo = sampleAnswers(rules);
const numRuns = Number(process.env['PRELASE_FUZZ_RUNS'] ?? 40);

function withInput(answers: Answers, id: string, entered: string | undefined): Answers {
	const inputs = new Map(answers.inputs);
	if (entered === undefined) inputs.delete(id);
	else {
		const parsed = parseInputEntry(rules.inputs.get(id)!, entered);
		if (!parsed.ok) throw new Error(`test setup: ${id} refuses ${entered}`);
		inputs.set(id, parsed.value);
	}
	return {...answers, inputs};
}

describe('the evaluation key', () => {
	const key = evaluationKey(rules, demo);
	it.each([
		{name: 'another location (a text no formula reads)', answers: () => withInput(demo, 'location', 'Room C.201, bench 1'), same: true},
		{name: 'another setup name', answers: () => ({...demo, setup: 'Another name'}), same: true},
		{name: 'the same limit spelled in mA (2000 mA for 2 A)', answers: () => withInput(demo, 'current_limit', '2000 mA'), same: true},
		{name: 'another limit (2.1 A)', answers: () => withInput(demo, 'current_limit', '2.1 A'), same: false},
		{name: 'the ambient in K (308.15 K for 35 degC)', answers: () => withInput(demo, 'ambient_max', '308.15 K'), same: true},
		{name: 'the location not given (a missing input)', answers: () => withInput(demo, 'location', undefined), same: false},
		{name: 'a confirmation answered no', answers: () => ({...demo, confirmations: new Map([...demo.confirmations, ['key_control', {answer: 'no' as const}]])}), same: false},
		{name: 'a note added to a confirmation', answers: () => ({...demo, confirmations: new Map([...demo.confirmations, ['key_control', {answer: 'yes' as const, note: 'key with R. Osei'}]])}), same: false},
	])('$name: same key $same', ({answers, same}) => {
		const other = answers();
		expect(evaluationKey(rules, other) === key).toBe(same);
		if (same) expect(evaluate(rules, other)).toEqual(evaluate(rules, demo));
	});

	it('answers with equal keys have equal evaluations (random changes to the text inputs and the limit)', () => {
		// Text inputs the demo gives (giving one it does not give changes which inputs are missing, and so the key).
		const texts = [...rules.inputs.values()].filter(({input}) => input.kind === 'text' && demo.inputs.has(input.id)).map(({input}) => input.id);
		fc.assert(
			fc.property(fc.constantFrom(...texts), fc.string({minLength: 1, maxLength: 12}).filter((text) => text.trim() !== '' && !/[\u0000-\u001f]/.test(text)), fc.constantFrom('2 A', '2000 mA', '2.1 A', '1.9 A'), (id, text, limit) => {
				const changed = withInput(withInput(demo, id, text), 'current_limit', limit);
				const equal = evaluationKey(rules, changed) === key;
				// Only the limit is read by the evaluation: the key follows its value, not the text inputs.
				expect(equal).toBe(limit === '2 A' || limit === '2000 mA');
				if (equal) expect(evaluate(rules, changed)).toEqual(evaluate(rules, demo));
			}),
			{numRuns},
		);
	});
});
