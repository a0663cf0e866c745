import {analysePlan} from '../interlock/analysis/analyse.js';
import {loadResults, resultsAgainstSheet} from '../interlock/functional-test/load-results.js';
import type {Plan} from '../interlock/plan/plan-schema.js';
import type {TestResults} from '../interlock/functional-test/results-schema.js';
import {buildTestBody} from '../interlock/functional-test/test-record.js';
import {testSheet} from '../interlock/functional-test/test-sheet.js';
import {dirname} from 'node:path';
import {recordsFolder} from './records-folder.js';
import type {CompiledRules} from '../rules/compile/compiled-rules.js';
import {settingsFile} from './settings.js';
import {signAndStore, type StoredRecord} from './sign-and-store.js';
import {problem, type Problem} from '../shared/problems.js';
import {failure, success, type Result} from '../shared/result.js';

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
export type RecordedTest = {path: string; fingerprint: string; keyCreated: boolean; outcome: 'passed' | 'failed'; outcomeText: string; testedOn: string; tester: string; /** The witness named, and whether they signed. */ witness?: {name: string; signed: boolean}} & Pick<StoredRecord, 'commit'>;

/**
 * Holds a filled-in test sheet (a results file) against the plan, then records it with
 * recordTestResults, whatever the outcome. Problems in the results come back as a failure whose
 * last problem says that no record was written.
 */
export function recordTest(plan: Plan, planFile: string, planText: string, rules: CompiledRules, options: RecordTestOptions, env: NodeJS.ProcessEnv): Result<RecordedTest, Problem> {
	const now = options.now ?? new Date();
	const results = loadResults(options.results, testSheet(plan), now);
	if (!results.ok) return failure([...results.errors, problem('record-results-file')]);
	return recordTestResults({plan, file: planFile, text: planText}, rules, results.value, {...options, now}, env);
}

/**
 * Records test results held in memory (read from a file, or entered on screen): holds them
 * against the plan's test sheet, then builds, signs (the tester with this machine's operator
 * key; the witness with their key file, when given) and writes the interlock test record,
 * whatever the outcome. Nothing is written when the results are refused: the failure lists
 * the problems, its last one saying what was refused.
 */
export function recordTestResults(tested: PlanAsTested, rules: CompiledRules, results: TestResults, options: RecordResultsOptions, env: NodeJS.ProcessEnv): Result<RecordedTest, Problem> {
	const now = options.now ?? new Date();
	const keyName = options.witnessKeyName ?? '--witness-key';
	const {plan} = tested;
	const sheet = testSheet(plan);
	const problems = resultsAgainstSheet(results, sheet, now);
	if (problems.length > 0) return failure([...problems, problem('record-results-refused')]);
	if (options.witnessKey !== undefined && results.witness === undefined) return failure([problem('record-witness-missing', {keyName})]);
	const body = buildTestBody({plan, planFile: tested.file, planText: tested.text, rules, analysis: analysePlan(plan), sheet, results, now});
	// A witness who does not sign is recorded as named, not signed.
	if (body.witness) body.witness = {...body.witness, signed: options.witnessKey !== undefined};
	const witness = options.witnessKey !== undefined && body.witness ? {name: body.witness.name, role: body.witness.role, purpose: 'witness' as const, keyFile: options.witnessKey, ownKey: problem('record-witness-own-key', {keyName})} : undefined;
	const stored = signAndStore(body, body.tester, witness, dirname(settingsFile(env)), recordsFolder(env, options.records), now, env);
	if (!stored.ok) return stored;
	return success({...stored.value, outcome: body.outcome, outcomeText: body.outcomeText, testedOn: body.testedOn, tester: body.tester.name, ...(body.witness ? {witness: {name: body.witness.name, signed: body.witness.signed === true}} : {})});
}
