import {spawn, type ChildProcessWithoutNullStreams} from 'node:child_process';
import {createHash} from 'node:crypto';
import {mkdirSync, mkdtempSync, readdirSync, readFileSync, rmSync, writeFileSync} from 'node:fs';
import {tmpdir} from 'node:os';
import {join, resolve} from 'node:path';
import {build} from 'esbuild';
import {afterAll, beforeAll, describe, expect, it} from 'vitest';
import {canonicalBytes} from '../../source/records/canonical.js';
import {readRecord} from '../../source/records/read-record.js';
import type {BenchRecord} from '../../source/records/record-schema.js';
import {signRecord} from '../../source/records/sign.js';
import {recordFileName, writeRecord} from '../../source/records/store.js';
import {sampleRecord, sampleRules, serialise, signerWith} from '../helpers/sample-record.js';

/**
 * A child process that writes records with prelase's own store. `once`: says "ready", waits
 * for a line on stdin, writes one record, says "wrote PATH". `loop`: writes records without end,
 * saying "start N" before and "wrote PATH" after each, until it is killed.
 */
const writerSource = `
import {readFileSync, writeSync} from 'node:fs';
import {writeRecord} from './source/records/store.js';
const [mode, folder, recordFile] = process.argv.slice(2);
const record = JSON.parse(readFileSync(recordFile, 'utf8'));
const say = (line) => writeSync(1, line + '\\n');
if (mode === 'once') {
	say('ready');
	process.stdin.once('data', () => {
		say('wrote ' + writeRecord(folder, record));
		process.exit(0);
	});
} else {
	for (let index = 0; ; index += 1) {
		say('start ' + index);
		say('wrote ' + writeRecord(folder, record));
	}
}
`;

/** The name of a temporary file the store writes before linking: dot, "record", pid, random hex, .tmp. */
const temporaryName = /^\.record\.\d+-[0-9a-f]{12}\.tmp$/;

let scratch: string;
let writer: string;
let record: BenchRecord;

beforeAll(async () => {
	scratch = mkdtempSync(join(tmpdir(), 'prelase-store-'));
	writer = join(scratch, 'writer.mjs');
	const {version} = JSON.parse(readFileSync('package.json', 'utf8')) as {version: string};
	await build({
		stdin: {contents: writerSource, resolveDir: resolve('.'), sourcefile: 'writer.js', loader: 'js'},
		outfile: writer,
		bundle: true,
		platform: 'node',
		format: 'esm',
		target: 'node20',
		define: {PRELASE_VERSION: JSON.stringify(version)},
		logLevel: 'silent',
	});
	record = sampleRecord({now: new Date('2026-03-04T05:06:07Z')});
});

afterAll(() => {
	rmSync(scratch, {recursive: true, force: true});
});

/** A fresh empty folder inside the scratch folder. */
function freshFolder(name: string): string {
	const folder = join(scratch, name);
	mkdirSync(folder);
	return folder;
}

/** Starts the writer child and collects what it says. */
function startWriter(mode: 'once' | 'loop', folder: string, recordFile: string) {
	const child = spawn(process.execPath, [writer, mode, folder, recordFile], {stdio: ['pipe', 'pipe', 'pipe']}) as ChildProcessWithoutNullStreams;
	const said = {lines: [] as string[], stderr: ''};
	let partial = '';
	const listeners: Array<() => void> = [];
	child.stdout.setEncoding('utf8').on('data', (chunk: string) => {
		const lines = (partial + chunk).split('\n');
		partial = lines.pop()!;
		said.lines.push(...lines);
		for (const listener of listeners) listener();
	});
	child.stderr.setEncoding('utf8').on('data', (chunk: string) => (said.stderr += chunk));
	const exited = new Promise<{code: number | null; signal: NodeJS.Signals | null}>((done) => child.on('close', (code, signal) => done({code, signal})));
	/** Resolves when the child has said a line for which `test` holds. */
	const saying = (test: (line: string) => boolean) =>
		new Promise<void>((done, fail) => {
			const check = () => {
				if (said.lines.some(test)) done();
			};
			listeners.push(check);
			check();
			void exited.then(() => (said.lines.some(test) ? done() : fail(new Error(`the writer exited first; stderr: ${said.stderr}`))));
		});
	return {child, said, exited, saying};
}

/** Every entry of a folder: record files, temporary files, and anything else. */
function entries(folder: string) {
	const names = readdirSync(folder).sort();
	return {
		records: names.filter((name) => name.endsWith('.json')),
		temporary: names.filter((name) => temporaryName.test(name)),
		other: names.filter((name) => !name.endsWith('.json') && !temporaryName.test(name)),
	};
}

