import {chmodSync, existsSync, mkdirSync, readFileSync, statSync, writeFileSync} from 'node:fs';
import {createPrivateKey, createPublicKey, type KeyObject} from 'node:crypto';
import {join} from 'node:path';
// Named imports (not the z namespace) let the bundler leave out the parts of zod not used.
import {array, object, string} from 'zod';
import {problem, type Problem} from '../shared/problems.js';
import {ProblemError} from '../shared/problem-error.js';
import {failure, success, type Result} from '../shared/result.js';
import {fingerprint, generateKeyPair, rawPublicKey} from './key-material.js';

/** A colleague's public key that this operator trusts. */
export type TrustedKey = {name: string; publicKey: string; fingerprint: string; addedAt: string};

const trustedSchema = array(object({name: string(), publicKey: string(), fingerprint: string(), addedAt: string()}).strict());

/** Where the operator's keys and trusted keys live: a `keys` folder beside the settings. */
export function keyFolder(settingsFolder: string): string {
	return join(settingsFolder, 'keys');
}

/** Refuses a private key file that someone other than its owner can read or write. */
function notPrivate(path: string): Problem | undefined {
	if (process.platform === 'win32') return undefined;
	const mode = statSync(path).mode & 0o777;
	return mode & 0o077 ? problem('key-file-open', {path, mode: mode.toString(8)}) : undefined;
}

/** The operator's private key, created on first use with owner-only permissions. */
export function operatorKey(settingsFolder: string, create: boolean): Result<{privateKey: KeyObject; created: boolean; path: string}, Problem> {
	const folder = keyFolder(settingsFolder);
	const path = join(folder, 'operator.key');
	if (!existsSync(path)) {
		if (!create) return failure([problem('key-none-yet')]);
		mkdirSync(folder, {recursive: true, mode: 0o700});
		const {privateKey} = generateKeyPair();
		writeFileSync(path, privateKey.export({format: 'pem', type: 'pkcs8'}), {mode: 0o600, flag: 'wx'});
		chmodSync(path, 0o600);
		writeFileSync(join(folder, 'operator.pub'), publicKeyPem(privateKey), {mode: 0o644});
		return success({privateKey, created: true, path});
	}
	const open = notPrivate(path);
	if (open) return failure([open]);
	try {
		return success({privateKey: createPrivateKey(readFileSync(path)), created: false, path});
	} catch (error) {
		return failure([problem('key-file-unreadable', {path, detail: (error as Error).message})]);
	}
}

/** A private key from a file another person gave (a second signer's key on this machine). */
export function keyFromFile(path: string): Result<KeyObject, Problem> {
	if (!existsSync(path)) return failure([problem('key-file-missing', {path})]);
	const open = notPrivate(path);
	if (open) return failure([open]);
	try {
		return success(createPrivateKey(readFileSync(path)));
	} catch (error) {
		return failure([problem('key-file-not-private', {path, detail: (error as Error).message})]);
	}
}

/** The PEM form of the public half of a key. */
export function publicKeyPem(key: KeyObject): string {
	return String((key.type === 'private' ? createPublicKey(key) : key).export({format: 'pem', type: 'spki'}));
}

function trustedPath(settingsFolder: string): string {
	return join(keyFolder(settingsFolder), 'trusted.json');
}

/** The colleagues' public keys this operator trusts. */
export function readTrusted(settingsFolder: string): TrustedKey[] {
	const path = trustedPath(settingsFolder);
	if (!existsSync(path)) return [];
	const parsed = trustedSchema.safeParse(JSON.parse(readFileSync(path, 'utf8')));
	if (!parsed.success) throw new ProblemError(problem('key-trusted-invalid', {path}));
	return parsed.data;
}

/** Replaces the list of trusted keys. */
export function writeTrusted(settingsFolder: string, keys: TrustedKey[]): void {
	mkdirSync(keyFolder(settingsFolder), {recursive: true, mode: 0o700});
	writeFileSync(trustedPath(settingsFolder), `${JSON.stringify(keys, null, 2)}\n`, {mode: 0o644});
}

/** The fingerprint of the operator's own key, when there is one. */
export function ownFingerprint(settingsFolder: string): string | undefined {
	const path = join(keyFolder(settingsFolder), 'operator.key');
	if (!existsSync(path)) return undefined;
	return fingerprint(rawPublicKey(createPrivateKey(readFileSync(path))));
}
