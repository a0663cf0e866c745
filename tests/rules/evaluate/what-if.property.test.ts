import fc from 'fast-check';
import {describe, expect, it} from 'vitest';
import {evaluate} from '../../../source/rules/evaluate/evaluate.js';
import type {Answers} from '../../../source/rules/evaluate/answers.js';
import {onPassingSide} from '../../../source/rules/evaluate/flip-search.js';
import {analyseWhatIf} from '../../../source/rules/evaluate/what-if.js';
import {parseInputEntry} from '../../../source/rules/evaluate/input-entry.js';
import {dimensions} from '../../../source/quantities/dimensions.js';
import {looksLikeRange} from '../../../source/quantities/range-entry.js';
import {readAnswers, readDemo, shippedRules} from '../bench-answers.js';

const rules = shippedRules();
const demos = ['bench3-808nm-clear.yaml', 'bench6-chilled-mount-cold-power-fail.yaml'];
const loaded = demos.map((name) => {
	const answers = readAnswers(rules, readDemo(name));
	if (!answers.ok) throw new Error(`${name} was refused`);
	return answers.value;
});

/**
 * The answers with one input moved to `si`, entered as the operator would enter it there: a value
 * given with a tolerance in percent (`5 V ± 5 %`, as the demos' supply is read) or widened by the
 * rules' default tolerance is read again through the answers' own entry parser with the same
 * tolerance, so it keeps it; any other value is an exact value.
 */
function withInput(answers: Answers, input: string, si: number): Answers {
	const inputs = new Map(answers.inputs);
	const answer = inputs.get(input);
	if (answer?.kind !== 'quantity') throw new Error(`${input} is not a quantity`);
	if (answer.range) {
		const unit = dimensions[answer.dimension].si;
		const percent = /\u00B1\s*([\d.]+)\s*%\s*$/.exec(answer.entered)?.[1];
		if (percent === undefined && looksLikeRange(answer.entered)) throw new Error(`${input} = ${answer.entered}: a range this test does not move`);
		const read = parseInputEntry(rules.inputs.get(input)!, `${si} ${unit}${percent === undefined ? '' : ` \u00B1 ${percent} %`}`.trim());
		if (!read.ok) throw new Error(`${input} = ${si} was refused`);
		inputs.set(input, read.value);
	} else inputs.set(input, {kind: 'quantity', entered: String(si), si, dimension: answer.dimension});
	return {...answers, inputs};
}

describe('flip points hold on the whole evaluator', () => {
	// The search runs on the rules cut down to one check; here each flip is judged again by the full
	// evaluation: at the reported point the check is on the passing side, just beyond it on the failing side.
	it('gives the two verdicts at a reported flip point and just beyond it, for setups moved at random', () => {
		const quantityInputs = [...loaded[0]!.inputs].filter(([, answer]) => answer.kind === 'quantity').map(([id]) => id);
		fc.assert(
			fc.property(fc.integer({min: 0, max: demos.length - 1}), fc.constantFrom(...quantityInputs), fc.double({min: 0.8, max: 1.2, noNaN: true}), (demo, moved, factor) => {
				const base = loaded[demo]!;
				const range = rules.inputs.get(moved)?.range;
				const current = base.inputs.get(moved);
				if (current?.kind !== 'quantity' || !range) return;
				const si = Math.min(range.max, Math.max(range.min, current.si * factor));
				const answers = withInput(base, moved, si);
				const result = analyseWhatIf(rules, answers, evaluate(rules, answers));
				for (const entry of result.checks) {
					for (const flip of entry.flips) {
						const at = evaluate(rules, withInput(answers, flip.input, flip.at.si)).checks.find((check) => check.id === entry.check)!;
						const beyond = evaluate(rules, withInput(answers, flip.input, flip.beyond)).checks.find((check) => check.id === entry.check)!;
						expect(onPassingSide(at.verdict), `${entry.check} at ${flip.input} = ${flip.at.si}`).toBe(true);
						expect(onPassingSide(beyond.verdict), `${entry.check} beyond ${flip.input} = ${flip.beyond}`).toBe(false);
						// Just beyond: within a relative 1e-9 of the flip, or of the current value for a flip at zero.
						expect(Math.abs(flip.beyond - flip.at.si)).toBeLessThanOrEqual(1e-9 * Math.max(Math.abs(flip.at.si), Math.abs(flip.now.si)));
					}
				}
			}),
			{numRuns: 12},
		);
	});
});
