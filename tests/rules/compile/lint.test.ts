import {describe, expect, it} from 'vitest';
import {loadRulesFromText} from '../../../source/rules/load.js';

/** A small valid rule file; each invalid case changes one thing in it. */
const base = `format: 1
name: lint fixture
caution: Test fixture only.
policy:
  margin:
    value: 10 %
    dimension: ratio
    meaning: margin below the maximum
    basis: site policy
steps:
  - id: diode
    title: Diode
    inputs:
      - id: maximum
        label: Absolute maximum current
        dimension: current
        range: [0 A, 10 A]
      - id: limit
        label: Current limit
        dimension: current
        range: [0 A, 10 A]
      - id: supply
        label: Supply
        dimension: voltage
        range: [0 V, 50 V]
      - id: mode
        kind: choice
        label: Mode
        options:
          constant_current: Constant current
          constant_power: Constant power
      - id: serial
        kind: text
        label: Serial number
    confirmations:
      - id: strap
        statement: The wrist strap was tested.
        basis: common practice
derived:
  - id: ceiling
    label: Ceiling
    dimension: current
    formula: maximum * (1 - margin)
checks:
  - id: limit_below
    step: diode
    title: Limit below the ceiling
    value: limit
    at_most: ceiling
    severity: stop
    explanation: The limit protects the diode.
    basis: common practice
`;

function lineOf(text: string, needle: string): number {
	// The last line holding the needle: a changed line comes after the original it duplicates.
	const index = text.split('\n').findLastIndex((line) => line.includes(needle));
	if (index < 0) throw new Error(`fixture has no line with ${needle}`);
	return index + 1;
}

/** `slack` allows the parser to report an unclosed bracket on the line after it opened. */
type Case = {name: string; from: string; to: string; code: string; lineHas: string; data?: Record<string, unknown>; slack?: number};

const invalid: Case[] = [
	{name: 'unknown name', from: 'at_most: ceiling', to: 'at_most: cieling', code: 'unknown-name', lineHas: 'cieling', data: {name: 'cieling'}},
	{name: 'unknown function', from: 'at_most: ceiling', to: 'at_most: floor(ceiling)', code: 'unknown-function', lineHas: 'floor(', data: {name: 'floor'}},
	{name: 'amperes compared with volts', from: 'at_most: ceiling', to: 'at_most: supply', code: 'compare-mismatch', lineHas: 'at_most: supply'},
	{name: 'adding amperes to volts', from: 'formula: maximum * (1 - margin)', to: 'formula: maximum + supply', code: 'dimension-mismatch', lineHas: 'maximum + supply'},
	{name: 'derived value of the wrong dimension', from: 'formula: maximum * (1 - margin)', to: 'formula: supply * 2', code: 'wrong-dimension', lineHas: 'supply * 2'},
	{name: 'a holds that is not boolean', from: '    value: limit\n    at_most: ceiling', to: '    holds: limit * 2', code: 'not-boolean', lineHas: 'holds: limit'},
	{name: 'a when that is not boolean', from: '    value: limit\n', to: '    when: limit\n    value: limit\n', code: 'not-boolean', lineHas: 'when: limit'},
	{name: 'duplicate input id', from: '      - id: serial', to: '      - id: supply', code: 'duplicate-id', lineHas: 'id: supply', data: {id: 'supply'}},
	{name: 'an id that is a unit name', from: '      - id: serial', to: '      - id: mA', code: 'schema', lineHas: 'id: mA'},
	{name: 'an id that is a lower-case unit name', from: '      - id: serial', to: '      - id: h', code: 'id-is-unit', lineHas: 'id: h', data: {id: 'h'}},
	{name: 'a check pointing at a missing step', from: '    step: diode', to: '    step: laser', code: 'missing-step', lineHas: 'step: laser', data: {step: 'laser'}},
	{name: 'policy value with the wrong dimension', from: '    value: 10 %', to: '    value: 10 V', code: 'policy-value', lineHas: 'value: 10 V'},
	{name: 'range with the wrong dimension', from: '        range: [0 V, 50 V]', to: '        range: [0 V, 50 A]', code: 'range-value', lineHas: 'range: [0 V, 50 A]'},
	{name: 'range upside down', from: '        range: [0 V, 50 V]', to: '        range: [50 V, 0 V]', code: 'range-order', lineHas: 'range: [50 V, 0 V]'},
	{name: 'text input in a formula', from: 'at_most: ceiling', to: 'at_most: serial', code: 'text-in-formula', lineHas: 'at_most: serial'},
	{name: 'choice used as a number', from: 'at_most: ceiling', to: 'at_most: mode', code: 'choice-misuse', lineHas: 'at_most: mode'},
	{name: 'choice compared with an unknown option', from: '    value: limit\n', to: '    when: mode == "constant_voltage"\n    value: limit\n', code: 'unknown-option', lineHas: 'constant_voltage'},
	{name: 'quoted text outside a choice comparison', from: 'at_most: ceiling', to: 'at_most: \'"ceiling"\'', code: 'string-not-allowed', lineHas: 'at_most:'},
	{name: 'assignment', from: 'at_most: ceiling', to: 'at_most: ceiling = 5 A', code: 'construct-not-allowed', lineHas: 'ceiling = 5 A'},
	{name: 'function definition', from: 'at_most: ceiling', to: 'at_most: "f(x) = x"', code: 'construct-not-allowed', lineHas: 'f(x) = x'},
	{name: 'property access', from: 'at_most: ceiling', to: 'at_most: ceiling.value', code: 'construct-not-allowed', lineHas: 'ceiling.value'},
	{name: 'a list', from: 'at_most: ceiling', to: 'at_most: "[1 A, 2 A]"', code: 'construct-not-allowed', lineHas: '[1 A, 2 A]'},
	{name: 'a block of expressions', from: 'at_most: ceiling', to: 'at_most: "ceiling; ceiling"', code: 'construct-not-allowed', lineHas: 'ceiling; ceiling'},
	{name: 'derived values in a circle', from: 'formula: maximum * (1 - margin)', to: 'formula: ceiling * 1', code: 'derived-cycle', lineHas: 'ceiling * 1'},
	{name: 'unknown message placeholder', from: '    explanation: The limit protects the diode.\n', to: '    explanation: The limit protects the diode.\n    message: "over by {{overshoot}}"\n', code: 'unknown-placeholder', lineHas: 'overshoot'},
	{name: 'unknown field', from: '    severity: stop', to: '    severity: stop\n    at_mots: ceiling', code: 'schema', lineHas: 'at_mots'},
	{name: 'bad severity', from: '    severity: stop', to: '    severity: fatal', code: 'schema', lineHas: 'severity: fatal'},
	{name: 'both holds and value', from: '    severity: stop', to: '    severity: stop\n    holds: limit < ceiling', code: 'schema', lineHas: '- id: limit_below'},
	{name: 'YAML syntax error', from: '    title: Diode', to: '    title: [Diode', code: 'yaml-syntax', lineHas: 'title: [Diode', slack: 1},
	{name: 'duplicate key', from: '    title: Diode', to: '    title: Diode\n    title: Laser', code: 'yaml-duplicate-key', lineHas: 'title: Laser'},
	{name: 'missing required field', from: '    explanation: The limit protects the diode.\n', to: '', code: 'schema', lineHas: '- id: limit_below'},
	{name: 'choice default not an option', from: '          constant_power: Constant power', to: '          constant_power: Constant power\n        default: constant_voltage', code: 'default-value', lineHas: 'default: constant_voltage'},
];

