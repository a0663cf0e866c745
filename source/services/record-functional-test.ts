import {analysePlan} from '../interlock/analysis/analyse.js';
import {loadResults, resultsAgainstSheet} from '../interlock/functional-test/load-results.js';
import type {Plan} from '../interlock/plan/plan-schema.js';
import type {TestResults} from '../interlock/functional-test/results-schema.js';
import {buildTestBody} from '../interlock/functional-test/test-record.js';
import {testSheet} from '../interlock/functional-test/test-sheet.js';
import {recordsFolder} from './records-folder.js';
import {keyFromFile, operatorKey} from '../records/key-store.js';
import {fingerprint, rawPublicKey, shortFingerprint} from '../records/keys.js';
import {signRecord} from '../records/sign-record.js';
import type {Signer} from '../records/sign.js';
import {writeRecord} from '../records/store.js';
import type {CompiledRules} from '../rules/compiled-rules.js';
import {openSettings} from './settings.js';
import {stripControl} from '../shared/text.js';
import {UsageError} from '../cli/usage-error.js';

/** What `plan FILE --record-test RESULTS` was asked to do. */
export type RecordTestOptions = {results: string; records?: string | undefined; witnessKey?: string | undefined; now?: Date};

/** Where the record goes and who else signs it, wherever the results came from. */
export type RecordResultsOptions = {
	records?: string | undefined;
	/** The witness's private key file; the witness then signs too (meaning verified). */
	witnessKey?: string | undefined;
	/** How the witness key is named in messages. @default '--witness-key' */
	witnessKeyName?: string;
	now?: Date;
};

/** The plan as tested: validated, the file it came from and its exact text (the record holds the text and its hash). */
export type PlanAsTested = {plan: Plan; file: string; text: string};

/** Where the interlock test record went and what it says. */
export type RecordedTest = {path: string; fingerprint: string; keyCreated: boolean; outcome: 'passed' | 'failed'; outcomeText: string; testedOn: string; tester: string};

/**
 * Holds a filled-in test sheet (a results file) against the plan, then records it with
 * recordTestResults, whatever the outcome.
 */
export function recordTest(plan: Plan, planFile: string, planText: string, rules: CompiledRules, options: RecordTestOptions, env: NodeJS.ProcessEnv): RecordedTest {
	const now = options.now ?? new Date();
	const results = loadResults(options.results, testSheet(plan), now);
	if (!results.ok) throw new UsageError(`the results file has problems; no record was written`, results.errors);
	return recordTestResults({plan, file: planFile, text: planText}, rules, results.value, {...options, now}, env);
}

/**
 * Records test results held in memory (read from a file, or entered on screen): holds them
 * against the plan's test sheet, then builds, signs (the tester with this machine's operator
 * key; the witness with their key file, when given) and writes the interlock test record,
 * whatever the outcome. Nothing is written when the results are refused.
 */
export function recordTestResults(tested: PlanAsTested, rules: CompiledRules, results: TestResults, options: RecordResultsOptions, env: NodeJS.ProcessEnv): RecordedTest {
	const now = options.now ?? new Date();
	const keyName = options.witnessKeyName ?? '--witness-key';
	const {plan} = tested;
	const sheet = testSheet(plan);
	const problems = resultsAgainstSheet(results, sheet, now);
	if (problems.length > 0) throw new UsageError('the test results have problems; no record was written', problems);
	if (options.witnessKey !== undefined && results.witness === undefined) throw new UsageError(`${keyName} needs a witness in the results file (witness: {name, role})`);
	const body = buildTestBody({plan, planFile: tested.file, planText: tested.text, rules, analysis: analysePlan(plan), sheet, results, now});
	const settings = openSettings(env);
	const {privateKey, created} = operatorKey(settings.folder, true);
	const signers: Array<{signer: Signer; key: typeof privateKey}> = [{signer: {name: stripControl(body.tester.name).trim(), role: stripControl(body.tester.role).trim(), meaning: 'performed'}, key: privateKey}];
	if (options.witnessKey !== undefined && body.witness) {
		const key = keyFromFile(options.witnessKey);
		if (fingerprint(rawPublicKey(key)) === fingerprint(rawPublicKey(privateKey))) throw new UsageError(`${keyName} is the tester's own key; the witness signs with a key of their own`);
		signers.push({signer: {name: stripControl(body.witness.name).trim(), role: stripControl(body.witness.role).trim(), meaning: 'verified'}, key});
	}
	const record = signRecord(body, signers, now);
	const path = writeRecord(recordsFolder(env, options.records), record);
	return {path, fingerprint: shortFingerprint(fingerprint(rawPublicKey(privateKey))), keyCreated: created, outcome: body.outcome, outcomeText: body.outcomeText, testedOn: body.testedOn, tester: body.tester.name};
}
