import {spawnSync} from 'node:child_process';
import {chmodSync, cpSync, mkdirSync, mkdtempSync, readdirSync, rmSync} from 'node:fs';
import {tmpdir} from 'node:os';
import {join, resolve} from 'node:path';
import {afterAll, beforeAll, describe, expect, it} from 'vitest';
import {caseFolder} from '../helpers/run-cli.js';

// Permissions are checked by the kernel only for users other than root (POSIX: the
// superuser bypasses file modes). Tests run as root on CI, so the program is started as the
// user nobody (uid 65534) with setpriv; run as anyone else, it runs as that user directly.
const bundle = resolve('dist/prelase.js');
const example = resolve('docs/examples/bench3-808nm-clear.yaml');
const asRoot = process.getuid?.() === 0;
let root: string;
let signed: string;

type Run = {code: number | null; stdout: string; stderr: string};

function run(home: string, args: string[]): Run {
	const command = asRoot ? ['setpriv', '--reuid=65534', '--regid=65534', '--clear-groups', process.execPath, bundle, ...args] : [process.execPath, bundle, ...args];
	const result = spawnSync(command[0]!, command.slice(1), {env: {PATH: process.env['PATH'], PRELASE_HOME: home}, encoding: 'utf8', timeout: 30_000});
	return {code: result.status, stdout: result.stdout, stderr: result.stderr};
}

/** A folder the test user owns (a case folder, handed to nobody when the tests run as root). */
function ownFolder(name: string): string {
	const folder = caseFolder(root, name);
	if (asRoot) spawnSync('chown', ['-R', '65534:65534', folder]);
	return folder;
}

beforeAll(() => {
	root = mkdtempSync(join(tmpdir(), 'prelase-permissions-'));
	chmodSync(root, 0o755);
	// Two signed records of the demo, made once and copied into each case.
	signed = ownFolder('signed');
	const home = join(signed, 'home');
	mkdirSync(home);
	if (asRoot) spawnSync('chown', ['65534:65534', home]);
	for (let i = 0; i < 2; i += 1) expect(run(home, ['check', '--answers', example, '--sign', 'Ada Quill', '--records', join(signed, 'records')]).code).toBe(0);
});
afterAll(() => rmSync(root, {recursive: true, force: true}));

function recordsCopy(): string {
	const folder = ownFolder('records');
	cpSync(join(signed, 'records'), folder, {recursive: true});
	if (asRoot) spawnSync('chown', ['-R', '65534:65534', folder]);
	return folder;
}

describe('audit: a folder or file it may not read is an integrity finding naming it, never an internal error', () => {
	it('a subfolder that cannot be listed (mode 000): exit 3, the folder is reported unreadable, the rest is audited', () => {
		const records = recordsCopy();
		mkdirSync(join(records, 'locked'), {mode: 0o000});
		if (asRoot) spawnSync('chown', ['65534:65534', join(records, 'locked')]);
		const audit = run(join(signed, 'home'), ['audit', records]);
		expect(audit.stderr).not.toContain('internal error');
		expect(audit.code).toBe(3);
		expect(audit.stdout).toMatch(/locked\n {2}Integrity {6}✗ NOT AUTHENTIC: cannot read the file \(EACCES\)/);
		expect(audit.stdout).toMatch(/Totals: 3 records · 2 authentic · 1 integrity failure/);
	});

	it('records whose stat is denied (a folder readable but not searchable, mode 644): exit 3, each is unreadable', () => {
		const records = recordsCopy();
		chmodSync(records, 0o644);
		const audit = run(join(signed, 'home'), ['audit', records]);
		expect(audit.stderr).not.toContain('internal error');
		expect(audit.code).toBe(3);
		expect(audit.stdout).toMatch(/Totals: \d+ records · 0 authentic · \d+ integrity failures/);
	});
});

describe('a read-only records folder or settings folder is a clear message (exit 74), and nothing is written', () => {
	it('check --sign into a read-only records folder', () => {
		const records = recordsCopy();
		const before = readdirSync(records).sort();
		chmodSync(records, 0o555);
		const sign = run(join(signed, 'home'), ['check', '--answers', example, '--sign', 'Ada Quill', '--records', records]);
		expect(sign.code).toBe(74);
		expect(sign.stderr).toMatch(new RegExp(`^prelase: could not write ${records}/.*permission denied, EACCES`, 'm'));
		expect(sign.stdout).not.toContain('Record written');
		chmodSync(records, 0o755);
		expect(readdirSync(records).sort()).toEqual(before);
	});

	it('the first signature with a read-only PRELASE_HOME (no key yet): the keys folder cannot be made', () => {
		const home = ownFolder('home');
		chmodSync(home, 0o555);
		const sign = run(home, ['check', '--answers', example, '--sign', 'Ada Quill', '--records', join(ownFolder('out'), 'records')]);
		expect(sign.code).toBe(74);
		expect(sign.stderr).toContain(`prelase: could not write ${join(home, 'keys')}: permission denied, EACCES`);
		expect(readdirSync(home)).toEqual([]);
	});

	it('the audit with a read-only PRELASE_HOME writes nothing there and audits as usual', () => {
		const home = join(signed, 'home');
		chmodSync(home, 0o555);
		try {
			const audit = run(home, ['audit', recordsCopy()]);
			expect(audit.code).toBe(1);
			expect(audit.stdout).toMatch(/Totals: 2 records · 2 authentic · 0 integrity failures/);
		} finally {
			chmodSync(home, 0o755);
		}
	});
});
