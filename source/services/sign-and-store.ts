import {previousRecord, rememberRecord} from '../records/chain.js';
import {namedKeyFromFile, operatorKey} from '../records/key-files.js';
import {fingerprint, rawPublicKey, shortFingerprint} from '../records/key-material.js';
import {sameName} from '../records/key-name.js';
import type {AnyRecord, InterlockTestBody, RecordBody} from '../records/record-schema.js';
import {signRecord, type Signer} from '../records/sign.js';
import {writeRecord} from '../records/store.js';
import {problem, type Problem} from '../shared/problems.js';
import {failure, success, type Result} from '../shared/result.js';
import {stripControl} from '../shared/text.js';
import {commitRecord} from './records-repository.js';

/** A second person who signs with their own private key file (as witness or approval), and the refusal when it is the operator's key. */
export type SecondSigner = {name: string; role: string; purpose: 'witness' | 'approval'; keyFile: string; ownKey: Problem};

/** Where a signed record was written and with which key; in a records repository, its commit (or why there is none). */
export type StoredRecord = {path: string; fingerprint: string; keyCreated: boolean; commit?: string | Problem};

const clean = (text: string) => stripControl(text).trim();

/**
 * Signs a record body (the operator with this machine's key, created on first use under the
 * operator's name, as the one who did the work; a second signer with their key file) and writes
 * it to the folder. Each signer must sign under the name their key carries. A mistake (an
 * unreadable or unnamed key, a name that is not the key's, the second key being the
 * operator's own) comes back as a failure and nothing is written, not even what `before` writes.
 */
export function signAndStore<Body extends RecordBody | InterlockTestBody>(body: Body, operator: {name: string; role: string}, second: SecondSigner | undefined, settingsFolder: string, folder: string, now?: Date, env: NodeJS.ProcessEnv = process.env, /** Written once the signers are known good, before the record (a bench check's rule text). */ before?: () => void): Result<StoredRecord, Problem> {
	const own = operatorKey(settingsFolder, true, operator.name);
	if (!own.ok) return own;
	const {privateKey, created, name: keyName, path: keyPath} = own.value;
	if (keyName === undefined) return failure([problem('key-unnamed', {path: keyPath})]);
	if (!sameName(operator.name, keyName)) return failure([problem('sign-name-not-key', {given: clean(operator.name), key: keyName})]);
	const signers: Array<{signer: Signer; key: typeof privateKey}> = [{signer: {name: keyName, role: clean(operator.role), purpose: 'operator'}, key: privateKey}];
	if (second) {
		const key = namedKeyFromFile(second.keyFile);
		if (!key.ok) return key;
		if (fingerprint(rawPublicKey(key.value.key)) === fingerprint(rawPublicKey(privateKey))) return failure([second.ownKey]);
		if (key.value.name === undefined) return failure([problem('sign-cosign-key-unnamed', {file: second.keyFile})]);
		if (!sameName(second.name, key.value.name)) return failure([problem('sign-cosign-name-not-key', {given: clean(second.name), file: second.keyFile, key: key.value.name})]);
		signers.push({signer: {name: key.value.name, role: clean(second.role), purpose: second.purpose}, key: key.value.key});
	}
	// The chain: the body names the key's previous record in this folder before anyone signs it.
	const key = fingerprint(rawPublicKey(privateKey));
	// A record of either kind of body is a record: TypeScript cannot see that through the type parameter.
	const chained: Body = {...body, previous: previousRecord(folder, key)};
	const record = signRecord(chained, signers, now) as AnyRecord;
	before?.();
	const path = writeRecord(folder, record);
	rememberRecord(folder, key, path);
	const commit = commitRecord(folder, [path], record, signers[0]!.signer.name, key, env);
	return success({path, fingerprint: shortFingerprint(key), keyCreated: created, ...commit});
}