describe('rule file lint', () => {
	it('accepts the fixture', () => {
		const loaded = loadRulesFromText(base, 'fixture.yaml');
		expect(loaded.ok ? [] : loaded.errors).toEqual([]);
	});

	it.each(invalid)('reports $name at its line', ({from, to, code, lineHas, data, slack = 0}) => {
		expect(base.includes(from), `fixture contains ${from}`).toBe(true);
		const text = base.replace(from, to);
		const loaded = loadRulesFromText(text, 'fixture.yaml');
		expect(loaded.ok).toBe(false);
		if (loaded.ok) return;
		const found = loaded.errors.find((entry) => entry.code === code);
		expect(found, `codes found: ${loaded.errors.map((entry) => entry.code).join(', ')}`).toBeDefined();
		expect(found!.file).toBe('fixture.yaml');
		expect(found!.line! - lineOf(text, lineHas)).toBeGreaterThanOrEqual(0);
		expect(found!.line! - lineOf(text, lineHas)).toBeLessThanOrEqual(slack);
		expect(found!.column).toBeGreaterThanOrEqual(1);
		if (data) expect(found!.data).toMatchObject(data);
	});

	it('reports every problem at once, not only the first', () => {
		const text = base.replace('at_most: ceiling', 'at_most: cieling').replace('    step: diode', '    step: laser').replace('    value: 10 %', '    value: 10 V');
		const loaded = loadRulesFromText(text, 'fixture.yaml');
		expect(loaded.ok).toBe(false);
		if (!loaded.ok) expect(loaded.errors.map((entry) => entry.code).sort()).toEqual(['missing-step', 'policy-value', 'unknown-name']);
	});

	it('points at the column of an unknown name inside the formula', () => {
		const text = base.replace('at_most: ceiling', 'at_most: ceiling + bogus_name');
		const loaded = loadRulesFromText(text, 'fixture.yaml');
		expect(loaded.ok).toBe(false);
		if (loaded.ok) return;
		const line = text.split('\n')[loaded.errors[0]!.line! - 1]!;
		expect(line.slice(loaded.errors[0]!.column! - 1)).toMatch(/^bogus_name/);
	});

	it('reports a broken derived value once, not again in every check that uses it', () => {
		const loaded = loadRulesFromText(base.replace('formula: maximum * (1 - margin)', 'formula: maximum + supply'), 'fixture.yaml');
		expect(loaded.ok).toBe(false);
		if (!loaded.ok) expect(loaded.errors.map((entry) => entry.code)).toEqual(['dimension-mismatch']);
	});

	it('warns when a # comment follows a formula on the same line', () => {
		const loaded = loadRulesFromText(base.replace('at_most: ceiling', 'at_most: ceiling # keep a margin'), 'fixture.yaml');
		expect(loaded.ok).toBe(true);
		if (loaded.ok) expect(loaded.warnings.map((entry) => entry.code)).toContain('formula-comment');
	});

	it('checks each branch of a ? b : c on its own', () => {
		const loaded = loadRulesFromText(base.replace('formula: maximum * (1 - margin)', 'formula: \'mode == "constant_current" ? maximum : supply\''), 'fixture.yaml');
		expect(loaded.ok).toBe(false);
		if (!loaded.ok) expect(loaded.errors.map((entry) => entry.code)).toContain('dimension-mismatch');
	});
});
