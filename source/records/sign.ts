import {sign, verify, type KeyObject} from 'node:crypto';
import {canonicalBytes} from './canonical.js';
import {fingerprint, rawPublicKey} from './key-material.js';
import type {AnyBody, Signature} from './record-schema.js';
import {purposeOfMeaning, signatureSha256, type Purpose} from './signature-purpose.js';
import {isoWithOffset} from '../shared/iso-time.js';

/**
 * Who is signing and for what purpose. A version 1 meaning (performed, verified, approved) is
 * still accepted and stands for its purpose (operator, witness, approval).
 */
export type Signer = {name: string; role: string} & ({purpose: Purpose} | {meaning: 'performed' | 'verified' | 'approved'});

/**
 * The bytes a signature covers: the RFC 8785 canonical form of the body together with the
 * signature's own statement (who, role, purpose, the signatures it endorses, when, which key),
 * so none can be swapped.
 */
export function signedBytes(body: AnyBody, statement: Omit<Signature, 'value' | 'fingerprint'>): Buffer {
	return canonicalBytes({body, signature: statement});
}

/** Ed25519 signature of bytes (the one place prelase signs anything). */
export function signBytes(bytes: Buffer, privateKey: KeyObject): Buffer {
	return sign(null, bytes, privateKey);
}

/** Ed25519 verification of bytes (the one place prelase verifies anything). */
export function verifyBytes(bytes: Buffer, publicKey: KeyObject, signature: Buffer): boolean {
	return verify(null, bytes, publicKey, signature);
}

/**
 * Signs a record body with a private key, as a person in a role, for a purpose. The signature
 * endorses the signatures made before it (their SHA-256, in order) and states how many
 * signatures the record is signed to carry, so that none can later be removed, repeated or
 * moved without a finding.
 */
export function signBody(body: AnyBody, signer: Signer, privateKey: KeyObject, now: Date = new Date(), earlier: readonly Signature[] = [], count = earlier.length + 1): Signature {
	const raw = rawPublicKey(privateKey);
	const purpose = 'purpose' in signer ? signer.purpose : purposeOfMeaning(signer.meaning);
	const statement = {
		signer: {name: signer.name, role: signer.role},
		purpose,
		endorses: earlier.map(signatureSha256),
		count,
		signedAt: isoWithOffset(now),
		algorithm: 'Ed25519' as const,
		publicKey: raw.toString('base64'),
	};
	const value = signBytes(signedBytes(body, statement), privateKey).toString('base64');
	return {...statement, fingerprint: fingerprint(raw), value};
}

/** A record (version 2) with its body signed by each signer in turn (the operator or tester first), each endorsing those before. */
export function signRecord<Body extends AnyBody>(body: Body, signers: ReadonlyArray<{signer: Signer; key: KeyObject}>, now?: Date) {
	const signatures: Signature[] = [];
	for (const {signer, key} of signers) signatures.push(signBody(body, signer, key, now, signatures, signers.length));
	return {format: 'prelase-record' as const, version: 2 as const, body, signatures};
}
