import {auditBothWays} from '../helpers/audit-both-ways.js';
import {mkdirSync, mkdtempSync, readFileSync, rmSync, writeFileSync} from 'node:fs';
import {tmpdir} from 'node:os';
import {join, resolve} from 'node:path';
import {afterAll, beforeAll, describe, expect, it} from 'vitest';
import {main} from '../../source/cli/dispatch.js';
import {type AuditReport, type RecordAudit} from '../../source/audit/audit.js';
import {listRecordFiles} from '../../source/audit/audit-files.js';
import {relateRecords} from '../../source/audit/audit-history.js';
import {KeyCache, bytesToVerify, checkIntegrity} from '../../source/records/integrity.js';
import {canonicalBytes} from '../../source/records/canonical.js';
import {bodySha256} from '../../source/records/build-body.js';
import {ownFingerprint} from '../../source/records/key-files.js';
import {operatorPrivateKey} from '../helpers/operator-key.js';
import {fingerprint, generateKeyPair, rawPublicKey} from '../../source/records/key-material.js';
import {readRecord} from '../../source/records/read-record.js';
import {confirmationList, type BenchRecord, type RecordBody} from '../../source/records/record-schema.js';
import {signedBytes, signRecord} from '../../source/records/sign.js';
import type {CompiledRules} from '../../source/rules/compile/compiled-rules.js';
import {loadRules, loadRulesFromText, shippedRulesPath} from '../../source/rules/load.js';
import {fakeIo} from '../helpers/fake-io.js';

const clearDemo = resolve('docs/examples/bench3-808nm-clear.yaml');
const shippedText = readFileSync(shippedRulesPath(), 'utf8');

let folder: string;
let home: string;
let shipped: CompiledRules;
let cleanPath: string;
let clean: BenchRecord;
let cleanText: string;

/** Runs `prelase check --sign` in-process and returns the path of the record it wrote. */
async function signedCheck(answers: string, records: string, ...extra: string[]): Promise<string> {
	const io = fakeIo({PRELASE_HOME: home});
	const code = await main(['check', '--answers', answers, '--sign', 'Test Person', '--role', 'test engineer', '--records', records, ...extra], io);
	if (code !== 0 && code !== 1) throw new Error(`check failed (${code}): ${io.stderr.text}`);
	const path = /Record written: (.+)/.exec(io.stdout.text)?.[1];
	if (!path) throw new Error(`no record written: ${io.stdout.text}`);
	return path;
}

let counter = 0;
/** Writes a record file (text or data) into a fresh folder of its own and returns its path. */
function writeRecordFile(content: string | BenchRecord): string {
	counter += 1;
	const dir = join(folder, `case-${counter}`);
	mkdirSync(dir, {recursive: true});
	const path = join(dir, 'record.json');
	writeFileSync(path, typeof content === 'string' ? content : `${JSON.stringify(content, null, 2)}\n`);
	return path;
}

/** The clean record's body changed by `change` and signed again with the operator's valid key. */
function resigned(change: (body: RecordBody) => void): BenchRecord {
	const body = structuredClone(clean.body);
	change(body);
	const privateKey = operatorPrivateKey(home);
	return signRecord(body, [{signer: {name: 'Test Person', role: 'test engineer', meaning: 'performed'}, key: privateKey}]);
}

function audit(paths: string[], options: {current?: CompiledRules; own?: string | undefined; trusted?: Array<{name: string; publicKey: string; fingerprint: string; addedAt: string}>} = {}): AuditReport {
	const own = 'own' in options ? options.own : ownFingerprint(home);
	return auditBothWays(paths, {current: options.current ?? shipped, trust: {own, trusted: options.trusted ?? []}});
}

function codes(record: RecordAudit): string[] {
	return record.findings.map((found) => found.code);
}

beforeAll(async () => {
	folder = mkdtempSync(join(tmpdir(), 'prelase-audit-'));
	home = join(folder, 'home');
	const loaded = loadRules(shippedRulesPath());
	if (!loaded.ok) throw new Error('the shipped rules must load');
	shipped = loaded.value;
	cleanPath = await signedCheck(clearDemo, join(folder, 'clean'));
	cleanText = readFileSync(cleanPath, 'utf8');
	clean = JSON.parse(cleanText) as BenchRecord;
});

