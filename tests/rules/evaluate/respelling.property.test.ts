import {readdirSync} from 'node:fs';
import fc from 'fast-check';
import {describe, expect, it} from 'vitest';
import {stringify} from 'yaml';
import type {Dimension} from '../../../source/quantities/dimensions.js';
import {normaliseEntry} from '../../../source/quantities/normalise-entry.js';
import {evaluate} from '../../../source/rules/evaluate/evaluate.js';
import type {Evaluation} from '../../../source/rules/evaluate/evaluation.js';
import {loadAnswersFromText} from '../../../source/rules/evaluate/load-answers.js';
import {examplesFolder, readDemo, shippedRules, type AnswersDocument} from '../bench-answers.js';

/**
 * However an input is spelled (SI prefix, scientific notation, °C/K/°F for a temperature, K/°C/°F
 * for a temperature difference, % or a fraction, ohm/Ω), the bench check must reach the same
 * outcome and the same verdict on every check. The re-spellings below are exact decimal
 * rewrites: prefixes are powers of ten (SI Brochure 9th ed., Table 7), T/K = t/°C + 273.15
 * (SI Brochure 2.3.1), t/°F = 1.8 t/°C + 32 and a 1 °F step is 5/9 K (NIST SP 811 B.9), % = 0.01
 * (ISO 80000-1).
 */

const rules = shippedRules();
const numRuns = Number(process.env['PRELASE_FUZZ_RUNS'] ?? 40);
const demos = readdirSync(examplesFolder).filter((name) => name.endsWith('.yaml'));

/** An exact decimal: digits × 10^exponent. */
type Decimal = {digits: bigint; exponent: number};

function decimal(text: string): Decimal {
	const match = /^([-+]?)(\d*)(?:\.(\d*))?(?:[eE]([-+]?\d+))?$/.exec(text)!;
	const fraction = match[3] ?? '';
	const digits = BigInt(`${match[2] ?? ''}${fraction}` || '0');
	return {digits: match[1] === '-' ? -digits : digits, exponent: Number(match[4] ?? 0) - fraction.length};
}

function add(a: Decimal, b: Decimal): Decimal {
	const exponent = Math.min(a.exponent, b.exponent);
	return {digits: a.digits * 10n ** BigInt(a.exponent - exponent) + b.digits * 10n ** BigInt(b.exponent - exponent), exponent};
}

const times = (a: Decimal, factor: Decimal): Decimal => ({digits: a.digits * factor.digits, exponent: a.exponent + factor.exponent});
const shift = (a: Decimal, decades: number): Decimal => ({digits: a.digits, exponent: a.exponent + decades});
const negate = (a: Decimal): Decimal => ({digits: -a.digits, exponent: a.exponent});

/** Plain decimal text without needless zeros: 0.0007, 700, -1.25. */
function plain({digits, exponent}: Decimal): string {
	if (digits === 0n) return '0';
	const sign = digits < 0n ? '-' : '';
	const text = (digits < 0n ? -digits : digits).toString();
	if (exponent >= 0) return sign + text + '0'.repeat(exponent);
	const padded = text.padStart(-exponent + 1, '0');
	const whole = padded.slice(0, exponent);
	const fraction = padded.slice(exponent).replace(/0+$/, '');
	return sign + whole + (fraction ? `.${fraction}` : '');
}

/** Three ways to write one decimal: plain, digits with an exponent, one digit before the point. */
function numberSpellings(value: Decimal): string[] {
	const sign = value.digits < 0n ? '-' : '';
	const text = (value.digits < 0n ? -value.digits : value.digits).toString().replace(/0+$/, '') || '0';
	const exponent = value.exponent + ((value.digits < 0n ? -value.digits : value.digits).toString().length - text.length);
	const normal = text.length > 1 ? `${text[0]}.${text.slice(1)}` : text;
	return [...new Set([plain(value), `${sign}${text}e${exponent}`, `${sign}${normal}E${exponent + text.length - 1}`])];
}

const prefixes: Record<string, number> = {n: -9, u: -6, m: -3, '': 0, k: 3, M: 6};
const bases = ['A', 'V', 'W', 'ohm', 'm', 's', 'rad', 'Hz'];
const symbolSpellings = (unit: string) => [...new Set([unit, unit.replace(/^u/, 'µ'), unit.replace(/ohm$/, 'Ω')])];
const withUnit = (numbers: string[], units: string[]) => numbers.flatMap((number) => units.flatMap((unit) => (unit === '' ? [number] : [`${number} ${unit}`, `${number}${unit}`])));

