import {auditBothWays} from '../helpers/audit-both-ways.js';
import {copyFileSync, mkdirSync, mkdtempSync, readFileSync, renameSync, rmSync, unlinkSync, writeFileSync} from 'node:fs';
import {createHash} from 'node:crypto';
import {tmpdir} from 'node:os';
import {basename, join} from 'node:path';
import {afterAll, describe, expect, it} from 'vitest';
import {type AuditReport} from '../../source/audit/audit.js';
import {ChainAudit, ChainEntry} from '../../source/audit/audit-chain.js';
import {listRecordFiles} from '../../source/audit/audit-files.js';
import {buildRecordBody} from '../../source/records/build-body.js';
import {ownFingerprint} from '../../source/records/key-files.js';
import type {RecordBody} from '../../source/records/record-schema.js';
import {signBytes, signRecord} from '../../source/records/sign.js';
import {canonicalBytes} from '../../source/records/canonical.js';
import {evaluate} from '../../source/rules/evaluate/evaluate.js';
import {auditText} from '../../source/render/audit-text.js';
import {isoWithOffset} from '../../source/shared/iso-time.js';
import {plain} from '../../source/shared/paint.js';
import {signAndStore} from '../../source/services/sign-and-store.js';
import {operatorPrivateKey} from '../helpers/operator-key.js';
import {caseFolder} from '../helpers/run-cli.js';
import {sampleAnswers, sampleRules} from '../helpers/sample-record.js';

const top = mkdtempSync(join(tmpdir(), 'prelase-audit-chain-'));
afterAll(() => rmSync(top, {recursive: true, force: true}));
const fresh = (name: string) => caseFolder(top, name);

const rules = sampleRules();
const answers = sampleAnswers(rules);
const evaluation = evaluate(rules, answers);
/** The time of every audit here: 12:00 UTC on 2026-03-04. */
const auditNow = new Date(Date.UTC(2026, 2, 4, 12, 0, 0));
const at = (minute: number) => new Date(Date.UTC(2026, 2, 4, 9, minute, 0));

/** A body for a check made at `when`, optionally changed before it is signed. */
function body(when: Date, change?: (made: RecordBody) => void): RecordBody {
	const made = buildRecordBody({rules, answers, evaluation, operator: {name: 'Dana Whitlow', role: 'bench operator'}, now: when});
	change?.(made);
	return made;
}

/** Signs and stores a record made at `when` with the key in `home`; returns its path. */
function write(home: string, folder: string, when: Date, change?: (made: RecordBody) => void): string {
	const stored = signAndStore(body(when, change), {name: 'Dana Whitlow', role: 'bench operator'}, undefined, home, folder, when);
	if (!stored.ok) throw new Error(stored.errors[0]!.code);
	return stored.value.path;
}

const sha256Of = (path: string) => createHash('sha256').update(readFileSync(path)).digest('hex'); // node:crypto, independent of the code under test

function audit(folder: string, home: string): AuditReport {
	return auditBothWays(listRecordFiles([folder]).files, {current: rules, trust: {own: ownFingerprint(home), trusted: []}, now: auditNow});
}

/** The chain, duplicate and clock findings of each record, by file name (other findings, such as a superseded record, are left out). */
function chainFindings(report: AuditReport): Record<string, Array<{code: string; text: string}>> {
	const ours = /^audit-(chain|duplicate|dated-after|interlock-record-missing)/;
	return Object.fromEntries(report.records.map((record) => [basename(record.file), record.findings.filter((found) => ours.test(found.code)).map(({code, text}) => ({code, text}))]));
}

describe('a whole chain', () => {
	it('three records of one key and one of another: no chain finding, every record chained', () => {
		const [alex, sam, folder] = [fresh('alex'), fresh('sam'), fresh('records')];
		const paths = [write(alex, folder, at(0)), write(sam, folder, at(1)), write(alex, folder, at(2)), write(alex, folder, at(3))];
		const report = audit(folder, alex);
		expect(chainFindings(report)).toEqual(Object.fromEntries(paths.map((path) => [basename(path), []])));
		expect(report.totals.beforeChain).toBe(0);
		expect(auditText(report, plain)).not.toContain('made before the chain');
	});
});

