import {mkdtempSync, readFileSync, writeFileSync} from 'node:fs';
import {tmpdir} from 'node:os';
import {join} from 'node:path';
import {beforeAll, describe, expect, it} from 'vitest';
import {runIn} from '../helpers/run-cli.js';
import {demoPlanFile} from '../interlock/plan-fixture.js';

const demoResults = 'docs/examples/interlock/bench3-interlock-test-results.yaml';
let folder: string;
let home: string;

/** Records a test with the plan and results given, and returns the record's path. */
async function recorded(plan: string, results: string): Promise<string> {
	const {stdout} = await runIn(home, ['plan', plan, '--record-test', results]);
	const path = /^Record written: (.+)$/m.exec(stdout)?.[1];
	if (!path) throw new Error(`no record written: ${stdout}`);
	return path;
}

beforeAll(() => {
	folder = mkdtempSync(join(tmpdir(), 'prelase-interlock-report-'));
	home = join(folder, 'home');
});

describe('prelase report on an interlock test record', () => {
	it('prints the outcome, the caution and deferral, the record details, every step in sheet order and the signatures', async () => {
		const path = await recorded(demoPlanFile, demoResults);
		const {code, stdout} = await runIn(home, ['report', path]);
		expect(code).toBe(0);
		const lines = stdout.split('\n');
		expect(lines[0]).toBe('# Interlock test record: Fenwick Hollow B.112 bench 3 — enclosure and room loop');
		expect(stdout).toContain('**Outcome: PASSED**');
		expect(stdout).toContain('> **CAUTION.** A functional test shows that the loop worked as built on the day it was tested.');
		expect(stdout).toContain('it never says a setup is safe');
		for (const row of ['| Tested on | 2026-11-30 |', '| Tested by | Ines Marlow, photonics engineer |', '| Witness | Tomas Reyes, deputy laser safety officer (named, not signed) |', '| Plan findings | 0 stop, 0 advise |', '| Policy | largest response 20 ms · resistance margin 25 % · test every 180 days · longest bypass 8 h |', '| Signatures | 1, all verified |']) {
			expect(lines).toContain(row);
		}
		const steps = stdout.slice(stdout.indexOf('## Steps'), stdout.indexOf('## Signatures')).split('\n').filter((line) => /^\| \d+ \| /.test(line));
		expect(steps.map((line) => line.split(' | ')[1])).toEqual(['lid_switch', 'fibre_sense', 'estop_bench', 'door_switch', 'chiller_flow', 'key_switch', 'loop wire break', 'power interruption', 'bypass time-out: alignment_bypass']);
		expect(steps[4]).toContain('| **✓ pass** | 16 ms |');
		expect(stdout).not.toContain('## Steps not passed');
		expect(stdout).toMatch(/\| 1 \| Ines Marlow \| photonics engineer \| operator \| .+ \| \*\*✓ verified\*\* \| ✓ your own key \|/);
	});

	it('puts a failed step first, under Steps not passed, with its note', async () => {
		const results = join(folder, 'failed.yaml');
		writeFileSync(results, readFileSync(demoResults, 'utf8').replace('{step: 4, concerns: door_switch, result: pass, stopped_in: 8 ms}', '{step: 4, concerns: door_switch, result: fail, note: emission went on for 2 s}'));
		const path = await recorded(demoPlanFile, results);
		const {stdout} = await runIn(home, ['report', path]);
		expect(stdout).toContain('**Outcome: FAILED**');
		expect(stdout).toContain('Failed: step 4 (door_switch) failed. Tag the loop out of service and tell the laser safety officer.');
		const section = stdout.slice(stdout.indexOf('## Steps not passed'), stdout.indexOf('## Record'));
		expect(section.split('\n').filter((line) => /^\| \d+ \| /.test(line))).toEqual([expect.stringMatching(/^\| 4 \| door_switch \| .* \| \*\*✗ FAIL\*\* \|  \| emission went on for 2 s \|$/)]);
	});

	it('as HTML: one self-contained page, hostile text from the plan escaped, and written to --out without overwriting', async () => {
		const plan = join(folder, 'hostile-plan.yaml');
		writeFileSync(plan, readFileSync(demoPlanFile, 'utf8').replace(/^name: .*$/m, 'name: "<script>alert(1)</script> & bench \\u0007"'));
		const path = await recorded(plan, demoResults);
		const out = join(folder, 'test.html');
		expect((await runIn(home, ['report', path, '--out', out])).code).toBe(0);
		const page = readFileSync(out, 'utf8');
		expect(page).toMatch(/^<!doctype html>/);
		expect(page).toContain('<h1>&lt;script&gt;alert(1)&lt;/script&gt; &amp; bench </h1>');
		expect(page).not.toContain('<script');
		expect(page).not.toContain('\u0007');
		expect(page).not.toMatch(/\b(src|href)=/);
		expect(page).toContain('Outcome: <strong>PASSED</strong>');
		expect(page.match(/<tr class="answer-yes">/g)).toHaveLength(9);
		const again = await runIn(home, ['report', path, '--out', out]);
		expect(again.code).toBe(2);
		expect(again.stderr).toContain('already exists; prelase does not overwrite it');
	});
});
