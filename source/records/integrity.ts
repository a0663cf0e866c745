import {sha256Hex} from '../shared/sha256.js';
import type {KeyObject} from 'node:crypto';
import {readRecordFile} from '../shared/record-file-read.js';
import {canonicalJson, canonicalJsonOfParsed, canonicalMembersOfParsed} from './canonical-json.js';
import {finding, type Finding} from './findings.js';
import {unsafeJsonKey} from './unsafe-json-names.js';
import {isLeanBenchRecord} from './lean-record-check.js';
import {fingerprint, publicKeyFromRaw} from './key-material.js';
import {schemaForRecord, type AnyRecord, type Signature} from './record-schema.js';
import {verifyBytes} from './sign.js';
import {signatureOrderFinding, signatureShapeFinding} from './signature-order.js';

/** Whether one signature verified, and if not, why (a message code). */
export type SignatureCheck = {index: number; valid: boolean; code?: Finding['code']; what?: string};

/** A record that passed integrity checking, with the SHA-256 of its canonical body; or why it did not. */
export type IntegrityCheck = (
	| {ok: true; record: AnyRecord; bodySha256: string; signatures: SignatureCheck[]; /** The canonical text of each of the body's members, when the body was in canonical order (as prelase writes it). */ bodyMembers?: ReadonlyMap<string, string>}
	| {ok: false; finding: Finding; record?: AnyRecord; signatures?: SignatureCheck[]}
) & {/** SHA-256 of the file's exact bytes, when read from a file: how the chain names a record. */ fileSha256?: string};

/**
 * Public keys parsed once each, by their base64 text: a folder of records is signed by a
 * few keys, and parsing a key for every verification costs a third of the throughput.
 */
export class KeyCache {
	readonly #keys = new Map<string, {key: KeyObject; fingerprint: string} | null>();

	/** The key object and the fingerprint of a base64 raw public key; undefined when it is not a valid key. */
	get(base64: string): {key: KeyObject; fingerprint: string} | undefined {
		let entry = this.#keys.get(base64);
		if (entry === undefined) {
			try {
				const raw = Buffer.from(base64, 'base64');
				entry = {key: publicKeyFromRaw(raw), fingerprint: fingerprint(raw)};
			} catch {
				entry = null;
			}
			this.#keys.set(base64, entry);
		}
		return entry ?? undefined;
	}
}

/** Reads a record file and checks its integrity (see checkIntegrity). */
export function readIntegrity(path: string, keys: KeyCache): IntegrityCheck {
	const read = readRecordFile(path);
	if (!read.ok) return {ok: false, finding: 'unreadable' in read ? finding('integrity', 'audit-unreadable', {reason: read.unreadable}) : finding('integrity', 'audit-not-record-file', {why: read.notRecordFile})};
	const bytes = read.bytes;
	return {...checkIntegrity(bytes.toString('utf8'), keys), fileSha256: sha256Hex(bytes)};
}

/**
 * Checks a record's text as readRecord() does (it parses as JSON, repeats no name and has no
 * `__proto__` name, has the record shape, and every signature, in canonical base64, verifies
 * with the key it names over the canonical form of the body and its statement), with each
 * key parsed once and the body put in canonical form once.
 *
 * The same bytes as signedBytes() in sign.ts, built so that the body is put in canonical
 * form once for every signature and for its SHA-256: RFC 8785 sorts the keys "body" before
 * "signature", so `{"body":B,"signature":S}` is the canonical form of {body, signature}.
 * Data from JSON.parse is plain by construction, so its canonical form needs no plainness check.
 */
export function checkIntegrity(text: string, keys: KeyCache): IntegrityCheck {
	let data: unknown;
	try {
		data = JSON.parse(text);
	} catch (error) {
		return {ok: false, finding: finding('integrity', 'audit-not-json', {detail: (error as Error).message})};
	}
	const unsafe = unsafeJsonKey(text);
	if (unsafe) return {ok: false, finding: unsafe.kind === 'duplicate' ? finding('integrity', 'audit-duplicate-name', {name: unsafe.name}) : finding('integrity', 'audit-prototype-name')};
	let record: AnyRecord;
	// A record in the shape prelase writes today is taken as it is; any other goes through the schema, which says what is wrong.
	if (isLeanBenchRecord(data)) record = data;
	else {
		const parsed = schemaForRecord(data).safeParse(data);
		if (!parsed.success) {
			const issue = parsed.error.issues[0];
			const field = issue?.path.map(String).join('.') || 'top level';
			if (field === 'signatures') return {ok: false, finding: finding('integrity', 'audit-unsigned')};
			return {ok: false, finding: finding('integrity', 'audit-not-record', {field, detail: issue?.message ?? 'invalid'})};
		}
		record = parsed.data;
	}
	const shape = signatureShapeFinding(record);
	if (shape) return {ok: false, record, finding: shape};
	let body: string;
	let members: Map<string, string> | undefined;
	try {
		// The body as read from the file, not as the schema returns it (a copy with its names in the schema's order).
		const read = (data as {body: unknown}).body;
		const built = canonicalMembersOfParsed(read);
		members = built?.members;
		body = built?.text ?? canonicalJsonOfParsed(read);
	} catch (error) {
		return {ok: false, record, finding: finding('integrity', 'audit-not-record', {field: 'body', detail: `it has no canonical form (${(error as Error).message})`})};
	}
	const signatures = record.signatures.map((signature, index) => ({index, ...verifyOne(body, signature, keys)}));
	const bad = signatures.find((entry) => !entry.valid);
	if (bad) {
		const signer = record.signatures[bad.index]!.signer.name;
		return {ok: false, record, signatures, finding: finding('integrity', bad.code!, {index: bad.index + 1, signer, ...(bad.what ? {what: bad.what} : {})})};
	}
	const order = record.version === 2 ? signatureOrderFinding(record.signatures) : undefined;
	if (order) return {ok: false, record, signatures, finding: order};
	return {ok: true, record, signatures, bodySha256: sha256Hex(body), ...(members ? {bodyMembers: members} : {})};
}

/**
 * The bytes a signature covers, from the body already in canonical form: the same bytes as
 * signedBytes() in sign.ts, because RFC 8785 orders "body" before "signature".
 */
export function bytesToVerify(canonicalBody: string, statement: Omit<Signature, 'value' | 'fingerprint'>): Buffer {
	return Buffer.from(`{"body":${canonicalBody},"signature":${canonicalJson(statement)}}`, 'utf8');
}

function verifyOne(body: string, signature: Signature, keys: KeyCache): {valid: boolean; code?: Finding['code']; what?: string} {
	const {value, fingerprint: stated, ...statement} = signature;
	// Base64 has spare bits: only the one canonical spelling of a key or signature is accepted.
	if (Buffer.from(value, 'base64').toString('base64') !== value) return {valid: false, code: 'audit-base64-not-canonical', what: 'signature'};
	if (Buffer.from(signature.publicKey, 'base64').toString('base64') !== signature.publicKey) return {valid: false, code: 'audit-base64-not-canonical', what: 'public key'};
	const key = keys.get(signature.publicKey);
	if (!key) return {valid: false, code: 'audit-bad-key'};
	if (key.fingerprint !== stated) return {valid: false, code: 'audit-fingerprint-mismatch'};
	let bytes: Buffer;
	try {
		bytes = bytesToVerify(body, statement);
	} catch {
		return {valid: false, code: 'audit-signature-invalid'};
	}
	return verifyBytes(bytes, key.key, Buffer.from(value, 'base64')) ? {valid: true} : {valid: false, code: 'audit-signature-invalid'};
}
