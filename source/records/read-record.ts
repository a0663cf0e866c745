import {readFileSync} from 'node:fs';
import {checkIntegrity, KeyCache, type SignatureCheck} from './integrity.js';
import type {AnyRecord} from './record-schema.js';
import {describeProblem} from '../shared/problems.js';

/** What integrity checking found: the record, or why it cannot be trusted at all. */
export type IntegrityResult =
	| {ok: true; record: AnyRecord; signatures: Array<{index: number; valid: true}>; /** SHA-256 of the canonical body: how amendments and links name it. */ bodySha256: string}
	| {ok: false; reason: string; record?: AnyRecord; signatures?: Array<{index: number; valid: boolean; reason?: string}>};

/**
 * Reads a record file and checks its integrity: it parses as JSON, has the record shape,
 * and every signature verifies over the canonical form of the body with the key it names.
 */
export function readRecord(path: string, keys?: KeyCache): IntegrityResult {
	let text: string;
	try {
		text = readFileSync(path, 'utf8');
	} catch (error) {
		return {ok: false, reason: `cannot read the file (${(error as NodeJS.ErrnoException).code ?? (error as Error).message})`};
	}
	return checkRecordText(text, keys);
}

/** The same checks for text already in hand: the audit's integrity check, with its findings in words. */
export function checkRecordText(text: string, keys = new KeyCache()): IntegrityResult {
	const checked = checkIntegrity(text, keys);
	if (checked.ok) return {ok: true, record: checked.record, signatures: checked.signatures.map(({index}) => ({index, valid: true as const})), bodySha256: checked.bodySha256};
	const record = checked.record;
	const signatures = record && checked.signatures?.map((entry) => ({index: entry.index, valid: entry.valid, ...(entry.valid ? {} : {reason: signatureReason(entry, record)})}));
	return {ok: false, reason: describeProblem(checked.finding), ...(record ? {record} : {}), ...(signatures ? {signatures} : {})};
}

/** Why one signature failed, without the "signature N (signer): " the record-level reason starts with. */
function signatureReason(entry: SignatureCheck, record: AnyRecord): string {
	const index = entry.index + 1;
	const signer = record.signatures[entry.index]!.signer.name;
	const text = describeProblem({code: entry.code ?? 'audit-signature-invalid', data: {index, signer, ...(entry.what ? {what: entry.what} : {})}});
	const prefix = `signature ${index} (${signer}): `;
	return text.startsWith(prefix) ? text.slice(prefix.length) : text;
}
