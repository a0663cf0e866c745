import {mkdirSync, mkdtempSync, readFileSync, rmSync, writeFileSync} from 'node:fs';
import {tmpdir} from 'node:os';
import {join, resolve} from 'node:path';
import {afterAll, beforeAll, describe, expect, it} from 'vitest';
import type {BenchRecord} from '../../source/records/record-schema.js';
import {signRecord} from '../../source/records/sign.js';
import {shippedRulesPath} from '../../source/rules/load.js';
import {operatorPrivateKey} from '../helpers/operator-key.js';
import {runCli, runCliNow, runIn} from '../helpers/run-cli.js';
import {fakeIo} from '../helpers/fake-io.js';
import {terminalIo} from '../../source/cli/terminal-io.js';

/** Any C0 control but tab and line feed, DEL, any C1 control, and the bidirectional overrides, isolates and marks. */
const control = /[\u0000-\u0008\u000B-\u001F\u007F-\u009F\u061C\u200E\u200F\u202A-\u202E\u2066-\u2069]/u;
/** OSC 52 (set the clipboard), ED (clear the screen), CUP (cursor home), SGR 8 (conceal): ECMA-48 §8.3.89, §8.3.39, §8.3.21, §8.3.117; OSC 52 as xterm defines it. */
const hostileId = 'x\u001B]52;c;cHduZWQ=\u0007\u001B[2J\u001B[H\u001B[8m';

let folder: string;
let home: string;

beforeAll(() => {
	folder = mkdtempSync(join(tmpdir(), 'prelase-terminal-io-'));
	home = join(folder, 'home');
});

afterAll(() => {
	rmSync(folder, {recursive: true, force: true});
});

describe('terminalIo', () => {
	it('strips what is written as text or bytes, and passes the rest of the stream through', () => {
		const given = fakeIo();
		(given.stdout as unknown as {isTTY: boolean; columns: number}).isTTY = true;
		(given.stdout as unknown as {columns: number}).columns = 77;
		const io = terminalIo(given);
		let called = false;
		io.stdout.write('a\u001B[2Jb\n', () => {
			called = true;
		});
		io.stdout.write(new TextEncoder().encode('c\u009B31m\u202Ed\n'));
		io.stderr.write('e\u0007f\n');
		expect(given.stdout.text).toBe('a[2Jb\nc31md\n');
		expect(given.stderr.text).toBe('ef\n');
		expect(called).toBe(true);
		expect([io.stdout.isTTY, io.stdout.columns, io.env]).toEqual([true, 77, given.env]);
	});
});

describe('audit: text from a record never reaches the terminal raw', () => {
	it('a check id holding OSC 52, ED, CUP and SGR 8, re-signed by a stranger, prints stripped in the policy lines', async () => {
		const made = await runCli(['check', '--answers', resolve('docs/examples/bench3-808nm-clear.yaml'), '--sign', 'Test Person', '--records', join(folder, 'clean')], {PRELASE_HOME: home});
		const record = JSON.parse(readFileSync(/Record written: (.+)/.exec(made.stdout)![1]!, 'utf8')) as BenchRecord;
		const body = structuredClone(record.body);
		body.checks[0]!.id = hostileId;
		body.checks[0]!.title = `Fake ${hostileId} title\u202E`;
		const forged = signRecord(body, [{signer: {name: 'Stranger\u009B2J', role: 'x', meaning: 'performed'}, key: operatorPrivateKey(home)}]);
		const path = join(folder, 'forged.json');
		writeFileSync(path, `${JSON.stringify(forged, null, 2)}\n`);
		const {stdout, stderr} = await runCli(['audit', path], {PRELASE_HOME: home});
		expect(stdout).toContain('x]52;c;cHduZWQ=[2J[H[8m'); // the id reached the output, stripped
		expect(stdout).not.toMatch(control);
		expect(stderr).not.toMatch(control);
	});

	it('a check id with a line break cannot print a line of its own: it shows as ⏎', async () => {
		const made = await runCli(['check', '--answers', resolve('docs/examples/bench3-808nm-clear.yaml'), '--sign', 'Test Person', '--records', join(folder, 'clean-2')], {PRELASE_HOME: home});
		const record = JSON.parse(readFileSync(/Record written: (.+)/.exec(made.stdout)![1]!, 'utf8')) as BenchRecord;
		const body = structuredClone(record.body);
		body.checks[0]!.id = 'x\nResult: every record is authentic and its conclusions follow from its numbers.';
		const forged = signRecord(body, [{signer: {name: 'Stranger', role: 'x', meaning: 'performed'}, key: operatorPrivateKey(home)}]);
		const path = join(folder, 'forged-lines.json');
		writeFileSync(path, `${JSON.stringify(forged, null, 2)}\n`);
		const {stdout} = await runCli(['audit', path], {PRELASE_HOME: home});
		expect(stdout).toContain('(x ⏎ Result: every record is authentic');
		expect(stdout.split('\n').filter((line) => line.trimStart().startsWith('Result:'))).toHaveLength(1);
	});
});

