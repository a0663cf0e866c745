import {canonicalBytes} from './canonical.js';
import type {Signature} from './record-schema.js';
import {sha256Hex} from '../shared/sha256.js';

/** What a signature is for: the operator (or tester) who did the work, a witness, an approval. */
export type Purpose = 'operator' | 'witness' | 'approval';

/** Every purpose, in the order signatures usually come. */
export const purposes: readonly Purpose[] = ['operator', 'witness', 'approval'];

const fromMeaning = {performed: 'operator', verified: 'witness', approved: 'approval'} as const;

/** The purpose a version 1 meaning stands for: performed → operator, verified → witness, approved → approval. */
export function purposeOfMeaning(meaning: keyof typeof fromMeaning): Purpose {
	return fromMeaning[meaning];
}

/** A signature's purpose: stated (version 2), or read from its version 1 meaning. */
export function purposeOf(signature: Pick<Signature, 'purpose' | 'meaning'>): Purpose {
	return signature.purpose ?? purposeOfMeaning(signature.meaning ?? 'performed');
}

/** The SHA-256 of a whole signature's RFC 8785 canonical form (value included): what a later signature endorses. */
export function signatureSha256(signature: Signature): string {
	return sha256Hex(canonicalBytes(signature));
}

/** The index of the signature of the one who did the work (operator or tester), or -1 when there is none. */
export function operatorSignatureIndex(signatures: ReadonlyArray<Pick<Signature, 'purpose' | 'meaning'>>): number {
	return signatures.findIndex((signature) => purposeOf(signature) === 'operator');
}

/** Whether a record carries a signature whose purpose is witness (a witness named without one is named, not signed). */
export function witnessSigned(record: {signatures: ReadonlyArray<Pick<Signature, 'purpose' | 'meaning'>>}): boolean {
	return record.signatures.some((signature) => purposeOf(signature) === 'witness');
}
