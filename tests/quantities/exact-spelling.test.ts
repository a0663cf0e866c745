import {mkdtempSync, rmSync, writeFileSync} from 'node:fs';
import {tmpdir} from 'node:os';
import {join} from 'node:path';
import {afterAll, describe, expect, it} from 'vitest';
import {stringify} from 'yaml';
import {main} from '../../source/cli/dispatch.js';
import {fakeIo} from '../helpers/fake-io.js';
import {findCalculation} from '../../source/calculations/registry.js';
import {runCalculation} from '../../source/calculations/run-calculation.js';
import type {Dimension} from '../../source/quantities/dimensions.js';
import {evaluateExpression} from '../../source/quantities/expression-evaluate.js';
import {parseExpression} from '../../source/quantities/expression-parser.js';
import {isQuantity} from '../../source/quantities/quantity.js';
import {parseQuantity} from '../../source/quantities/parse-quantity.js';
import {loadAnswersFromText} from '../../source/rules/evaluate/load-answers.js';
import {readDemo, shippedRules, withChanges} from '../rules/bench-answers.js';

/**
 * Every spelling of one value must give the same double, the one nearest the exact decimal
 * (ECMA-262 §7.1.4.1.1 StringToNumber rounds a decimal literal correctly; the SI prefixes are
 * exact powers of ten, SI Brochure 9th ed. Table 7). The `si` column is that double.
 */
const groups: Array<{dimension: Dimension; si: number; spellings: string[]}> = [
	{dimension: 'length', si: 7e-7, spellings: ['700 nm', '0.7 um', '0.7 µm', '7e-7 m', '7E-7m', '0.0007 mm', '.0007 mm', '700e-9 m', '0.00007 cm']}, // SI Brochure Table 7: n = 1e-9, µ = 1e-6, m = 1e-3, c = 1e-2
	{dimension: 'length', si: 1.4e-6, spellings: ['1400 nm', '1.4 um', '1.4e-6 m', '0.0014 mm', '14e2 nm']}, // SI Brochure Table 7
	{dimension: 'length', si: 1.05e-6, spellings: ['1050 nm', '1.05 um', '1.05e-6 m', '105e1 nm']}, // SI Brochure Table 7
	{dimension: 'current', si: 0.25, spellings: ['250 mA', '0.25 A', '2.5e-1 A', '250000 uA', '250e-3 A']}, // SI Brochure Table 7: m = 1e-3, µ = 1e-6
	{dimension: 'current', si: 0.0011, spellings: ['1.1 mA', '0.0011 A', '1100 uA', '1.1e-3 A']}, // SI Brochure Table 7
	{dimension: 'power', si: 0.003, spellings: ['3 mW', '0.003 W', '3e-3 W', '3000 uW', '3000000 nW']}, // SI Brochure Table 7
	{dimension: 'time', si: 1.3e-5, spellings: ['13 us', '0.013 ms', '1.3e-5 s', '13000 ns', '13 µs']}, // SI Brochure Table 7
	{dimension: 'resistance', si: 4700, spellings: ['4.7 kohm', '4700 ohm', '4700 Ω', '0.0047 Mohm', '4.7kΩ']}, // SI Brochure Table 7: k = 1e3, M = 1e6
	{dimension: 'ratio', si: 0.033, spellings: ['3.3 %', '0.033', '3.3%', '33e-3']}, // ISO 80000-1 (2009) 3.8: % = 0.01
	{dimension: 'irradiance', si: 10, spellings: ['1 mW/cm^2', '10 W/m^2', '0.001 W/cm^2']}, // SI Brochure Table 7: 1e-3 / (1e-2)^2 = 10
	{dimension: 'temperature', si: 298.15, spellings: ['25 degC', '25 °C', '298.15 K', '77 degF', '77 °F']}, // SI Brochure 2.3.1: T/K = t/°C + 273.15; NIST SP 811 B.9: (77 + 459.67)/1.8 = 298.15
	{dimension: 'temperature', si: 233.15, spellings: ['-40 degC', '233.15 K', '-40 degF', '−40 °C']}, // NIST SP 811 B.9: −40 °F = −40 °C = 233.15 K
	{dimension: 'temperature', si: 310.15, spellings: ['37 degC', '310.15 K', '98.6 degF']}, // NIST SP 811 B.9: (98.6 + 459.67)/1.8 = 310.15
	{dimension: 'temperature_difference', si: 50, spellings: ['50 K', '50 degC', '90 degF', '50000 mK']}, // NIST SP 811 B.9: 1 °F step = 5/9 K
];

const rows = groups.flatMap(({dimension, si, spellings}) => spellings.map((entry) => ({entry, dimension, si})));

