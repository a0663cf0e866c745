import {basename} from 'node:path';
import {buildRecordBody} from '../records/build-body.js';
import {keyFromFile, operatorKey} from '../records/key-store.js';
import {fingerprint, rawPublicKey, shortFingerprint} from '../records/keys.js';
import {readRecord} from '../records/read-record.js';
import {signRecord} from '../records/sign-record.js';
import type {Signer} from '../records/sign.js';
import {writeRecord} from '../records/store.js';
import {recordsFolder} from './records-folder.js';
import type {InterlockLink} from '../interlock/functional-test/test-link.js';
import type {Answers} from '../rules/answers.js';
import type {CompiledRules} from '../rules/compiled-rules.js';
import type {Evaluation} from '../rules/evaluation.js';
import {openSettings} from './settings.js';
import {stripControl} from '../shared/text.js';
import {UsageError} from '../cli/usage-error.js';

/** What `check --sign` was asked to do. */
export type SignOptions = {
	name: string;
	role?: string;
	records?: string;
	amends?: string;
	reason?: string;
	cosign?: {name: string; role?: string; key: string; meaning: string};
};

/** Where a record was written and with which key. */
export type WrittenRecord = {path: string; fingerprint: string; keyCreated: boolean; folder: string};

const meanings = new Set(['verified', 'approved']);

/** Builds, signs and writes the record of a bench check (in every outcome). */
export function signAndWrite(rules: CompiledRules, answers: Answers, evaluation: Evaluation, options: SignOptions, env: NodeJS.ProcessEnv, interlockTest: InterlockLink | null = null): WrittenRecord {
	const name = stripControl(options.name).trim();
	if (!name) throw new UsageError('--sign needs the name of the person signing');
	const settings = openSettings(env);
	const saved = settings.read();
	const folder = recordsFolder(env, options.records);
	let amends;
	if (options.amends !== undefined) {
		if (!options.reason?.trim()) throw new UsageError('--amends needs --reason saying what the correction is and why');
		const original = readRecord(options.amends);
		if (!original.ok) throw new UsageError(`the record to amend, ${options.amends}, fails its integrity check: ${original.reason}`);
		if (original.record.body.kind !== 'bench-check') throw new UsageError(`${options.amends} is an interlock test record; a bench check can amend only a bench-check record`);
		amends = {record: basename(options.amends), bodySha256: original.bodySha256, reason: stripControl(options.reason).trim()};
	} else if (options.reason !== undefined) {
		throw new UsageError('--reason goes with --amends RECORD');
	}
	const {privateKey, created} = operatorKey(settings.folder, true);
	const signers: Array<{signer: Signer; key: typeof privateKey}> = [{signer: {name, role: stripControl(options.role ?? saved.role ?? '').trim(), meaning: 'performed'}, key: privateKey}];
	if (options.cosign) {
		if (!meanings.has(options.cosign.meaning)) throw new UsageError(`--cosign-meaning must be verified or approved, not "${options.cosign.meaning}"`);
		signers.push({
			signer: {name: stripControl(options.cosign.name).trim(), role: stripControl(options.cosign.role ?? '').trim(), meaning: options.cosign.meaning as Signer['meaning']},
			key: keyFromFile(options.cosign.key),
		});
		if (fingerprint(rawPublicKey(signers[1]!.key)) === fingerprint(rawPublicKey(privateKey))) throw new UsageError('--cosign-key is your own key; the second signer signs with a key of their own');
	}
	const body = buildRecordBody({rules, answers, evaluation, operator: {name, role: signers[0]!.signer.role}, interlockTest, ...(amends ? {amends} : {})});
	const record = signRecord(body, signers);
	const path = writeRecord(folder, record);
	return {path, fingerprint: shortFingerprint(fingerprint(rawPublicKey(privateKey))), keyCreated: created, folder};
}
