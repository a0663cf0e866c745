import {mkdirSync, mkdtempSync, readFileSync, rmSync, writeFileSync} from 'node:fs';
import {tmpdir} from 'node:os';
import {join} from 'node:path';
import fc from 'fast-check';
import {afterAll, beforeAll, describe, expect, it} from 'vitest';
import {auditRecords} from '../../source/audit/audit.js';
import {listRecordFiles} from '../../source/audit/audit-files.js';
import {buildRecordBody} from '../../source/records/build-body.js';
import {ownFingerprint} from '../../source/records/key-files.js';
import {evaluate} from '../../source/rules/evaluate/evaluate.js';
import {signAndStore} from '../../source/services/sign-and-store.js';
import {sampleAnswers, sampleRules} from '../helpers/sample-record.js';

const rules = sampleRules();
let top: string;
let home: string;
let folder: string;
/** The three records of one key, in the order written: each later one names the one before. */
let paths: string[];
let originals: Buffer[];

beforeAll(() => {
	top = mkdtempSync(join(tmpdir(), 'prelase-chain-property-'));
	home = join(top, 'home');
	folder = join(top, 'records');
	mkdirSync(home);
	const answers = sampleAnswers(rules);
	const evaluation = evaluate(rules, answers);
	paths = [0, 1, 2].map((minute) => {
		const now = new Date(Date.UTC(2026, 2, 4, 9, minute, 0));
		const stored = signAndStore(buildRecordBody({rules, answers, evaluation, operator: {name: 'Dana Whitlow', role: 'bench operator'}, now}), {name: 'Dana Whitlow', role: 'bench operator'}, undefined, home, folder, now);
		if (!stored.ok) throw new Error(stored.errors[0]!.code);
		return stored.value.path;
	});
	originals = paths.map((path) => readFileSync(path));
});
afterAll(() => rmSync(top, {recursive: true, force: true}));

/** Whether the audit of the folder catches a change: an integrity failure, or a finding of the chain. */
function caught(): boolean {
	const report = auditRecords(listRecordFiles([folder]).files, {current: rules, trust: {own: ownFingerprint(home), trusted: []}, now: new Date(Date.UTC(2026, 2, 4, 12))});
	return report.records.some((record) => !record.authentic || record.findings.some((found) => found.code.startsWith('audit-chain-')));
}

/** Runs `check` with the byte at `at` of record `which` replaced by `value`, then puts the original back. */
function withByte<T>(which: number, at: number, value: number, check: () => T): T {
	const changed = Buffer.from(originals[which]!);
	changed[at] = value;
	writeFileSync(paths[which]!, changed);
	try {
		return check();
	} finally {
		writeFileSync(paths[which]!, originals[which]!);
	}
}

/** The byte range of a record's chain link: `"previous": {…}` as the store writes it. */
function linkSpan(bytes: Buffer): {start: number; end: number} {
	const start = bytes.indexOf('"previous": {');
	return {start, end: bytes.indexOf('}', start) + 1};
}

describe('any single-byte change is caught, by the signature or by the chain', () => {
	it('the untouched folder has no chain finding and no integrity failure (so each catch below is the change\'s doing)', () => {
		expect(caught()).toBe(false);
	});

	it('a change anywhere in any record (a later record, or for the latest the head file, names its exact bytes)', () => {
		const change = fc.record({which: fc.constantFrom(0, 1, 2), at: fc.nat(), value: fc.integer({min: 0, max: 255})});
		fc.assert(
			fc.property(change, ({which, at, value}) => {
				const place = at % originals[which]!.length;
				fc.pre(originals[which]![place] !== value);
				return withByte(which, place, value, caught);
			}),
			{numRuns: 100},
		);
	});

	it('a change inside the chain link of any record, whitespace included', () => {
		const change = fc.record({which: fc.constantFrom(1, 2), at: fc.nat(), value: fc.integer({min: 0, max: 255})});
		fc.assert(
			fc.property(change, ({which, at, value}) => {
				const {start, end} = linkSpan(originals[which]!);
				const place = start + (at % (end - start));
				fc.pre(originals[which]![place] !== value);
				return withByte(which, place, value, caught);
			}),
			{numRuns: 100},
		);
	});
});
