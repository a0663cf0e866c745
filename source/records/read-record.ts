import {readFileSync} from 'node:fs';
import {schemaForRecord, type AnyRecord} from './record-schema.js';
import {unsafeJsonKey} from './json-keys.js';
import {verifySignature} from './sign.js';

/** What integrity checking found: the record, or why it cannot be trusted at all. */
export type IntegrityResult =
	| {ok: true; record: AnyRecord; signatures: Array<{index: number; valid: true}>}
	| {ok: false; reason: string; record?: AnyRecord; signatures?: Array<{index: number; valid: boolean; reason?: string}>};

/**
 * Reads a record file and checks its integrity: it parses as JSON, has the record shape,
 * and every signature verifies over the canonical form of the body with the key it names.
 */
export function readRecord(path: string): IntegrityResult {
	let text: string;
	try {
		text = readFileSync(path, 'utf8');
	} catch (error) {
		return {ok: false, reason: `cannot read the file (${(error as NodeJS.ErrnoException).code ?? (error as Error).message})`};
	}
	return checkRecordText(text);
}

/** The same checks for text already in hand. */
export function checkRecordText(text: string): IntegrityResult {
	let data: unknown;
	try {
		data = JSON.parse(text);
	} catch (error) {
		return {ok: false, reason: `not valid JSON (${(error as Error).message})`};
	}
	const unsafe = unsafeJsonKey(text);
	if (unsafe) return {ok: false, reason: unsafe.kind === 'duplicate' ? `the name "${unsafe.name}" appears twice in one object, so the file holds a value the signature does not cover` : 'the record has a "__proto__" name, which is refused'};
	const parsed = schemaForRecord(data).safeParse(data);
	if (!parsed.success) {
		const issue = parsed.error.issues[0];
		const unsigned = issue?.path.join('.') === 'signatures';
		return {ok: false, reason: unsigned ? 'the record is unsigned' : `not a prelase record (${issue?.path.join('.') || 'top level'}: ${issue?.message ?? 'invalid'})`};
	}
	const record = parsed.data;
	const signatures = record.signatures.map((signature, index) => {
		try {
			const verified = verifySignature(record.body, signature);
			return verified.ok ? {index, valid: true as const} : {index, valid: false as const, reason: verified.reason};
		} catch (error) {
			return {index, valid: false as const, reason: `the body cannot be put in canonical form (${(error as Error).message})`};
		}
	});
	const bad = signatures.find((entry) => !entry.valid);
	if (bad) return {ok: false, reason: `signature ${bad.index + 1} (${record.signatures[bad.index]!.signer.name}): ${bad.reason ?? 'invalid'}`, record, signatures};
	return {ok: true, record, signatures: signatures as Array<{index: number; valid: true}>};
}