describe('what the chain shows', () => {
	it.each([
		{name: 'a minute apart', minutes: [0, 1, 2]},
		{name: 'all in the same second (the dates cannot order them; the chain does)', minutes: [0, 0, 0]},
	])('a record deleted from the middle, $name: the next one names it, "a deleted record"', ({minutes}) => {
		const [alex, folder] = [fresh('alex'), fresh('records')];
		const [, second, third] = minutes.map((minute) => write(alex, folder, at(minute))) as [string, string, string];
		const sha256 = sha256Of(second);
		unlinkSync(second);
		expect(chainFindings(audit(folder, alex))[basename(third)]).toEqual([
			{code: 'audit-chain-missing', text: `the record names ${basename(second)} (SHA-256 ${sha256}) as the previous record of its key in this folder, and no record here has those bytes: a deleted record`},
		]);
	});

	it('the first records deleted: a chain with a gap at its start', () => {
		const [alex, folder] = [fresh('alex'), fresh('records')];
		const [first, second] = [write(alex, folder, at(0)), write(alex, folder, at(1))];
		const sha256 = sha256Of(first);
		unlinkSync(first);
		expect(chainFindings(audit(folder, alex))[basename(second)]).toEqual([
			{code: 'audit-chain-gap-at-start', text: `the earliest record of its key here names ${basename(first)} (SHA-256 ${sha256}) as its previous record, which is not here: the records before it were deleted, or are not among the records audited`},
		]);
	});

	it('the previous record changed after the next was written (a reformatted file still verifies, but its bytes differ)', () => {
		const [alex, folder] = [fresh('alex'), fresh('records')];
		const [first, second] = [write(alex, folder, at(0)), write(alex, folder, at(1))];
		const sha256 = sha256Of(first);
		writeFileSync(first, JSON.stringify(JSON.parse(readFileSync(first, 'utf8'))));
		const report = audit(folder, alex);
		expect(report.records.find((record) => record.file === first)!.authentic).toBe(true);
		expect(chainFindings(report)[basename(second)]).toEqual([
			{code: 'audit-chain-changed', text: `the record names ${basename(first)} (SHA-256 ${sha256}) as the previous record of its key, but that file now has SHA-256 ${sha256Of(first)}: it was changed after this record was written`},
		]);
	});

	it('two records naming the same predecessor: a fork, reported on both', () => {
		const [alex, folder] = [fresh('alex'), fresh('records')];
		const first = write(alex, folder, at(0));
		const head = join(folder, '.prelase-chain', `${ownFingerprint(alex)!.slice('sha256:'.length)}.json`);
		const remembered = readFileSync(head);
		const second = write(alex, folder, at(1));
		// As a second writer would have seen it at the same moment: the head before the second record.
		writeFileSync(head, remembered);
		const third = write(alex, folder, at(2));
		const found = chainFindings(audit(folder, alex));
		const words = (other: string) => `this record and ${basename(other)} both name ${basename(first)} as the previous record of their key: the chain forks (two records written at once by one key to one folder, or a record deleted and its place taken)`;
		expect(found[basename(second)]).toEqual([{code: 'audit-chain-fork', text: words(third)}]);
		expect(found[basename(third)]).toEqual([{code: 'audit-chain-fork', text: words(second)}]);
		expect(found[basename(first)]).toEqual([]);
	});

	it('a byte-identical copy under another name is a duplicate, not "superseded" and not a fork', () => {
		const [alex, folder] = [fresh('alex'), fresh('records')];
		const [first, second] = [write(alex, folder, at(0)), write(alex, folder, at(1))];
		const copy = join(folder, 'zz-copy.json');
		copyFileSync(second, copy);
		const report = audit(folder, alex);
		const byName = Object.fromEntries(report.records.map((record) => [basename(record.file), record.findings.map((found) => found.code)]));
		expect(byName).toEqual({[basename(first)]: ['audit-superseded'], [basename(second)]: [], 'zz-copy.json': ['audit-duplicate']});
		expect(chainFindings(report)['zz-copy.json']).toEqual([{code: 'audit-duplicate', text: `this file is a byte-identical copy of ${basename(second)}: one record under two names`}]);
	});
});

