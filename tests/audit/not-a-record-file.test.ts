import {auditBothWays} from '../helpers/audit-both-ways.js';
import {execFileSync} from 'node:child_process';
import {mkdirSync, mkdtempSync, readFileSync, rmSync, symlinkSync, writeFileSync} from 'node:fs';
import {createServer, type Server} from 'node:net';
import {tmpdir} from 'node:os';
import {basename, join} from 'node:path';
import {afterAll, beforeAll, describe, expect, it} from 'vitest';

import {listRecordFiles} from '../../source/audit/audit-files.js';
import {findTestRecords} from '../../source/interlock/functional-test/test-link.js';
import {buildRecordBody} from '../../source/records/build-body.js';
import {scanHead} from '../../source/records/chain.js';
import {readRuleText, ruleTextPath} from '../../source/records/rule-texts.js';
import {ownFingerprint} from '../../source/records/key-files.js';
import {readRecord} from '../../source/records/read-record.js';
import {evaluate} from '../../source/rules/evaluate/evaluate.js';
import {signAndStore} from '../../source/services/sign-and-store.js';
import {maxRecordFileBytes} from '../../source/shared/record-file-read.js';
import {sampleAnswers, sampleRules} from '../helpers/sample-record.js';

// Issue 15 item 9: a records folder holding things that are not record files. Each must be a
// finding naming the file and why, read without waiting or growing, and the rest still audited.

const top = mkdtempSync(join(tmpdir(), 'prelase-not-record-'));
const home = join(top, 'home');
const folder = join(top, 'records');
const outside = join(top, 'outside.json');
const rules = sampleRules();
let good: string;
let socket: Server;

beforeAll(async () => {
	mkdirSync(folder, {recursive: true});
	const answers = sampleAnswers(rules);
	const now = new Date(Date.UTC(2026, 2, 4, 9, 0, 0));
	const body = buildRecordBody({rules, answers, evaluation: evaluate(rules, answers), operator: {name: 'Dana Whitlow', role: 'bench operator'}, now});
	const stored = signAndStore(body, {name: 'Dana Whitlow', role: 'bench operator'}, undefined, home, folder, now);
	if (!stored.ok) throw new Error(stored.errors[0]!.code);
	good = stored.value.path;
	writeFileSync(outside, readFileSync(good));
	execFileSync('mkfifo', [join(folder, 'pipe.json')]);
	symlinkSync('/dev/zero', join(folder, 'zero.json'));
	symlinkSync(outside, join(folder, 'out.json'));
	symlinkSync(good, join(folder, 'twice.json'));
	symlinkSync('.', join(folder, 'loop'));
	// 9 MiB: above the 8 MiB cap (8 MiB = 8,388,608 bytes), JSON-looking so only the size refuses it.
	writeFileSync(join(folder, 'big.json'), `{"pad":"${'x'.repeat(9 * 1024 * 1024)}"}`);
	socket = createServer();
	await new Promise<void>((done) => socket.listen(join(folder, 'sock.json'), done));
});

afterAll(async () => {
	await new Promise<void>((done) => socket.close(() => done()));
	rmSync(top, {recursive: true, force: true});
});

describe('the audit of a folder with things that are not record files', () => {
	const expected = [
		{name: 'pipe.json', why: 'a named pipe (FIFO)'},
		{name: 'zero.json', why: 'a symbolic link'},
		{name: 'out.json', why: 'a symbolic link'},
		{name: 'twice.json', why: 'a symbolic link'},
		{name: 'loop', why: 'a symbolic link'},
		{name: 'big.json', why: '9437194 bytes, above the 8388608 bytes'}, // 9*1024*1024 + the 10 bytes of {"pad":""} around it
		{name: 'sock.json', why: 'a socket'},
	];

	it.each(expected)('$name is a finding "not a record file" ($why)', {timeout: 20_000}, ({name, why}) => {
		const report = auditBothWays(listRecordFiles([folder]).files, {current: rules, trust: {own: ownFingerprint(home), trusted: []}});
		const entry = report.records.find((record) => basename(record.file) === name);
		expect(entry?.authentic).toBe(false);
		expect(entry?.findings).toMatchObject([{kind: 'integrity', code: 'audit-not-record-file', data: {why: expect.stringContaining(why)}}]);
	});

	it('audits the rest of the folder: the real record is authentic, and nothing else is listed', {timeout: 20_000}, () => {
		const report = auditBothWays(listRecordFiles([folder]).files, {current: rules, trust: {own: ownFingerprint(home), trusted: []}});
		expect(report.records.find((record) => record.file === good)?.authentic).toBe(true);
		expect(report.records.map((record) => basename(record.file)).sort()).toEqual([basename(good), ...expected.map((entry) => entry.name)].sort());
	});

	it('lists a link to a folder without walking into it (no loop)', () => {
		expect(listRecordFiles([folder]).files.filter((file) => file.includes('/loop/'))).toEqual([]);
	});

	it('caps record files at 8 MiB (8,388,608 bytes)', () => {
		expect(maxRecordFileBytes).toBe(8_388_608);
	});
});

describe('other readers of a records folder pass such files over without reading them', () => {
	it('the chain scan finds the real record as the head of its key', {timeout: 20_000}, () => {
		expect(scanHead(folder, ownFingerprint(home)!)).toEqual({file: basename(good), sha256: expect.stringMatching(/^[0-9a-f]{64}$/)});
	});

	it('the bench check\'s search for interlock test records finds none and counts nothing damaged', {timeout: 20_000}, () => {
		expect(findTestRecords(folder, new Set())).toEqual({found: [], untrusted: 0, damaged: 0});
	});

	it.each([
		{name: 'pipe.json', says: 'not a record file: a named pipe (FIFO)'},
		{name: 'zero.json', says: 'not a record file: a character device'},
		{name: 'big.json', says: 'not a record file: 9437194 bytes'},
	])('a record named on its own ($name) is refused with a reason', {timeout: 20_000}, ({name, says}) => {
		expect(readRecord(join(folder, name))).toEqual({ok: false, reason: expect.stringContaining(says)});
	});

	it('a link named on its own to a real record is followed', () => {
		expect(readRecord(join(folder, 'out.json')).ok).toBe(true);
	});

	it.each([
		{name: 'a link to /dev/zero', make: (path: string) => symlinkSync('/dev/zero', path), reason: 'not a rule text file: a symbolic link'},
		{name: 'a named pipe', make: (path: string) => execFileSync('mkfifo', [path]), reason: 'not a rule text file: a named pipe (FIFO)'},
		{name: 'a 9 MiB file', make: (path: string) => writeFileSync(path, 'x'.repeat(9 * 1024 * 1024)), reason: 'not a rule text file: 9437184 bytes'},
	])('a stored rule text that is $name is unreadable, with why', {timeout: 20_000}, ({make, reason}) => {
		const sha = 'a'.repeat(64);
		const path = ruleTextPath(join(top, `rule-texts-${reason.length}-${Math.random().toString(16).slice(2)}`), sha);
		mkdirSync(join(path, '..'), {recursive: true});
		make(path);
		expect(readRuleText(path, sha)).toEqual({status: 'unreadable', path, reason: expect.stringContaining(reason)});
	});
});