afterAll(() => {
	rmSync(folder, {recursive: true, force: true});
});

/** The text with its first `from` replaced by `to`; a test whose change does not apply fails here rather than passing unchanged. */
function replaced(text: string, from: string, to: string): string {
	if (!text.includes(from)) throw new Error(`the record text has no ${from}`);
	return text.replace(from, to);
}

describe('a clean record', () => {
	it('is authentic and consistent, signed with the auditor\'s own key, with no findings', () => {
		const report = audit([cleanPath]);
		expect(report.exitCode).toBe(0);
		expect(report.status).toBe('authentic_and_consistent');
		const [record] = report.records;
		expect(record!.authentic).toBe(true);
		expect(record!.findings).toEqual([]);
		expect(record!.consistency).toEqual({reevaluated: true, consistent: true, rulesSha256: shipped.sha256});
		expect(record!.signatures).toEqual([
			expect.objectContaining({index: 1, signer: {name: 'Test Person', role: 'test engineer'}, purpose: 'operator', valid: true, authentic: true, trust: 'own', fingerprint: ownFingerprint(home)}),
		]);
		expect(record!.bodySha256).toBe(bodySha256(clean.body));
		expect(record!.record?.outcome).toBe('clear_to_energize');
		expect(record!.currentPolicy).toMatchObject({sameRules: true, checks: [], inputsNeeded: [], confirmationsAdded: [], outcome: {recorded: 'clear_to_energize', current: 'clear_to_energize'}});
		expect(record!.notChecked.map((item) => item.item)).toEqual(['record-age', 'interlock-test']);
		expect(report.totals).toEqual({records: 1, authentic: 1, integrityFailures: 0, consistent: 1, withFindings: 0, findings: {integrity: 0, trust: 0, consistency: 0, policy: 0, history: 0}, beforeChain: 0});
	});

	it('verifies the same bytes that signing covers', () => {
		const {value: _value, fingerprint: _stated, ...statement} = clean.signatures[0]!;
		const canonicalBody = canonicalBytes(clean.body).toString('utf8');
		expect(bytesToVerify(canonicalBody, statement).equals(signedBytes(clean.body, statement))).toBe(true);
		const other = {...statement, signer: {name: 'Ω “quoted” \\ name', role: ''}, meaning: 'approved' as const};
		expect(bytesToVerify(canonicalBody, other).equals(signedBytes(clean.body, other))).toBe(true);
		expect(checkIntegrity(cleanText, new KeyCache())).toMatchObject({ok: true, bodySha256: bodySha256(clean.body)});
	});
});