describe('every spelling of a value gives the same double', () => {
	it.each(rows)('$entry as $dimension', ({entry, dimension, si}) => {
		const parsed = parseQuantity(entry, dimension);
		expect(parsed.ok).toBe(true);
		if (parsed.ok) expect(Object.is(parsed.value.si, si), `${entry} gave ${parsed.value.si}, expected ${si}`).toBe(true);
	});

	const literals = rows.filter(({entry, dimension}) => dimension !== 'ratio' && /^[-\d.]/.test(entry) && !/[°Ω−µ]/.test(entry) && !entry.includes('/'));
	it.each(literals.filter(({dimension}) => dimension !== 'temperature_difference'))('the formula literal $entry', ({entry, si}) => {
		const value = evaluateExpression(parseExpression(entry), new Map());
		expect(isQuantity(value)).toBe(true);
		if (isQuantity(value)) expect(Object.is(value.value, si), `${entry} gave ${value.value}, expected ${si}`).toBe(true);
	});

	it.each(['700 nm', '0.7 um', '7e-7 m', '0.0007 mm', '700e-9 m'])('calc mpe reads wavelength=%s as 7e-7 m and gives the same result', (spelling) => {
		const mpe = findCalculation('mpe')!;
		const run = runCalculation(mpe, [`wavelength=${spelling}`, 'duration=0.25s']);
		const reference = runCalculation(mpe, ['wavelength=700nm', 'duration=0.25s']);
		expect(run.ok && reference.ok).toBe(true);
		if (!run.ok || !reference.ok) return;
		expect(Object.is(run.value.inputs['wavelength']!.si, 7e-7)).toBe(true); // SI Brochure Table 7
		expect(run.value.outputs).toEqual(reference.value.outputs);
	});

	it.each(['700 nm', '0.7 um', '7e-7 m', '0.0007 mm', '700e-9 m'])('check --answers reads beam1_wavelength: %s as 7e-7 m', (spelling) => {
		const rules = shippedRules();
		const document = withChanges(readDemo('bench3-808nm-clear.yaml'), {beam1_wavelength: spelling});
		const answers = loadAnswersFromText(stringify(document), 'case.yaml', rules);
		expect(answers.ok).toBe(true);
		if (!answers.ok) return;
		const entry = answers.value.inputs.get('beam1_wavelength');
		expect(entry?.kind === 'quantity' && Object.is(entry.si, 7e-7)).toBe(true); // SI Brochure Table 7
	});

	it('a negative literal in degC is the temperature below zero (−20 °C = 253.15 K)', () => {
		const value = evaluateExpression(parseExpression('-20 degC'), new Map());
		expect(isQuantity(value) && value.value).toBe(253.15); // SI Brochure 2.3.1: −20 + 273.15
	});
});

describe('the commands see the same double for every spelling', () => {
	const folder = mkdtempSync(join(tmpdir(), 'prelase-spelling-'));
	afterAll(() => rmSync(folder, {recursive: true, force: true}));

	/** `prelase check --answers FILE --json` on the clearing demo with some inputs re-spelled. */
	const checkJson = (changes: Record<string, string>) => {
		const file = join(folder, `${Object.values(changes).join('-').replaceAll(/[^\w.-]/g, '_')}.yaml`);
		writeFileSync(file, stringify(withChanges(readDemo('bench3-808nm-clear.yaml'), changes)));
		const io = fakeIo();
		const code = main(['check', '--answers', file, '--json'], io);
		const json = JSON.parse(io.stdout.text) as {outcome: string; checks: unknown[]; inputs: Record<string, {si?: number}>};
		const si = Object.fromEntries(Object.entries(json.inputs).map(([id, entry]) => [id, entry.si]));
		return {code, outcome: json.outcome, checks: json.checks, si};
	};

	it('check --answers --json gives the same inputs, outcome and checks for values spelled three ways', () => {
		const reference = checkJson({diode_threshold: '450 mA', sense_resistance: '100 mohm', ambient_max: '35 degC', beam2_wavelength: '650 nm'});
		// SI Brochure Table 7 (prefixes) and 2.3.1 (35 °C = 308.15 K); NIST SP 811 B.9 ((95 + 459.67)/1.8 = 308.15 K)
		for (const changes of [
			{diode_threshold: '450000 uA', sense_resistance: '100000 uohm', ambient_max: '95 degF', beam2_wavelength: '0.65 um'},
			{diode_threshold: '4.5e-1 A', sense_resistance: '1e-1 ohm', ambient_max: '308.15 K', beam2_wavelength: '6.5e-7 m'},
		]) {
			const respelled = checkJson(changes);
			expect(respelled.si).toEqual(reference.si);
			expect(respelled.code).toBe(reference.code);
			expect(respelled.outcome).toBe(reference.outcome);
			expect(respelled.checks).toEqual(reference.checks);
		}
	});

	it('calc headroom gives the same inputs and outputs for 100 mohm, 100000 uohm and 0.1 ohm', () => {
		const outputs = ['100 mohm', '100000 uohm', '0.1 ohm', '1e-4 kohm'].map((sense) => {
			const io = fakeIo();
			main(['calc', 'headroom', 'supply=5V', 'tolerance=5%', 'cable_resistance=50mohm', `sense_resistance=${sense}`, 'driver_drop=0.8V', 'forward_voltage=1.9V', 'current=2A', '--json'], io);
			return io.stdout.text;
		});
		expect(outputs[0]).toMatch(/"outputs"/);
		const [first, ...others] = outputs.map((output) => JSON.parse(output) as {inputs: Record<string, {si: number}>; outputs: unknown});
		for (const other of others) {
			expect(other.inputs['sense_resistance']!.si).toBe(0.1); // SI Brochure Table 7
			expect(other.outputs).toEqual(first!.outputs);
		}
	});
});
