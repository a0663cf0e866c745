import {createHash} from 'node:crypto';
import {copyFileSync, mkdirSync, mkdtempSync, readdirSync, readFileSync, rmSync, unlinkSync, writeFileSync} from 'node:fs';
import {tmpdir} from 'node:os';
import {join, resolve} from 'node:path';
import fc from 'fast-check';
import {afterAll, beforeAll, describe, expect, it} from 'vitest';
import {auditRecords} from '../../source/audit/audit.js';
import {listRecordFiles} from '../../source/audit/audit-files.js';
import {ownFingerprint} from '../../source/records/key-files.js';
import type {BenchRecord} from '../../source/records/record-schema.js';
import {signRecord} from '../../source/records/sign.js';
import type {CompiledRules} from '../../source/rules/compile/compiled-rules.js';
import {loadRulesFromText, shippedRulesPath} from '../../source/rules/load.js';
import {operatorPrivateKey} from '../helpers/operator-key.js';
import {runIn} from '../helpers/run-cli.js';
import {sampleRules} from '../helpers/sample-record.js';

const clearDemo = resolve('docs/examples/bench3-808nm-clear.yaml');
const shippedText = readFileSync(shippedRulesPath(), 'utf8');
/** SHA-256 by node's crypto (OpenSSL), independently of prelase's own helper. */
const sha256 = (text: string) => createHash('sha256').update(text).digest('hex');

let folder: string;
let home: string;
let shipped: CompiledRules;
/** Other current rules than the ones the records were made under: the audit cannot borrow their text. */
let otherRules: CompiledRules;

/** Signs the clear demo into `records` through the command line and returns the record's path. */
async function signedCheck(records: string): Promise<string> {
	const {code, stdout, stderr} = await runIn(home, ['check', '--answers', clearDemo, '--sign', 'Test Person', '--role', 'test engineer', '--records', records]);
	if (code !== 0) throw new Error(`check failed (${code}): ${stderr}`);
	const path = /Record written: (.+)/.exec(stdout)?.[1];
	if (!path) throw new Error(`no record written: ${stdout}`);
	return path.trim();
}

const audit = (paths: string[], current = shipped) => auditRecords(paths, {current, trust: {own: ownFingerprint(home), trusted: []}});

beforeAll(() => {
	folder = mkdtempSync(join(tmpdir(), 'prelase-rule-texts-'));
	home = join(folder, 'home');
	shipped = sampleRules();
	const other = loadRulesFromText(shippedText.replace('value: 3 s', 'value: 4 s'), 'site.yaml');
	if (!other.ok) throw new Error('test setup: the changed rules must load');
	otherRules = other.value;
});

afterAll(() => rmSync(folder, {recursive: true, force: true}));

