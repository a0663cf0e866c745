import {existsSync, mkdtempSync, readdirSync, readFileSync, rmSync, writeFileSync} from 'node:fs';
import {tmpdir} from 'node:os';
import {join, resolve} from 'node:path';
import {afterAll, beforeAll, describe, expect, it} from 'vitest';
import {main} from '../../../source/cli/dispatch.js';
import {helpTexts} from '../../../source/cli/commands/help.js';
import {runCliNow} from '../../helpers/run-cli.js';

const failDemo = resolve('docs/examples/bench6-chilled-mount-cold-power-fail.yaml');

let folder: string;
let signerHome: string;
let colleagueHome: string;
let recordPath: string;
let recordText: string;

/** Runs the program in-process with a settings folder; returns what it said. */
function run(home: string, ...argv: string[]) {
	return runCliNow(argv, {PRELASE_HOME: home});
}

function writeTemp(name: string, content: string): string {
	const file = join(folder, name);
	writeFileSync(file, content);
	return file;
}

beforeAll(() => {
	folder = mkdtempSync(join(tmpdir(), 'prelase-report-'));
	signerHome = join(folder, 'signer');
	colleagueHome = join(folder, 'colleague');
	const records = join(folder, 'records');
	const checked = run(signerHome, 'check', '--answers', failDemo, '--sign', 'Test Person', '--role', 'test engineer', '--records', records);
	if (checked.code !== 1) throw new Error(`test setup: the failing demo should sign and exit 1, got ${checked.code}: ${checked.stderr}`);
	const [name] = readdirSync(records).filter((entry) => !entry.startsWith('.')); // the chain's .prelase-chain/ sits beside the records
	recordPath = join(records, name!);
	recordText = readFileSync(recordPath, 'utf8');
});

afterAll(() => {
	rmSync(folder, {recursive: true, force: true});
});

describe('prelase report: printing a signed record', () => {
	it.each([
		{name: 'markdown by default', args: [], start: '# Bench check record: Fenwick Hollow bench 6', contains: ['**Outcome: DO NOT ENERGIZE**', '| **✗ FAIL** | Optical power at the limit current, coldest case', '| 2.62 W | ≤ 2.5 W | over by 125 mW | 4.99 % |']},
		{name: 'markdown asked for', args: ['--format', 'md'], start: '# Bench check record:', contains: ['> **CAUTION.**', 'have the final word.']},
		{name: 'html asked for', args: ['--format', 'html'], start: '<!doctype html>', contains: ['<strong>DO NOT ENERGIZE</strong>', '<td class="number">2.62 W</td><td class="number">≤ 2.5 W</td>', 'have the final word.']},
	])('$name', ({args, start, contains}) => {
		const {code, stdout, stderr} = run(signerHome, 'report', recordPath, ...args);
		expect(stderr).toBe('');
		expect(code).toBe(0);
		expect(stdout.startsWith(start)).toBe(true);
		for (const text of contains) expect(stdout).toContain(text);
	});

	it('says the signer is verified and the key is the reader\'s own', () => {
		const {stdout} = run(signerHome, 'report', recordPath);
		expect(stdout).toMatch(/\| 1 \| Test Person \| test engineer \| operator \| .+ \| \*\*✓ verified\*\* \| ✓ your own key \|/);
	});

	it('says when the key is not trusted, and names the colleague once it is', () => {
		const before = run(colleagueHome, 'report', recordPath);
		expect(before.code).toBe(0);
		expect(before.stdout).toContain('! not among your trusted keys');
		const exported = run(signerHome, 'keys', 'export');
		const pem = writeTemp('test-person.pem', exported.stdout);
		expect(run(colleagueHome, 'keys', 'trust', pem, '--name', 'Test Person').code).toBe(0);
		const after = run(colleagueHome, 'report', recordPath);
		expect(after.stdout).toContain('✓ trusted as Test Person');
		expect(after.stdout).not.toContain('not among your trusted keys');
	});
});

describe('prelase report: the rule text stored with the records', () => {
	it('gives the titles, steps and caution from the text the record names by hash; without that file, ids and what the record itself says', () => {
		const body = (JSON.parse(recordText) as {body: {rules: {sha256: string; text?: string}}}).body;
		expect(body.rules.text).toBeUndefined();
		expect(run(signerHome, 'report', recordPath).stdout).toContain('## 2. Laser diode ratings');
		const stored = join(folder, 'records', 'rules', `${body.rules.sha256}.yaml`);
		const kept = readFileSync(stored, 'utf8');
		rmSync(stored);
		try {
			const page = run(signerHome, 'report', recordPath);
			expect(page.code).toBe(0);
			expect(page.stdout).not.toContain('Laser diode ratings');
			// A record keeps what was entered, computed and concluded; the titles, steps and caution are the text's.
			expect(page.stdout).toContain('## 1. Inputs, checks and confirmations (the rule text with their steps could not be read)');
			expect(page.stdout).toContain('The rule text this record names could not be read, so its caution is not shown here.');
			expect(page.stdout).toContain('| **✗ FAIL** | cold_power_at_limit (`cold_power_at_limit`, severity unknown) | 2.62 W | limit 2.5 W | misses by 125 mW |');
		} finally {
			writeFileSync(stored, kept);
		}
	});
});

