import {copyFileSync, mkdirSync, mkdtempSync, readFileSync, rmSync, writeFileSync} from 'node:fs';
import {tmpdir} from 'node:os';
import {join, resolve} from 'node:path';
import {afterAll, beforeAll, describe, expect, it} from 'vitest';
import {localDay} from '../../source/interlock/functional-test/load-results.js';
import {operatorPrivateKey} from '../helpers/operator-key.js';
import type {BenchRecord} from '../../source/records/record-schema.js';
import {signRecord} from '../../source/records/sign.js';
import {runCli} from '../helpers/run-cli.js';

// The demo: plan → test sheet → recorded test → a bench check that uses it → the audit.
const demo = resolve('docs/examples/interlock');
let folder: string;
let home: string;
let records: string;
let benchPath: string;

async function run(...argv: string[]) {
	const result = await runCli(argv, {PRELASE_HOME: home});
	return {...result, stdout: result.stdout.replaceAll(/\n {3,}/g, ' ')};
}

/** The demo results, tested on `day`, with a step failed if asked. */
function results(day: string, failStep?: number): string {
	// Without the witness: a witness named without signing is an audit finding (tests/audit/interlock-audit.test.ts), and this flow's audit is to come out clean.
	let text = readFileSync(join(demo, 'bench3-interlock-test-results.yaml'), 'utf8').replace('tested_on: 2026-11-30', `tested_on: ${day}`).replace(/^witness: .*\n/m, '');
	if (failStep !== undefined) text = text.replace(`{step: ${failStep}, concerns: `, `{step: ${failStep}, result: fail, note: did not stop, concerns: `).replace(/(\{step: \d+, result: fail, note: did not stop, concerns: [^,]+), result: pass/, '$1');
	const file = join(folder, `results-${day}-${failStep ?? 'pass'}.yaml`);
	writeFileSync(file, text);
	return file;
}

const daysAgo = (days: number) => localDay(new Date(Date.now() - days * 86_400_000));

beforeAll(() => {
	folder = mkdtempSync(join(tmpdir(), 'prelase-interlock-flow-'));
	home = join(folder, 'home');
	records = join(home, 'records');
	// the plan and the linked answers side by side, as shipped (the answers name the plan relative to themselves)
	for (const name of ['bench3-interlock-plan.yaml', 'bench3-808nm-linked.yaml']) copyFileSync(join(demo, name), join(folder, name));
});
afterAll(() => rmSync(folder, {recursive: true, force: true}));

describe('the interlock planner feeding the bench check', () => {
	const plan = () => join(folder, 'bench3-interlock-plan.yaml');
	const answers = () => join(folder, 'bench3-808nm-linked.yaml');

	it('before any test the linked check says do not energize and says why', async () => {
		const {code, stdout} = await run('check', '--answers', answers());
		expect(code).toBe(1);
		expect(stdout).toContain('Interlock test (untested): no interlock test record of this plan');
		expect(stdout).toContain('Outcome: DO NOT ENERGIZE');
	});

	it('a passing test recorded today clears it, and the check names the record', async () => {
		const recorded = await run('plan', plan(), '--record-test', results(daysAgo(1)));
		expect(recorded.code).toBe(0);
		const testPath = /Record written: (.+)/.exec(recorded.stdout)![1]!;
		const {code, stdout} = await run('check', '--answers', answers());
		expect(code).toBe(0);
		// the path may be wrapped anywhere on a narrow terminal: compare without white space
		expect(stdout.replaceAll(/\s+/g, '')).toContain(`Interlocktest(current):answeredfromtheinterlocktestrecord${testPath}`.replaceAll(/\s+/g, ''));
		expect(stdout).toContain('Outcome: CLEAR TO ENERGIZE');
		const json = JSON.parse((await run('check', '--answers', answers(), '--json')).stdout) as {interlockTest: {status: string; record: {testedOn: string}}; confirmations: Array<{id: string; status: string}>};
		expect(json.interlockTest).toMatchObject({status: 'current', record: {testedOn: daysAgo(1)}});
		expect(json.confirmations.filter((entry) => entry.id === 'interlock_loop_tested' || entry.id === 'manual_reset_after_interruption').map((entry) => entry.status)).toEqual(['yes', 'yes']);
	});

	it('the signed bench record holds the link, and the audit holds the two records together', async () => {
		const signed = await run('check', '--answers', answers(), '--sign', 'Ines Marlow', '--role', 'photonics engineer');
		expect(signed.code).toBe(0);
		benchPath = /Record written: (.+)/.exec(signed.stdout)![1]!;
		const bench = JSON.parse(readFileSync(benchPath, 'utf8')) as BenchRecord;
		expect(bench.body.interlockTest).toMatchObject({status: 'current', record: {outcome: 'passed', testedOn: daysAgo(1)}});
		const audit = await run('audit', records);
		expect(audit.code).toBe(0);
		expect(audit.stdout).toContain('Plan tested');
		expect(audit.stdout).not.toContain('is not among the records audited');
		// the bench record alone: the audit says it could not see the test record
		const alone = join(folder, 'alone');
		mkdirSync(alone);
		copyFileSync(benchPath, join(alone, 'bench.json'));
		expect((await run('audit', alone)).stdout).toContain('which is not among the records audited');
	});

	it('a bench record that misstates the test it used is a consistency finding', async () => {
		const bench = JSON.parse(readFileSync(benchPath, 'utf8')) as BenchRecord;
		const body = structuredClone(bench.body);
		body.interlockTest!.record!.testedOn = '2026-01-01';
		const forged = signRecord(body, [{signer: {name: 'Ines Marlow', role: 'photonics engineer', meaning: 'performed'}, key: operatorPrivateKey(home)}]);
		const mixed = join(folder, 'mixed');
		mkdirSync(mixed);
		for (const name of (await import('node:fs')).readdirSync(records).filter((entry) => entry.includes('interlock-test'))) copyFileSync(join(records, name), join(mixed, name));
		writeFileSync(join(mixed, 'forged.json'), JSON.stringify(forged));
		const audit = await run('audit', mixed);
		expect(audit.code).toBe(1);
		expect(audit.stdout).toMatch(/the record says it used the interlock test .+ \(tested 2026-01-01, passed\), but that test record says tested \d{4}-\d{2}-\d{2}, passed/);
	});

	it('a failed test recorded after the passing one blocks the check', async () => {
		const recorded = await run('plan', plan(), '--record-test', results(daysAgo(0), 4));
		expect(recorded.code).toBe(1);
		expect(recorded.stdout).toContain('FAILED');
		const {code, stdout} = await run('check', '--answers', answers());
		expect(code).toBe(1);
		expect(stdout).toContain('Interlock test (failed)');
		expect(stdout).toContain('step 4 (door_switch) failed');
	});

	it('a passing test older than the 180-day interval blocks the check: overdue', async () => {
		rmSync(records, {recursive: true, force: true});
		expect((await run('plan', plan(), '--record-test', results(daysAgo(200)))).code).toBe(0);
		const {code, stdout} = await run('check', '--answers', answers());
		expect(code).toBe(1);
		expect(stdout).toContain('Interlock test (overdue)');
		expect(stdout).toContain("it is OVERDUE: the policy's interval is 180 days");
	});
});
