import {spawnSync} from 'node:child_process';
import {copyFileSync, mkdirSync, mkdtempSync, readFileSync, rmSync, writeFileSync} from 'node:fs';
import {tmpdir} from 'node:os';
import {join, resolve} from 'node:path';
import {afterAll, beforeAll, describe, expect, it} from 'vitest';
import {generateKeyPair} from '../../../source/records/key-material.js';
import {sampleRecord, sampleRules, serialise, signerWith} from '../../helpers/sample-record.js';

// The bundle, built once by the test set-up: worker threads run the program's own file, so
// the parallel audit exists only in the bundle (from source, the audit judges in one thread).
const bundle = resolve('dist/prelase.js');
let folder: string;
let records: string;

const audit = (...args: string[]) => {
	const said = spawnSync(process.execPath, [bundle, 'audit', records, ...args], {env: {PATH: process.env['PATH'], PRELASE_HOME: join(folder, 'home'), NO_COLOR: '1'}, encoding: 'utf8'});
	return {code: said.status, stdout: said.stdout, stderr: said.stderr};
};

beforeAll(() => {
	folder = mkdtempSync(join(tmpdir(), 'prelase-audit-parallel-'));
	records = join(folder, 'records');
	mkdirSync(join(records, 'archive'), {recursive: true});
	const rules = sampleRules();
	const key = generateKeyPair().privateKey;
	// 60 checks of one setup by one key over two days (each later one supersedes the one before;
	// each names no predecessor, so the chain reports forks), in two folders; a byte-identical
	// copy; a record with one byte of its body changed; a file that is not JSON.
	for (let index = 0; index < 60; index += 1) {
		const record = sampleRecord({rules, signers: [signerWith('Ada Operator', 'performed', key)], now: new Date(Date.UTC(2026, 10, 1 + (index % 2), 8, index))});
		writeFileSync(join(records, index % 5 === 0 ? 'archive' : '.', `r${String(index).padStart(2, '0')}.json`), serialise(record));
	}
	copyFileSync(join(records, 'r01.json'), join(records, 'r01-copy.json'));
	writeFileSync(join(records, 'r02-changed.json'), readFileSync(join(records, 'r02.json'), 'utf8').replace('"clear_to_energize"', '"incomplete"'));
	writeFileSync(join(records, 'notes.json'), '{"not": "a record"');
});
afterAll(() => rmSync(folder, {recursive: true, force: true}));

describe('prelase audit --jobs N: records judged in worker threads give the same audit as one thread', () => {
	it.each([['text'], ['json']])('in %s: the same words, findings, totals and exit status', (form) => {
		const extra = form === 'json' ? ['--json'] : [];
		const one = audit('--jobs', '1', ...extra);
		const three = audit('--jobs', '3', ...extra);
		expect(one.stderr).toBe('');
		expect(three.stderr).toBe('');
		expect(one.code).toBe(3); // an integrity failure among them (the changed record)
		expect(three.code).toBe(one.code);
		expect(three.stdout).toBe(one.stdout);
		if (form === 'json') {
			const report = JSON.parse(one.stdout) as {totals: {records: number; integrityFailures: number}; findingCodes: Array<{code: string}>};
			expect(report.totals).toMatchObject({records: 63, integrityFailures: 2});
			expect(report.findingCodes.map((found) => found.code)).toEqual(expect.arrayContaining(['audit-superseded', 'audit-duplicate', 'audit-untrusted-key']));
		}
	});

	it.each([['0'], ['65'], ['2.5'], ['two'], ['']])('refuses --jobs %j, naming the allowed range (exit 2)', (value) => {
		const said = audit('--jobs', value);
		expect(said.code).toBe(2);
		expect(said.stderr).toContain('--jobs must be a whole number of worker threads from 1 to 64');
	});
});
