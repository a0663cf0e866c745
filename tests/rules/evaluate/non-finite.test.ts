import {describe, expect, it} from 'vitest';
import {stringify} from 'yaml';
import {evaluate} from '../../../source/rules/evaluate/evaluate.js';
import {loadAnswersFromText} from '../../../source/rules/evaluate/load-answers.js';
import {loadRulesFromText} from '../../../source/rules/load.js';

/**
 * A comparison with a value that is not a finite number (x/0, 0/0) decides nothing, so a check
 * that depends on one fails with the reason (IEEE 754-2019 §5.11: every ordered comparison with
 * NaN is false, so `not (NaN > limit)` would otherwise read as true; common practice for a safety
 * check to err to the safe side).
 */
const fixture = (check: string) => `format: 1
name: non-finite fixture
caution: Test fixture only.
steps:
  - id: driver
    title: Driver
    inputs:
      - id: current_limit
        label: Current limit
        dimension: current
        range: [0 A, 10 A]
      - id: supply
        label: Supply
        dimension: voltage
        range: [0 V, 50 V]
checks:
  - id: probe
    step: driver
    title: Probe
${check}
    severity: stop
    explanation: Test fixture.
    basis: common practice
`;

// With supply = 3 V each of these divides by zero: x/0 is ±Infinity and 0/0 is NaN (IEEE 754-2019 §7.3, §7.2).
const infinite = 'current_limit * (1 V / (supply - 3 V))';
const notANumber = 'current_limit * ((supply - 3 V) / (supply - 3 V))';

const runtime: Array<{name: string; check: string}> = [
	{name: 'holds with an infinite operand', check: `    holds: ${infinite} >= 0 A`},
	{name: 'holds under not with NaN', check: `    holds: not (${notANumber} > 10 A)`},
	{name: 'holds inside and', check: `    holds: current_limit <= 10 A and not (${notANumber} > 10 A)`},
	{name: 'holds inside or', check: `    holds: current_limit > 10 A or not (${notANumber} > 10 A)`},
	{name: 'holds inside a ? b : c', check: `    holds: "(${notANumber} > 10 A) ? false : true"`},
	{name: 'value through min() with NaN', check: `    value: min(current_limit, ${notANumber})\n    at_most: 10 A`},
	{name: 'value with a NaN limit through max()', check: `    value: current_limit\n    at_most: max(10 A, ${notANumber})`},
	{name: 'a when that cannot be decided', check: `    when: ${notANumber} <= 10 A\n    holds: current_limit <= 10 A`},
];

describe('a non-finite operand is never a pass', () => {
	it.each(runtime)('$name fails with the reason', ({check}) => {
		// (A check whose when cannot be decided says so first.)
		const loaded = loadRulesFromText(fixture(check), 'fixture.yaml');
		expect(loaded.ok ? [] : loaded.errors.map((found) => `${found.code} ${JSON.stringify(found.data)}`)).toEqual([]);
		if (!loaded.ok) return;
		const answers = loadAnswersFromText(stringify({inputs: {current_limit: '1 A', supply: '3 V'}}), 'case.yaml', loaded.value);
		if (!answers.ok) throw new Error('answers refused');
		const result = evaluate(loaded.value, answers.value).checks[0]!;
		expect(result.verdict).toBe('fail');
		expect(result.error).toMatch(/not a finite number/);
		if (check.includes('when:')) expect(result.error).toMatch(/^its condition \(when\) cannot be decided/);
	});

	it.each(runtime)('$name still passes with a finite operand', ({check}) => {
		const loaded = loadRulesFromText(fixture(check), 'fixture.yaml');
		if (!loaded.ok) throw new Error(loaded.errors.map((found) => found.code).join(', '));
		const answers = loadAnswersFromText(stringify({inputs: {current_limit: '1 A', supply: '5 V'}}), 'case.yaml', loaded.value);
		if (!answers.ok) throw new Error('answers refused');
		// hand arithmetic: 1 A × 1 V / 2 V = 0.5 A ≥ 0 A; 1 A × 2 V / 2 V = 1 A ≤ 10 A
		expect(evaluate(loaded.value, answers.value).checks[0]!.verdict).toBe('pass');
	});
});

const lint: Array<{name: string; check: string; lineHas: string}> = [
	{name: 'a limit divided by zero', check: '    holds: current_limit <= 1 A / 0', lineHas: 'holds:'},
	{name: 'a product with 0/0 under not', check: '    holds: not (current_limit * (0/0) > 1 A)', lineHas: 'holds:'},
	{name: 'an at_most of 1 A / 0', check: '    value: current_limit\n    at_most: 1 A / 0', lineHas: 'at_most:'},
	{name: 'a when with exp() overflowing', check: '    when: current_limit < exp(1000) * 1 A\n    holds: current_limit <= 10 A', lineHas: 'when:'},
	{name: 'a division by a difference that is always zero', check: '    holds: current_limit * (1 V / (supply - supply)) >= 0 A', lineHas: 'holds:'},
];

describe('a formula that can only be non-finite is a load-time error', () => {
	it.each(lint)('$name', ({check, lineHas}) => {
		const text = fixture(check);
		const loaded = loadRulesFromText(text, 'fixture.yaml');
		expect(loaded.ok).toBe(false);
		if (loaded.ok) return;
		const found = loaded.errors.find((entry) => entry.code === 'formula-not-finite');
		expect(found, loaded.errors.map((entry) => entry.code).join(', ')).toBeDefined();
		expect(found!.file).toBe('fixture.yaml');
		expect(found!.line).toBe(text.split('\n').findIndex((line) => line.includes(lineHas)) + 1);
	});

	it('a division that is zero only at one sample value is not an error', () => {
		// The middle of 0 V…50 V is 25 V; other samples in the range keep the denominator away from zero.
		const loaded = loadRulesFromText(fixture('    holds: current_limit * (1 V / (supply - 25 V)) >= -100 A'), 'fixture.yaml');
		expect(loaded.ok ? [] : loaded.errors.map((found) => found.code)).toEqual([]);
	});
});
