import {describe, expect, it} from 'vitest';
import {outcomeReason, summaryGroups, summaryLines} from '../../../source/ui/bench-check/summary-lines.js';
import {evaluateDocument, readDemo, shippedRules, withChanges} from '../../rules/bench-answers.js';

const rules = shippedRules();
const demo = readDemo('bench3-808nm-clear.yaml');
const unanswered = {use_authorised: null, sop_present: null, operator_trained: null};

describe('the summary in order, and the reason for the outcome', () => {
	it.each([
		// The clear demo: every stop check holds (docs/examples/bench3-808nm-clear.yaml says so in its header).
		{name: 'the clear demo', inputs: {}, confirmations: {}, reason: 'every stop check holds and every confirmation that applies is answered'},
		// Three confirmations left out: incomplete, and the first of them (in rule order) is named.
		{name: 'three confirmations unanswered', inputs: {}, confirmations: unanswered, reason: '3 confirmations unanswered: Use of this laser on this bench is authorised by the laser safety officer.'},
		// 2.4 A against 2.5 A less the shipped 10 % margin (2.25 A) fails, and so does the power at 2.4 A, coldest.
		{name: 'the limit too high', inputs: {current_limit: '2.4 A'}, confirmations: {}, reason: "2 stop checks fail: Current limit below the diode's absolute maximum less the margin"},
		// A confirmation answered no blocks energizing on its own (docs: a required confirmation must be yes).
		{name: 'the wrist strap answered no', inputs: {}, confirmations: {wrist_strap_tested: 'no'}, reason: '1 confirmation answered no: The wrist strap was tested today (system resistance below 35 MΩ).'},
	])('$name', ({inputs, confirmations, reason}) => {
		const evaluation = evaluateDocument(rules, withChanges(demo, inputs, confirmations));
		expect(outcomeReason(evaluation)).toBe(reason);
	});

	it('puts failures, then what is unanswered or open, then advice, then passes', () => {
		const evaluation = evaluateDocument(rules, withChanges(demo, {current_limit: '2.4 A', ambient_max: null}, {use_authorised: null, wrist_strap_tested: 'no'}));
		const groups = summaryGroups(evaluation);
		const rank = {fail: 0, open: 1, advise: 2, pass: 3} as const;
		const order = summaryLines(evaluation).map((line) => Object.entries(groups).find(([, lines]) => lines.some((entry) => entry.key === line.key))![0] as keyof typeof rank);
		expect(order).toEqual([...order].sort((a, b) => rank[a] - rank[b]));
		expect(groups.fail.some((line) => line.text.startsWith('✗ NO         The wrist strap'))).toBe(true);
		expect(groups.open.some((line) => line.text.startsWith('? unanswered Use of this laser'))).toBe(true);
		expect(groups.open.some((line) => line.text === 'Inputs not given: ambient_max')).toBe(true);
		expect(groups.advise.length).toBeGreaterThan(0);
		expect(groups.pass.length).toBeGreaterThan(0);
	});
});
