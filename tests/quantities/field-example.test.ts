import {describe, expect, it} from 'vitest';
import {calculationHelp} from '../../source/cli/commands/calc.js';
import {calculations} from '../../source/calculations/registry.js';
import {describeCalcProblem, runCalculation} from '../../source/calculations/run-calculation.js';
import {parseQuantity} from '../../source/quantities/parse-quantity.js';
import {loadRules, shippedRulesPath} from '../../source/rules/load.js';
import {parseInputEntry} from '../../source/rules/evaluate/input-entry.js';
import {fieldHint} from '../../source/ui/bench-check/field-hint.js';
import type {Dimension} from '../../source/quantities/dimensions.js';

// Each field's example must read as a value of the field's dimension that the field accepts: the
// example is checked by the same parser that reads an operator's entry (source/quantities/parse-quantity.ts),
// and against the field's declared range and default (the registry and rules/default.yaml).

type Span = {min: number; max: number; aboveMin?: boolean; whole?: boolean};

function expectAccepted(example: string, dimension: Dimension, range: Span | undefined, fallback?: number) {
	const parsed = parseQuantity(example, dimension);
	expect(parsed.ok, `"${example}" reads as ${dimension}`).toBe(true);
	if (!parsed.ok) return;
	const si = parsed.value.si;
	if (range) {
		// Relative slack of 1e-9: a shown example is rounded to three figures (20 °C is 293.15 K).
		const slack = 1e-9 * Math.max(1, Math.abs(range.min), Math.abs(range.max));
		expect(range.aboveMin ? si > range.min : si >= range.min - slack, `"${example}" is not below the range`).toBe(true);
		expect(si <= range.max + slack, `"${example}" is not above the range`).toBe(true);
		if (range.whole) expect(Number.isInteger(si)).toBe(true);
	}
	// A field with a default shows its default as the example.
	if (fallback !== undefined) expect(si).toBeCloseTo(fallback, 6);
}

const calcInputs = calculations.flatMap((calculation) => Object.entries(calculation.inputs).map(([key, input]) => [calculation.name, key, input, calculation] as const));

describe('calc NAME --help: every input\'s "e.g. key=VALUE" is a value that input accepts', () => {
	it.each(calcInputs.map(([name, key, input, calculation]) => [name, key, input, calculation]))('%s %s', (_name, key, input, calculation) => {
		const help = calculationHelp(calculation, 10_000);
		const shown = new RegExp(`e\\.g\\. ${key}=([^;]+);`).exec(help)?.[1];
		expect(shown, `${key} has an example`).toBeDefined();
		expectAccepted(shown!, input.dimension, input.range, input.default);
		// The example also runs: the calculation reads it as the key's value.
		const entries = Object.entries(calculation.inputs).filter(([, other]) => other.default === undefined && !other.optional).map(([other]) => `${other}=${other === key ? shown : 'x'}`);
		const run = runCalculation(calculation, entries);
		if (!run.ok) for (const found of run.errors) expect(found.field === key ? describeCalcProblem(found) : '').not.toMatch(new RegExp(`^"${shown}"`));
	});

	it('a missing input\'s message gives that input\'s own example (wire length: a cable length, not a wavelength)', () => {
		const wire = calculations.find((calculation) => calculation.name === 'wire')!;
		const run = runCalculation(wire, ['awg=20']);
		expect(run.ok).toBe(false);
		if (run.ok) return;
		const message = run.errors.map((found) => describeCalcProblem(found)).join('\n');
		const example = /for example length=(\S+?)\)/.exec(message)?.[1];
		expect(example).toBeDefined();
		expectAccepted(example!, 'length', wire.inputs['length']!.range);
		expect(parseQuantity(example!, 'length').ok && (parseQuantity(example!, 'length') as {value: {si: number}}).value.si).toBeGreaterThanOrEqual(0.01); // a wire is centimetres to metres long (common practice)
	});

	// A distance or a diameter is never shown in nanometres (the beam-diameter and cable-length fields; common practice).
	it.each([['od', 'diameter'], ['nohd', 'diameter'], ['wire', 'length']])('calc %s %s: the example is not a wavelength', (name, key) => {
		const calculation = calculations.find((entry) => entry.name === name)!;
		if (!(key in calculation.inputs)) return expect(Object.keys(calculation.inputs)).not.toContain(key);
		const shown = new RegExp(`e\\.g\\. ${key}=([^;]+);`).exec(calculationHelp(calculation, 10_000))?.[1];
		expect(shown).not.toMatch(/nm$/);
	});
});

describe('shipped rules: every quantity input\'s example (screen hint and entry messages) is a value it accepts', () => {
	const loaded = loadRules(shippedRulesPath());
	if (!loaded.ok) throw new Error('the shipped rules load');
	const rules = loaded.value;
	const inputs = [...rules.inputs.values()].filter((compiled) => compiled.input.kind === 'quantity');

	it('the shipped rules have quantity inputs with ranges to check', () => {
		expect(inputs.filter((compiled) => compiled.range).length).toBeGreaterThan(20);
	});

	it.each(inputs.map((compiled) => [compiled.input.id, compiled]))('%s', (_id, compiled) => {
		const {input} = compiled;
		if (input.kind !== 'quantity') return;
		const hint = fieldHint(rules, {kind: 'input', id: input.id, input});
		const shown = /e\.g\. (.+?)(?:, |$)/.exec(hint)?.[1];
		expect(shown, hint).toBeDefined();
		expectAccepted(shown!, input.dimension, compiled.range, compiled.defaultValue?.si);
		// An entry that is not a number is answered with the same example.
		const refused = parseInputEntry(compiled, 'about seven');
		expect(refused.ok).toBe(false);
		if (!refused.ok) expect(refused.problem.data['example']).toBe(shown);
	});
});
