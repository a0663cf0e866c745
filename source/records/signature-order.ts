import {finding, type Finding} from './findings.js';
import type {AnyRecord, Signature} from './record-schema.js';
import {signatureSha256} from './signature-purpose.js';

/**
 * A signature without the fields of its record's version: a version 1 signature states a
 * meaning; a version 2 signature states its purpose, the signatures it endorses and the count.
 */
export function signatureShapeFinding(record: AnyRecord): Finding | undefined {
	for (const [index, signature] of record.signatures.entries()) {
		const field = (name: string, detail: string) => finding('integrity', 'audit-not-record', {field: `signatures.${index}.${name}`, detail});
		if (record.version === 1) {
			if (signature.meaning === undefined) return field('meaning', 'a version 1 signature states its meaning');
			for (const name of ['purpose', 'endorses', 'count'] as const) if (signature[name] !== undefined) return field(name, `a version 1 signature has no ${name}`);
		} else {
			if (signature.meaning !== undefined) return field('meaning', 'a version 2 signature states its purpose, not a meaning');
			for (const name of ['purpose', 'endorses', 'count'] as const) if (signature[name] === undefined) return field(name, `a version 2 signature states its ${name}`);
		}
	}
	return undefined;
}

/**
 * Checks that the signatures of a version 2 record are the ones signed, in the order signed:
 * each endorses the SHA-256 of every signature before it, and each states how many the record
 * was signed to carry. Called once every signature verifies, so what each states is genuine.
 * Finds, in this order: a repeated signature, a removed one, a reordered one, one that does not
 * endorse those before it as they stand, and a count that differs from the signatures held.
 */
export function signatureOrderFinding(signatures: readonly Signature[]): Finding | undefined {
	const hashes = signatures.map(signatureSha256);
	const who = (index: number) => ({index: index + 1, signer: signatures[index]!.signer.name});
	for (const [index, hash] of hashes.entries()) {
		const first = hashes.indexOf(hash);
		if (first < index) return finding('integrity', 'audit-signature-duplicated', {...who(index), first: first + 1});
	}
	const count = Math.max(...signatures.map((signature) => signature.count ?? 0));
	if (signatures.length < count) {
		const held = new Set(signatures.map((signature) => signature.endorses?.length ?? 0));
		const missing = Array.from({length: count}, (_, position) => position).filter((position) => !held.has(position));
		return finding('integrity', 'audit-signature-missing', {count, held: signatures.length, missing: (missing.length > 0 ? missing : [count - 1]).map((position) => position + 1).join(', ')});
	}
	for (const [index, signature] of signatures.entries()) {
		const position = signature.endorses?.length ?? 0;
		if (position !== index) return finding('integrity', 'audit-signature-reordered', {...who(index), position: position + 1});
	}
	for (const [index, signature] of signatures.entries()) {
		const other = (signature.endorses ?? []).findIndex((hash, earlier) => hash !== hashes[earlier]);
		if (other >= 0) return finding('integrity', 'audit-signature-not-endorsed', {...who(index), other: other + 1});
	}
	for (const [index, signature] of signatures.entries()) {
		if (signature.count !== signatures.length) return finding('integrity', 'audit-signature-count', {...who(index), count: signature.count ?? 0, held: signatures.length});
	}
	return undefined;
}
