import {spawnSync} from 'node:child_process';
import {build} from 'esbuild';
import {mkdtempSync, readdirSync, readFileSync, statSync, writeFileSync} from 'node:fs';
import {tmpdir} from 'node:os';
import {join, resolve} from 'node:path';
import {afterAll, beforeAll, describe, expect, it} from 'vitest';
import {rmSync} from 'node:fs';
import {caseFolder} from '../helpers/run-cli.js';

// The file size limit (bash `ulimit -f N`, in 1024-byte blocks, POSIX setrlimit RLIMIT_FSIZE)
// makes a write past N kB fail or come back short: the short write of a full disk, on demand.
// Node ignores SIGXFSZ (measured on Node 20: the write returns a short count, then EFBIG),
// so prelase sees the fault as a write result and must report it.

const bundle = resolve('dist/prelase.js');
const example = resolve('docs/examples/bench3-808nm-clear.yaml');
let root: string;

let harness: string;

beforeAll(async () => {
	root = mkdtempSync(join(tmpdir(), 'prelase-write-faults-'));
	harness = join(root, 'harness.mjs');
	await build({
		entryPoints: ['tests/helpers/write-fault-harness.ts'],
		outfile: harness,
		bundle: true,
		platform: 'node',
		format: 'esm',
		target: 'node20',
		banner: {js: "import {createRequire as __cr} from 'node:module'; const require = __cr(import.meta.url);"},
		logLevel: 'error',
	});
});
afterAll(() => rmSync(root, {recursive: true, force: true}));

type Run = {code: number | null; stdout: string; stderr: string};

/** Runs the bundle with PRELASE_HOME=home, under `ulimit -f limitKb` when given; output goes to pipes (never limited). */
function run(home: string, args: string[], limitKb?: number, program = bundle): Run {
	const quoted = args.map((arg) => `'${arg.replaceAll("'", "'\\''")}'`).join(' ');
	const script = `${limitKb === undefined ? '' : `ulimit -f ${limitKb}; `}exec "${process.execPath}" "${program}" ${quoted}`;
	const result = spawnSync("bash", ["--norc", "--noprofile", "-c", script], {env: {PATH: process.env['PATH'], PRELASE_HOME: home}, encoding: 'utf8', timeout: 30_000});
	return {code: result.status, stdout: result.stdout, stderr: result.stderr};
}

/** Every file in a folder (names starting with a dot too), with its bytes, so "unchanged" can be checked. */
function snapshot(folder: string): Record<string, string> {
	const files: Record<string, string> = {};
	for (const entry of readdirSync(folder, {recursive: true, withFileTypes: true})) {
		if (entry.isFile()) files[join(entry.parentPath, entry.name).slice(folder.length)] = readFileSync(join(entry.parentPath, entry.name), 'utf8');
	}
	return files;
}

const sign = (records: string) => ['check', '--answers', example, '--sign', 'Ada Quill', '--records', records];

describe('a write cut short by the file size limit (ulimit -f) leaves the previous file and says so', () => {
	it('record: check --sign under a 4 kB limit writes no record (a record is ~9 kB), exits non-zero, and the next run signs', () => {
		const home = caseFolder(root, 'home');
		const records = join(home, 'records');
		expect(run(home, sign(records)).code).toBe(0);
		const before = snapshot(records);
		const faulted = run(home, sign(records), 4);
		expect(faulted.code).not.toBe(0);
		expect(faulted.code).not.toBe(70);
		expect(faulted.stdout).not.toContain('Record written');
		expect(faulted.stderr).toMatch(/could not write .*records.*file size limit/s);
		expect(snapshot(records)).toEqual(before);
		const next = run(home, sign(records));
		expect(next.code).toBe(0);
		// Two records of one setup: the later supersedes the earlier (a history finding, exit 1), and nothing is broken.
		const audit = run(home, ['audit', records]);
		expect(audit.code).toBe(1);
		expect(audit.stdout).toMatch(/2 records · 2 authentic · 0 integrity failures/);
	});

	it('stored rule text: check --sign to a new folder under a 20 kB limit stores no part of the ~54 kB rule text', () => {
		const home = caseFolder(root, 'home');
		expect(run(home, sign(join(home, 'first'))).code).toBe(0);
		const records = join(home, 'second');
		const faulted = run(home, sign(records), 20);
		expect(faulted.code).not.toBe(0);
		expect(faulted.code).not.toBe(70);
		expect(faulted.stderr).toMatch(/could not write .*rules.*file size limit/s);
		const left = readdirSync(join(records, 'rules'));
		expect(left).toEqual([]);
		expect(run(home, sign(records)).code).toBe(0);
		expect(run(home, ['audit', records]).code).toBe(0);
	});

	it('key: making the signing key under a zero limit leaves no key file, and the next run makes a working key', () => {
		const home = caseFolder(root, 'home');
		const faulted = run(home, ['keys', '--name', 'Ada Quill'], 0);
		expect(faulted.code).not.toBe(0);
		expect(faulted.code).not.toBe(70);
		expect(faulted.stderr).toMatch(/could not write .*operator\.key.*file size limit/s);
		expect(readdirSync(join(home, 'keys'))).toEqual([]);
		const next = run(home, ['keys', '--name', 'Ada Quill']);
		expect(next.code).toBe(0);
		expect(run(home, sign(join(home, 'records'))).code).toBe(0);
	});

	it('trust list: keys trust under a zero limit leaves trusted.json as it was, and keys list still reads it', () => {
		const home = caseFolder(root, 'home');
		expect(run(home, ['keys', '--name', 'Ada Quill']).code).toBe(0);
		for (const name of ['Bo Reyes', 'Cy Lund']) {
			const other = caseFolder(root, 'colleague');
			expect(run(other, ['keys', '--name', name]).code).toBe(0);
			writeFileSync(join(other, 'pub.pem'), run(other, ['keys', 'export']).stdout);
			if (name === 'Bo Reyes') expect(run(home, ['keys', 'trust', join(other, 'pub.pem')]).code).toBe(0);
			else {
				const trusted = join(home, 'keys', 'trusted.json');
				const before = readFileSync(trusted, 'utf8');
				const faulted = run(home, ['keys', 'trust', join(other, 'pub.pem')], 0);
				expect(faulted.code).not.toBe(0);
				expect(faulted.code).not.toBe(70);
				expect(faulted.stderr).toMatch(/could not write .*trusted\.json.*file size limit/s);
				expect(readFileSync(trusted, 'utf8')).toBe(before);
				expect(readdirSync(join(home, 'keys')).filter((file) => file.endsWith('.tmp'))).toEqual([]);
				const list = run(home, ['keys', 'list']);
				expect(list.code).toBe(0);
				expect(list.stdout).toContain('Bo Reyes');
				expect(run(home, ['keys', 'trust', join(other, 'pub.pem')]).code).toBe(0);
				expect(run(home, ['keys', 'list']).stdout).toContain('Cy Lund');
			}
		}
		expect(statSync(join(home, 'keys', 'trusted.json')).size).toBeGreaterThan(0);
	});
});

