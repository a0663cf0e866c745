import {createHash} from 'node:crypto';
import {mkdtempSync, readFileSync, rmSync, writeFileSync} from 'node:fs';
import {tmpdir} from 'node:os';
import {join, resolve} from 'node:path';
import {afterAll, beforeAll, describe, expect, it} from 'vitest';
import {main} from '../../../source/cli/dispatch.js';
import {helpTexts} from '../../../source/cli/commands/help.js';
import {messages} from '../../../source/shared/messages.js';
import type {Problem} from '../../../source/shared/problems.js';
import {loadAnswers} from '../../../source/rules/evaluate/load-answers.js';
import {loadRules, shippedRulesPath} from '../../../source/rules/load.js';
import type {CompiledRules} from '../../../source/rules/compile/compiled-rules.js';
import {version} from '../../../source/shared/version.js';
import {runCliNow} from '../../helpers/run-cli.js';

const examples = resolve('docs/examples');
const clearDemo = join(examples, 'bench3-808nm-clear.yaml');
const failDemo = join(examples, 'bench6-chilled-mount-cold-power-fail.yaml');
const incompleteDemo = join(examples, 'bench3-808nm-incomplete.yaml');
const clearText = readFileSync(clearDemo, 'utf8');
const shippedRulesText = readFileSync(shippedRulesPath(), 'utf8');

/** Runs the program in-process and returns what it said. */
function run(...argv: string[]) {
	return runCliNow(argv);
}

/** Runs `check --json` and parses stdout. */
function runJson(answers: string) {
	const result = run('check', '--answers', answers, '--json');
	return {...result, json: JSON.parse(result.stdout) as Record<string, any>};
}

/**
 * Replaces the one line of `text` that equals `from` (after trimming) with `to`, and returns
 * the new text with the 1-based line where the change lands.
 */
function editLine(text: string, from: string, to: string): {text: string; line: number} {
	const lines = text.split('\n');
	const index = lines.findIndex((line) => line.trim() === from);
	if (index < 0) throw new Error(`test setup: no line "${from}"`);
	if (lines.findIndex((line, at) => at > index && line.trim() === from) >= 0) throw new Error(`test setup: "${from}" is not unique`);
	const indent = /^\s*/.exec(lines[index]!)![0];
	lines[index] = `${indent}${to}`;
	return {text: lines.join('\n'), line: index + 1};
}

let folder: string;
let rules: CompiledRules;

beforeAll(() => {
	folder = mkdtempSync(join(tmpdir(), 'prelase-cli-'));
	const loaded = loadRules(shippedRulesPath());
	if (!loaded.ok) throw new Error('the shipped rules must load');
	rules = loaded.value;
});

afterAll(() => {
	rmSync(folder, {recursive: true, force: true});
});

function writeTemp(name: string, content: string | Uint8Array): string {
	const file = join(folder, name);
	writeFileSync(file, content);
	return file;
}

/** Loads an answers file through the core, to assert the problem codes behind the CLI text. */
function answerProblems(file: string): Problem[] {
	const loaded = loadAnswers(file, rules);
	return loaded.ok ? [] : loaded.errors;
}