describe('integrity failures (exit 3)', () => {
	const otherKey = rawPublicKey(generateKeyPair().publicKey);
	const cases: Array<{name: string; make: () => string; code: string}> = [
		{name: 'a byte changed in the body', make: () => replaced(cleanText, '"diode_max_current": "2.5 A"', '"diode_max_current": "3.5 A"'), code: 'audit-signature-invalid'},
		{name: 'a verdict changed without signing again', make: () => replaced(cleanText, '"verdict":"pass"', '"verdict":"fail"'), code: 'audit-signature-invalid'},
		{name: 'the signature removed', make: () => JSON.stringify({...clean, signatures: []}), code: 'audit-unsigned'},
		{name: 'no signatures field', make: () => JSON.stringify({format: clean.format, version: clean.version, body: clean.body}), code: 'audit-unsigned'},
		{name: 'the public key swapped (fingerprint left)', make: () => JSON.stringify({...clean, signatures: [{...clean.signatures[0]!, publicKey: otherKey.toString('base64')}]}), code: 'audit-fingerprint-mismatch'},
		{
			name: 'the public key and its fingerprint swapped',
			make: () => JSON.stringify({...clean, signatures: [{...clean.signatures[0]!, publicKey: otherKey.toString('base64'), fingerprint: fingerprint(otherKey)}]}),
			code: 'audit-signature-invalid',
		},
		{
			name: 'a rule text put into the body (records name theirs by hash)',
			make: () => JSON.stringify({...clean, body: {...clean.body, rules: {...clean.body.rules, text: shippedText}}}),
			code: 'audit-signature-invalid',
		},
		{name: 'the signer renamed', make: () => JSON.stringify({...clean, signatures: [{...clean.signatures[0]!, signer: {name: 'Someone Else', role: 'test engineer'}}]}), code: 'audit-signature-invalid'},
		{name: 'a name repeated in the body (JSON.parse keeps the last)', make: () => cleanText.replace('"kind": "bench-check",', '"kind": "bench-check",\n    "outcome": "do_not_energize",'), code: 'audit-duplicate-name'},
		{name: 'a "__proto__" name', make: () => cleanText.replace('"kind": "bench-check",', '"kind": "bench-check",\n    "__proto__": {},'), code: 'audit-prototype-name'},
		{
			name: 'a signature in non-canonical base64 (spare bits set)',
			make: () => {
				const value = clean.signatures[0]!.value;
				const last = value.at(-3)!;
				const alphabet = 'ABCDEFGHIJKLMNOPQRSTUVWXYZabcdefghijklmnopqrstuvwxyz0123456789+/';
				// The last character before "==" carries 4 spare bits; setting one keeps the bytes the same.
				const spelled = `${value.slice(0, -3)}${alphabet[alphabet.indexOf(last) | 1]}==`;
				if (spelled === value) return JSON.stringify({...clean, signatures: [{...clean.signatures[0]!, value: `${value.slice(0, -3)}${alphabet[alphabet.indexOf(last) | 2]}==`}]});
				return JSON.stringify({...clean, signatures: [{...clean.signatures[0]!, value: spelled}]});
			},
			code: 'audit-base64-not-canonical',
		},
		{name: 'cut short', make: () => cleanText.slice(0, 5000), code: 'audit-not-json'},
		{name: 'JSON that is not a record', make: () => '{"hello": "world"}', code: 'audit-not-record'},
	];

	it.each(cases)('$name → $code', ({make, code}) => {
		const path = writeRecordFile(make());
		const report = audit([path]);
		expect(report.exitCode).toBe(3);
		expect(report.status).toBe('integrity_failure');
		expect(report.records[0]!.authentic).toBe(false);
		expect(report.records[0]!.findings).toEqual([expect.objectContaining({kind: 'integrity', code})]);
		expect(report.records[0]!.consistency).toBeNull();
		// The audit agrees with the record reader everywhere else in prelase.
		expect(readRecord(path).ok).toBe(false);
	});

	it('a missing file is unreadable', () => {
		const report = audit([join(folder, 'no-such-record.json')]);
		expect(report.exitCode).toBe(3);
		expect(report.records[0]!.findings[0]).toMatchObject({code: 'audit-unreadable', data: {reason: 'ENOENT'}});
	});

	it('one bad record in a folder fails the whole audit with 3', () => {
		const report = audit([cleanPath, writeRecordFile(cases[0]!.make())]);
		expect(report.exitCode).toBe(3);
		expect(report.totals).toMatchObject({records: 2, authentic: 1, integrityFailures: 1});
	});

	it('keys in another order still verify (the signature covers the canonical form)', () => {
		const reversed = (value: unknown): unknown =>
			Array.isArray(value) ? value.map(reversed) : value && typeof value === 'object' ? Object.fromEntries(Object.entries(value).reverse().map(([key, item]) => [key, reversed(item)])) : value;
		const path = writeRecordFile(JSON.stringify(reversed(clean)));
		expect(Object.keys(JSON.parse(readFileSync(path, 'utf8')) as object)).toEqual(Object.keys(clean as object).reverse());
		expect(audit([path]).exitCode).toBe(0);
	});
});

