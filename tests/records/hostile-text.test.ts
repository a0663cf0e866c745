import {mkdtempSync, readFileSync, readdirSync, rmSync, writeFileSync} from 'node:fs';
import {tmpdir} from 'node:os';
import {join} from 'node:path';
import {afterAll, beforeAll, describe, expect, it} from 'vitest';
import {main} from '../../source/cli/dispatch.js';
import {readRecord} from '../../source/records/read-record.js';
import {confirmationList, type BenchRecord} from '../../source/records/record-schema.js';
import {writeRecord} from '../../source/records/store.js';
import type {Answers} from '../../source/rules/evaluate/answers.js';
import type {CompiledRules} from '../../source/rules/compile/compiled-rules.js';
import {fakeIo} from '../helpers/fake-io.js';
import {clearDemoPath, sampleAnswers, sampleRecord, sampleRules} from '../helpers/sample-record.js';

/** A line of 10 000 characters with no space to break it at. */
const longLine = 'ABCDEFGHIJ'.repeat(1000);

/**
 * Text that tries to take over a terminal: clear the screen (CSI 2J), retitle the window
 * (OSC 0 … BEL), flip the reading direction (RLO, LRI … PDI), the same through C1 controls
 * (NEL, CSI, DCS, OSC, ST), and a very long line.
 */
// NEL (U+0085) is a line break, refused in a one-line setup name (docs/rule-file.md); the note carries it.
const hostileSetup = 'Bench 3 \u001b[2J\u001b]0;title\u0007 \u202eright-to-left\u202c \u2066isolate\u2069 \u009b2J\u0090dcs\u009c\u009d0;t\u009c \u001b[31mred\u001b[0m end.';
const hostileNote = `No bypass \u001b[2J\u001b]0;title\u0007 here \u202eevil\u202c \u2066\u2067\u2068x\u2069 C1:\u0080\u0085\u009b31m\u009f\u007f ${longLine} done.`;

/** Every character a terminal could act on; tabs and newlines are allowed in output. */
const controlCharacter = /[\u0000-\u0008\u000b-\u001f\u007f-\u009f\u202a-\u202e\u2066-\u2069]/u;

/** A YAML double-quoted scalar of any text, written in pure ASCII with \u escapes. */
function yamlQuoted(text: string): string {
	return `"${[...text].map((character) => {
		const code = character.codePointAt(0)!;
		if (code >= 0x20 && code < 0x7f && character !== '"' && character !== '\\') return character;
		if (code > 0xffff) return `\\U${code.toString(16).padStart(8, '0')}`;
		return `\\u${code.toString(16).padStart(4, '0')}`;
	}).join('')}"`;
}

/** The clear demo's answers file with the hostile setup name and a hostile note on bypass_recorded. */
function hostileAnswersText(): string {
	const demo = readFileSync(clearDemoPath, 'utf8');
	const lines = demo.split('\n');
	const setup = lines.findIndex((line) => line.startsWith('setup: '));
	const note = lines.findIndex((line) => line.trim() === 'note: No bypass is fitted on bench 3.');
	if (setup < 0 || note < 0) throw new Error('test setup: the clear demo has changed; update this test');
	lines[setup] = `setup: ${yamlQuoted(hostileSetup)}`;
	lines[note] = `    note: ${yamlQuoted(hostileNote)}`;
	return lines.join('\n');
}

let folder: string;
let rules: CompiledRules;

beforeAll(() => {
	folder = mkdtempSync(join(tmpdir(), 'prelase-hostile-'));
	rules = sampleRules();
});

afterAll(() => {
	rmSync(folder, {recursive: true, force: true});
});

