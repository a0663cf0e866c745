import {sign, verify, type KeyObject} from 'node:crypto';
import {canonicalBytes} from './canonical.js';
import {fingerprint, publicKeyFromRaw, rawPublicKey} from './keys.js';
import type {AnyBody, Signature} from './record-schema.js';

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

/** Checks one signature over a body: the key matches its fingerprint and the signature verifies. */
export function verifySignature(body: AnyBody, signature: Signature): {ok: true} | {ok: false; reason: string} {
	const {value, fingerprint: stated, ...statement} = signature;
	// Base64 has spare bits: only the one canonical spelling of a key or signature is accepted.
	if (Buffer.from(value, 'base64').toString('base64') !== value) return {ok: false, reason: 'the signature is not in canonical base64'};
	if (Buffer.from(signature.publicKey, 'base64').toString('base64') !== signature.publicKey) return {ok: false, reason: 'the public key is not in canonical base64'};
	let raw: Buffer;
	let key: KeyObject;
	try {
		raw = Buffer.from(signature.publicKey, 'base64');
		key = publicKeyFromRaw(raw);
	} catch {
		return {ok: false, reason: 'the public key is not a valid Ed25519 key'};
	}
	if (fingerprint(raw) !== stated) return {ok: false, reason: 'the fingerprint does not match the public key'};
	const valid = verifyBytes(signedBytes(body, statement), key, Buffer.from(value, 'base64'));
	return valid ? {ok: true} : {ok: false, reason: 'the signature does not match the content (the record or its signature was altered)'};
}

/** An ISO 8601 timestamp with the local offset: 2026-12-01T18:49:07+01:00. */
export function isoWithOffset(date: Date): string {
	const pad = (value: number, width = 2) => String(Math.abs(value)).padStart(width, '0');
	const offset = -date.getTimezoneOffset();
	const sign = offset >= 0 ? '+' : '-';
	return `${date.getFullYear()}-${pad(date.getMonth() + 1)}-${pad(date.getDate())}T${pad(date.getHours())}:${pad(date.getMinutes())}:${pad(date.getSeconds())}${sign}${pad(Math.floor(Math.abs(offset) / 60))}:${pad(Math.abs(offset) % 60)}`;
}