describe('consistency: altered and signed again with a valid key (exit 1)', () => {
	it('a verdict changed from pass to fail', () => {
		const record = resigned((body) => {
			body.checks.find((check) => check.id === 'emission_delay_long_enough')!.verdict = 'fail';
		});
		const report = audit([writeRecordFile(record)]);
		expect(report.exitCode).toBe(1);
		const [audited] = report.records;
		expect(audited!.authentic).toBe(true);
		expect(audited!.consistency?.consistent).toBe(false);
		expect(audited!.findings).toContainEqual(expect.objectContaining({kind: 'consistency', code: 'audit-verdict-mismatch', data: {id: 'emission_delay_long_enough', recorded: 'fail', computed: 'pass'}}));
		expect(codes(audited!)).toContain('audit-counts-mismatch');
	});

	it('the outcome changed', () => {
		const record = resigned((body) => {
			body.outcome = 'do_not_energize';
		});
		const [audited] = audit([writeRecordFile(record)]).records;
		expect(audited!.findings).toContainEqual(expect.objectContaining({code: 'audit-outcome-mismatch', data: {recorded: 'do not energize', computed: 'clear to energize'}}));
		expect(audited!.findings.find((found) => found.code === 'audit-outcome-mismatch')!.text).toContain("the record's conclusions do not follow from its numbers");
	});

	it('an input entered as one value and recorded as another (a record made before the lean body states both)', () => {
		const record = resigned((body) => {
			body.inputs['current_limit'] = {entered: '2.4 A', si: 2, unit: 'A', text: '2 A'};
		});
		const [audited] = audit([writeRecordFile(record)]).records;
		expect(audited!.findings).toContainEqual(expect.objectContaining({code: 'audit-input-value-mismatch', data: {id: 'current_limit', entered: '2.4 A', computed: '2.4 A', recorded: '2 A'}}));
		// At 2.4 A the derived dissipation differs too.
		expect(codes(audited!)).toContain('audit-derived-mismatch');
	});

	it('an input entered as another value than the one the conclusions were drawn from', () => {
		const record = resigned((body) => {
			body.inputs['current_limit'] = '2.4 A';
		});
		const [audited] = audit([writeRecordFile(record)]).records;
		// At 2.4 A the limit is above the ceiling of 2.25 A (2.5 A less 10 %): the recorded pass does not follow;
		// the limit is also the value of the check against the driver's maximum: 2 A recorded, 2.4 A from what was entered.
		expect(audited!.findings).toContainEqual(expect.objectContaining({code: 'audit-verdict-mismatch', data: {id: 'limit_below_diode_maximum', recorded: 'pass', computed: 'fail'}}));
		expect(audited!.findings).toContainEqual(expect.objectContaining({code: 'audit-figure-mismatch', data: {id: 'limit_within_driver', what: 'value', recorded: '2 A', computed: '2.4 A'}}));
		expect(codes(audited!)).toContain('audit-derived-mismatch');
	});

	it('a figure changed while the verdict still holds', () => {
		const record = resigned((body) => {
			const check = body.checks.find((entry) => entry.id === 'emission_delay_long_enough')!;
			check.value = {si: 4, unit: 's', text: '4 s'};
		});
		const [audited] = audit([writeRecordFile(record)]).records;
		expect(audited!.findings).toEqual([expect.objectContaining({code: 'audit-figure-mismatch', data: {id: 'emission_delay_long_enough', what: 'value', recorded: '4 s', computed: '3 s'}})]);
	});

	it('keeps the corner each check was judged at, and agrees with it on re-evaluation', () => {
		// The demo's supply is 5 V with the rules' default 5 %: 4.75 V .. 5.25 V (hand arithmetic: 5 × (1 ∓ 0.05)).
		const headroom = clean.body.checks.find((entry) => entry.id === 'compliance_headroom')!;
		// The low end is worst for the headroom, the high end for the dissipation (hand arithmetic in the worst-corner tests).
		expect(headroom.corner).toBe('supply_nominal low');
		const dissipation = clean.body.checks.find((entry) => entry.id === 'dissipation_within_rating')!;
		expect(dissipation.corner).toBe('supply_nominal high');
		// A check whose result is the same at either end of the supply keeps no corner (the record stays short).
		expect(clean.body.checks.find((entry) => entry.id === 'brownout_before_control_lost')!.corner).toBeUndefined();
		expect(audit([cleanPath]).records[0]!.findings).toEqual([]);
	});

	it.each([
		{name: 'moved to the other end', corner: 'supply_nominal high'},
		{name: 'moved inside the range', corner: 'supply_nominal inside 4.8'},
		{name: 'with its method edited', corner: 'searched: supply_nominal low'},
		{name: 'naming another input', corner: 'ambient_max low'},
	])('a corner $name is a finding', ({corner}) => {
		const record = resigned((body) => {
			body.checks.find((entry) => entry.id === 'compliance_headroom')!.corner = corner;
		});
		const [audited] = audit([writeRecordFile(record)]).records;
		expect(audited!.findings).toEqual([expect.objectContaining({code: 'audit-corner-mismatch', data: expect.objectContaining({id: 'compliance_headroom'})})]);
	});

	it('a corner added to a check whose result did not depend on the range\'s end is a finding', () => {
		const record = resigned((body) => {
			body.checks.find((entry) => entry.id === 'brownout_before_control_lost')!.corner = 'supply_nominal low';
		});
		const [audited] = audit([writeRecordFile(record)]).records;
		expect(audited!.findings).toEqual([expect.objectContaining({code: 'audit-corner-mismatch', data: expect.objectContaining({id: 'brownout_before_control_lost', computed: 'nowhere in particular (no corner)'})})]);
	});

	it('a corner removed is a finding', () => {
		const record = resigned((body) => {
			delete body.checks.find((entry) => entry.id === 'compliance_headroom')!.corner;
		});
		const [audited] = audit([writeRecordFile(record)]).records;
		expect(audited!.findings).toEqual([expect.objectContaining({code: 'audit-corner-mismatch', data: expect.objectContaining({id: 'compliance_headroom', recorded: 'nowhere in particular (no corner)'})})]);
	});

	it('a stated rule hash that does not match the embedded text (a record made before the store)', () => {
		const record = resigned((body) => {
			body.rules.text = shippedText;
			body.rules.sha256 = '0'.repeat(64);
		});
		const [audited] = audit([writeRecordFile(record)]).records;
		expect(audited!.findings).toContainEqual(expect.objectContaining({code: 'audit-rules-hash-mismatch', data: {stated: '0'.repeat(64), actual: shipped.sha256}}));
	});

	it('a confirmation status that its answer cannot give', () => {
		const record = resigned((body) => {
			const [first] = Object.keys(body.confirmations);
			(body.confirmations as Record<string, string>)[first!] = 'skip';
		});
		const [audited] = audit([writeRecordFile(record)]).records;
		expect(audited!.findings).toContainEqual(expect.objectContaining({code: 'audit-confirmation-mismatch', data: {id: confirmationList(clean.body)[0]!.id, recorded: 'skip', computed: 'unanswered'}}));
	});

	it('embedded rules that do not load cannot be re-evaluated', () => {
		const text = 'format: 1\nname: broken\n';
		const record = resigned((body) => {
			body.rules = {...body.rules, text, sha256: loadRulesFromText(text, 'x').ok ? '' : body.rules.sha256};
		});
		const [audited] = audit([writeRecordFile(record)]).records;
		expect(audited!.consistency).toMatchObject({reevaluated: false, consistent: false});
		expect(codes(audited!)).toEqual(expect.arrayContaining(['audit-rules-hash-mismatch', 'audit-rules-do-not-load']));
	});

	// The audit compares records that hold the same conclusions under the same evaluation once
	// (audit-contents.ts): an altered record among honest ones of the same numbers must still be
	// judged on what it holds, and an honest one after it must not inherit its findings.
	it('honest and altered records of the same numbers in one audit: each judged on its own conclusions', () => {
		const verdict = resigned((body) => {
			body.checks.find((check) => check.id === 'emission_delay_long_enough')!.verdict = 'fail';
		});
		const figure = resigned((body) => {
			body.checks.find((entry) => entry.id === 'emission_delay_long_enough')!.value = {si: 4, unit: 's', text: '4 s'};
		});
		const counts = resigned((body) => {
			body.counts = {...body.counts, pass: (body.counts['pass'] ?? 0) + 1};
		});
		const consistencyCodes = (audited: RecordAudit) => audited.findings.filter((found) => found.kind === 'consistency').map((found) => found.code);
		const alone = [verdict, figure, counts].map((record) => consistencyCodes(audit([writeRecordFile(record)]).records[0]!));
		const paths = [cleanPath, writeRecordFile(verdict), writeRecordFile(resigned(() => {})), writeRecordFile(figure), cleanPath, writeRecordFile(counts), writeRecordFile(resigned(() => {}))];
		const together = audit(paths).records.map(consistencyCodes);
		expect(together).toEqual([[], alone[0], [], alone[1], [], alone[2], []]);
		expect(alone).toEqual([expect.arrayContaining(['audit-verdict-mismatch']), ['audit-figure-mismatch'], ['audit-counts-mismatch']]);
	});
});

