import {previousRecord, rememberRecord} from '../records/chain.js';
import {keyFromFile, operatorKey} from '../records/key-files.js';
import {fingerprint, rawPublicKey, shortFingerprint} from '../records/key-material.js';
import type {AnyRecord, InterlockTestBody, RecordBody} from '../records/record-schema.js';
import {signRecord, type Signer} from '../records/sign.js';
import {writeRecord} from '../records/store.js';
import type {Problem} from '../shared/problems.js';
import {failure, success, type Result} from '../shared/result.js';
import {stripControl} from '../shared/text.js';
import {commitRecord} from './records-repository.js';

/** A second person who signs with their own private key file, and the refusal when it is the operator's key. */
export type SecondSigner = {name: string; role: string; meaning: Exclude<Signer['meaning'], 'performed'>; keyFile: string; ownKey: Problem};

/** Where a signed record was written and with which key; in a records repository, its commit (or why there is none). */
export type StoredRecord = {path: string; fingerprint: string; keyCreated: boolean; commit?: string | Problem};

const clean = (text: string) => stripControl(text).trim();

/**
 * Signs a record body (the operator with this machine's key, created on first use, as the one who
 * performed the work; a second signer with their key file) and writes it to the folder. A
 * mistake (an unreadable key, the second key being the operator's own) comes back as a failure
 * and nothing is written.
 */
export function signAndStore<Body extends RecordBody | InterlockTestBody>(body: Body, operator: {name: string; role: string}, second: SecondSigner | undefined, settingsFolder: string, folder: string, now?: Date, env: NodeJS.ProcessEnv = process.env): Result<StoredRecord, Problem> {
	const own = operatorKey(settingsFolder, true);
	if (!own.ok) return own;
	const {privateKey, created} = own.value;
	const signers: Array<{signer: Signer; key: typeof privateKey}> = [{signer: {name: clean(operator.name), role: clean(operator.role), meaning: 'performed'}, key: privateKey}];
	if (second) {
		const key = keyFromFile(second.keyFile);
		if (!key.ok) return key;
		if (fingerprint(rawPublicKey(key.value)) === fingerprint(rawPublicKey(privateKey))) return failure([second.ownKey]);
		signers.push({signer: {name: clean(second.name), role: clean(second.role), meaning: second.meaning}, key: key.value});
	}
	// The chain: the body names the key's previous record in this folder before anyone signs it.
	const key = fingerprint(rawPublicKey(privateKey));
	// A record of either kind of body is a record: TypeScript cannot see that through the type parameter.
	const chained: Body = {...body, previous: previousRecord(folder, key)};
	const record = signRecord(chained, signers, now) as AnyRecord;
	const path = writeRecord(folder, record);
	rememberRecord(folder, key, path);
	const commit = commitRecord(folder, [path], record, signers[0]!.signer.name, key, env);
	return success({path, fingerprint: shortFingerprint(key), keyCreated: created, ...commit});
}