describe('rule texts stored once by hash', () => {
	it('two records in one folder share one stored text, named by its SHA-256, and carry only the hash', async () => {
		const records = join(folder, 'two');
		const first = await signedCheck(records);
		const second = await signedCheck(records);
		expect(first).not.toBe(second);
		const expected = sha256(shippedText);
		expect(readdirSync(join(records, 'rules'))).toEqual([`${expected}.yaml`]);
		expect(readFileSync(join(records, 'rules', `${expected}.yaml`), 'utf8')).toBe(shippedText);
		for (const path of [first, second]) {
			const record = JSON.parse(readFileSync(path, 'utf8')) as BenchRecord;
			expect(record.body.rules).toEqual({name: 'prelase bench policy (shipped default)', file: expect.any(String), sha256: expected});
			// The text is not in the record: not even its first line.
			expect(readFileSync(path, 'utf8')).not.toContain(JSON.stringify(shippedText.split('\n')[0]).slice(1, -1));
		}
		// The stored text is not a record to the audit: only the two .json files are listed.
		expect(listRecordFiles([records]).files.sort()).toEqual([first, second].sort());
		const report = audit(listRecordFiles([records]).files, otherRules);
		expect(report.records.map((entry) => entry.consistency)).toEqual([0, 1].map(() => ({reevaluated: true, consistent: true, rulesSha256: expected})));
	});

	it.each([
		{name: 'missing', change: (path: string) => unlinkSync(path), code: 'audit-rules-text-missing'},
		{name: 'changed by one byte', change: (path: string) => writeFileSync(path, readFileSync(path, 'utf8').replace('value: 3 s', 'value: 2 s')), code: 'audit-rules-text-altered'},
	])('a stored rule text $name is a finding naming the file, and the record is not re-evaluated', async ({change, code}) => {
		const records = join(folder, `broken-${code}`);
		const path = await signedCheck(records);
		const stored = join(records, 'rules', `${sha256(shippedText)}.yaml`);
		change(stored);
		const report = audit([path], otherRules);
		const [audited] = report.records;
		expect(audited!.authentic).toBe(true);
		expect(audited!.consistency).toEqual({reevaluated: false, consistent: false, rulesSha256: null});
		const found = audited!.findings.find((entry) => entry.code === code);
		expect(found).toMatchObject({kind: 'consistency'});
		expect(found!.text).toContain(stored);
		if (code === 'audit-rules-text-altered') expect(found!.data).toEqual({file: stored, stated: sha256(shippedText), actual: sha256(readFileSync(stored, 'utf8'))});
		expect(report.exitCode).toBe(1);
	});

	it('any single-byte change to a stored rule text is caught (property over position and byte)', async () => {
		const records = join(folder, 'property');
		const path = await signedCheck(records);
		const stored = join(records, 'rules', `${sha256(shippedText)}.yaml`);
		const original = readFileSync(stored);
		fc.assert(
			fc.property(fc.integer({min: 0, max: original.length - 1}), fc.integer({min: 1, max: 255}), (position, delta) => {
				const changed = Buffer.from(original);
				changed[position] = (changed[position]! + delta) % 256;
				writeFileSync(stored, changed);
				const codes = audit([path], otherRules).records[0]!.findings.map((entry) => entry.code);
				expect(codes).toContain('audit-rules-text-altered');
			}),
			{numRuns: 40},
		);
		writeFileSync(stored, original);
	});

	it('an altered stored text is a finding even when the current rules have the stated hash (their text re-evaluates the record)', async () => {
		const records = join(folder, 'altered-current');
		const path = await signedCheck(records);
		const stored = join(records, 'rules', `${sha256(shippedText)}.yaml`);
		writeFileSync(stored, `${shippedText}\n`);
		const [audited] = audit([path]).records;
		expect(audited!.findings.map((entry) => entry.code)).toEqual(['audit-rules-text-altered']);
		expect(audited!.consistency).toMatchObject({reevaluated: true, rulesSha256: sha256(shippedText)});
	});

	it('a text stored in a folder above the record is found (records sorted into sub-folders)', async () => {
		const records = join(folder, 'sorted');
		const path = await signedCheck(records);
		mkdirSync(join(records, '2026-12'));
		const moved = join(records, '2026-12', 'moved.json');
		copyFileSync(path, moved);
		unlinkSync(path);
		const [audited] = audit([moved], otherRules).records;
		expect(audited!.consistency).toMatchObject({reevaluated: true, consistent: true});
	});

	it('an older record that embeds its rule text still audits under that text, with no store', () => {
		const records = join(folder, 'older');
		mkdirSync(records);
		const template = JSON.parse(readFileSync(readdirSync(join(folder, 'two')).filter((name) => name.endsWith('.json')).map((name) => join(folder, 'two', name))[0]!, 'utf8')) as BenchRecord;
		const body = {...template.body, rules: {...template.body.rules, text: shippedText}};
		const older = signRecord(body, [{signer: {name: 'Test Person', role: 'test engineer', meaning: 'performed'}, key: operatorPrivateKey(home)}]);
		const path = join(records, 'older.json');
		writeFileSync(path, `${JSON.stringify(older, null, 2)}\n`);
		const report = audit([path], otherRules);
		expect(report.records[0]!.consistency).toEqual({reevaluated: true, consistent: true, rulesSha256: sha256(shippedText)});
		expect(report.records[0]!.findings.filter((entry) => entry.kind === 'consistency')).toEqual([]);
	});
});