describe('trust', () => {
	it('a valid signature by a key the auditor does not trust is a finding, not an integrity failure', () => {
		const report = audit([cleanPath], {own: undefined});
		expect(report.exitCode).toBe(1);
		expect(report.records[0]!.signatures[0]!.trust).toBe('untrusted');
		expect(report.records[0]!.findings).toEqual([expect.objectContaining({kind: 'trust', code: 'audit-untrusted-key', data: {index: 1, signer: 'Test Person', fingerprint: ownFingerprint(home)!}})]);
	});

	it('a key in the trusted list is trusted under the name it was added with; a stated name that differs is a finding', () => {
		const stated = clean.signatures[0]!;
		const report = audit([cleanPath], {own: undefined, trusted: [{name: 'T. Person (bench 3)', publicKey: stated.publicKey, fingerprint: stated.fingerprint, addedAt: '2026-01-01T00:00:00+00:00'}]});
		expect(report.exitCode).toBe(1);
		expect(report.records[0]!.signatures[0]).toMatchObject({trust: 'trusted', trustedAs: 'T. Person (bench 3)', authentic: true});
		expect(report.records[0]!.findings.map((found) => [found.code, found.text])).toEqual([['audit-signer-name-differs', 'signature 1: signed as Test Person by the key you trust as T. Person (bench 3)']]);
	});

	it('the same key trusted under the name the record states: no finding, exit 0', () => {
		const stated = clean.signatures[0]!;
		const report = audit([cleanPath], {own: undefined, trusted: [{name: 'Test Person', publicKey: stated.publicKey, fingerprint: stated.fingerprint, addedAt: '2026-01-01T00:00:00+00:00'}]});
		expect(report.exitCode).toBe(0);
	});
});