describe('hostile text in the record itself', () => {
	let written: string;
	let record: BenchRecord;

	beforeAll(() => {
		const demo = sampleAnswers(rules);
		const confirmations = new Map(demo.confirmations);
		confirmations.set('bypass_recorded', {answer: 'not_applicable', note: hostileNote});
		const answers: Answers = {...demo, setup: hostileSetup, confirmations};
		record = sampleRecord({rules, answers});
		written = writeRecord(join(folder, 'direct'), record);
	});

	it('the test strings hold every kind of hostile character', () => {
		for (const needle of ['\u001b[2J', '\u001b]0;title\u0007', '\u202e', '\u2066', '\u0085', '\u009b']) expect(hostileSetup + hostileNote).toContain(needle);
		expect(hostileNote).toContain(longLine);
		expect(longLine).toHaveLength(10_000);
	});

	it('keeps the setup name and the note byte-exact in the file, and the file verifies', () => {
		const data = JSON.parse(readFileSync(written, 'utf8')) as BenchRecord;
		expect(data.body.setup.name).toBe(hostileSetup);
		expect(confirmationList(data.body).find((entry) => entry.id === 'bypass_recorded')?.note).toBe(hostileNote);
		expect(readRecord(written)).toMatchObject({ok: true});
	});

	it('writes C0 controls as JSON escapes and C1 and bidirectional controls as their raw UTF-8 bytes', () => {
		const bytes = readFileSync(written);
		expect(bytes.includes(Buffer.from(String.raw`\u001b[2J\u001b]0;title\u0007`))).toBe(true);
		expect(bytes.includes(0x1b)).toBe(false);
		expect(bytes.includes(Buffer.from('\u202eright-to-left\u202c', 'utf8'))).toBe(true);
		expect(bytes.includes(Buffer.from(' \u009b2J', 'utf8'))).toBe(true);
		expect(bytes.includes(Buffer.from('C1:\u0080\u0085\u009b31m', 'utf8'))).toBe(true);
		expect(bytes.includes(Buffer.from(longLine))).toBe(true);
	});
});

describe('prelase check --sign with hostile text in the answers file', () => {
	let answersFile: string;
	let recordsFolder: string;
	let run: {code: number; stdout: string; stderr: string};

	beforeAll(async () => {
		answersFile = join(folder, 'hostile-answers.yaml');
		writeFileSync(answersFile, hostileAnswersText());
		recordsFolder = join(folder, 'records');
		const io = fakeIo({PRELASE_HOME: join(folder, 'home')});
		const code = await main(['check', '--answers', answersFile, '--sign', 'Ada Operator', '--records', recordsFolder], io);
		run = {code, stdout: io.stdout.text, stderr: io.stderr.text};
	});

	it('runs the check and writes one record', () => {
		expect(run.stderr).toBe('');
		expect(run.code).toBe(0);
		expect(run.stdout).toContain('Outcome: CLEAR TO ENERGIZE');
		expect(readdirSync(recordsFolder).filter((name) => name.endsWith('.json'))).toHaveLength(1);
	});

	it('shows the setup name and the note with no control character left in the text output', () => {
		expect(run.stdout).not.toMatch(controlCharacter);
		expect(run.stderr).not.toMatch(controlCharacter);
		expect(run.stdout).toContain('Setup   Bench 3 [2J]0;title right-to-left isolate 2Jdcs0;t [31mred[0m end.');
		expect(run.stdout).toContain('note: No bypass [2J]0;title here evil x C1:31m');
		// the 10 000-character word is cut to the width (100 columns without a terminal), never one huge line
		expect(run.stdout).toContain(longLine.slice(0, 60));
		// (a file path is never cut: it must stay copyable)
		expect(run.stdout.split("\n").filter((line) => line.length > 100 && !line.startsWith("Record written: "))).toEqual([]);
	});

	it('keeps the setup name and the note byte-exact in the record', () => {
		const name = readdirSync(recordsFolder).find((entry) => entry.endsWith('.json'))!;
		const data = JSON.parse(readFileSync(join(recordsFolder, name), 'utf8')) as BenchRecord;
		expect(data.body.setup.name).toBe(hostileSetup);
		expect(confirmationList(data.body).find((entry) => entry.id === 'bypass_recorded')?.note).toBe(hostileNote);
	});

	it('the record it wrote verifies', () => {
		const name = readdirSync(recordsFolder).find((entry) => entry.endsWith('.json'))!;
		expect(readRecord(join(recordsFolder, name))).toMatchObject({ok: true});
	});

	it('check --json carries no raw control character either (C0 escaped, nothing from C1 or the bidirectional set)', async () => {
		const io = fakeIo({PRELASE_HOME: join(folder, 'home')});
		expect(await main(['check', '--answers', answersFile, '--json'], io)).toBe(0);
		expect(io.stdout.text).not.toMatch(controlCharacter);
		const json = JSON.parse(io.stdout.text) as {setup: string};
		expect(json.setup).toContain('right-to-left');
	});
});
