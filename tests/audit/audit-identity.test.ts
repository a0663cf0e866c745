import {auditBothWays} from '../helpers/audit-both-ways.js';
import {mkdtempSync, readFileSync, rmSync, writeFileSync} from 'node:fs';
import type {KeyObject} from 'node:crypto';
import {tmpdir} from 'node:os';
import {basename, join} from 'node:path';
import {afterAll, beforeAll, describe, expect, it} from 'vitest';

import type {Trust} from '../../source/audit/audit-trust.js';
import {canonicalBytes} from '../../source/records/canonical.js';
import {fingerprint, generateKeyPair, rawPublicKey} from '../../source/records/key-material.js';
import type {BenchRecord} from '../../source/records/record-schema.js';
import {signBytes, signRecord} from '../../source/records/sign.js';
import {bodySha256} from '../../source/records/build-body.js';
import {sha256Hex} from '../../source/shared/sha256.js';
import type {CompiledRules} from '../../source/rules/compile/compiled-rules.js';
import type {RuleFile} from '../../source/rules/file/schema.js';
import {sampleRecord, sampleRules, serialise, signerWith} from '../helpers/sample-record.js';

let folder: string;
let rules: CompiledRules;
const operator = generateKeyPair().privateKey;
const officer = generateKeyPair().privateKey;
let files = 0;

beforeAll(() => {
	folder = mkdtempSync(join(tmpdir(), 'prelase-audit-identity-'));
	rules = sampleRules();
});
afterAll(() => rmSync(folder, {recursive: true, force: true}));

const write = (record: unknown) => {
	files += 1;
	const path = join(folder, `record-${files}.json`);
	writeFileSync(path, serialise(record));
	return path;
};
const entry = (name: string, key: KeyObject, extra: {roles?: string[]; revokedFrom?: string} = {}) => {
	const raw = rawPublicKey(key);
	return {name, publicKey: raw.toString('base64'), fingerprint: fingerprint(raw), addedAt: '2026-01-01T00:00:00+00:00', ...extra};
};
/** The current rules with a signing section (the demo's laser class is class_4: docs/examples/bench3-808nm-clear.yaml). */
const withSigning = (signing: RuleFile['signing']): CompiledRules => ({...rules, rules: {...rules.rules, signing}});
/** The findings of one record, code and words. */
function findings(record: unknown, trust: Trust, current = rules): string[][] {
	const report = auditBothWays([write(record)], {current, trust});
	return report.records[0]!.findings.map((found) => [found.code, found.text]);
}

/** Operator Ada (trusted) and a second signer claiming the role "Laser Safety Officer " (trusted as Lin Officer). */
function cosigned(purpose: 'verified' | 'approved' = 'approved', now?: Date): BenchRecord {
	return sampleRecord({rules, ...(now ? {now} : {}), signers: [signerWith('Ada Operator', 'performed', operator), signerWith('Lin Officer', purpose, officer, 'Laser Safety Officer ')]});
}

describe('roles are granted, not claimed', () => {
	it('a claimed authority role (compared case-insensitively after trimming) that the trust list does not grant is a finding', () => {
		expect(findings(cosigned(), {trusted: [entry('Ada Operator', operator), entry('Lin Officer', officer)]})).toEqual([
			['audit-role-not-granted', 'signature 2 (Lin Officer) claims the role "Laser Safety Officer ", which carries authority, but your trust list does not grant it to that key; grant it with: prelase keys trust FILE --name NAME --role ROLE'],
		]);
	});

	it('the same role granted: no finding', () => {
		expect(findings(cosigned(), {trusted: [entry('Ada Operator', operator), entry('Lin Officer', officer, {roles: ['laser safety officer']})]})).toEqual([]);
	});

	it('a role that carries no authority needs no grant', () => {
		const record = sampleRecord({rules, signers: [signerWith('Ada Operator', 'performed', operator, 'bench technician')]});
		expect(findings(record, {trusted: [entry('Ada Operator', operator)]})).toEqual([]);
	});
});

describe('the name on a signature and the name in the trust list', () => {
	it('signed as X by the key you trust as Y', () => {
		const record = sampleRecord({rules, signers: [signerWith('Sam Colleague', 'performed', operator, 'bench technician')]});
		expect(findings(record, {trusted: [entry('Alex Newcomer', operator)]})).toEqual([['audit-signer-name-differs', 'signature 1: signed as Sam Colleague by the key you trust as Alex Newcomer']]);
	});

	it('a signature by an unknown key is intact, signer unknown: not called authentic', () => {
		const report = auditBothWays([write(cosigned())], {current: rules, trust: {trusted: [entry('Ada Operator', operator)]}});
		expect(report.records[0]!.signatures.map((signature) => [signature.valid, signature.authentic])).toEqual([
			[true, true],
			[true, false],
		]);
	});
});

describe('revoked keys', () => {
	const signedAt = new Date('2026-06-10T09:00:00Z');
	it('a signature made after the revocation date is a finding (a bare date starts at 00:00 UTC+14)', () => {
		expect(findings(cosigned('approved', signedAt), {trusted: [entry('Ada Operator', operator), entry('Lin Officer', officer, {roles: ['laser safety officer'], revokedFrom: '2026-06-10'})]})).toEqual([
			['audit-signed-after-revocation', 'signature 2 (Lin Officer) was made 2026-06-10T09:00:00+00:00, after the key you trust as Lin Officer was revoked from 2026-06-10'],
		]);
	});

	it('a signature made before it: no finding', () => {
		expect(findings(cosigned('approved', signedAt), {trusted: [entry('Ada Operator', operator), entry('Lin Officer', officer, {roles: ['laser safety officer'], revokedFrom: '2026-06-12'})]})).toEqual([]);
	});
});

