import {sha256Hex} from '../shared/sha256.js';
import {createPrivateKey, createPublicKey, generateKeyPairSync, type KeyObject} from 'node:crypto';

const spkiPrefix = Buffer.from('302a300506032b6570032100', 'hex');
const pkcs8Prefix = Buffer.from('302e020100300506032b657004220420', 'hex');

/** The raw 32-byte Ed25519 public key of a key object. */
export function rawPublicKey(key: KeyObject): Buffer {
	const der = (key.type === 'private' ? createPublicKey(key) : key).export({format: 'der', type: 'spki'});
	return der.subarray(der.length - 32);
}

/** A public key object from its raw 32 bytes. */
export function publicKeyFromRaw(raw: Buffer): KeyObject {
	if (raw.length !== 32) throw new Error(`an Ed25519 public key is 32 bytes, got ${raw.length}`);
	return createPublicKey({key: Buffer.concat([spkiPrefix, raw]), format: 'der', type: 'spki'});
}

/** A private key object from its 32-byte seed (RFC 8032's "secret key"). */
export function privateKeyFromSeed(seed: Buffer): KeyObject {
	if (seed.length !== 32) throw new Error(`an Ed25519 seed is 32 bytes, got ${seed.length}`);
	return createPrivateKey({key: Buffer.concat([pkcs8Prefix, seed]), format: 'der', type: 'pkcs8'});
}

/** A fresh Ed25519 key pair. */
export function generateKeyPair(): {privateKey: KeyObject; publicKey: KeyObject} {
	return generateKeyPairSync('ed25519');
}

/** The fingerprint people compare: SHA-256 of the raw public key, as `sha256:` and 64 hex digits. */
export function fingerprint(raw: Buffer): string {
	return `sha256:${sha256Hex(raw)}`;
}

/** A fingerprint short enough to read aloud: the first 16 hex digits in groups of four. */
export function shortFingerprint(full: string): string {
	return full.replace(/^sha256:/, '').slice(0, 16).match(/.{4}/g)!.join(' ');
}