describe('the latest record of a key, which no later record names', () => {
	it('deleted: the head file beside the records still names it, so the record before it reports it', () => {
		const [alex, folder] = [fresh('alex'), fresh('records')];
		const [first, second] = [write(alex, folder, at(0)), write(alex, folder, at(1))];
		const sha256 = sha256Of(second);
		unlinkSync(second);
		expect(chainFindings(audit(folder, alex))).toEqual({
			[basename(first)]: [{code: 'audit-chain-head-missing', text: `the chain's head file names ${basename(second)} (SHA-256 ${sha256}) as the latest record of this key here, and it is not in the folder: the latest record was deleted`}],
		});
	});

	it('reformatted (it still verifies, but its bytes differ from the ones the head file names)', () => {
		const [alex, folder] = [fresh('alex'), fresh('records')];
		const only = write(alex, folder, at(0));
		const sha256 = sha256Of(only);
		writeFileSync(only, JSON.stringify(JSON.parse(readFileSync(only, 'utf8'))));
		expect(chainFindings(audit(folder, alex))).toEqual({
			[basename(only)]: [{code: 'audit-chain-head-changed', text: `the chain's head file names this file (SHA-256 ${sha256}) as the latest record of this key here, but the file now has SHA-256 ${sha256Of(only)}: it was changed after it was written`}],
		});
	});

	it('not among the files audited but still in the folder: no finding (an audit of some of the records)', () => {
		const [alex, folder] = [fresh('alex'), fresh('records')];
		const [first] = [write(alex, folder, at(0)), write(alex, folder, at(1))];
		const report = auditBothWays([first], {current: rules, trust: {own: ownFingerprint(alex), trusted: []}, now: auditNow});
		expect(chainFindings(report)).toEqual({[basename(first)]: []});
	});
});

describe('a copy in another folder', () => {
	it('is a duplicate, and still the predecessor that a record of its own folder names', () => {
		const [alex, one, two] = [fresh('alex'), fresh('one'), fresh('two')];
		const first = write(alex, one, at(0));
		// The folder copied whole, head file and all, and the key goes on writing in the copy.
		copyFileSync(first, join(two, basename(first)));
		mkdirSync(join(two, '.prelase-chain'));
		const head = `${ownFingerprint(alex)!.slice('sha256:'.length)}.json`;
		copyFileSync(join(one, '.prelase-chain', head), join(two, '.prelase-chain', head));
		const next = write(alex, two, at(1));
		const report = auditBothWays(listRecordFiles([one, two]).files, {current: rules, trust: {own: ownFingerprint(alex), trusted: []}, now: auditNow});
		expect(report.records.map((record) => [record.file, record.findings.filter((found) => /^audit-(chain|duplicate)/.test(found.code)).map((found) => found.code)])).toEqual([
			[first, []],
			[join(two, basename(first)), ['audit-duplicate']],
			[next, []],
		]);
	});
});

describe('a record moved into a subfolder of the records folder audited', () => {
	it('is still found by its bytes: no chain finding', () => {
		const [alex, folder] = [fresh('alex'), fresh('records')];
		const [first, second, third] = [write(alex, folder, at(0)), write(alex, folder, at(1)), write(alex, folder, at(2))];
		mkdirSync(join(folder, 'archive'));
		for (const path of [first, second]) renameSync(path, join(folder, 'archive', basename(path)));
		expect(chainFindings(audit(folder, alex))).toEqual({[basename(first)]: [], [basename(second)]: [], [basename(third)]: []});
	});
});

describe('clock skew', () => {
	it.each([
		// the allowance is 5 minutes, as for interlock test records dated after now
		{name: '10 minutes after the audit', minutes: 10, found: true},
		{name: '4 minutes after the audit (within the allowance for a fast clock)', minutes: 4, found: false},
	])('a record dated $name', ({minutes, found}) => {
		const [alex, folder] = [fresh('alex'), fresh('records')];
		const when = new Date(auditNow.getTime() + minutes * 60_000);
		const path = write(alex, folder, when);
		const dated = (JSON.parse(readFileSync(path, 'utf8')) as {body: {createdAt: string}}).body.createdAt;
		expect(chainFindings(audit(folder, alex))[basename(path)]).toEqual(found ? [{code: 'audit-dated-after-audit', text: `the record is dated ${dated}, after the time of the audit (${isoWithOffset(auditNow)}, allowing 5 min for a fast clock): the clock of the machine that wrote it was wrong, or its date was set by hand`}] : []);
	});

	it('a record dated before the record it follows in the chain', () => {
		const [alex, folder] = [fresh('alex'), fresh('records')];
		const first = write(alex, folder, at(30));
		const second = write(alex, folder, at(10));
		const dated = (path: string) => (JSON.parse(readFileSync(path, 'utf8')) as {body: {createdAt: string}}).body.createdAt;
		expect(chainFindings(audit(folder, alex))[basename(second)]).toEqual([
			{code: 'audit-chain-clock-backwards', text: `the record is dated ${dated(second)}, before the record it follows in its key's chain, ${basename(first)} (${dated(first)}): a clock was set back between the two`},
		]);
	});
});

