import {writeFileSync} from 'node:fs';
import type {KeyObject} from 'node:crypto';
import {generateKeyPair} from '../../source/records/key-material.js';

/**
 * Writes a private key file as `prelase keys` makes one: the holder's name on a line before the
 * PEM block (omitted when name is undefined, as a key from an earlier version). Returns the path.
 */
export function writeNamedKey(path: string, name: string | undefined, mode = 0o600, key: KeyObject = generateKeyPair().privateKey): string {
	const pem = String(key.export({format: 'pem', type: 'pkcs8'}));
	writeFileSync(path, name === undefined ? pem : `Name: ${name}\n${pem}`, {mode});
	return path;
}
