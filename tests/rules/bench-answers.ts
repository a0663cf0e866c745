import {readFileSync} from 'node:fs';
import {resolve} from 'node:path';
import {expect} from 'vitest';
import {parse, stringify} from 'yaml';
import type {CompiledRules} from '../../source/rules/compile/compiled-rules.js';
import {evaluate} from '../../source/rules/evaluate/evaluate.js';
import type {CheckResult, Evaluation} from '../../source/rules/evaluate/evaluation.js';
import {loadAnswersFromText} from '../../source/rules/evaluate/load-answers.js';
import {loadRules, shippedRulesPath} from '../../source/rules/load.js';
import type {Problem} from '../../source/shared/problems.js';
import type {Result} from '../../source/shared/result.js';
import type {Answers} from '../../source/rules/evaluate/answers.js';

/** An answers file as plain data, before it is read against the rules. */
export type AnswersDocument = {setup?: string; inputs: Record<string, unknown>; confirmations: Record<string, unknown>};

/** Replacement entries; `null` removes the entry (the input or confirmation is left unanswered). */
export type Changes = Record<string, unknown>;

/** The folder of demo answers files. */
export const examplesFolder = resolve('docs', 'examples');

/** The shipped rule file, loaded and compiled; a failure here is a failure of every test. */
export function shippedRules(): CompiledRules {
	const loaded = loadRules(shippedRulesPath());
	if (!loaded.ok) throw new Error(`the shipped rules did not load: ${loaded.errors.map((found) => found.code).join(', ')}`);
	return loaded.value;
}

/** A demo answers file as plain data. */
export function readDemo(fileName: string): AnswersDocument {
	const data = parse(readFileSync(resolve(examplesFolder, fileName), 'utf8')) as Partial<AnswersDocument>;
	return {...(data.setup ? {setup: data.setup} : {}), inputs: {...data.inputs}, confirmations: {...data.confirmations}};
}

function apply(entries: Record<string, unknown>, changes: Changes): Record<string, unknown> {
	const result = {...entries};
	for (const [id, value] of Object.entries(changes)) {
		if (value === null) delete result[id];
		else result[id] = value;
	}
	return result;
}

/** A copy of an answers document with some inputs and confirmations changed or removed. */
export function withChanges(document: AnswersDocument, inputs: Changes = {}, confirmations: Changes = {}): AnswersDocument {
	return {...document, inputs: apply(document.inputs, inputs), confirmations: apply(document.confirmations, confirmations)};
}

/** Reads an answers document against the rules the way an answers file is read. */
export function readAnswers(rules: CompiledRules, document: AnswersDocument): Result<Answers, Problem> {
	return loadAnswersFromText(stringify(document), 'case.yaml', rules);
}

/** Reads and evaluates an answers document; an answers file the loader refuses fails the test. */
export function evaluateDocument(rules: CompiledRules, document: AnswersDocument): Evaluation {
	const answers = readAnswers(rules, document);
	if (!answers.ok) throw new Error(`the answers were refused: ${answers.errors.map((found) => `${found.code} at ${found.field ?? '?'}`).join(', ')}`);
	return evaluate(rules, answers.value);
}

/** One check's result by id; a missing id fails the test. */
export function checkResult(evaluation: Evaluation, id: string): CheckResult {
	const found = evaluation.checks.find((check) => check.id === id);
	if (!found) throw new Error(`no check ${id} in the evaluation`);
	return found;
}

/** Asserts a number agrees with the expected value to a relative 1e-9 (absolute 1e-12 near zero). */
export function expectClose(actual: number | null | undefined, expected: number, what: string): void {
	expect(actual, what).toBeTypeOf('number');
	const difference = Math.abs((actual as number) - expected);
	expect(difference, `${what}: got ${actual}, expected ${expected}`).toBeLessThanOrEqual(Math.max(1e-12, 1e-9 * Math.abs(expected)));
}
