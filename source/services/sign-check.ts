import {basename, dirname} from 'node:path';
import {buildRecordBody} from '../records/build-body.js';
import {readRecord} from '../records/read-record.js';
import {storeRuleText} from '../records/rule-texts.js';
import {recordsFolder} from './records-folder.js';
import type {InterlockLink} from '../interlock/functional-test/test-link.js';
import type {Answers} from '../rules/evaluate/answers.js';
import type {CompiledRules} from '../rules/compile/compiled-rules.js';
import type {Evaluation} from '../rules/evaluate/evaluation.js';
import {loadSettings, settingsFile} from './settings.js';
import {signAndStore, type SecondSigner, type StoredRecord} from './sign-and-store.js';
import {problem, type Problem} from '../shared/problems.js';
import {failure, success, type Result} from '../shared/result.js';
import {stripControl} from '../shared/text.js';
import {hasLineBreak} from '../shared/one-line.js';
import type {WhatIf} from '../rules/evaluate/what-if.js';

/** What `check --sign` was asked to do. */
export type SignOptions = {
	name: string;
	role?: string;
	records?: string;
	amends?: string;
	reason?: string;
	cosign?: {name: string; role?: string; key: string; meaning: string};
	/** The what-if analysis to keep as the record's sensitivity section. */
	whatIf?: WhatIf;
};

/** What a second signature is for, by the word given: the purposes, and the version 1 meanings that stand for them. */
const cosignPurposes = new Map<string, 'witness' | 'approval'>([['witness', 'witness'], ['approval', 'approval'], ['verified', 'witness'], ['approved', 'approval']]);

/** Where a record was written and with which key. */
export type WrittenRecord = {path: string; fingerprint: string; keyCreated: boolean; folder: string} & Pick<StoredRecord, 'commit'>;

/**
 * Builds, signs and writes the record of a bench check (in every outcome). A mistake in what
 * was asked (no name, an amendment without a reason, a bad second key...) comes back as a
 * failure whose last problem says what was refused; nothing is written then.
 */
export function signAndWrite(rules: CompiledRules, answers: Answers, evaluation: Evaluation, options: SignOptions, env: NodeJS.ProcessEnv, interlockTest: InterlockLink | null = null): Result<WrittenRecord, Problem> {
	const name = stripControl(options.name).trim();
	if (!name) return failure([problem('sign-no-name')]);
	const saved = loadSettings(env);
	if (!saved.ok) return saved;
	const folder = recordsFolder(env, options.records);
	let amends;
	if (options.amends !== undefined) {
		if (!options.reason?.trim()) return failure([problem('sign-amends-no-reason')]);
		const original = readRecord(options.amends);
		if (!original.ok) return failure([problem('sign-amends-not-intact', {file: options.amends, reason: original.reason})]);
		if (original.record.body.kind !== 'bench-check') return failure([problem('sign-amends-interlock', {file: options.amends})]);
		amends = {record: basename(options.amends), bodySha256: original.bodySha256, reason: stripControl(options.reason).trim()};
	} else if (options.reason !== undefined) {
		return failure([problem('sign-reason-without-amends')]);
	}
	let second: SecondSigner | undefined;
	if (options.cosign) {
		const {meaning} = options.cosign;
		const purpose = cosignPurposes.get(meaning);
		if (purpose === undefined) return failure([problem('sign-cosign-meaning', {meaning})]);
		second = {name: options.cosign.name, role: options.cosign.role ?? '', purpose, keyFile: options.cosign.key, ownKey: problem('sign-cosign-own-key')};
	}
	const role = stripControl(options.role ?? saved.value.role ?? '').trim();
	if (hasLineBreak(role) || hasLineBreak(options.cosign?.role ?? '')) return failure([problem('single-line', {label: 'the role'})]);
	const body = buildRecordBody({rules, answers, evaluation, operator: {name, role}, interlockTest, ...(amends ? {amends} : {}), ...(options.whatIf ? {whatIf: options.whatIf} : {})});
	// The rule text goes in first, so that a record never names a text the folder lacks (and only once the signers are known good).
	const stored = signAndStore(body, {name, role}, second, dirname(settingsFile(env)), folder, undefined, env, () => storeRuleText(folder, rules.text));
	if (!stored.ok) return stored;
	return success({...stored.value, folder});
}
