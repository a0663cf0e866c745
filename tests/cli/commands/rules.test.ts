import {mkdtempSync, readFileSync, rmSync, writeFileSync} from 'node:fs';
import {tmpdir} from 'node:os';
import {join, resolve} from 'node:path';
import {afterAll, beforeAll, describe, expect, it} from 'vitest';
import {parse} from 'yaml';
import {auditRecords} from '../../../source/audit/audit.js';
import {evaluate} from '../../../source/rules/evaluate/evaluate.js';
import {evaluationToJson} from '../../../source/rules/evaluate/evaluation-json.js';
import {loadAnswers} from '../../../source/rules/evaluate/load-answers.js';
import {loadRules, loadRulesFromText, shippedRulesPath} from '../../../source/rules/load.js';
import type {RulesShow} from '../../../source/rules/inspect/outline.js';
import {policyValueText} from '../../../source/rules/file/schema.js';
import {runCli} from '../../helpers/run-cli.js';

const clearDemo = resolve('docs/examples/bench3-808nm-clear.yaml');
const siteText = `format: 1
extends: shipped
name: Test site policy
policy_changed:
  current_margin:
    value: 20 %
checks_changed:
  beam2_hazard_distance:
    severity: stop
    reason: no hazard distance may reach an uncontrolled position
switched_off:
  pin_configuration_supported: the driver family floats its output
`;

let folder: string;
let home: string;
let sitePath: string;

beforeAll(() => {
	folder = mkdtempSync(join(tmpdir(), 'prelase-rules-command-'));
	home = join(folder, 'home');
	sitePath = join(folder, 'site.yaml');
	writeFileSync(sitePath, siteText);
});
afterAll(() => rmSync(folder, {recursive: true, force: true}));

async function run(...argv: string[]) {
	return runCli(argv, {PRELASE_HOME: home});
}

describe('prelase rules validate', () => {
	it('reports every problem of every file with file:line:column, then exits 1', async () => {
		const bad = join(folder, 'bad.yaml');
		writeFileSync(bad, 'format: 1\nextends: shipped\npolicy_changed:\n  current_margin:\n    value: 2 A\nswitched_off:\n  pin_configuration_supported: ""\n  no_such_check: why\n');
		const {code, stdout} = await run('rules', 'validate', sitePath, bad);
		expect(code).toBe(1);
		expect(stdout).toContain(`${sitePath}: ok (28 checks, 1 switched off, 64 inputs, 21 confirmations; extends 1 file(s))`);
		expect(stdout).toContain(`${bad}:7:3: error: switched_off.pin_configuration_supported: switching off the check "pin_configuration_supported" needs a reason`);
		expect(stdout).toContain(`${bad}:8:3: error: switched_off.no_such_check: the base has no check "no_such_check"`);
		expect(stdout).toContain(`${bad}:5:12: error: policy_changed.current_margin.value: the policy value "current_margin" is not valid`);
		expect(stdout).toContain('3 problems found.');
	});

	it.each([
		{name: 'no file', argv: ['rules', 'validate']},
		{name: 'json with validate', argv: ['rules', 'validate', 'x.yaml', '--json']},
		{name: 'diff with one file', argv: ['rules', 'diff', 'shipped']},
		{name: 'init with no file', argv: ['rules', 'init']},
	])('exits 2 for bad usage: $name', async ({argv}) => {
		expect((await run(...argv)).code).toBe(2);
	});
});

describe('prelase rules show', () => {
	it('gives the effective rules with the file and line each part came from', async () => {
		const {code, stdout} = await run('rules', 'show', sitePath, '--json');
		expect(code).toBe(0);
		const shown = JSON.parse(stdout) as RulesShow;
		const margin = shown.policy.find((entry) => entry.id === 'current_margin');
		expect(margin).toMatchObject({value: '20 %', dimension: 'ratio', from: {file: sitePath, line: 6}, previous: {value: '10 %'}});
		expect(shown.policy.find((entry) => entry.id === 'power_margin')?.from?.line).toBe(28);
		expect(shown.switchedOff).toMatchObject([{id: 'pin_configuration_supported', reason: 'the driver family floats its output', switchedOffAt: {file: sitePath, line: 12}}]);
		const people = shown.steps.find((step) => step.id === 'people')!;
		expect(people.checks.find((check) => check.id === 'beam2_hazard_distance')).toMatchObject({
			severity: 'stop',
			condition: 'beam2_nohd ≤ uncontrolled_distance',
			when: 'second_beam',
			severityChange: {from: 'advise', to: 'stop', at: {file: sitePath, line: 9}},
		});
		expect(shown.steps.flatMap((step) => step.checks).some((check) => check.id === 'pin_configuration_supported')).toBe(false);
	});

	it('shows the shipped policy when no file is given and no rule file is set', async () => {
		const {code, stdout} = await run('rules', 'show');
		expect(code).toBe(0);
		expect(stdout.split('\n')[0]).toBe('Rules   prelase bench policy (shipped default)');
		expect(stdout).toContain('Switched off (not evaluated)\n  none');
	});
});