describe('current policy', () => {
	it('lists a check that the current rules make fail, and the outcome it changes', () => {
		const site = loadRulesFromText(shippedText.replace(/(min_emission_delay:\n\s+value:) 3 s/, '$1 5 s'), join(folder, 'site.yaml'));
		if (!site.ok) throw new Error('the site rules must load');
		expect(site.value.sha256).not.toBe(shipped.sha256);
		const report = audit([cleanPath], {current: site.value});
		expect(report.exitCode).toBe(1);
		const policy = report.records[0]!.currentPolicy!;
		expect(policy.sameRules).toBe(false);
		expect(policy.outcome).toEqual({recorded: 'clear_to_energize', current: 'do_not_energize'});
		expect(policy.checks).toEqual([{id: 'emission_delay_long_enough', title: 'Emission delay at or above the policy minimum', recorded: 'pass', current: 'fail', value: '3 s', limit: '5 s', relation: 'at_least'}]);
		expect(report.records[0]!.findings).toEqual([expect.objectContaining({kind: 'policy', code: 'audit-policy-outcome', data: expect.objectContaining({recorded: 'clear to energize', current: 'do not energize', count: 1})})]);
		// The record is still consistent under its own rules.
		expect(report.records[0]!.consistency?.consistent).toBe(true);
	});

	it('lists inputs and confirmations the current rules add', () => {
		const added = shippedText.replace(/^steps:\n/m, 'steps:\n  - id: extra\n    title: Extra\n    inputs:\n      - id: extra_serial\n        label: Extra serial\n        kind: text\n    confirmations:\n      - id: extra_confirmed\n        statement: The extra thing was done.\n        basis: site policy\n');
		const site = loadRulesFromText(added, join(folder, 'site-extra.yaml'));
		if (!site.ok) throw new Error(`the site rules must load: ${JSON.stringify(site.errors[0])}`);
		const policy = audit([cleanPath], {current: site.value}).records[0]!.currentPolicy!;
		expect(policy.inputsNeeded).toEqual(['extra_serial']);
		expect(policy.confirmationsAdded).toEqual([{id: 'extra_confirmed', statement: 'The extra thing was done.', status: 'unanswered'}]);
		expect(policy.outcome.current).toBe('incomplete');
	});
});

