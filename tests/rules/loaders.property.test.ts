import {readFileSync} from 'node:fs';
import {resolve} from 'node:path';
import fc from 'fast-check';
import {beforeAll, describe, expect, it} from 'vitest';
import {messages} from '../../source/shared/messages.js';
import type {Problem} from '../../source/shared/problems.js';
import type {Dimension} from '../../source/quantities/dimensions.js';
import {parseQuantity} from '../../source/quantities/parse-quantity.js';
import type {CompiledRules} from '../../source/rules/compile/compiled-rules.js';
import {loadAnswersFromText} from '../../source/rules/evaluate/load-answers.js';
import {loadRules, loadRulesFromText} from '../../source/rules/load.js';
import type {Result} from '../../source/shared/result.js';

const rulesText = readFileSync(resolve('rules/default.yaml'), 'utf8');
const answersText = readFileSync(resolve('docs/examples/bench3-808nm-clear.yaml'), 'utf8');
const numRuns = Number(process.env['PRELASE_FUZZ_RUNS'] ?? 200);

/** One edit of a text, the kind a hurried person or a damaged file makes. */
type Mutation =
	| {kind: 'delete-line'; at: number}
	| {kind: 'duplicate-line'; at: number}
	| {kind: 'swap-characters'; at: number}
	| {kind: 'truncate'; at: number}
	| {kind: 'insert'; at: number; text: string};

const position = fc.double({min: 0, max: 1, noNaN: true, maxExcluded: true});
const junk = fc.oneof(
	fc.string({maxLength: 8}),
	fc.string({unit: 'binary', maxLength: 8}),
	fc.uint8Array({maxLength: 8}).map((bytes) => Buffer.from(bytes).toString('latin1')),
	fc.constantFrom(':', ': ', '- ', '\n', '\t', '"', "'", '[', '{', '}', ']', '#', '&a', '*a', '!!str', '? ', '|', '>-', ' ', '<<: *a', '\u0000', '\r'),
);
const mutation: fc.Arbitrary<Mutation> = fc.oneof(
	fc.record({kind: fc.constant('delete-line' as const), at: position}),
	fc.record({kind: fc.constant('duplicate-line' as const), at: position}),
	fc.record({kind: fc.constant('swap-characters' as const), at: position}),
	fc.record({kind: fc.constant('truncate' as const), at: position}),
	fc.record({kind: fc.constant('insert' as const), at: position, text: junk}),
);

/** Applies one edit; positions are fractions of the text so they fit any length. */
function mutate(text: string, edit: Mutation): string {
	if (edit.kind === 'delete-line' || edit.kind === 'duplicate-line') {
		const lines = text.split('\n');
		const index = Math.floor(edit.at * lines.length);
		if (edit.kind === 'delete-line') lines.splice(index, 1);
		else lines.splice(index, 0, lines[index] ?? '');
		return lines.join('\n');
	}
	const index = Math.floor(edit.at * text.length);
	if (edit.kind === 'truncate') return text.slice(0, index);
	if (edit.kind === 'insert') return text.slice(0, index) + edit.text + text.slice(index);
	if (index + 1 >= text.length) return text;
	return text.slice(0, index) + text[index + 1] + text[index] + text.slice(index + 2);
}

const mutatedFrom = (original: string) => fc.array(mutation, {minLength: 1, maxLength: 3}).map((edits) => edits.reduce(mutate, original));

/**
 * What every loader result must be: ok, or a non-empty list of errors each with a known
 * code, the file it was given and a line inside (or just past) the text.
 */
function expectWellFormed(result: Result<unknown, Problem>, text: string, file: string): void {
	const lastLine = text.split('\n').length + 1;
	const problems = result.ok ? result.warnings : result.errors;
	if (!result.ok) expect(result.errors.length).toBeGreaterThan(0);
	for (const found of problems) {
		expect(Object.keys(messages)).toContain(found.code);
		expect(found.file).toBe(file);
		if (found.code === 'file-empty') continue;
		expect(Number.isInteger(found.line)).toBe(true);
		expect(found.line).toBeGreaterThanOrEqual(1);
		expect(found.line).toBeLessThanOrEqual(lastLine);
	}
}

let rules: CompiledRules;

