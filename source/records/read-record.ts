import {realpathSync} from 'node:fs';
import {readRecordFile} from '../shared/record-file-read.js';
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
	let read: ReturnType<typeof readRecordFile>;
	try {
		// A file named on its own may be a link (the person chose it); what it leads to must be a regular file of a record's size.
		read = readRecordFile(realpathSync(path));
	} catch (error) {
		read = {ok: false, unreadable: (error as NodeJS.ErrnoException).code ?? (error as Error).message};
	}
	if (!read.ok) {
		const reason = 'unreadable' in read ? describeProblem({code: 'audit-unreadable', data: {reason: read.unreadable}}) : describeProblem({code: 'audit-not-record-file', data: {why: read.notRecordFile}});
		return {ok: false, reason};
	}
	return checkRecordText(read.bytes.toString('utf8'), keys);
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
