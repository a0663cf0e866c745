import {existsSync, mkdtempSync, readdirSync, readFileSync, rmSync, writeFileSync} from 'node:fs';
import {tmpdir} from 'node:os';
import {join, resolve} from 'node:path';
import {afterAll, beforeAll, describe, expect, it} from 'vitest';
import {loadAnswers} from '../../../source/rules/evaluate/load-answers.js';
import {loadRules, shippedRulesPath} from '../../../source/rules/load.js';
import {runCli, runCliNow} from '../../helpers/run-cli.js';

const failDemo = resolve('docs/examples/bench6-chilled-mount-cold-power-fail.yaml');
const failText = readFileSync(failDemo, 'utf8');
const shippedText = readFileSync(shippedRulesPath(), 'utf8');
/** The real outcome line of a check that fails (plain output, no colour). */
const realOutcome = 'Outcome: DO NOT ENERGIZE';
/** Every kind of line break: LF, CR, CR LF, VT, FF, NEL, LS, PS (Unicode UAX #14 mandatory breaks). */
const breaks = ['\\n', '\\r', '\\r\\n', '\\v', '\\f', '\\x85', '\\u2028', '\\u2029'];

let folder: string;
let count = 0;

function writeTemp(text: string): string {
	count += 1;
	const file = join(folder, `case-${count}.yaml`);
	writeFileSync(file, text);
	return file;
}

/** Replaces the one line `key: value` (after its indent) of `text`, and gives the 1-based line it is on. */
function editValue(text: string, line: string, value: string): {text: string; line: number} {
	const lines = text.split('\n');
	const index = lines.findIndex((entry) => entry.trim() === line);
	if (index < 0 || lines.findIndex((entry, at) => at > index && entry.trim() === line) >= 0) throw new Error(`test setup: "${line}" is not one unique line`);
	const [indent, key] = /^(\s*)([^:]+):/.exec(lines[index]!)!.slice(1);
	lines[index] = `${indent}${key}: ${value}`;
	return {text: lines.join('\n'), line: index + 1};
}

beforeAll(() => {
	folder = mkdtempSync(join(tmpdir(), 'prelase-single-line-'));
});

afterAll(() => {
	rmSync(folder, {recursive: true, force: true});
});

describe('single-line fields of an answers file refuse a line break: exit 2, file:line, the field', () => {
	const cases = [
		...breaks.map((found) => ({name: `the setup name with ${found}`, line: 'setup: Fenwick Hollow bench 6 — FH-915-3 on LD-5L, chilled mount at 5 °C', value: `"Bench 6${found}Outcome: CLEAR TO ENERGIZE"`, field: 'setup'})),
		{name: 'a serial (text input)', line: 'diode_serial: FH-915-3 s/n 0108 (invented)', value: '"FH-915-3\\nOutcome: CLEAR TO ENERGIZE"', field: 'inputs.diode_serial'},
		{name: 'the location (text input), as a literal block', line: 'location: Room B.114, bench 6', value: '|-\n    Room B.114\n    Outcome: CLEAR TO ENERGIZE', field: 'inputs.location'},
	];

	it.each(cases)('$name', ({line, value, field}) => {
		const edited = editValue(failText, line, value);
		const file = writeTemp(edited.text);
		const {code, stdout, stderr} = runCliNow(['check', '--answers', file]);
		expect(code).toBe(2);
		expect(stdout).toBe('');
		expect(stderr).toContain(`${file}:${edited.line}:`);
		expect(stderr).toContain(`${field}: `);
		const rules = loadRules(shippedRulesPath());
		if (!rules.ok) throw new Error('the shipped rules must load');
		const loaded = loadAnswers(file, rules.value);
		expect(loaded.ok).toBe(false);
		if (!loaded.ok) expect(loaded.errors[0]).toMatchObject({code: 'single-line', file, line: edited.line, field});
	});
});

describe('single-line fields of a rule file refuse a line break: exit 2, file:line, the field', () => {
	const cases = [
		{name: 'the rule file name', line: 'name: prelase bench policy (shipped default)', field: 'name'},
		{name: 'a step title', line: 'title: Setup and authorisation', field: 'steps.0.title'},
		{name: 'an input label', line: 'label: Room and bench', field: 'steps.0.inputs.2.label'},
		{name: 'an option label', line: 'class_4: Class 4', field: 'steps.0.inputs.4.options.class_4'},
	];

	it.each(cases)('$name', ({line, field}) => {
		const value = /:\s(.+)$/.exec(line)![1]!;
		const edited = editValue(shippedText, line, `"${value}\\nOutcome: CLEAR TO ENERGIZE"`);
		const file = writeTemp(edited.text);
		const {code, stdout, stderr} = runCliNow(['check', '--answers', failDemo, '--rules', file]);
		expect(code).toBe(2);
		expect(stdout).toBe('');
		expect(stderr).toContain(`${file}:${edited.line}:`);
		expect(stderr).toContain(`${field}: `);
	});
});

describe('no text from a file can print a line equal to the real outcome line', () => {
	// Every field that may span lines (caution, summaries, statements, explanations, messages,
	// bases, notes) carries a forged outcome after each kind of line break.
	const forged = breaks.map((found) => `${found}Outcome: CLEAR TO ENERGIZE${found}${realOutcome}${found}`).join('');
	const multiLine = /^(\s+(?:- )?)(caution|summary|statement|explanation|message|basis): ([^>|"'\n][^\n]*)$/gm;

	it('a failing check prints exactly one outcome line, the real one, and no line that claims clear to energize', () => {
		const rules = shippedText.replaceAll(multiLine, (_line, indent: string, key: string, value: string) => `${indent}${key}: ${JSON.stringify(value).slice(0, -1)}${forged}"`);
		expect(rules).not.toBe(shippedText);
		const answers = failText.replace('note: No bypass on bench 6.}', `note: "No bypass${forged}"}`);
		expect(answers).not.toBe(failText);
		const {code, stdout, stderr} = runCliNow(['check', '--answers', writeTemp(answers), '--rules', writeTemp(rules)]);
		expect(stderr).toBe('');
		expect(code).toBe(1);
		expect(stdout).toContain('CLEAR TO ENERGIZE'); // the forged text did reach the output, indented
		expect(stdout.split('\n').filter((line) => line === realOutcome)).toHaveLength(1);
		expect(stdout.split('\n').filter((line) => line.startsWith('Outcome:'))).toEqual([realOutcome]);
	});
});

describe('a role given on the command line is one line too', () => {
	it.each([
		{name: '--role', argv: ['--role', 'engineer\nOutcome: CLEAR TO ENERGIZE']},
		{name: '--role with a paragraph separator', argv: ['--role', 'engineer\u2029Outcome: CLEAR TO ENERGIZE']},
	])('$name with a line break: exit 2, the role named, no record written', async ({argv}) => {
		const records = join(folder, `records-${(count += 1)}`);
		const {code, stdout, stderr} = await runCli(['check', '--answers', resolve('docs/examples/bench3-808nm-clear.yaml'), '--sign', 'Test Person', ...argv, '--records', records], {PRELASE_HOME: join(folder, 'home')});
		expect(code).toBe(2);
		expect(stdout).not.toContain('Record written');
		expect(stderr).toContain('the role is one line of text');
		expect(existsSync(records) ? readdirSync(records, {recursive: true}).filter((name) => String(name).endsWith('.json')) : []).toEqual([]);
	});
});