describe('writing records', () => {
	it('names a record by date, time, setup and a short hash of its canonical body, with the store\'s exact text', () => {
		const folder = freshFolder('named');
		const path = writeRecord(folder, record);
		const hash = createHash('sha256').update(canonicalBytes(record.body)).digest('hex').slice(0, 8);
		const stamp = record.body.createdAt.slice(0, 19).replaceAll(':', '').replace('T', '-');
		expect(path).toBe(join(folder, `${stamp}-fenwick-hollow-bench-3-fh-808-2-on-ld-5l-${hash}.json`));
		expect(stamp).toMatch(/^\d{4}-\d{2}-\d{2}-\d{6}$/);
		expect(readFileSync(path, 'utf8')).toBe(serialise(record));
		expect(readRecord(path)).toMatchObject({ok: true});
		expect(entries(folder)).toEqual({records: [recordFileName(record)], temporary: [], other: []});
	});

	it('never overwrites: the same record twice gives a second file with -2, and the first keeps its bytes', () => {
		const folder = freshFolder('twice');
		const first = writeRecord(folder, record);
		const before = readFileSync(first);
		const second = writeRecord(folder, record);
		const third = writeRecord(folder, record);
		expect(second).toBe(first.replace(/\.json$/, '-2.json'));
		expect(third).toBe(first.replace(/\.json$/, '-3.json'));
		expect(readFileSync(first).equals(before)).toBe(true);
		for (const path of [first, second, third]) expect(readRecord(path)).toMatchObject({ok: true});
		expect(entries(folder)).toMatchObject({temporary: [], other: []});
		expect(entries(folder).records).toHaveLength(3);
	});

	it('never overwrites a file of someone else\'s that already has the name', () => {
		const folder = freshFolder('taken');
		const taken = join(folder, recordFileName(record));
		writeFileSync(taken, 'not mine to replace\n');
		const path = writeRecord(folder, record);
		expect(path).toBe(taken.replace(/\.json$/, '-2.json'));
		expect(readFileSync(taken, 'utf8')).toBe('not mine to replace\n');
		expect(readRecord(path)).toMatchObject({ok: true});
	});

	it('creates the records folder when it does not exist yet', () => {
		const folder = join(scratch, 'made', 'on', 'demand');
		expect(readRecord(writeRecord(folder, record))).toMatchObject({ok: true});
	});
});

describe('several processes at once', () => {
	it('8 processes writing the same record at the same moment leave 8 intact files with distinct names and no temporary files', async () => {
		const folder = freshFolder('eight');
		const recordFile = join(scratch, 'eight-record.json');
		writeFileSync(recordFile, serialise(record));
		const writers = Array.from({length: 8}, () => startWriter('once', folder, recordFile));
		await Promise.all(writers.map((entry) => entry.saying((line) => line === 'ready')));
		for (const entry of writers) entry.child.stdin.write('go\n');
		const exits = await Promise.all(writers.map((entry) => entry.exited));
		expect(exits).toEqual(Array.from({length: 8}, () => ({code: 0, signal: null})));
		expect(writers.map((entry) => entry.said.stderr).join('')).toBe('');

		const written = writers.map((entry) => entry.said.lines.find((line) => line.startsWith('wrote '))!.slice('wrote '.length));
		const base = recordFileName(record).replace(/\.json$/, '');
		const expected = [`${base}.json`, ...Array.from({length: 7}, (_, index) => `${base}-${index + 2}.json`)].sort();
		expect(written.map((path) => path.slice(folder.length + 1)).sort()).toEqual(expected);
		expect(entries(folder)).toEqual({records: expected, temporary: [], other: []});
		const text = serialise(record);
		for (const name of expected) {
			expect(readFileSync(join(folder, name), 'utf8')).toBe(text);
			expect(readRecord(join(folder, name))).toMatchObject({ok: true});
		}
	});

	it('a writer killed mid-write leaves no partial record: every .json verifies, leftovers are only dot-tmp files', async () => {
		const folder = freshFolder('killed');
		// A body of a few megabytes, so that writing, syncing and hashing each record takes a while.
		const body = structuredClone(record.body);
		body.rules.text = `${record.body.rules.text}\n${'# padding to make the record slow to write\n'.repeat(50_000)}`;
		const huge = signRecord(body, [signerWith('Ada Operator', 'performed')]);
		const text = serialise(huge);
		const recordFile = join(scratch, 'huge-record.json');
		writeFileSync(recordFile, text);

		let finished = 0;
		for (const delay of [0, 25, 100]) {
			const entry = startWriter('loop', folder, recordFile);
			// Let one record finish, then kill the writer as soon as its next temporary file appears.
			await entry.saying((line) => line.startsWith('wrote '));
			const mine = `.record.${entry.child.pid}-`;
			const deadline = Date.now() + 10_000;
			while (!readdirSync(folder).some((name) => name.startsWith(mine) && name.endsWith('.tmp'))) {
				if (Date.now() > deadline) throw new Error('the writer never started a second record');
				await new Promise((done) => setTimeout(done, 1));
			}
			if (delay > 0) await new Promise((done) => setTimeout(done, delay));
			entry.child.kill('SIGKILL');
			expect(await entry.exited).toEqual({code: null, signal: 'SIGKILL'});
			finished += entry.said.lines.filter((line) => line.startsWith('wrote ')).length;
		}

		const found = entries(folder);
		expect(found.other).toEqual([]);
		// Each finished write left a record; a kill after linking may leave one more per writer.
		expect(found.records.length).toBeGreaterThanOrEqual(Math.max(3, finished));
		expect(found.records.length).toBeLessThanOrEqual(finished + 3);
		for (const name of found.records) {
			const path = join(folder, name);
			expect(readFileSync(path, 'utf8') === text, `${name} is the whole record`).toBe(true);
			expect(readRecord(path).ok, `${name} verifies`).toBe(true);
		}
		// The first writer was killed while its temporary file was there: a write really was interrupted.
		expect(found.temporary.length).toBeGreaterThanOrEqual(1);
		for (const name of found.temporary) expect(name.endsWith('.json')).toBe(false);
	});
});
