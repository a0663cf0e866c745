import {createHash} from 'node:crypto';
import {copyFileSync, mkdirSync, mkdtempSync, readdirSync, readFileSync, rmSync, writeFileSync} from 'node:fs';
import {tmpdir} from 'node:os';
import {join, resolve} from 'node:path';
import {afterAll, beforeAll, describe, expect, it} from 'vitest';
import {main} from '../../../source/cli/dispatch.js';
import {helpTexts} from '../../../source/cli/commands/help.js';
import {operatorPrivateKey} from '../../helpers/operator-key.js';
import type {BenchRecord, RecordBody} from '../../../source/records/record-schema.js';
import {signRecord} from '../../../source/records/sign.js';
import {shippedRulesPath} from '../../../source/rules/load.js';
import {openSettings} from '../../../source/services/settings.js';
import {fakeIo, fakeStream} from '../../helpers/fake-io.js';
import {runCli, unwrap} from '../../helpers/run-cli.js';

const clearDemo = resolve('docs/examples/bench3-808nm-clear.yaml');

let folder: string;
let home: string;
let cleanPath: string;
let clean: BenchRecord;
let strictRules: string;

/** Runs the program in-process with the test's settings folder and returns what it said. */
async function run(argv: string[], env: NodeJS.ProcessEnv = {PRELASE_HOME: home}) {
	const result = await runCli(argv, env);
	return {...result, stdout: unwrap(result.stdout)};
}

let counter = 0;
function writeRecord(content: string | BenchRecord, name = 'record.json'): string {
	counter += 1;
	const dir = join(folder, `case-${counter}`);
	mkdirSync(dir, {recursive: true});
	const path = join(dir, name);
	writeFileSync(path, typeof content === 'string' ? content : `${JSON.stringify(content, null, 2)}\n`);
	return path;
}

function resigned(change: (body: RecordBody) => void, signer = {name: 'Test Person', role: 'test engineer'}): BenchRecord {
	const body = structuredClone(clean.body);
	change(body);
	return signRecord(body, [{signer: {...signer, meaning: 'performed'}, key: operatorPrivateKey(home)}]);
}

beforeAll(async () => {
	folder = mkdtempSync(join(tmpdir(), 'prelase-audit-cli-'));
	home = join(folder, 'home');
	const made = await run(['check', '--answers', clearDemo, '--sign', 'Test Person', '--role', 'test engineer', '--records', join(folder, 'clean')]);
	cleanPath = /Record written: (.+)/.exec(made.stdout)![1]!;
	clean = JSON.parse(readFileSync(cleanPath, 'utf8')) as BenchRecord;
	strictRules = join(folder, 'site.yaml');
	writeFileSync(strictRules, readFileSync(shippedRulesPath(), 'utf8').replace(/(min_emission_delay:\n\s+value:) 3 s/, '$1 5 s'));
});

afterAll(() => {
	rmSync(folder, {recursive: true, force: true});
});

