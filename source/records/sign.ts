import {sign, verify, type KeyObject} from 'node:crypto';
import {canonicalBytes} from './canonical.js';
import {fingerprint, rawPublicKey} from './key-material.js';
import type {AnyBody, Signature} from './record-schema.js';
import {isoWithOffset} from '../shared/iso-time.js';

/** Who is signing and what the signature means. */
export type Signer = {name: string; role: string; meaning: Signature['meaning']};

/**
 * The bytes a signature covers: the RFC 8785 canonical form of the body together with the
 * signature's own statement (who, role, meaning, when, which key), so none can be swapped.
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

/** Signs a record body with a private key, as a person in a role, with a meaning. */
export function signBody(body: AnyBody, signer: Signer, privateKey: KeyObject, now: Date = new Date()): Signature {
	const raw = rawPublicKey(privateKey);
	const statement = {signer: {name: signer.name, role: signer.role}, meaning: signer.meaning, signedAt: isoWithOffset(now), algorithm: 'Ed25519' as const, publicKey: raw.toString('base64')};
	const value = signBytes(signedBytes(body, statement), privateKey).toString('base64');
	return {...statement, fingerprint: fingerprint(raw), value};
}

/** A record with its body signed by each signer in turn (the operator or tester first). */
export function signRecord<Body extends AnyBody>(body: Body, signers: ReadonlyArray<{signer: Signer; key: KeyObject}>, now?: Date) {
	return {format: 'prelase-record' as const, version: 1 as const, body, signatures: signers.map(({signer, key}) => signBody(body, signer, key, now))};
}