describe('prelase check: the demos', () => {
	it.each([
		{name: 'clear demo → 0', file: clearDemo, code: 0, outcome: 'clear_to_energize'},
		{name: 'cold-power fail demo → 1', file: failDemo, code: 1, outcome: 'do_not_energize'},
		{name: 'incomplete demo → 1', file: incompleteDemo, code: 1, outcome: 'incomplete'},
	])('$name', ({file, code, outcome}) => {
		const text = run('check', '--answers', file);
		expect(text.code).toBe(code);
		expect(text.stderr).toBe('');
		const json = runJson(file);
		expect(json.code).toBe(code);
		expect(json.json['outcome']).toBe(outcome);
	});

	it('prints plain text with the outcome and the caution when stdout is not a terminal', () => {
		const {code, stdout} = run('check', '--answers', clearDemo);
		expect(code).toBe(0);
		expect(stdout).toContain('Outcome: CLEAR TO ENERGIZE');
		expect(stdout).toContain('CAUTION');
		expect(stdout).toContain('Summary: 0 fail · 2 advise · 0 open · 22 pass · 5 skip');
		expect(stdout).not.toMatch(/\u001B\[/);
	});

	it('lists the failing check first in the summary of the fail demo', () => {
		const {stdout} = run('check', '--answers', failDemo);
		const summary = stdout.slice(stdout.indexOf('Summary:'));
		expect(summary).toMatch(/✗ FAIL\s+Optical power at the limit current, coldest case/);
		// 1.05 W/A × (3 A − 0.6 A × exp(−20/110)) = 2.62 W against 2.5 W (T0 model, Coldren et al., from memory)
		expect(summary).toContain('2.62 W, limit ≤ 2.5 W · over the limit by 125 mW');
		expect(stdout).toContain('Outcome: DO NOT ENERGIZE');
	});

	it('names what is missing in the incomplete demo', () => {
		const {stdout} = run('check', '--answers', incompleteDemo);
		expect(stdout).toContain('Inputs not given: photodiode_responsivity, brownout_trip');
		expect(stdout).toContain('Outcome: INCOMPLETE');
	});
});

describe('prelase check --json', () => {
	it('has the tool, the rules with their SHA-256, the setup and the outcome', () => {
		const {json} = runJson(clearDemo);
		expect(json['tool']).toEqual({name: 'prelase', version});
		expect(json['rules']['name']).toBe('prelase bench policy (shipped default)');
		expect(json['rules']['file']).toBe(shippedRulesPath());
		expect(json['rules']['sha256']).toMatch(/^[0-9a-f]{64}$/);
		expect(json['rules']['sha256']).toBe(createHash('sha256').update(shippedRulesText).digest('hex'));
		expect(json['setup']).toBe('Fenwick Hollow bench 3 — FH-808-2 on LD-5L, constant current');
		expect(json['outcome']).toBe('clear_to_energize');
		expect(json['outcomeText']).toBe('clear to energize');
		expect(json['counts']).toEqual({pass: 22, fail: 0, advise: 2, open: 0, skip: 5});
		expect(json['caution']).toBe(rules.rules.caution);
		expect(json['deferral']).toMatch(/laser safety officer/);
	});

	it('gives every quantity input as entered, in SI, with its unit and text', () => {
		const {json} = runJson(clearDemo);
		const inputs = json['inputs'];
		expect(inputs['current_limit']).toEqual({entered: '2 A', si: 2, unit: 'A', text: '2 A'});
		expect(inputs['diode_threshold']).toEqual({entered: '450 mA', si: 0.45, unit: 'A', text: '450 mA'});
		expect(inputs['diode_series_resistance']).toEqual({entered: '0.15 ohm', si: 0.15, unit: 'ohm', text: '150 mΩ'});
		expect(inputs['cable_resistance']).toMatchObject({entered: '50 mohm', unit: 'ohm', text: '50 mΩ'});
		expect(inputs['cable_resistance'].si).toBeCloseTo(0.05, 12);
		expect(inputs['ambient_max']).toMatchObject({entered: '35 degC', unit: 'K', text: '35 °C'});
		expect(inputs['ambient_max'].si).toBeCloseTo(308.15, 9);
		// The old file's supply_tolerance is read as the supply's range: 5 V × (1 ∓ 0.05) = 4.75 V .. 5.25 V (hand arithmetic).
		expect(inputs['supply_nominal']).toMatchObject({entered: '5 V ± 5 %', si: 5, unit: 'V', text: '5 V', range: {low: {unit: 'V', text: '4.75 V'}, high: {unit: 'V', text: '5.25 V'}}});
		expect(Object.keys(inputs)).not.toContain('supply_tolerance');
		expect(inputs['laser_class']).toEqual({entered: 'class_4', option: 'class_4'});
		expect(inputs['reverse_protection']).toEqual({entered: 'yes', value: true});
		expect(inputs['location']).toEqual({entered: 'Room B.112, bench 3', value: 'Room B.112, bench 3'});
		expect(Object.keys(inputs)).not.toContain('power_setpoint');
	});

	it('gives derived values in SI with their unit', () => {
		const {json} = runJson(clearDemo);
		const derived = json['derived'];
		// A derived value is shown at the middle of the supply's range, with its span over the range's ends:
		// worst dissipation at the limit, (V − 1.6 V − 0.15 Ω × 2 A) × 2 A, at 5 V, 4.75 V and 5.25 V (hand arithmetic).
		expect(derived['supply_high'].si).toBeCloseTo(5, 12);
		expect(derived['worst_dissipation']).toMatchObject({unit: 'W', text: '6.2 W'});
		expect(derived['worst_dissipation'].si).toBeCloseTo((5 - 1.6 - 0.15 * 2) * 2, 9);
		expect(derived['worst_dissipation'].span.low.si).toBeCloseTo((4.75 - 1.6 - 0.15 * 2) * 2, 9);
		expect(derived['worst_dissipation'].span.high.si).toBeCloseTo((5.25 - 1.6 - 0.15 * 2) * 2, 9);
		// Derated linearly from 10 W at 25 °C to 0 W at 125 °C, at 35 °C.
		expect(derived['allowed_dissipation'].si).toBeCloseTo((10 * (125 - 35)) / (125 - 25), 9);
		expect(derived['monitor_current']).toEqual({open: ['photodiode_responsivity', 'power_setpoint']});
	});

	it('gives each check its verdict, value, limit and margin', () => {
		const {json} = runJson(clearDemo);
		const checks = json['checks'] as Array<Record<string, any>>;
		expect(checks).toHaveLength(rules.checks.length);
		for (const check of checks) {
			expect(Object.keys(check)).toEqual(expect.arrayContaining(['id', 'step', 'title', 'severity', 'verdict']));
			expect(['pass', 'fail', 'advise', 'open', 'skip']).toContain(check['verdict']);
		}
		const limit = checks.find((check) => check['id'] === 'limit_below_diode_maximum')!;
		expect(limit).toMatchObject({
			step: 'driver',
			title: "Current limit below the diode's absolute maximum less the margin",
			severity: 'stop',
			verdict: 'pass',
			value: {si: 2, unit: 'A', text: '2 A'},
			limit: {unit: 'A', text: '2.25 A'},
			margin: {unit: 'A', text: '250 mA'},
		});
		// Ceiling 2.5 A × (1 − 10 %) = 2.25 A; margin 0.25 A, a ninth of the ceiling.
		expect(limit['limit'].si).toBeCloseTo(2.25, 12);
		expect(limit['margin'].si).toBeCloseTo(0.25, 12);
		expect(limit['margin'].fraction).toBeCloseTo(0.25 / 2.25, 12);
		const skipped = checks.find((check) => check['id'] === 'power_setpoint_below_maximum')!;
		expect(skipped['verdict']).toBe('skip');
		expect(skipped['value']).toBeUndefined();
		const advised = checks.find((check) => check['id'] === 'short_circuit_dissipation')!;
		expect(advised).toMatchObject({severity: 'advise', verdict: 'advise'});
		// Shorted output: 5.25 V × 2 A = 10.5 W against 9 W.
		expect(advised['value'].si).toBeCloseTo(10.5, 9);
		expect(advised['margin'].si).toBeCloseTo(9 - 10.5, 9);
	});

	it('gives a failing check a negative margin', () => {
		const {json} = runJson(failDemo);
		const check = (json['checks'] as Array<Record<string, any>>).find((entry) => entry['id'] === 'cold_power_at_limit')!;
		expect(check['verdict']).toBe('fail');
		// T0 model (Coldren et al., from memory), by hand: 1.05 W/A × (3 A − 0.6 A × exp((5 − 25)/110)) = 2.6247357 W against 2.5 W.
		const cold = 1.05 * (3 - 0.6 * Math.exp(-20 / 110));
		expect(cold).toBeCloseTo(2.6247357, 6);
		expect(check['value'].si).toBeCloseTo(cold, 9);
		expect(check['limit'].si).toBeCloseTo(2.5, 9);
		expect(check['margin'].si).toBeCloseTo(2.5 - cold, 9);
		expect(check['margin'].fraction).toBeCloseTo((2.5 - cold) / 2.5, 9);
		expect(check['margin'].text).toBe('-125 mW');
		expect(json['counts']).toEqual({pass: 19, fail: 1, advise: 2, open: 0, skip: 7});
	});

	it('gives each confirmation its status, and open checks what they need', () => {
		const clear = runJson(clearDemo).json;
		const confirmations = clear['confirmations'] as Array<Record<string, any>>;
		expect(confirmations.map((entry) => entry['id'])).toEqual([...rules.confirmations.keys()]);
		expect(confirmations.find((entry) => entry['id'] === 'bypass_recorded')).toMatchObject({status: 'not_applicable', note: 'No bypass is fitted on bench 3.'});
		expect(confirmations.find((entry) => entry['id'] === 'responsivity_measured')).toMatchObject({status: 'skip'});
		expect(confirmations.find((entry) => entry['id'] === 'use_authorised')).toMatchObject({status: 'yes'});

		const incomplete = runJson(incompleteDemo).json;
		expect(incomplete['counts']).toEqual({pass: 18, fail: 0, advise: 1, open: 4, skip: 6});
		expect(incomplete['missingInputs']).toEqual(['photodiode_responsivity', 'brownout_trip', 'beam1_eyewear_od']);
		const open = (incomplete['checks'] as Array<Record<string, any>>).find((entry) => entry['id'] === 'brownout_before_control_lost')!;
		expect(open).toMatchObject({verdict: 'open', needs: ['brownout_trip']});
		const unanswered = (incomplete['confirmations'] as Array<Record<string, any>>).find((entry) => entry['id'] === 'interlock_loop_tested');
		expect(unanswered).toMatchObject({status: 'unanswered'});
	});
});

describe('prelase check with ranges: the corner of every verdict', () => {
	it('text and JSON name the end of the supply range each check was judged at', () => {
		const text = run('check', '--answers', clearDemo);
		// The demo's 5 V with the rules' default 5 %: 4.75 V .. 5.25 V (hand arithmetic: 5 × (1 ∓ 0.05)).
		expect(text.stdout).toContain('supply_nominal                 4.75 V .. 5.25 V');
		expect(text.stdout).toMatch(/3\.65 V ≥ 2\.4 V · margin 1\.25 V \(52\.1 %\)\n\s+judged at supply_nominal 4\.75 V \(low end\)/);
		expect(text.stdout).toMatch(/6\.7 W ≤ 9 W[^\n]*\n\s+judged at supply_nominal 5\.25 V \(high end\)/);
		const {json} = runJson(clearDemo);
		const corner = (id: string) => (json['checks'] as Array<Record<string, any>>).find((check) => check['id'] === id)!['corner'];
		expect(corner('compliance_headroom')).toEqual({method: 'corners', inputs: [{id: 'supply_nominal', end: 'low', si: 4.75, unit: 'V', text: '4.75 V'}]});
		expect(corner('dissipation_within_rating')).toEqual({method: 'corners', inputs: [{id: 'supply_nominal', end: 'high', si: 5.25, unit: 'V', text: '5.25 V'}]});
		expect(corner('limit_below_diode_maximum')).toBeUndefined();
	});
});

describe('help and version', () => {
	it.each([
		{name: 'prelase --help', argv: ['--help'], first: 'prelase — pre-energize bench check'},
		{name: 'prelase -h', argv: ['-h'], first: 'prelase — pre-energize bench check'},
		{name: 'prelase help', argv: ['help'], first: 'prelase — pre-energize bench check'},
		{name: 'prelase check --help', argv: ['check', '--help'], first: 'prelase check — the bench check'},
		{name: 'prelase check -h', argv: ['check', '-h'], first: 'prelase check — the bench check'},
		{name: 'prelase rules --help', argv: ['rules', '--help'], first: 'prelase rules — rule files'},
	])('$name prints its help and exits 0', ({argv, first}) => {
		const {code, stdout, stderr} = run(...argv);
		expect(code).toBe(0);
		expect(stdout.startsWith(first)).toBe(true);
		expect(stdout).toContain('Usage:');
		expect(stderr).toBe('');
	});

	/** The commands the main help lists under "Commands:". */
	const listed = (() => {
		const section = helpTexts.main.split('Commands:\n')[1]?.split('\n\n')[0] ?? '';
		return section.split('\n').map((line) => /^\s+([a-z]+)\s/.exec(line)?.[1]).filter((name): name is string => name !== undefined);
	})();

	it('the main help lists check and rules', () => {
		expect(listed).toEqual(expect.arrayContaining(['check', 'rules']));
	});

	it.each(listed)('every listed command takes --help: %s', (command) => {
		const {code, stdout, stderr} = run(command, '--help');
		expect(code).toBe(0);
		expect(stdout.startsWith(`prelase ${command}`)).toBe(true);
		expect(stderr).toBe('');
	});

	it.each([['--version'], ['-v']])('%s prints the version from package.json', (flag) => {
		const {code, stdout} = run(flag);
		expect(code).toBe(0);
		const pkg = JSON.parse(readFileSync('package.json', 'utf8')) as {version: string};
		expect(stdout).toBe(`${pkg.version}\n`);
	});
});

describe('bad usage exits 2 and says what to do', () => {
	it.each([
		{name: 'unknown command', argv: ['chek'], says: ['unknown command "chek"', 'check', 'rules', '--help']},
		{name: 'unknown option', argv: ['check', '--answer', clearDemo], says: ['unknown option --answer', 'did you mean "--answers"', '--help']},
		{name: 'missing --answers', argv: ['check'], says: ['--answers FILE', 'does not prompt']},
		{name: '--answers without a value', argv: ['check', '--answers'], says: ['--answers', '--help']},
		{name: 'a stray positional', argv: ['check', '--answers', clearDemo, 'extra'], says: ["'extra'"]},
		{name: '--json with a value', argv: ['check', '--answers', clearDemo, '--json=yes'], says: ["'--json'"]},
		{name: 'unknown rules action', argv: ['rules', 'frob'], says: ['"frob"', 'schema or validate']},
	])('$name', ({argv, says}) => {
		const {code, stdout, stderr} = run(...argv);
		expect(code).toBe(2);
		expect(stdout).toBe('');
		for (const words of says) expect(stderr).toContain(words);
		expect(stderr).not.toMatch(/\n\s+at /);
		expect(stderr).not.toContain('internal error');
	});
});

type AnswersCase = {
	name: string;
	/** The line of the clear demo to change, and what to put there. */
	from: string;
	to: string;
	code: keyof typeof messages;
	field?: string;
	/** Problem data the message is filled from (what was given, what is allowed). */
	data?: Record<string, string | number>;
	/** When the problem is reported away from the edited line. */
	lineOffset?: number;
};

const answersCases: AnswersCase[] = [
	{name: 'malformed YAML (a colon inside an unquoted value)', from: 'current_limit: 2 A', to: 'current_limit: 2 A: 3', code: 'yaml-syntax'},
	{name: 'malformed YAML (a value starting with @)', from: 'current_limit: 2 A', to: 'current_limit: @2 A', code: 'yaml-syntax'},
	{
		name: 'unknown input id with a near miss',
		from: 'current_limit: 2 A',
		to: 'curent_limit: 2 A',
		code: 'answers-unknown-input',
		field: 'inputs.curent_limit',
		data: {id: 'curent_limit', hint: ' (did you mean "current_limit"?)'},
	},
	{name: 'unknown input id far from any', from: 'current_limit: 2 A', to: 'flux_capacitor: 2 A', code: 'answers-unknown-input', field: 'inputs.flux_capacitor', data: {hint: ''}},
	{
		name: 'unknown confirmation with a near miss',
		from: 'interlock_loop_tested: yes',
		to: 'interlock_loop_test: yes',
		code: 'answers-unknown-confirmation',
		field: 'confirmations.interlock_loop_test',
		data: {hint: ' (did you mean "interlock_loop_tested"?)'},
	},
	{name: 'unknown top-level key', from: 'setup: Fenwick Hollow bench 3 — FH-808-2 on LD-5L, constant current', to: 'setpu: bench 3', code: 'answers-unknown-key', field: 'setpu'},
	{name: 'a current with no unit', from: 'current_limit: 2 A', to: 'current_limit: 2', code: 'entry-missing-unit', field: 'inputs.current_limit', data: {entered: '2', noun: 'a current'}},
	{
		name: 'a current given in millivolts',
		from: 'current_limit: 2 A',
		to: 'current_limit: 250 mV',
		code: 'entry-wrong-dimension',
		field: 'inputs.current_limit',
		data: {entered: '250 mV', received: 'a voltage', noun: 'a current'},
	},
	{
		name: 'a temperature in coulomb',
		from: 'ambient_max: 35 degC',
		to: 'ambient_max: 35 C',
		code: 'entry-wrong-dimension',
		field: 'inputs.ambient_max',
		data: {entered: '35 C', hint: ' (C is coulomb; write degC for degrees Celsius)'},
	},
	{name: 'a lower-case unit', from: 'current_limit: 2 A', to: 'current_limit: 2 ma', code: 'entry-unknown-unit', field: 'inputs.current_limit', data: {entered: '2 ma'}},
	{
		name: 'a negative current',
		from: 'current_limit: 2 A',
		to: 'current_limit: -2 A',
		code: 'answers-out-of-range',
		field: 'inputs.current_limit',
		data: {entered: '-2 A', min: '0 A', max: '500 A'},
	},
	{
		name: 'a current above the sane range',
		from: 'current_limit: 2 A',
		to: 'current_limit: 900 A',
		code: 'answers-out-of-range',
		field: 'inputs.current_limit',
		data: {entered: '900 A', min: '0 A', max: '500 A'},
	},
	{name: 'an old tolerance below zero', from: 'supply_tolerance: 5 %', to: 'supply_tolerance: -5 %', code: 'answers-out-of-range', field: 'inputs.supply_tolerance', data: {min: '0 %', max: '100 %'}},
	{name: 'a reversed range', from: 'diode_knee_voltage: 1.6 V', to: 'diode_knee_voltage: 1.7 V .. 1.5 V', code: 'range-reversed', field: 'inputs.diode_knee_voltage'},
	{name: 'a range with ends of two dimensions', from: 'diode_knee_voltage: 1.6 V', to: 'diode_knee_voltage: 1.5 V .. 1.7 A', code: 'range-mixed-dimensions', field: 'inputs.diode_knee_voltage'},
	{name: 'a range on a choice', from: 'laser_class: class_4', to: 'laser_class: 3 .. 4', code: 'range-not-numeric', field: 'inputs.laser_class'},
	{name: 'a range the rules refuse', from: 'diode_max_current: 2.5 A', to: 'diode_max_current: 2.4 A .. 2.6 A', code: 'range-not-allowed', field: 'inputs.diode_max_current'},
	{name: 'NaN', from: 'current_limit: 2 A', to: 'current_limit: NaN', code: 'entry-not-a-number', field: 'inputs.current_limit'},
	{name: 'YAML .nan for a ratio', from: 'supply_tolerance: 5 %', to: 'supply_tolerance: .nan', code: 'entry-not-a-number', field: 'inputs.supply_tolerance'},
	{name: 'YAML .inf', from: 'current_limit: 2 A', to: 'current_limit: .inf', code: 'entry-not-a-number', field: 'inputs.current_limit'},
	{name: 'YAML .inf for a ratio', from: 'supply_tolerance: 5 %', to: 'supply_tolerance: .inf', code: 'entry-not-a-number', field: 'inputs.supply_tolerance'},
	{name: 'an overflowing exponent', from: 'current_limit: 2 A', to: 'current_limit: 1e999 A', code: 'entry-not-finite', field: 'inputs.current_limit', data: {entered: '1e999 A'}},
	{name: 'a list for a quantity', from: 'current_limit: 2 A', to: 'current_limit: [2 A]', code: 'answers-not-quantity', field: 'inputs.current_limit', data: {received: 'a list'}},
	{name: 'a yes/no input given "maybe"', from: 'reverse_protection: yes', to: 'reverse_protection: maybe', code: 'answers-not-yes-no', field: 'inputs.reverse_protection', data: {entered: 'maybe'}},
	{
		name: 'a choice that is not an option',
		from: 'control_mode: constant_current',
		to: 'control_mode: constant_voltage',
		code: 'answers-not-an-option',
		field: 'inputs.control_mode',
		data: {entered: 'constant_voltage', allowed: 'constant_current, constant_power'},
	},
	{name: 'a confirmation given "maybe"', from: 'key_control: yes', to: 'key_control: maybe', code: 'answers-bad-answer', field: 'confirmations.key_control', data: {entered: 'maybe'}},
	{name: 'not applicable with no note', from: 'note: No bypass is fitted on bench 3.', to: 'note: ""', code: 'answers-note-required', field: 'confirmations.bypass_recorded', lineOffset: -1},
	{name: 'not applicable where it is forbidden', from: 'use_authorised: yes', to: 'use_authorised: {answer: n/a, note: x}', code: 'answers-not-applicable-forbidden', field: 'confirmations.use_authorised'},
];

describe('bad answers files exit 2 naming file, line and field', () => {
	it.each(answersCases)('$name', ({name, from, to, code, field, data, lineOffset}) => {
		const edited = editLine(clearText, from, to);
		const file = writeTemp(`${name.replaceAll(/\W+/g, '-')}.yaml`, edited.text);
		const line = edited.line + (lineOffset ?? 0);

		const result = run('check', '--answers', file);
		expect(result.code).toBe(2);
		expect(result.stdout).toBe('');
		expect(result.stderr).toContain(`${file}:${line}:`);
		if (field) expect(result.stderr).toContain(`${field}: `);
		expect(result.stderr).toContain('the answers file has problems');
		expect(result.stderr).not.toMatch(/\n\s+at /);

		const problems = answerProblems(file);
		expect(problems.length).toBeGreaterThan(0);
		const first = problems[0]!;
		expect(first).toMatchObject({code, file, line});
		if (field) expect(first.field).toBe(field);
		if (data) expect(first.data).toMatchObject(data);
	});

	it('reports every bad entry of a file, not just the first', () => {
		const one = editLine(clearText, 'current_limit: 2 A', 'current_limit: 250 mV');
		const two = editLine(one.text, 'reverse_protection: yes', 'reverse_protection: maybe');
		const file = writeTemp('two-problems.yaml', two.text);
		const {code, stderr} = run('check', '--answers', file);
		expect(code).toBe(2);
		expect(stderr).toContain(`${file}:${one.line}:`);
		expect(stderr).toContain(`${file}:${two.line}:`);
		expect(answerProblems(file).map((found) => found.code)).toEqual(['entry-wrong-dimension', 'answers-not-yes-no']);
	});

	it('a duplicate key exits 2 at the line of the second key', () => {
		const edited = editLine(clearText, 'current_setpoint: 1.6 A', 'current_setpoint: 1.6 A\n  current_limit: 3 A');
		const file = writeTemp('duplicate.yaml', edited.text);
		const {code, stderr} = run('check', '--answers', file);
		expect(code).toBe(2);
		expect(stderr).toContain(`${file}:${edited.line + 1}:`);
		expect(answerProblems(file)).toMatchObject([{code: 'yaml-duplicate-key', file, line: edited.line + 1}]);
	});

	it('a duplicate key is named in full', () => {
		const edited = editLine(clearText, 'current_setpoint: 1.6 A', 'current_setpoint: 1.6 A\n  current_limit: 3 A');
		const file = writeTemp('duplicate-name.yaml', edited.text);
		expect(answerProblems(file)[0]?.data).toEqual({key: 'current_limit'});
		expect(run('check', '--answers', file).stderr).toContain('"current_limit"');
	});

	it('a duplicate key names its field', () => {
		const edited = editLine(clearText, 'current_setpoint: 1.6 A', 'current_setpoint: 1.6 A\n  current_limit: 3 A');
		const file = writeTemp('duplicate-field.yaml', edited.text);
		expect(answerProblems(file)[0]?.field).toBe('inputs.current_limit');
	});

	it('YAML .inf is echoed as written', () => {
		const edited = editLine(clearText, 'current_limit: 2 A', 'current_limit: .inf');
		const file = writeTemp('inf-echo.yaml', edited.text);
		expect(run('check', '--answers', file).stderr).toContain('".inf"');
	});

	it('an alias to a missing anchor', () => {
		const edited = editLine(clearText, 'current_limit: 2 A', 'current_limit: *limit');
		const file = writeTemp('dangling-alias.yaml', edited.text);
		const result = run('check', '--answers', file);
		expect(result.stderr).not.toContain('internal error');
		expect(result.code).toBe(2);
		expect(result.stderr).toContain(`${file}:${edited.line}:`);
	});

	it('an alias bomb', () => {
		const levels = ['a0: &a0 [x, x, x, x, x, x, x, x, x, x]'];
		for (let level = 1; level < 6; level += 1) levels.push(`a${level}: &a${level} [${Array.from({length: 10}, () => `*a${level - 1}`).join(', ')}]`);
		const file = writeTemp('alias-bomb.yaml', `${levels.join('\n')}\n`);
		const result = run('check', '--answers', file);
		expect(result.stderr).not.toContain('internal error');
		expect(result.code).toBe(2);
		expect(result.stderr).toContain(`${file}:`);
	});

	it.each([
		{name: 'an empty file', content: '', code: 'file-empty'},
		{name: 'a file of blank lines', content: '  \n\n\t\n', code: 'file-empty'},
		{name: 'a binary file', content: new Uint8Array([0x73, 0x65, 0x74, 0x00, 0x00, 0x01, 0xff, 0x00]), code: 'file-binary'},
		{name: 'a comment only', content: '# nothing yet\n', code: 'yaml-not-mapping'},
		{name: 'a list at the top', content: '- current_limit: 2 A\n', code: 'yaml-not-mapping'},
	] as const)('$name', ({name, content, code}) => {
		const file = writeTemp(`${name.replaceAll(/\W+/g, '-')}.yaml`, content);
		const result = run('check', '--answers', file);
		expect(result.code).toBe(2);
		expect(result.stderr.startsWith(`${file}`)).toBe(true);
		expect(result.stderr).not.toMatch(/\n\s+at /);
		expect(answerProblems(file)).toMatchObject([{code, file}]);
	});

	it('a missing file', () => {
		const file = join(folder, 'no-such-answers.yaml');
		const result = run('check', '--answers', file);
		expect(result.code).toBe(2);
		expect(result.stderr).toContain(`${file}: error: cannot read the file (no such file)`);
		expect(answerProblems(file)).toMatchObject([{code: 'file-unreadable', file, data: {reason: 'no such file'}}]);
	});

	it('a folder given as the answers file', () => {
		const result = run('check', '--answers', folder);
		expect(result.code).toBe(2);
		expect(result.stderr).toContain(`${folder}: error: this is not a regular file (a folder, a device or a pipe)`);
		expect(result.stderr).not.toContain('internal error');
	});
});

describe('bad rule files given with --rules exit 2 naming file, line and field', () => {
	const ruleCases = [
		{name: 'a check comparing amperes with volts', from: 'at_most: driver_max_current', to: 'at_most: photodiode_bias', code: 'compare-mismatch', field: 'checks.1.at_most'},
		{name: 'an unknown name in a formula', from: 'at_most: driver_max_current', to: 'at_most: driver_max_curent', code: 'unknown-name', field: 'checks.1.at_most'},
		{name: 'an unknown function', from: 'at_most: driver_max_current', to: 'at_most: maximum(driver_max_current, current_limit)', code: 'unknown-function', field: 'checks.1.at_most'},
		{name: 'a policy value of the wrong dimension', from: 'value: 0.5 V', to: 'value: 0.5 A', code: 'policy-value', field: 'policy.headroom_margin.value'},
	] as const;

	it.each(ruleCases)('$name', ({name, from, to, code, field}) => {
		const edited = editLine(shippedRulesText, from, to);
		const file = writeTemp(`rules-${name.replaceAll(/\W+/g, '-')}.yaml`, edited.text);
		const result = run('check', '--answers', clearDemo, '--rules', file);
		expect(result.code).toBe(2);
		expect(result.stdout).toBe('');
		expect(result.stderr).toContain(`${file}:${edited.line}:`);
		expect(result.stderr).toContain(`${field}: `);
		expect(result.stderr).toContain('the rule file has problems');
		const loaded = loadRules(file);
		expect(loaded.ok).toBe(false);
		if (!loaded.ok) expect(loaded.errors[0]).toMatchObject({code, file, line: edited.line, field});
	});

	it('a missing rule file', () => {
		const file = join(folder, 'no-such-rules.yaml');
		const result = run('check', '--answers', clearDemo, '--rules', file);
		expect(result.code).toBe(2);
		expect(result.stderr).toContain(`${file}: error: cannot read the file (no such file)`);
	});

	it('an answers file checked against another rule file is read with that file', () => {
		const edited = editLine(shippedRulesText, 'value: 3 s', 'value: 5 s');
		const file = writeTemp('rules-longer-delay.yaml', edited.text);
		const {code, json} = (() => {
			const result = run('check', '--answers', clearDemo, '--rules', file, '--json');
			return {code: result.code, json: JSON.parse(result.stdout) as Record<string, any>};
		})();
		expect(code).toBe(1);
		expect(json['rules']).toMatchObject({file, sha256: createHash('sha256').update(edited.text).digest('hex')});
		const delay = (json['checks'] as Array<Record<string, any>>).find((entry) => entry['id'] === 'emission_delay_long_enough');
		expect(delay).toMatchObject({verdict: 'fail', limit: {si: 5, unit: 's'}});
	});
});