describe('across records', () => {
	it('relates an amendment to its original, and reports a missing original', async () => {
		const records = join(folder, 'amended');
		const original = await signedCheck(clearDemo, records);
		const amendment = await signedCheck(clearDemo, records, '--amends', original, '--reason', 'supply tolerance re-read from the label');
		const report = audit(listRecordFiles([records]).files);
		const byFile = new Map(report.records.map((record) => [record.file, record]));
		expect(byFile.get(amendment)!.history?.amends).toEqual({record: original.split('/').pop(), bodySha256: byFile.get(original)!.bodySha256, reason: 'supply tolerance re-read from the label', file: original});
		expect(byFile.get(original)!.history?.amendedBy).toEqual([expect.objectContaining({file: amendment, reason: 'supply tolerance re-read from the label'})]);
		// Same setup fingerprint: superseded, but the amendment already says more than that.
		expect(byFile.get(original)!.history?.supersededBy?.file).toBe(amendment);
		expect(codes(byFile.get(original)!)).toEqual(['audit-amended-by']);
		expect(codes(byFile.get(amendment)!)).toEqual([]);
		expect(report.exitCode).toBe(1);

		const alone = audit([amendment]);
		// Alone, the amendment also names a previous record of its key that is not among those audited.
		expect(codes(alone.records[0]!)).toEqual(['audit-amended-missing', 'audit-chain-gap-at-start']);
		expect(alone.records[0]!.history?.amends?.file).toBeNull();
	});

	it('a later record for the same setup supersedes the earlier; a changed setup is named', async () => {
		const records = join(folder, 'history');
		const first = await signedCheck(clearDemo, records);
		await new Promise((done) => setTimeout(done, 1100));
		const second = await signedCheck(clearDemo, records);
		const moved = join(folder, 'moved.yaml');
		writeFileSync(moved, readFileSync(clearDemo, 'utf8').replace('location: Room B.112, bench 3', 'location: Room B.114, bench 1'));
		await new Promise((done) => setTimeout(done, 1100));
		const third = await signedCheck(moved, records);
		const report = audit(listRecordFiles([records]).files);
		const byFile = new Map(report.records.map((record) => [record.file, record]));
		expect(byFile.get(first)!.findings).toEqual([expect.objectContaining({code: 'audit-superseded', data: {file: second, createdAt: expect.any(String)}})]);
		expect(codes(byFile.get(second)!)).toEqual([]);
		expect(byFile.get(third)!.history?.setupChangedFrom).toMatchObject({file: second, changed: ['location']});
		expect(byFile.get(third)!.findings).toEqual([expect.objectContaining({kind: 'history', code: 'audit-setup-changed', data: expect.objectContaining({changed: 'location'})})]);
	});
});

describe('relating records', () => {
	it('puts an amendment after its original even when both carry the same second', () => {
		const at = '2026-12-01T10:00:00+00:00';
		const identifying = {location: 'Room B.112, bench 3'};
		const original = {file: 'b-original.json', bodySha256: 'a'.repeat(64), createdAt: at, setupName: 'bench 3', fingerprint: 'sha256:1', identifying};
		const amendment = {...original, file: 'a-amendment.json', bodySha256: 'b'.repeat(64), amends: {record: 'b-original.json', bodySha256: 'a'.repeat(64), reason: 'typo'}};
		const [forAmendment, forOriginal] = relateRecords([amendment, original]);
		expect(forOriginal!.history.supersededBy).toEqual({file: 'a-amendment.json', createdAt: at});
		expect(forOriginal!.findings.map((found) => found.code)).toEqual(['audit-amended-by']);
		expect(forAmendment!.history.supersededBy).toBeUndefined();
		expect(forAmendment!.findings).toEqual([]);
	});
});

describe('finding the record files', () => {
	it('walks folders, leaving out dotfiles, dot-folders and *.tmp, and names missing paths', () => {
		const root = join(folder, 'walk');
		mkdirSync(join(root, 'sub', 'deeper'), {recursive: true});
		mkdirSync(join(root, '.hidden'), {recursive: true});
		for (const name of ['b.json', 'a.json', '.x.json', '.1-abc.tmp', 'sub/c.json', 'sub/w.tmp', 'sub/deeper/d.json', '.hidden/e.json']) writeFileSync(join(root, name), '{}');
		const found = listRecordFiles([root, join(root, 'a.json'), join(root, 'nothing-here')]);
		expect(found.files).toEqual([join(root, 'a.json'), join(root, 'b.json'), join(root, 'sub', 'c.json'), join(root, 'sub', 'deeper', 'd.json')]);
		expect(found.missing).toEqual([join(root, 'nothing-here')]);
		expect(listRecordFiles([join(root, '.x.json')]).files).toEqual([join(root, '.x.json')]);
	});
});