describe('the signing policy of the rule file', () => {
	const trust = (roles: string[]) => ({trusted: [entry('Ada Operator', operator), entry('Lin Officer', officer, {roles})]});

	it('a class 4 check without a countersignature by a granted role is incomplete until countersigned', () => {
		const alone = sampleRecord({rules, signers: [signerWith('Ada Operator', 'performed', operator)]});
		const current = withSigning({countersign: {roles: ['laser safety officer'], laser_classes: ['class_4'], switched_off_checks: false}});
		expect(findings(alone, trust([]), current)).toEqual([
			['audit-countersign-required', 'incomplete until countersigned: the policy requires a countersignature by a granted laser safety officer for laser class class_4; have them countersign an amendment (check --sign NAME --amends THIS-RECORD --reason ... --cosign NAME --cosign-key FILE --cosign-meaning approval)'],
		]);
		expect(findings(cosigned(), trust(['laser safety officer']), current)).toEqual([]);
	});

	it('a countersigned amendment completes the record it amends: the original then reports the amendment, not the missing countersignature', () => {
		const current = withSigning({countersign: {roles: ['laser safety officer'], laser_classes: ['class_4'], switched_off_checks: false}});
		const original = sampleRecord({rules, now: new Date('2026-06-10T09:00:00Z'), signers: [signerWith('Ada Operator', 'performed', operator)]});
		const originalPath = write(original);
		// The amendment, as `check --sign Ada --amends ORIGINAL --reason ... --cosign Lin --cosign-meaning approval` writes it:
		// it names the original by body hash and the previous record of Ada's key by the SHA-256 of its bytes.
		const body = {
			...original.body,
			createdAt: '2026-06-10T10:00:00+00:00',
			amends: {record: basename(originalPath), bodySha256: bodySha256(original.body), reason: 'countersigned by the laser safety officer'},
			previous: {file: basename(originalPath), sha256: sha256Hex(readFileSync(originalPath))},
		};
		const amendment = signRecord(body, [signerWith('Ada Operator', 'performed', operator), signerWith('Lin Officer', 'approved', officer, 'laser safety officer')], new Date('2026-06-10T10:00:00Z'));
		const amendmentPath = write(amendment);
		const report = auditBothWays([originalPath, amendmentPath], {current, trust: trust(['laser safety officer'])});
		const [first, second] = report.records;
		expect(first!.findings.map((found) => found.code)).toEqual(['audit-amended-by']);
		expect(first!.history?.countersignedBy?.file).toBe(amendmentPath);
		expect(second!.findings).toEqual([]);
		// Without the countersignature the amendment completes nothing: both lack it.
		const unsigned = signRecord({...body, amends: {...body.amends, reason: 'ambient re-measured'}}, [signerWith('Ada Operator', 'performed', operator)], new Date('2026-06-10T10:00:00Z'));
		const plain = auditBothWays([originalPath, write(unsigned)], {current, trust: trust(['laser safety officer'])});
		expect(plain.records.map((audit) => audit.findings.map((found) => found.code).sort())).toEqual([
			['audit-amended-by', 'audit-countersign-required'],
			['audit-countersign-required'],
		]);
	});

	it('the purposes the policy requires', () => {
		const alone = sampleRecord({rules, signers: [signerWith('Ada Operator', 'performed', operator)]});
		const current = withSigning({purposes: {bench_check: ['operator', 'approval']}});
		expect(findings(alone, trust([]), current)).toEqual([['audit-purpose-required', 'the policy requires a signature for the purpose approval on a bench-check record, and this record has none']]);
	});
});

describe('version 1 records', () => {
	it('still verify, with a note (not a finding) that their signatures neither state a purpose nor endorse one another', () => {
		const v2 = sampleRecord({rules, signers: [signerWith('Ada Operator', 'performed', operator)]});
		// A version 1 signature as earlier prelase made it: the statement {signer, meaning, signedAt, algorithm, publicKey} signed with the body.
		const statement = {signer: v2.signatures[0]!.signer, meaning: 'performed' as const, signedAt: v2.signatures[0]!.signedAt, algorithm: 'Ed25519' as const, publicKey: v2.signatures[0]!.publicKey};
		const value = signBytes(canonicalBytes({body: v2.body, signature: statement}), operator).toString('base64');
		const v1 = {format: 'prelase-record', version: 1, body: v2.body, signatures: [{...statement, fingerprint: v2.signatures[0]!.fingerprint, value}]};
		const report = auditBothWays([write(v1)], {current: rules, trust: {trusted: [entry('Ada Operator', operator)]}});
		const [audit] = report.records;
		expect(audit!.authentic).toBe(true);
		expect(audit!.findings).toEqual([]);
		expect(audit!.signatures[0]).toMatchObject({purpose: 'operator', meaning: 'performed', authentic: true});
		expect(audit!.notChecked.map((item) => item.item)).toContain('signature-order');
	});
});