beforeAll(() => {
	const loaded = loadRules(resolve('rules/default.yaml'));
	if (!loaded.ok) throw new Error('the shipped rules must load');
	rules = loaded.value;
});

describe('loadRulesFromText never throws', () => {
	it('loads the shipped rules unchanged', () => {
		const loaded = loadRulesFromText(rulesText, 'x.yaml');
		expect(loaded.ok).toBe(true);
	});

	it('on random strings', () => {
		fc.assert(
			fc.property(fc.string({maxLength: 200}), (text) => {
				expectWellFormed(loadRulesFromText(text, 'x.yaml'), text, 'x.yaml');
			}),
			{numRuns},
		);
	});

	it('on mutations of the shipped rules', () => {
		fc.assert(
			fc.property(mutatedFrom(rulesText), (text) => {
				expectWellFormed(loadRulesFromText(text, 'x.yaml'), text, 'x.yaml');
			}),
			{numRuns},
		);
	}, 60_000);

	it('an alias to a missing anchor is a problem, not a throw', () => {
		const text = rulesText.replace('name: prelase bench policy (shipped default)', 'name: *missing');
		expectWellFormed(loadRulesFromText(text, 'x.yaml'), text, 'x.yaml');
	});
});

describe('loadAnswersFromText never throws', () => {
	it('loads the clear demo unchanged', () => {
		expect(loadAnswersFromText(answersText, 'a.yaml', rules).ok).toBe(true);
	});

	it('on random strings', () => {
		fc.assert(
			fc.property(fc.string({maxLength: 200}), (text) => {
				expectWellFormed(loadAnswersFromText(text, 'a.yaml', rules), text, 'a.yaml');
			}),
			{numRuns},
		);
	});

	it('on random key: value lines', () => {
		const key = fc.oneof(fc.constantFrom(...rules.inputs.keys(), ...rules.confirmations.keys(), '__proto__', 'constructor', 'toString'), fc.string({maxLength: 12}));
		const value = fc.oneof(fc.string({maxLength: 12}), fc.constantFrom('2 A', '.inf', '-.inf', '.nan', '~', 'yes', 'n/a', '[1, 2]', '{answer: n/a}', '{answer: n/a, note: x}', '1e999', '0x10', '!!binary AAAA', '&a 1', '*b'));
		const section = fc.constantFrom('inputs', 'confirmations');
		fc.assert(
			fc.property(fc.array(fc.tuple(section, key, value), {maxLength: 6}), (entries) => {
				const text = entries.map(([where, id, raw]) => `${where}:\n  ${JSON.stringify(id)}: ${raw}`).join('\n');
				if (text.trim() === '') return;
				expectWellFormed(loadAnswersFromText(text, 'a.yaml', rules), text, 'a.yaml');
			}),
			{numRuns},
		);
	});

	it('on mutations of the clear demo', () => {
		fc.assert(
			fc.property(mutatedFrom(answersText), (text) => {
				expectWellFormed(loadAnswersFromText(text, 'a.yaml', rules), text, 'a.yaml');
			}),
			{numRuns},
		);
	});

	it('an alias to a missing anchor is a problem, not a throw', () => {
		const text = answersText.replace('current_limit: 2 A', 'current_limit: *limit');
		const loaded = loadAnswersFromText(text, 'a.yaml', rules);
		expect(loaded).toMatchObject({ok: false, errors: [{file: 'a.yaml', line: 26}]});
	});

	it('an alias bomb is a problem, not a throw', () => {
		const levels = ['a0: &a0 [x, x, x, x, x, x, x, x, x, x]'];
		for (let level = 1; level < 6; level += 1) levels.push(`a${level}: &a${level} [${Array.from({length: 10}, () => `*a${level - 1}`).join(', ')}]`);
		const text = `${levels.join('\n')}\n`;
		expectWellFormed(loadAnswersFromText(text, 'a.yaml', rules), text, 'a.yaml');
	});
});