describe('new files a command writes (rules init FILE, report --out FILE) are whole or absent', () => {
	it('rules init under a 4 kB limit leaves no file (the template is larger), and the next run writes it', () => {
		const folder = caseFolder(root, 'init');
		const file = join(folder, 'site.yaml');
		const faulted = run(folder, ['rules', 'init', file], 4);
		expect(faulted.code).toBe(74);
		expect(faulted.stderr).toMatch(/could not write .*site\.yaml.*file size limit/s);
		expect(readdirSync(folder)).toEqual([]);
		expect(run(folder, ['rules', 'init', file]).code).toBe(0);
		expect(run(folder, ['rules', 'validate', file]).code).toBe(0);
	});

	it('report --out under a zero limit leaves no file, and the next run writes it', () => {
		const home = caseFolder(root, 'home');
		const records = join(home, 'records');
		expect(run(home, sign(records)).code).toBe(0);
		const [record] = readdirSync(records).filter((name) => name.endsWith('.json'));
		const out = join(home, 'report.html');
		const faulted = run(home, ['report', join(records, record!), '--format', 'html', '--out', out], 0);
		expect(faulted.code).toBe(74);
		expect(faulted.stderr).toMatch(/could not write .*report\.html.*file size limit/s);
		expect(readdirSync(home)).not.toContain('report.html');
		expect(run(home, ['report', join(records, record!), '--format', 'html', '--out', out]).code).toBe(0);
		expect(statSync(out).size).toBeGreaterThan(1000);
	});
});

it.each([['check'], ['keys'], ['plan']])('prelase %s --help names exit status 74 for a file that could not be written', (command) => {
	expect(run(root, [command, '--help']).stdout).toMatch(/^ {2}74 a file could not be written \(disk full, file size limit, read-only or denied folder\);$/m);
});

describe('the files only the screens write (a draft, a plan, the settings) under the file size limit', () => {
	// [kind, the file it writes in the folder, its name in the message]
	it.each([
		['draft', join('drafts', 'current.json'), /could not write .*current\.json.*file size limit/s],
		['plan', 'plan.yaml', /could not write .*plan\.yaml.*file size limit/s],
		['settings', 'config.json', /could not .*config\.json.*file size limit/s],
	])('%s: a 30 kB save under a 20 kB limit fails with a message, the 4 kB file before it is intact, no temporary is left, and the next save works', (kind, file, message) => {
		const folder = caseFolder(root, kind);
		const harnessRun = (size: number, limitKb?: number) => run(folder, [kind, folder, String(size)], limitKb, harness);
		expect(harnessRun(4000).code).toBe(0);
		const before = readFileSync(join(folder, file), 'utf8');
		expect(before.length).toBeGreaterThan(4000);
		const faulted = harnessRun(30_000, 20);
		expect(faulted.stderr).toMatch(message);
		expect(faulted.code).toBe(74);
		expect(readFileSync(join(folder, file), 'utf8')).toBe(before);
		expect(Object.keys(snapshot(folder)).filter((name) => name.endsWith('.tmp'))).toEqual([]);
		expect(harnessRun(30_000).code).toBe(0);
		expect(statSync(join(folder, file)).size).toBeGreaterThan(30_000);
	});
});