const kelvinOffset = decimal('273.15');
/** Every exact spelling of an entry for an input of this dimension. */
function spellings(entered: string, dimension: Dimension): string[] {
	const text = normaliseEntry(entered);
	const numberText = /^[-+]?(?:\d+\.?\d*|\.\d+)(?:[eE][-+]?\d+)?/.exec(text)![0];
	const value = decimal(numberText);
	const unit = text.slice(numberText.length).trim();
	if (dimension === 'temperature') {
		const celsius = unit === 'K' ? add(value, negate(kelvinOffset)) : value;
		const fahrenheit = add(times(celsius, decimal('1.8')), decimal('32'));
		return [...withUnit(numberSpellings(celsius), ['degC', '°C']), ...withUnit(numberSpellings(add(celsius, kelvinOffset)), ['K']), ...withUnit(numberSpellings(fahrenheit), ['degF', '°F'])];
	}
	if (dimension === 'temperature_difference') {
		return [...withUnit(numberSpellings(value), ['K', 'degC', '°C']), ...withUnit(numberSpellings(times(value, decimal('1.8'))), ['degF'])];
	}
	if (dimension === 'ratio') {
		const fraction = unit === '%' ? shift(value, -2) : value;
		return [...withUnit(numberSpellings(fraction), ['']), ...withUnit(numberSpellings(shift(fraction, 2)), ['%'])];
	}
	const base = bases.find((candidate) => unit === candidate || (unit.endsWith(candidate) && Object.hasOwn(prefixes, unit.slice(0, -candidate.length))));
	if (!base) return withUnit(numberSpellings(value), [unit]);
	const si = shift(value, prefixes[unit.slice(0, -base.length)]!);
	return Object.entries(prefixes).flatMap(([prefix, decade]) => withUnit(numberSpellings(shift(si, -decade)), symbolSpellings(prefix + base)));
}

function evaluateDocument(document: AnswersDocument): Evaluation {
	const answers = loadAnswersFromText(stringify(document), 'case.yaml', rules);
	if (!answers.ok) throw new Error(`refused: ${answers.errors.map((found) => `${found.code} ${found.field ?? ''} ${JSON.stringify(found.data)}`).join('; ')}`);
	return evaluate(rules, answers.value);
}

const verdicts = (evaluation: Evaluation) => evaluation.checks.map((check) => `${check.id}: ${check.verdict}`);

describe('re-spelled demo inputs', () => {
	it('finds the demo setups', () => {
		expect(demos.length).toBeGreaterThanOrEqual(3);
	});

	it('spells 700 nm, 25 °C, 60 K and 5 % exactly (SI Brochure Table 7 and 2.3.1, NIST SP 811 B.9)', () => {
		expect(spellings('700 nm', 'length')).toEqual(expect.arrayContaining(['0.7 um', '7e-7 m', '0.0007 mm', '0.7µm']));
		expect(spellings('25 degC', 'temperature')).toEqual(expect.arrayContaining(['298.15 K', '77 degF', '25 °C'])); // 25 × 1.8 + 32 = 77
		expect(spellings('60 K', 'temperature_difference')).toEqual(expect.arrayContaining(['60 degC', '108 degF'])); // 60 × 1.8 = 108
		expect(spellings('5 %', 'ratio')).toEqual(expect.arrayContaining(['0.05', '5e-2']));
	});

	it.each(demos)('%s: any re-spelling of every input gives the same outcome and verdicts', (name) => {
		const document = readDemo(name);
		const reference = evaluateDocument(document);
		const quantityInputs = Object.entries(document.inputs).filter(([id, raw]) => rules.inputs.get(id)?.input.kind === 'quantity' && raw !== null && raw !== '');
		const choices = Object.fromEntries(
			quantityInputs.map(([id, raw]) => {
				const input = rules.inputs.get(id)!.input;
				return [id, fc.constantFrom(...spellings(String(raw), input.kind === 'quantity' ? input.dimension : 'number'))];
			}),
		);
		fc.assert(
			fc.property(fc.record(choices), (respelled) => {
				const evaluation = evaluateDocument({...document, inputs: {...document.inputs, ...respelled}});
				expect(evaluation.outcome).toBe(reference.outcome);
				expect(verdicts(evaluation)).toEqual(verdicts(reference));
				evaluation.checks.forEach((check, index) => {
					const before = reference.checks[index]!;
					expect(Object.is(check.value?.si, before.value?.si) && Object.is(check.limit?.si, before.limit?.si), `${check.id}: ${check.value?.text} vs ${before.value?.text}`).toBe(true);
				});
			}),
			{numRuns},
		);
	});
});
