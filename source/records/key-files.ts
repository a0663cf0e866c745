import {chmodSync, existsSync, mkdirSync, statSync} from 'node:fs';
import {createPrivateKey, createPublicKey, type KeyObject} from 'node:crypto';
import {join} from 'node:path';
// Named imports (not the z namespace) let the bundler leave out the parts of zod not used.
import {array, object, string} from 'zod';
import {problem, type Problem} from '../shared/problems.js';
import {ProblemError} from '../shared/problem-error.js';
import {failure, success, type Result} from '../shared/result.js';
import {fingerprint, generateKeyPair, rawPublicKey} from './key-material.js';
import {createFileAtomically, replaceFileAtomically} from '../shared/atomic-file.js';
import {asWriteError} from '../shared/file-write-error.js';
import {cleanKeyName, nameInPem, pemWithName} from './key-name.js';
import {FileShapeError, readCappedText} from '../shared/capped-read.js';
import {lazySchema} from '../shared/lazy-schema.js';

/**
 * A colleague's public key that this operator trusts: under a name, with the roles granted to
 * it (when any), and the date from which it is revoked (when it is).
 */
export type TrustedKey = {name: string; publicKey: string; fingerprint: string; addedAt: string; roles?: string[]; revokedFrom?: string};

const trustedSchema = lazySchema(() => array(object({name: string(), publicKey: string(), fingerprint: string(), addedAt: string(), roles: array(string()).optional(), revokedFrom: string().optional()}).strict()));

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

/** The operator's key: the private key, whether it was just made, its file, and its holder's name (undefined for a key made without one). */
export type OperatorKey = {privateKey: KeyObject; created: boolean; path: string; name: string | undefined};

/**
 * The operator's private key, created on first use with owner-only permissions and with the
 * holder's name (`name`), which a key cannot be created without.
 */
export function operatorKey(settingsFolder: string, create: boolean, name?: string): Result<OperatorKey, Problem> {
	const folder = keyFolder(settingsFolder);
	const path = join(folder, 'operator.key');
	if (!existsSync(path)) {
		if (!create) return failure([problem('key-none-yet')]);
		const holder = cleanKeyName(name ?? '');
		if (!holder) return failure([problem('key-no-name')]);
		makeKeyFolder(folder);
		const {privateKey} = generateKeyPair();
		// Written whole or not at all, never over a key: when another process made the key a
		// moment before (two first signatures at once), its key is read and used below.
		if (createFileAtomically(path, pemWithName(String(privateKey.export({format: 'pem', type: 'pkcs8'})), holder), 0o600)) {
			chmodSync(path, 0o600);
			replaceFileAtomically(join(folder, 'operator.pub'), publicKeyPem(privateKey, holder), 0o644);
			return success({privateKey, created: true, path, name: holder});
		}
	}
	const open = notPrivate(path);
	if (open) return failure([open]);
	try {
		const text = readCappedText(path);
		if (text.trim() === '') return failure([problem('key-file-empty', {path})]);
		return success({privateKey: createPrivateKey(text), created: false, path, name: nameInPem(text)});
	} catch (error) {
		return failure([problem('key-file-unreadable', {path, detail: (error as Error).message})]);
	}
}

/**
 * Names the operator's key once (a key made by an earlier version carries no name). The same
 * name again is accepted; another name is refused: a key belongs to one person.
 */
export function nameOperatorKey(settingsFolder: string, name: string): Result<OperatorKey, Problem> {
	const own = operatorKey(settingsFolder, true, name);
	if (!own.ok || own.value.created) return own;
	const holder = cleanKeyName(name);
	if (!holder) return failure([problem('key-no-name')]);
	if (own.value.name !== undefined) return own.value.name === holder ? own : failure([problem('key-name-set', {name: own.value.name})]);
	const {privateKey, path} = own.value;
	replaceFileAtomically(path, pemWithName(readCappedText(path), holder), 0o600);
	replaceFileAtomically(join(keyFolder(settingsFolder), 'operator.pub'), publicKeyPem(privateKey, holder), 0o644);
	return success({...own.value, name: holder});
}

/** A private key from a file another person gave (a second signer's key on this machine). */
export function keyFromFile(path: string): Result<KeyObject, Problem> {
	const named = namedKeyFromFile(path);
	return named.ok ? success(named.value.key) : named;
}

/** A private key file with the name of its holder (undefined for a key made without one). */
export function namedKeyFromFile(path: string): Result<{key: KeyObject; name: string | undefined}, Problem> {
	if (!existsSync(path)) return failure([problem('key-file-missing', {path})]);
	const open = notPrivate(path);
	if (open) return failure([open]);
	try {
		const text = readCappedText(path);
		return success({key: createPrivateKey(text), name: nameInPem(text)});
	} catch (error) {
		return failure([problem('key-file-not-private', {path, detail: (error as Error).message})]);
	}
}

/** The PEM form of the public half of a key, with its holder's name before it when given. */
export function publicKeyPem(key: KeyObject, name?: string): string {
	const pem = String((key.type === 'private' ? createPublicKey(key) : key).export({format: 'pem', type: 'spki'}));
	return name ? pemWithName(pem, name) : pem;
}

function trustedPath(settingsFolder: string): string {
	return join(keyFolder(settingsFolder), 'trusted.json');
}

/** The colleagues' public keys this operator trusts; a file that is not the JSON list prelase writes (truncated, damaged) is a ProblemError naming it. */
export function readTrusted(settingsFolder: string): TrustedKey[] {
	const path = trustedPath(settingsFolder);
	if (!existsSync(path)) return [];
	let data: unknown;
	try {
		data = JSON.parse(readCappedText(path));
	} catch (error) {
		// Words of our own, not the parser's message, which quotes the file's text.
		const code = (error as NodeJS.ErrnoException).code;
		const detail = error instanceof FileShapeError ? error.message : code ?? (/end of (JSON )?input|unterminated/i.test((error as Error).message) ? 'it ends part-way, as a write cut short leaves it' : 'it is not JSON');
		throw new ProblemError(problem('key-trusted-damaged', {path, detail}));
	}
	const parsed = trustedSchema.safeParse(data);
	if (!parsed.success) throw new ProblemError(problem('key-trusted-invalid', {path}));
	return parsed.data;
}

/** Replaces the list of trusted keys, atomically: a failed write leaves the list as it was. */
export function writeTrusted(settingsFolder: string, keys: TrustedKey[]): void {
	makeKeyFolder(keyFolder(settingsFolder));
	replaceFileAtomically(trustedPath(settingsFolder), `${JSON.stringify(keys, null, 2)}\n`, 0o644);
}

/** Makes the owner-only keys folder; a folder that cannot be made is a FileWriteError naming it. */
function makeKeyFolder(folder: string): void {
	try {
		mkdirSync(folder, {recursive: true, mode: 0o700});
	} catch (error) {
		throw asWriteError(folder, error);
	}
}

/**
 * The fingerprint of the operator's own key, when there is one: from the private key, else from
 * the public key file beside it. A key file that cannot be read (empty, damaged, denied) gives
 * none, so a command that only needs to know which signatures are the operator's (the audit,
 * the report) still runs; their signatures are then reported as by an untrusted key.
 */
export function ownFingerprint(settingsFolder: string): string | undefined {
	for (const [file, read] of [['operator.key', createPrivateKey], ['operator.pub', createPublicKey]] as const) {
		try {
			return fingerprint(rawPublicKey(read(readCappedText(join(keyFolder(settingsFolder), file)))));
		} catch {
			// Missing or unreadable: try the next file.
		}
	}
	return undefined;
}