describe('records made before the chain', () => {
	it('are no chain finding; the audit says once that they cannot show deletions', () => {
		const [alex, folder] = [fresh('alex'), fresh('records')];
		write(alex, fresh('other'), at(0)); // makes Alex's key
		const key = operatorPrivateKey(alex);
		for (const minute of [1, 2]) {
			// A format version 1 record (no chain field, a version 1 signature over {body, signature statement}), as prelase wrote before the chain.
			const v2 = signRecord(body(at(minute)), [{signer: {name: 'Dana Whitlow', role: 'bench operator', meaning: 'performed'}, key}], at(minute));
			const statement = {signer: v2.signatures[0]!.signer, meaning: 'performed' as const, signedAt: v2.signatures[0]!.signedAt, algorithm: 'Ed25519' as const, publicKey: v2.signatures[0]!.publicKey};
			const value = signBytes(canonicalBytes({body: v2.body, signature: statement}), key).toString('base64');
			const old = {format: 'prelase-record', version: 1, body: v2.body, signatures: [{...statement, fingerprint: v2.signatures[0]!.fingerprint, value}]};
			writeFileSync(join(folder, `old-${minute}.json`), `${JSON.stringify(old, null, 2)}\n`);
		}
		const chained = write(alex, folder, at(3));
		const report = audit(folder, alex);
		expect(chainFindings(report)).toEqual({'old-1.json': [], 'old-2.json': [], [basename(chained)]: []});
		expect(report.totals.beforeChain).toBe(2);
		const text = auditText(report, plain);
		expect(text.split('\n').filter((line) => line.includes('made before the chain'))).toEqual(['Records made before the chain: 2 (they name no previous record, so a deletion among them cannot show)']);
	});
});

describe('a record that refers to a record it cannot find', () => {
	it('an interlock test record the check used, not among the records audited, is a finding', () => {
		const [alex, folder] = [fresh('alex'), fresh('records')];
		const interlockTest = {status: 'current' as const, plan: {file: 'plan.yaml', sha256: 'a'.repeat(64)}, record: {file: 'gone.json', bodySha256: 'b'.repeat(64), testedOn: '2026-03-01', outcome: 'passed' as const, dueBy: '2026-08-28'}, text: 'answered from the interlock test record gone.json'};
		const path = write(alex, folder, at(0), (made) => {
			made.interlockTest = interlockTest;
		});
		expect(chainFindings(audit(folder, alex))[basename(path)]).toEqual([
			{code: 'audit-interlock-record-missing', text: `the record used the interlock test gone.json (body SHA-256 ${'b'.repeat(64)}, tested 2026-03-01, passed), which is not among the records audited: a deleted or withheld test record`},
		]);
	});
});

describe('the accumulator on its own (the shape a streaming audit feeds)', () => {
	const entry = (index: number, version: number, previous: {file: string; sha256: string} | null | undefined) => {
		const made = new ChainEntry(index, `/records/r${index}.json`, String(index).repeat(64));
		Object.assign(made, {key: `sha256:${'c'.repeat(64)}`, previousSha: previous === undefined ? undefined : (previous?.sha256 ?? null), previousFile: previous?.file, createdAt: '2026-03-04T09:00:00+00:00', kind: 'bench-check', version});
		return made;
	};

	it.each([
		{name: 'a version 1 record without the link: made before the chain, no finding', version: 1, codes: [], before: 1},
		{name: 'a later version without the link: a finding', version: 2, codes: ['audit-chain-link-missing'], before: 1},
		{name: 'a later version that starts the chain: no finding', version: 2, previous: null, codes: [], before: 0},
	])('$name', ({version, previous, codes, before}) => {
		const chain = new ChainAudit(auditNow);
		expect(chain.add(entry(0, version, previous))).toBeUndefined();
		expect(chain.findings().map(({finding}) => finding.code)).toEqual(codes);
		expect(chain.beforeChain()).toBe(before);
	});
});

describe('files named with a leading ./ or a doubled slash', () => {
	it('a changed predecessor is still found by its name in its folder', () => {
		const chain = new ChainAudit(auditNow);
		const first = new ChainEntry(0, './records//r0.json', 'a'.repeat(64));
		Object.assign(first, {key: 'sha256:k', previousSha: null, createdAt: '2026-03-04T09:00:00+00:00', kind: 'bench-check', version: 2});
		const second = new ChainEntry(1, './records//r1.json', 'b'.repeat(64));
		// It names r0.json with other bytes than r0.json has now: r0.json was changed after r1.json was written.
		Object.assign(second, {key: 'sha256:k', previousSha: 'c'.repeat(64), previousFile: 'r0.json', createdAt: '2026-03-04T10:00:00+00:00', kind: 'bench-check', version: 2});
		chain.add(first);
		chain.add(second);
		expect(chain.findings().map(({index, finding}) => [index, finding.code])).toContainEqual([1, 'audit-chain-changed']);
	});
});
