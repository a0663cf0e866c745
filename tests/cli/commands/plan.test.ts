import {mkdtempSync, readFileSync, writeFileSync} from 'node:fs';
import {tmpdir} from 'node:os';
import {join} from 'node:path';
import {describe, expect, it} from 'vitest';
import {main} from '../../../source/cli/dispatch.js';
import {runCliNow} from '../../helpers/run-cli.js';

const demoFile = 'docs/examples/interlock/bench3-interlock-plan.yaml';

/** plan answers at once. */
function run(...argv: string[]) {
	return runCliNow(argv);
}

/** The demo with the emergency stop wired normally open and the side panel left unsecured. */
function faultyPlan(): string {
	const text = readFileSync(demoFile, 'utf8')
		.replace('FH-ES1 mushroom emergency stop on the bench front\n    contact: normally_closed', 'FH-ES1 mushroom emergency stop on the bench front\n    contact: normally_open')
		.replace('beam_reachable: true\n    secured_by: tool', 'beam_reachable: true\n    secured_by: none');
	const file = join(mkdtempSync(join(tmpdir(), 'prelase-plan-')), 'faulty.yaml');
	writeFileSync(file, text);
	return file;
}

describe('prelase plan', () => {
	it.each([
		{name: 'the demo', text: (plan: string) => plan, line: 'Location:       Room B.112, bench 3', json: 'Room B.112, bench 3'},
		{name: 'a plan without a location', text: (plan: string) => plan.replace(/^location: .*\n/m, ''), line: 'Location:       none given: add location (room and bench, as the bench check gives it), or no bench check can use a test of this plan', json: null},
	])('names the location of $name, which ties its tests to a bench', ({text, line, json}) => {
		const file = join(mkdtempSync(join(tmpdir(), 'prelase-plan-')), 'plan.yaml');
		writeFileSync(file, text(readFileSync(demoFile, 'utf8')));
		expect(run('plan', file).stdout).toContain(`${line}\n`);
		expect((JSON.parse(run('plan', file, '--json').stdout) as {plan: {location: string | null}}).plan.location).toBe(json);
	});

	it('prints the loop figures, no findings and the verdict for the demo, exit 0', () => {
		const {code, stdout, stderr} = run('plan', demoFile);
		expect(stderr).toBe('');
		expect(code).toBe(0);
		expect(stdout).toContain('resistance  3.42 Ω (contacts 480 mΩ + wire 2.94 Ω at 30 °C)');
		expect(stdout).toContain('allowed     75 Ω (input reads 100 Ω as closed, less 25 %)');
		expect(stdout).toContain('response    16.5 ms at the slowest, chiller_flow; policy allows 20 ms');
		expect(stdout).toContain('Verdict: No stop findings, 0 advise findings');
		expect(stdout).toContain('laser safety officer');
	});

	it('lists every stop finding with what it concerns, exit 1', () => {
		const {code, stdout} = run('plan', faultyPlan());
		expect(code).toBe(1);
		expect(stdout).toContain('STOP    device estop_bench: a normally-open contact in the loop');
		expect(stdout).toContain('STOP    access point side_panel: a beam can be reached through this access point');
		expect(stdout).toContain('Verdict: 2 stop findings, 0 advise findings');
	});

	it('prints the JSON contract', () => {
		const {code, stdout} = run('plan', faultyPlan(), '--json');
		expect(code).toBe(1);
		const result = JSON.parse(stdout) as {loop: Record<string, {si: number; text: string}>; findings: Array<{severity: string; code: string; subject: unknown; message: string}>; verdict: {stops: number; advises: number}};
		expect(result.loop['contacts']).toEqual({si: expect.closeTo(0.48, 12) as number, text: '480 mΩ'});
		expect(result.loop['current']).toEqual({si: 0.01, text: '10 mA'});
		expect(result.findings.map((entry) => [entry.severity, entry.code, entry.subject])).toEqual([
			['stop', 'interlock-normally-open', {kind: 'device', id: 'estop_bench'}],
			['stop', 'interlock-access-unsecured', {kind: 'access_point', id: 'side_panel'}],
		]);
		expect(result.verdict).toMatchObject({stops: 2, advises: 0});
	});

	it('prints the test sheet in Markdown, exit 0', () => {
		const {code, stdout} = run('plan', demoFile, '--test-sheet', 'md');
		expect(code).toBe(0);
		expect(stdout).toMatch(/^# Interlock functional test — Fenwick Hollow/);
		expect(stdout.split('\n').filter((line) => /^\| \d+ \|/.test(line))).toHaveLength(9);
	});

	it.each([
		{name: 'no FILE', argv: ['plan'], says: 'plan needs a plan FILE'},
		{name: 'a missing file', argv: ['plan', 'no-such-plan.yaml'], says: 'no-such-plan.yaml: error: cannot read the file (no such file)'},
		{name: 'an unknown sheet format', argv: ['plan', demoFile, '--test-sheet', 'pdf'], says: 'unknown test sheet format "pdf"'},
		{name: 'an unknown option', argv: ['plan', demoFile, '--jsn'], says: 'did you mean "--json"'},
		{name: 'a rule file instead of a plan', argv: ['plan', 'rules/default.yaml'], says: 'error: (top level): unknown fields "caution", "policy"'},
	])('refuses $name with exit 2', ({argv, says}) => {
		const {code, stderr} = run(...argv);
		expect(code).toBe(2);
		expect(stderr).toContain(says);
		expect(stderr).not.toContain('internal error');
	});

	it('has help, and a line in the main usage', () => {
		const help = run('plan', '--help').stdout;
		for (const usage of ['prelase plan FILE --test-sheet md|html', 'prelase plan FILE --record-test RESULTS [--records DIR] [--witness-key FILE]', 'prelase plan --schema plan|results', '--rules FILE']) expect(help).toContain(usage);
		expect(run('--help').stdout).toContain('prelase plan FILE [--json | --test-sheet md|html | --record-test RESULTS | --edit]');
	});
});

describe('prelase plan under a rule file without the interlock policy', () => {
	it('names each missing policy value and the rule file, exit 2', () => {
		const shipped = readFileSync('rules/default.yaml', 'utf8');
		const start = shipped.indexOf('  interlock_max_response_time:');
		const cut = shipped.slice(0, start) + shipped.slice(shipped.indexOf('\n\n', start) + 1);
		const rules = join(mkdtempSync(join(tmpdir(), 'prelase-plan-rules-')), 'no-interlock.yaml');
		writeFileSync(rules, cut);
		const {code, stderr} = run('plan', demoFile, '--rules', rules);
		expect(code).toBe(2);
		for (const [name, noun] of [['interlock_max_response_time', 'a time'], ['interlock_resistance_margin', 'a fraction or percentage'], ['interlock_test_interval', 'a time'], ['interlock_longest_bypass', 'a time']]) {
			expect(stderr).toContain(`${rules}: error: the interlock policy value ${name} (${noun}) is missing from the rule file`);
		}
		expect(stderr).toContain(`prelase plan: 4 problem(s) in ${rules}; nothing analysed`);
	});
});