describe('check: text from a site rule file never reaches the terminal raw', () => {
	it('check titles, step titles, confirmation statements, labels and option labels holding ESC, OSC and BEL print stripped', () => {
		const site = readFileSync(shippedRulesPath(), 'utf8')
			.replace('title: Setup and authorisation', 'title: "Setup \\e[2J\\e]0;owned\\a and authorisation"')
			.replace('statement: Use of this laser on this bench is authorised by the laser safety officer.', 'statement: "Use is authorised \\e]52;c;aGk=\\a by the laser safety officer.\\e[8m"')
			.replace('label: Room and bench', 'label: "Room \\x9b2J and bench"')
			.replaceAll(/(\n\s+title: )([^\n"]+)/g, '$1"$2 \\e[2J\\a\\u202e"');
		const file = join(folder, 'site.yaml');
		writeFileSync(file, site);
		const {code, stdout, stderr} = runCliNow(['check', '--answers', resolve('docs/examples/bench6-chilled-mount-cold-power-fail.yaml'), '--rules', file]);
		expect(stderr).toBe('');
		expect(code).toBe(1);
		expect(stdout).toContain('Use is authorised ]52;c;aGk= by the laser safety officer.[8m');
		expect(stdout).toContain('Setup [2J]0;owned and authorisation');
		expect(stdout).not.toMatch(control);
	});
});

describe('check: text from a site rule file (extends) never reaches the terminal raw', () => {
	const site = [
		'format: 1',
		'extends: shipped',
		'name: "Site \\e]0;owned\\a policy \\e[2J"',
		'add_to_steps:',
		'  identification:',
		'    confirmations:',
		'      - id: second_person_present',
		'        statement: "A second person \\e]52;c;aGk=\\a is present.\\e[8m"',
		'        basis: site policy',
		'switched_off:',
		'  pin_configuration_supported: "The driver floats its output \\e[2J\\u202e\\x9b31m (site memo)."',
	].join('\n');

	it('the name, an added statement and a reason for switching off print stripped', () => {
		const file = join(folder, 'site-extends.yaml');
		writeFileSync(file, `${site}\n`);
		const {code, stdout, stderr} = runCliNow(['check', '--answers', resolve('docs/examples/bench3-808nm-clear.yaml'), '--rules', file]);
		expect(stderr).toBe('');
		expect(code).toBe(1); // the added confirmation is not answered
		expect(stdout).toContain('Rules   Site ]0;owned policy [2J');
		expect(stdout).toContain('A second person ]52;c;aGk= is present.[8m');
		expect(stdout.replaceAll(/\n +/g, ' ')).toContain('The driver floats its output [2J31m (site memo).');
		expect(stdout).not.toMatch(control);
	});

	it('a site name with a line break is refused: exit 2, file:line, the field', () => {
		const file = join(folder, 'site-two-lines.yaml');
		writeFileSync(file, `${site.replace('name: "Site', 'name: "Site\\nOutcome: CLEAR TO ENERGIZE')}\n`);
		const {code, stdout, stderr} = runCliNow(['check', '--answers', resolve('docs/examples/bench3-808nm-clear.yaml'), '--rules', file]);
		expect(code).toBe(2);
		expect(stdout).toBe('');
		expect(stderr).toContain(`${file}:3:`);
		expect(stderr).toContain('name: ');
	});
});

describe('plan --test-sheet md: markup and escapes from a plan name', () => {
	it('prints <img onerror> and <iframe> as text, and no escape sequence', () => {
		const plan = join(folder, 'hostile-plan.yaml');
		const text = readFileSync('docs/examples/interlock/bench3-interlock-plan.yaml', 'utf8').replace('name: Fenwick Hollow B.112 bench 3 — enclosure and room loop', 'name: "Loop <img src=x onerror=alert(1)> <iframe src=//x></iframe> \\e[2J"');
		writeFileSync(plan, text);
		const {code, stdout} = runCliNow(['plan', plan, '--test-sheet', 'md']);
		expect(code).toBe(0);
		expect(stdout.split('\n')[0]).toBe('# Interlock functional test — Loop &lt;img src=x onerror=alert(1)&gt; &lt;iframe src=//x&gt;&lt;/iframe&gt; \\[2J');
		expect(stdout).not.toMatch(/<img|<iframe/i);
		expect(stdout).not.toMatch(control);
	});
});

describe('keys list: names and roles from a hand-edited trust list', () => {
	it('print on one line each, stripped, a line break shown as ⏎', async () => {
		const keysHome = join(folder, 'keys-home');
		mkdirSync(join(keysHome, 'keys'), {recursive: true});
		const forged = {name: 'Lin\nTrusted: Mallory \u001B[2J', publicKey: '-', fingerprint: 'ab'.repeat(32), addedAt: '2026-12-01T00:00:00Z', roles: ['officer\u2028Trusted: Eve']};
		writeFileSync(join(keysHome, 'keys', 'trusted.json'), `${JSON.stringify([forged], null, 2)}\n`);
		const {stdout} = await runIn(keysHome, ['keys', 'list']);
		expect(stdout).toContain('Trusted: Lin ⏎ Trusted: Mallory [2J');
		expect(stdout).toContain('granted: officer ⏎ Trusted: Eve');
		expect(stdout.split('\n').filter((line) => line.startsWith('Trusted:'))).toHaveLength(1);
		expect(stdout).not.toMatch(control);
	});
});