describe('prelase audit: exit status', () => {
	it('0 for a clean record, with the summary of who signed and what holds', async () => {
		const {code, stdout, stderr} = await run(['audit', cleanPath]);
		expect(code).toBe(0);
		expect(stderr).toBe('');
		expect(stdout).toContain('Setup          Fenwick Hollow bench 3 — FH-808-2 on LD-5L, constant current');
		expect(stdout).toContain('Operator       Test Person, test engineer');
		expect(stdout).toMatch(/Signature 1 {4}✓ authentic Test Person \(test engineer\), operator, .* · your own key/);
		expect(stdout).toContain('Integrity      ✓ authentic: every signature verifies over the body');
		expect(stdout).toContain('Consistency    ✓ the recorded values, verdicts and outcome follow from the recorded inputs');
		expect(stdout).toContain('Findings       none');
		expect(stdout).toContain('Result: every record is authentic and its conclusions follow from its numbers.');
		expect(stdout).toContain('laser safety officer');
		expect(stdout.replaceAll('it never says a setup is safe', '')).not.toMatch(/\bsafe\b/);
		expect(stdout).not.toMatch(/\u001B\[/);
	});

	it('3 for a byte changed in the body', async () => {
		const path = writeRecord(readFileSync(cleanPath, 'utf8').replace('"diode_max_current": "2.5 A"', '"diode_max_current": "2.6 A"'));
		const {code, stdout} = await run(['audit', path]);
		expect(code).toBe(3);
		expect(stdout).toContain('Integrity      ✗ NOT AUTHENTIC: signature 1 (Test Person): the signature does not match the content');
		expect(stdout).toContain('Result: INTEGRITY FAILURE');
	});

	it('3 for an unsigned record and for a file that is not a record', async () => {
		expect((await run(['audit', writeRecord({...clean, signatures: []})])).code).toBe(3);
		const notes = await run(['audit', writeRecord('just some notes\n', 'notes.txt')]);
		expect(notes.code).toBe(3);
		expect(notes.stdout).toContain('NOT AUTHENTIC: not valid JSON');
	});

	it('1 for a verdict altered and signed again with a valid key', async () => {
		const record = resigned((body) => {
			body.checks.find((check) => check.id === 'emission_delay_long_enough')!.verdict = 'fail';
			body.outcome = 'do_not_energize';
		});
		const {code, stdout} = await run(['audit', writeRecord(record)]);
		expect(code).toBe(1);
		expect(stdout).toContain('Integrity      ✓ authentic');
		expect(stdout).toContain("Consistency    ✗ the record's conclusions do not follow from its numbers");
		expect(stdout).toContain('[consistency] the check "emission_delay_long_enough" is recorded as fail, but its numbers give pass');
		expect(stdout).toContain('[consistency] the record says do not energize, but its numbers give clear to energize');
	});

	it('1 for a key the auditor does not trust', async () => {
		const {code, stdout} = await run(['audit', cleanPath], {PRELASE_HOME: join(folder, 'another-home')});
		expect(code).toBe(1);
		expect(stdout).toContain('! NOT a key you trust');
		expect(stdout).toContain('[trust] signature 1 (Test Person) was made with a key you do not trust');
	});

	it.each([
		{name: 'no PATH', argv: ['audit'], message: 'name the records to audit'},
		{name: 'a PATH that does not exist', argv: ['audit', '/nonexistent/records'], message: 'no such file or folder: /nonexistent/records'},
		{name: 'an unknown option', argv: ['audit', '--rule', 'x.yaml', '.'], message: 'unknown option --rule'},
		{name: 'a current rule file with problems', argv: ['audit', '--rules', '/nonexistent/site.yaml', '.'], message: 'the current rule file /nonexistent/site.yaml has problems'},
	])('2 for $name', async ({argv, message}) => {
		const {code, stdout, stderr} = await run(argv);
		expect(code).toBe(2);
		expect(stdout).toBe('');
		expect(stderr).toContain(message);
	});

	it('2 for a folder with no record files in it', async () => {
		const empty = join(folder, 'empty');
		mkdirSync(empty, {recursive: true});
		writeFileSync(join(empty, '.123-abc.tmp'), 'partial');
		const {code, stderr} = await run(['audit', empty]);
		expect(code).toBe(2);
		expect(stderr).toContain('no record files in');
	});
});

describe('prelase audit: current rules', () => {
	it('lists the check the current rules (--rules) make fail, and the outcome it changes', async () => {
		const {code, stdout} = await run(['audit', cleanPath, '--rules', strictRules]);
		expect(code).toBe(1);
		expect(stdout).toContain('would change this record:');
		expect(stdout).toContain('outcome: do not energize instead of clear to energize');
		expect(stdout).toContain('✗ FAIL Emission delay at or above the policy minimum (emission_delay_long_enough; was pass) · 3 s, limit ≥ 5 s');
		expect(stdout).toContain('[policy] under the current rules');
	});

	it('takes the current rules from the settings when --rules is not given', async () => {
		const settingsHome = join(folder, 'settings-home');
		mkdirSync(join(settingsHome, 'keys'), {recursive: true});
		copyFileSync(join(home, 'keys', 'operator.key'), join(settingsHome, 'keys', 'operator.key'));
		openSettings({PRELASE_HOME: settingsHome}).write({rulesFile: strictRules});
		const {code, stdout} = await run(['audit', cleanPath, '--json'], {PRELASE_HOME: settingsHome});
		expect(code).toBe(1);
		const json = JSON.parse(stdout) as {currentRules: {file: string}; records: Array<{currentPolicy: {checks: Array<{id: string; current: string}>}}>};
		expect(json.currentRules.file).toBe(strictRules);
		expect(json.records[0]!.currentPolicy.checks).toEqual([expect.objectContaining({id: 'emission_delay_long_enough', recorded: 'pass', current: 'fail'})]);
	});
});

describe('prelase audit: folders', () => {
	it('audits a folder recursively and ends with a table and totals', async () => {
		const records = join(folder, 'folder');
		mkdirSync(join(records, '2026-12'), {recursive: true});
		copyFileSync(cleanPath, join(records, '2026-12', 'a.json'));
		writeFileSync(join(records, '2026-12', 'b.json'), readFileSync(cleanPath, 'utf8').replace('"diode_max_current": "2.5 A"', '"diode_max_current": "2.6 A"'));
		writeFileSync(join(records, '.c.json'), 'ignored');
		const {code, stdout} = await run(['audit', records]);
		expect(code).toBe(3);
		// The side-by-side table of these paths would be wider than 100 columns: a block per record instead.
		expect(stdout).toMatch(/^1\. \S*a\.json\n {3}\S+ · clear to energize · authentic · consistent yes · current rules same ·\s+0 findings$/m);
		expect(stdout).toMatch(/^2\. \S*b\.json\n {3}\S+ · clear to energize · FAILED · consistent - · current rules - ·\s+1 finding$/m);
		expect(stdout).toContain('Totals: 2 records · 1 authentic · 1 integrity failure · 1 consistent · 0 authentic with findings (findings: 1 integrity)');
	});

	it('shows a progress line on a terminal for more than 1000 records, and clears it', async () => {
		const records = join(folder, 'many');
		mkdirSync(records, {recursive: true});
		for (let index = 0; index < 1001; index += 1) copyFileSync(cleanPath, join(records, `r${String(index).padStart(4, '0')}.json`));
		const io = fakeIo({PRELASE_HOME: home});
		const stderr = fakeStream();
		(stderr as unknown as {isTTY: boolean}).isTTY = true;
		const code = await main(['audit', records, '--json'], {...io, stderr});
		// A thousand and one copies of one record: each earlier copy is superseded by the next.
		expect(code).toBe(1);
		expect(stderr.text).toContain('\rAuditing records: 1001 of 1001 (100 %)');
		expect(stderr.text.endsWith('\r\u001B[2K')).toBe(true);
		expect((JSON.parse(io.stdout.text) as {totals: {records: number}}).totals.records).toBe(1001);
		// Not a terminal: no progress line.
		const piped = await run(['audit', records, '--json']);
		expect(piped.stderr).toBe('');
	});

	it('shows no progress line on a terminal for 51 records (a short audit)', async () => {
		const records = join(folder, 'fifty-one');
		mkdirSync(records, {recursive: true});
		for (let index = 0; index < 51; index += 1) copyFileSync(cleanPath, join(records, `r${String(index).padStart(2, '0')}.json`));
		const stderr = fakeStream();
		(stderr as unknown as {isTTY: boolean}).isTTY = true;
		await main(['audit', records, '--json'], {...fakeIo({PRELASE_HOME: home}), stderr});
		expect(stderr.text).toBe('');
	});
});

describe('prelase audit: a large audit is summarised, --all lists every record', () => {
	let records: string;
	beforeAll(() => {
		records = join(folder, 'twenty-one');
		mkdirSync(records, {recursive: true});
		// 21 checks of one setup by one key, each naming the one before it (a chain, as prelase writes them).
		let previous: {file: string; sha256: string} | null = null;
		for (let index = 0; index < 21; index += 1) {
			const file = `r${String(index).padStart(2, '0')}.json`;
			const record: BenchRecord = signRecord({...clean.body, previous}, [{signer: {name: 'Test Person', role: 'test engineer', meaning: 'performed'}, key: operatorPrivateKey(home)}]);
			const text: string = `${JSON.stringify(record, null, 2)}\n`;
			writeFileSync(join(records, file), text);
			previous = {file, sha256: createHash('sha256').update(text).digest('hex')};
		}
	});

	it('by default: totals, each finding code with its count, then only the records with findings, one short entry each', async () => {
		const {code, stdout} = await run(['audit', records]);
		expect(code).toBe(1);
		expect(stdout).toContain('Summary of 21 records; prelase audit PATH --all lists every record in full');
		expect(stdout).toContain('Totals: 21 records · 21 authentic · 0 integrity failures · 21 consistent · 20 authentic with findings (findings: 20 history)');
		const flat = stdout.replaceAll(/\n {5,}/g, ' ');
		expect(flat).toMatch(/\n {2}20 × \[history\] audit-superseded, the first: a later record for the same setup fingerprint supersedes this one: \S*r01\.json/);
		expect(stdout).toContain('Records with findings: 20 of 21');
		// The last copy supersedes the others and has no finding of its own: it is not listed.
		expect(flat).toMatch(/\n {2}\S*r19\.json · clear to energize · 1 finding\n {4}! \[history\] a later record for the same setup fingerprint supersedes this one: \S*r20\.json/);
		expect(stdout).not.toContain('r20.json · ');
		expect(stdout).not.toContain('Integrity      ✓');
		expect(stdout).toContain('Result: authentic, with findings');
	});

	it('--all lists every record in full with the table, as a small audit does', async () => {
		const {code, stdout} = await run(['audit', records, '--all']);
		expect(code).toBe(1);
		expect(stdout.match(/\n {2}Integrity {6}✓ authentic/g)).toHaveLength(21);
		expect(stdout).toMatch(/^21\. \S*r20\.json\n {3}\S+ · clear to energize · authentic · consistent yes · current rules same ·\s+0 findings$/m);
		expect(stdout).not.toContain('Records with findings');
	});

	it('in JSON: the summary says so, lists the records with findings and counts the codes; --all gives every record', async () => {
		const summary = JSON.parse((await run(['audit', records, '--json'])).stdout) as {listing: string; records: unknown[]; withFindings: Array<{file: string; findings: Array<{code: string}>}>; findingCodes: unknown[]};
		expect(summary.listing).toBe('summary');
		expect(summary.records).toEqual([]);
		expect(summary.withFindings).toHaveLength(20);
		expect(summary.withFindings[0]).toMatchObject({file: join(records, 'r00.json'), authentic: true, kind: 'bench-check', outcome: 'clear_to_energize', findings: [{code: 'audit-superseded', text: expect.stringContaining('a later record for the same setup fingerprint supersedes this one')}]});
		expect(summary.findingCodes).toEqual([{kind: 'history', code: 'audit-superseded', count: 20, example: expect.stringContaining('r01.json')}]);
		const all = JSON.parse((await run(['audit', records, '--json', '--all'])).stdout) as {listing: string; records: unknown[]; withFindings: unknown[]};
		expect(all.listing).toBe('all');
		expect(all.records).toHaveLength(21);
		expect(all.withFindings).toEqual([]);
	});
});

describe('prelase audit: hostile text from a record', () => {
	const escape = '\u001B[2J';
	const bidi = '\u202E';
	let path: string;
	let original: BenchRecord;

	beforeAll(() => {
		original = resigned(
			(body) => {
				body.setup.name = `${escape}Bench${bidi} 3\nIntegrity      ✓ forged line`;
				body.operator = {name: `Mallory${escape}`, role: `tech${bidi}nician`};
				(body.confirmations as Record<string, unknown>)['bypass_recorded'] = {status: 'not_applicable', note: `No bypass${escape}${bidi} fitted \u009B31m`};
			},
			{name: `Mallory${escape}`, role: `tech${bidi}nician`},
		);
		path = writeRecord(original);
	});

	it('never reaches the terminal raw in the text output', async () => {
		const {code, stdout} = await run(['audit', path]);
		expect(code).toBe(0);
		expect(stdout).not.toContain('\u001B');
		expect(stdout).not.toContain(bidi);
		expect(stdout).not.toContain('\u009B');
		expect(stdout).toContain('Setup          [2JBench 3 ⏎ Integrity ✓ forged line');
		expect(stdout).toContain('Operator       Mallory[2J, technician');
		expect(stdout).toContain('note: No bypass[2J fitted 31m');
		// The line break in the setup name cannot start a forged line of its own.
		expect(stdout.split('\n').some((line) => line.startsWith('Integrity      ✓ forged'))).toBe(false);
	});

	it('is escaped in the JSON output, which still gives the exact text', async () => {
		const {code, stdout} = await run(['audit', path, '--json']);
		expect(code).toBe(0);
		expect(stdout).not.toContain('\u001B');
		expect(stdout).not.toContain(bidi);
		expect(stdout).not.toContain('\u009B');
		expect(stdout).toContain('\\u202e');
		const json = JSON.parse(stdout) as {records: Array<{record: {setup: {name: string}; operator: {name: string}; exceptions: Array<{note?: string}>}}>};
		expect(json.records[0]!.record.setup.name).toBe(original.body.setup.name);
		expect(json.records[0]!.record.operator.name).toBe(`Mallory${escape}`);
		expect(json.records[0]!.record.exceptions[0]!.note).toBe(`No bypass${escape}${bidi} fitted \u009B31m`);
	});
});

describe('prelase audit --json', () => {
	it('gives everything the audit found', async () => {
		const {code, stdout} = await run(['audit', cleanPath, '--json']);
		expect(code).toBe(0);
		const json = JSON.parse(stdout) as Record<string, any>;
		expect(Object.keys(json)).toEqual(['tool', 'currentRules', 'trust', 'listing', 'records', 'findingCodes', 'withFindings', 'totals', 'status', 'exitCode']);
		expect(json['status']).toBe('authentic_and_consistent');
		expect(json['exitCode']).toBe(0);
		expect(json['currentRules']).toEqual({name: 'prelase bench policy (shipped default)', file: shippedRulesPath(), sha256: clean.body.rules.sha256});
		expect(json['trust']).toEqual({own: clean.signatures[0]!.fingerprint, trusted: 0});
		const record = json['records'][0];
		expect(Object.keys(record)).toEqual(['file', 'authentic', 'bodySha256', 'record', 'interlockTest', 'signatures', 'consistency', 'currentPolicy', 'history', 'notChecked', 'findings']);
		expect(record.interlockTest).toBeNull();
		expect(record.file).toBe(cleanPath);
		expect(record.record).toMatchObject({createdAt: clean.body.createdAt, operator: {name: 'Test Person', role: 'test engineer'}, outcome: 'clear_to_energize', setup: clean.body.setup && {name: clean.body.setup.name, fingerprint: clean.body.setup.fingerprint}});
		expect(record.record.exceptions).toEqual([expect.objectContaining({status: 'not_applicable', note: 'No bypass is fitted on bench 3.'})]);
		expect(record.signatures[0]).toMatchObject({index: 1, purpose: 'operator', valid: true, authentic: true, trust: 'own'});
		expect(record.history).toEqual({amendedBy: []});
		expect(record.notChecked).toEqual([
			{item: 'record-age', text: expect.stringContaining('not checked')},
			{item: 'interlock-test', text: expect.stringContaining('not checked')},
		]);
		expect(json['totals']).toMatchObject({records: 1, authentic: 1, integrityFailures: 0, consistent: 1, withFindings: 0});
	});

	it('gives each finding its kind, code, data and words', async () => {
		const {stdout} = await run(['audit', cleanPath, '--json'], {PRELASE_HOME: join(folder, 'stranger-home')});
		const finding = (JSON.parse(stdout) as {records: Array<{findings: unknown[]}>}).records[0]!.findings[0];
		expect(finding).toEqual({kind: 'trust', code: 'audit-untrusted-key', data: {index: 1, signer: 'Test Person', fingerprint: clean.signatures[0]!.fingerprint}, text: expect.stringContaining('a key you do not trust')});
	});
});

describe('prelase audit --help', () => {
	it('prints the help with the exit statuses, and the main help lists audit', async () => {
		const io = fakeIo({PRELASE_HOME: home});
		const code = await main(['audit', '--help'], io);
		const stdout = io.stdout.text;
		expect(code).toBe(0);
		expect(stdout).toBe(`${helpTexts.audit}\n`);
		expect(stdout).toContain('3  integrity failure');
		expect(stdout).toMatch(/--all\s+List every record in full/);
		expect(stdout).toContain('more than 20 records are summarised');
		expect(helpTexts.main).toMatch(/\n {2}audit {5}Check signed records: authentic, consistent, and what the current rules change\n/);
	});
});

describe('the chain, through the command', () => {
	it('a record deleted from a folder of three: exit 1, the next record names it; --json counts no record before the chain', async () => {
		const records = join(folder, 'chain-three');
		const written: string[] = [];
		for (let index = 0; index < 3; index += 1) {
			const {code} = await run(['check', '--answers', clearDemo, '--sign', 'Test Person', '--role', 'test engineer', '--records', records]);
			expect(code).toBe(0);
			// The new file of the folder (the printed path may be wrapped).
			written.push(join(records, readdirSync(records).find((name) => name.endsWith('.json') && !written.includes(join(records, name)))!));
		}
		const gone = written[1]!.slice(records.length + 1);
		rmSync(written[1]!);
		const text = await run(['audit', records]);
		expect(text.code).toBe(1);
		expect(text.stdout).toContain(`[history] the record names ${gone} (SHA-256 `);
		expect(text.stdout).toContain('no record here has those bytes: a deleted record');
		const json = JSON.parse((await run(['audit', records, '--json'])).stdout) as {totals: {beforeChain: number}; records: Array<{file: string; findings: Array<{code: string}>}>};
		expect(json.totals.beforeChain).toBe(0); // every record here was written with the chain
		expect(json.records.find((record) => record.file === written[2])!.findings.map((found) => found.code)).toContain('audit-chain-missing');
	});
});
