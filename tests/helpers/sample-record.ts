import {recordJson} from '../../source/records/record-json.js';
import type {KeyObject} from 'node:crypto';
import {resolve} from 'node:path';
import {buildRecordBody} from '../../source/records/build-body.js';
import {generateKeyPair} from '../../source/records/key-material.js';
import type {BenchRecord} from '../../source/records/record-schema.js';
import {signRecord, type Signer} from '../../source/records/sign.js';
import type {Answers} from '../../source/rules/evaluate/answers.js';
import type {CompiledRules} from '../../source/rules/compile/compiled-rules.js';
import {evaluate} from '../../source/rules/evaluate/evaluate.js';
import {analyseWhatIf} from '../../source/rules/evaluate/what-if.js';
import {loadAnswers} from '../../source/rules/evaluate/load-answers.js';
import {loadRules, shippedRulesPath} from '../../source/rules/load.js';

/** The demo answers whose every stop check holds. */
export const clearDemoPath = resolve('docs', 'examples', 'bench3-808nm-clear.yaml');

/** The shipped rules, loaded and compiled; a failure here fails every test that uses them. */
export function sampleRules(): CompiledRules {
	const loaded = loadRules(shippedRulesPath());
	if (!loaded.ok) throw new Error(`test setup: the shipped rules did not load (${loaded.errors.map((found) => found.code).join(', ')})`);
	return loaded.value;
}

/** The clear demo's answers, read against the rules. */
export function sampleAnswers(rules: CompiledRules): Answers {
	const loaded = loadAnswers(clearDemoPath, rules);
	if (!loaded.ok) throw new Error(`test setup: the clear demo did not load (${loaded.errors.map((found) => found.code).join(', ')})`);
	return loaded.value;
}

/** One signer with a fresh key, or the key given. */
export function signerWith(name: string, meaning: 'performed' | 'verified' | 'approved', key: KeyObject = generateKeyPair().privateKey, role = 'bench operator'): {signer: Signer; key: KeyObject} {
	return {signer: {name, role, meaning}, key};
}

/**
 * A real signed record of the clear demo: shipped rules, evaluated answers, a body built and
 * signed by prelase's own code. Signers default to one operator with a fresh key.
 */
export function sampleRecord(
	options: {rules?: CompiledRules; answers?: Answers; signers?: ReadonlyArray<{signer: Signer; key: KeyObject}>; now?: Date; operator?: {name: string; role: string}; /** Keep the what-if analysis as the record's sensitivity section. */ withWhatIf?: boolean} = {},
): BenchRecord {
	const rules = options.rules ?? sampleRules();
	const answers = options.answers ?? sampleAnswers(rules);
	const signers = options.signers ?? [signerWith('Ada Operator', 'performed')];
	const operator = options.operator ?? {name: signers[0]!.signer.name, role: signers[0]!.signer.role};
	const evaluation = evaluate(rules, answers);
	const body = buildRecordBody({rules, answers, evaluation, operator, ...(options.now ? {now: options.now} : {}), ...(options.withWhatIf ? {whatIf: analyseWhatIf(rules, answers, evaluation)} : {})});
	// The first record of its key in its folder, as prelase writes one: it names no previous record.
	return signRecord({...body, previous: null}, signers, options.now);
}

/** A record as the store writes it to disk. */
export function serialise(record: unknown): string {
	return recordJson(record);
}