/** Units a person may type for each dimension, with how many SI units one of them is. */
const unitsByDimension: Array<{dimension: Dimension; unit: string; factor: number; offset?: number}> = [
	{dimension: 'current', unit: 'A', factor: 1},
	{dimension: 'current', unit: 'mA', factor: 1e-3},
	{dimension: 'current', unit: 'uA', factor: 1e-6},
	{dimension: 'current', unit: 'µA', factor: 1e-6},
	{dimension: 'current', unit: 'nA', factor: 1e-9},
	{dimension: 'current', unit: 'kA', factor: 1e3},
	{dimension: 'voltage', unit: 'V', factor: 1},
	{dimension: 'voltage', unit: 'mV', factor: 1e-3},
	{dimension: 'voltage', unit: 'kV', factor: 1e3},
	{dimension: 'power', unit: 'W', factor: 1},
	{dimension: 'power', unit: 'mW', factor: 1e-3},
	{dimension: 'power', unit: 'uW', factor: 1e-6},
	{dimension: 'resistance', unit: 'ohm', factor: 1},
	{dimension: 'resistance', unit: 'Ω', factor: 1},
	{dimension: 'resistance', unit: 'mohm', factor: 1e-3},
	{dimension: 'resistance', unit: 'kohm', factor: 1e3},
	{dimension: 'resistance', unit: 'Mohm', factor: 1e6},
	{dimension: 'temperature', unit: 'K', factor: 1},
	{dimension: 'temperature', unit: 'degC', factor: 1, offset: 273.15},
	{dimension: 'temperature', unit: '°C', factor: 1, offset: 273.15},
	{dimension: 'temperature_difference', unit: 'K', factor: 1},
	{dimension: 'time', unit: 's', factor: 1},
	{dimension: 'time', unit: 'ms', factor: 1e-3},
	{dimension: 'time', unit: 'us', factor: 1e-6},
	{dimension: 'frequency', unit: 'Hz', factor: 1},
	{dimension: 'frequency', unit: 'MHz', factor: 1e6},
	{dimension: 'length', unit: 'nm', factor: 1e-9},
	{dimension: 'length', unit: 'mm', factor: 1e-3},
	{dimension: 'length', unit: 'm', factor: 1},
	{dimension: 'angle', unit: 'mrad', factor: 1e-3},
	{dimension: 'thermal_resistance', unit: 'K/W', factor: 1},
	{dimension: 'responsivity', unit: 'A/W', factor: 1},
	{dimension: 'responsivity', unit: 'mA/W', factor: 1e-3},
	{dimension: 'slope_efficiency', unit: 'W/A', factor: 1},
	{dimension: 'transconductance', unit: 'A/V', factor: 1},
	{dimension: 'transconductance', unit: 'mA/V', factor: 1e-3},
	{dimension: 'irradiance', unit: 'W/m^2', factor: 1},
	{dimension: 'irradiance', unit: 'mW/cm^2', factor: 10},
	{dimension: 'radiant_exposure', unit: 'J/m^2', factor: 1},
	{dimension: 'energy', unit: 'J', factor: 1},
	{dimension: 'energy', unit: 'mJ', factor: 1e-3},
	{dimension: 'ratio', unit: '%', factor: 1e-2},
	{dimension: 'ratio', unit: '', factor: 1},
	{dimension: 'number', unit: '', factor: 1},
];

describe('parseQuantity reads back any finite number written with a valid unit', () => {
	const magnitude = fc.oneof(
		fc.constant(0),
		fc.double({min: 1e-200, max: 1e200, noNaN: true}),
		fc.double({min: 1e-3, max: 1e4, noNaN: true}),
		fc.integer({min: 0, max: 100_000}),
	);
	const number = fc.tuple(magnitude, fc.boolean()).map(([value, negative]) => (negative ? -value : value));

	it('within 1e-9 relative', () => {
		fc.assert(
			fc.property(number, fc.constantFrom(...unitsByDimension), fc.constantFrom('', ' '), (value, {dimension, unit, factor, offset}, space) => {
				const entry = unit === '' ? String(value) : `${String(value)}${space}${unit}`;
				const parsed = parseQuantity(entry, dimension);
				expect(parsed, entry).toMatchObject({ok: true});
				if (!parsed.ok) return;
				const expected = value * factor + (offset ?? 0);
				// Relative to the larger of the result and the entered value, so a temperature near absolute zero is still judged fairly.
				const scale = Math.max(Math.abs(expected), Math.abs(value * factor), Number.MIN_VALUE);
				expect(Math.abs(parsed.value.si - expected) / scale, entry).toBeLessThanOrEqual(1e-9);
				expect(parsed.value.dimension).toBe(dimension);
			}),
			{numRuns},
		);
	});
});