describe('prelase report --out', () => {
	it.each([
		{name: 'html from the extension', file: 'page.html', args: [], start: '<!doctype html>'},
		{name: 'markdown from the extension', file: 'page.md', args: [], start: '# Bench check record:'},
		{name: 'the format flag wins', file: 'page.txt', args: ['--format', 'html'], start: '<!doctype html>'},
	])('$name', ({file, args, start}) => {
		const out = join(folder, file);
		const {code, stdout} = run(signerHome, 'report', recordPath, '--out', out, ...args);
		expect(code).toBe(0);
		expect(stdout).toBe(`Report written: ${out}\n`);
		expect(readFileSync(out, 'utf8').startsWith(start)).toBe(true);
		expect(readFileSync(out, 'utf8')).toContain('2.62 W');
	});

	it('refuses to overwrite an existing file and leaves it as it was', () => {
		const out = writeTemp('kept.html', 'keep me');
		const {code, stdout, stderr} = run(signerHome, 'report', recordPath, '--out', out);
		expect(code).toBe(2);
		expect(stdout).toBe('');
		expect(stderr).toContain('already exists');
		expect(readFileSync(out, 'utf8')).toBe('keep me');
	});
});

describe('prelase report: bad usage and records that fail their integrity check', () => {
	it.each([
		{name: 'no RECORD', args: () => ['report'], code: 2, says: 'name the record to print'},
		{name: 'two records', args: () => ['report', recordPath, recordPath], code: 2, says: 'one record at a time'},
		{name: 'unknown format', args: () => ['report', recordPath, '--format', 'pdf'], code: 2, says: 'unknown format "pdf"'},
		{name: 'unknown option', args: () => ['report', recordPath, '--fromat', 'md'], code: 2, says: 'unknown option --fromat (did you mean "--format"?)'},
		{name: 'a changed value', args: () => ['report', writeTemp('altered.json', recordText.replace(`"text":"2.62 W"`, `"text":"1.62 W"`))], code: 3, says: 'signature 1 (Test Person): the signature does not match the content'},
		{name: 'a changed verdict', args: () => ['report', writeTemp('verdict.json', recordText.replace(`"verdict":"fail"`, `"verdict":"pass"`))], code: 3, says: 'fails its integrity check'},
		{name: 'no signatures', args: () => ['report', writeTemp('unsigned.json', JSON.stringify({...JSON.parse(recordText), signatures: []}))], code: 3, says: 'the record is unsigned'},
		{name: 'not JSON', args: () => ['report', writeTemp('broken.json', recordText.slice(0, 200))], code: 3, says: 'not valid JSON'},
		{name: 'no such file', args: () => ['report', join(folder, 'missing.json')], code: 3, says: 'cannot read the file (ENOENT)'},
	])('$name → $code', ({args, code, says}) => {
		const argv = args();
		if (code === 3 && argv[1] !== join(folder, 'missing.json')) expect(readFileSync(argv[1]!, 'utf8')).not.toBe(recordText);
		const result = run(signerHome, ...argv);
		expect(result.code).toBe(code);
		expect(result.stdout).toBe('');
		expect(result.stderr).toContain(says);
	});

	it('writes no file for a record that fails its integrity check', () => {
		const out = join(folder, 'never.html');
		const altered = writeTemp('altered-out.json', recordText.replace(`"text":"2.62 W"`, `"text":"1.62 W"`));
		expect(run(signerHome, 'report', altered, '--out', out).code).toBe(3);
		expect(existsSync(out)).toBe(false);
	});
});

describe('prelase report --help', () => {
	it('prints the help and is listed in the main help', () => {
		const {code, stdout} = run(signerHome, 'report', '--help');
		expect(code).toBe(0);
		expect(stdout).toBe(`${helpTexts.report}\n`);
		expect(stdout).toContain('3  the record fails its integrity check');
		expect(run(signerHome, '--help').stdout).toContain('prelase report RECORD [--format md|html] [--out FILE]');
	});
});