describe('prelase rules diff', () => {
	it('exits 0 for the same rules and 1 for different ones', async () => {
		expect((await run('rules', 'diff', 'shipped', shippedRulesPath())).code).toBe(0);
		const different = await run('rules', 'diff', 'shipped', sitePath);
		expect(different.code).toBe(1);
		expect(different.stdout).toContain('current_margin: 10 % → 20 % (ratio)');
		expect(different.stdout).toContain('beam2_hazard_distance: Hazard distance of beam 2');
		expect(different.stdout).toContain('  severity: advise → stop');
	});
});

describe('prelase rules init', () => {
	it('writes a site file with every shipped policy value commented out, which validates and changes nothing', async () => {
		const file = join(folder, 'init.yaml');
		expect((await run('rules', 'init', file)).code).toBe(0);
		const text = readFileSync(file, 'utf8');
		const shipped = loadRules(shippedRulesPath());
		if (!shipped.ok) throw new Error('shipped does not load');
		for (const [id, entry] of Object.entries(shipped.value.rules.policy)) {
			expect(text).toContain(`#   ${id}:\n`);
			expect(text).toContain(`#     value: ${policyValueText(entry.value)}\n`);
		}
		expect(text).toContain('#   pin_configuration_supported: "Why it does not apply here, and who decided"');
		expect(parse(text)).toEqual({format: 1, extends: 'shipped'});
		expect((await run('rules', 'diff', 'shipped', file)).code).toBe(0);
		// Uncommenting the policy section as written keeps every value: still no difference.
		const start = text.indexOf('# policy_changed:');
		const end = text.indexOf('\n\n', start);
		const section = text.slice(start, end).replaceAll(/^# (policy_changed:| {2}\w+:| {4}value: .*)$/gm, '$1');
		const uncommented = text.slice(0, start) + section + text.slice(end);
		writeFileSync(file, uncommented);
		expect(Object.keys((parse(uncommented) as {policy_changed: object}).policy_changed)).toEqual(Object.keys(shipped.value.rules.policy));
		expect((await run('rules', 'diff', 'shipped', file)).code).toBe(0);
	});

	it('refuses to overwrite a file', async () => {
		const {code, stderr} = await run('rules', 'init', sitePath);
		expect(code).toBe(2);
		expect(stderr).toContain('already exists');
		expect(readFileSync(sitePath, 'utf8')).toBe(siteText);
	});
});

describe('records made with a site file', () => {
	it('evaluate the same from the record\'s rule text alone, and audit consistent', async () => {
		const records = join(folder, 'records');
		const {code, stdout} = await run('check', '--answers', clearDemo, '--rules', sitePath, '--sign', 'Test Person', '--records', records, '--json');
		expect(code).toBe(1);
		const json = JSON.parse(stdout) as {record: {path: string}; rules: {switchedOff: unknown}; checks: Array<{id: string}>};
		expect(json.rules.switchedOff).toEqual([{id: 'pin_configuration_supported', title: 'Package pin configuration suits the driver in this mounting', reason: 'the driver family floats its output'}]);
		expect(json.checks.some((check) => check.id === 'pin_configuration_supported')).toBe(false);

		const body = (JSON.parse(readFileSync(json.record.path, 'utf8')) as {body: {rules: {text?: string; sha256: string}}}).body;
		// The record names its rule text by SHA-256; the text is stored once in the records folder.
		expect(body.rules.text).toBeUndefined();
		const again = loadRulesFromText(readFileSync(join(records, 'rules', `${body.rules.sha256}.yaml`), 'utf8'), 'from-record.yaml');
		const site = loadRules(sitePath);
		if (!again.ok || !site.ok) throw new Error('rules do not load');
		expect(again.value.sha256).toBe(body.rules.sha256);
		const answers = loadAnswers(clearDemo, site.value);
		if (!answers.ok) throw new Error('answers do not load');
		const strip = (value: ReturnType<typeof evaluationToJson>) => ({...value, rules: {...value.rules, file: ''}});
		expect(strip(evaluationToJson(again.value, answers.value, evaluate(again.value, answers.value)))).toEqual(strip(evaluationToJson(site.value, answers.value, evaluate(site.value, answers.value))));

		const report = auditRecords([json.record.path], {current: site.value, trust: {trusted: []}});
		expect(report.records[0]?.consistency).toMatchObject({reevaluated: true, consistent: true});
		expect(report.records[0]?.currentPolicy).toMatchObject({sameRules: true, checks: []});
	});
});
