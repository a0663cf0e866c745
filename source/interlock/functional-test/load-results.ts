import {problem, type Problem} from '../../shared/problems.js';
import {failure, success, type Result} from '../../shared/result.js';
import {formatQuantity} from '../../quantities/format.js';
import {schemaProblems} from '../../rules/file/schema-problems.js';
import {parseYamlSource, readTextFile} from '../../shared/yaml-source.js';
import {testResultsSchema, type StepResult, type TestResults} from './results-schema.js';
import type {TestSheet, TestStep} from './test-sheet.js';

/** What a results file is, for messages about the wrong kind of file. */
export const resultsFileExpected = 'the results of an interlock functional test (YAML)';

/** A calendar day in local time, YYYY-MM-DD. */
export function localDay(date: Date): string {
	const pad = (value: number) => String(value).padStart(2, '0');
	return `${date.getFullYear()}-${pad(date.getMonth() + 1)}-${pad(date.getDate())}`;
}

/**
 * Reads the results of a functional test and holds them against the plan's test sheet: every
 * step answered once, each naming what the sheet's step concerns, no pass slower than the
 * policy allows, a note for every step not applicable, and no test dated after today.
 */
export function loadResults(file: string, sheet: TestSheet, now: Date): Result<TestResults, Problem> {
	const text = readTextFile(file, resultsFileExpected);
	if (!text.ok) return text;
	return loadResultsFromText(text.value, file, sheet, now);
}

/** The same as loadResults, for text already in hand. */
export function loadResultsFromText(text: string, file: string, sheet: TestSheet, now: Date): Result<TestResults, Problem> {
	const parsed = parseYamlSource(text, file, resultsFileExpected);
	if (!parsed.ok) return parsed;
	const source = parsed.value;
	const validated = testResultsSchema.safeParse(source.data);
	if (!validated.success) return failure(schemaProblems(validated.error.issues, source, 'docs/interlock.md'));
	const problems = resultsAgainstSheet(validated.data, sheet, now, (path) => ({file: source.file, ...source.locate(path), field: path.join('.')}));
	return problems.length > 0 ? failure(problems) : success(validated.data, parsed.warnings);
}

/** Where a problem is: a file's line and column, or (for results held in memory) the field alone. */
export type Locate = (path: Array<string | number>) => Pick<Problem, 'file' | 'line' | 'column' | 'field'>;

const byField: Locate = (path) => ({field: path.join('.')});

/**
 * The problems of one step's result against its step of the sheet: another subject than the
 * sheet's, a pass slower than the policy's response time, or not applicable without a note.
 */
export function stepProblems(entry: StepResult, step: TestStep, sheet: TestSheet, at: Locate = byField, path: Array<string | number> = []): Problem[] {
	const problems: Problem[] = [];
	if (entry.concerns !== step.subject) problems.push(problem('interlock-results-concerns', {step: entry.step, expected: step.subject, given: entry.concerns}, at([...path, 'concerns'])));
	if (entry.result === 'pass' && entry.stopped_in !== undefined && entry.stopped_in > sheet.limitSeconds) {
		problems.push(problem('interlock-results-too-slow', {step: entry.step, measured: formatQuantity(entry.stopped_in, 'time'), limit: sheet.limit}, at([...path, 'stopped_in'])));
	}
	if (entry.result === 'not_applicable' && entry.note === undefined) problems.push(problem('interlock-results-na-note', {step: entry.step}, at([...path, 'result'])));
	return problems;
}

/**
 * Holds validated results against the plan's test sheet: every step answered once and as
 * stepProblems asks, and no test dated after today. The file and the screen both use it, so
 * results get the same checks and messages wherever they were written down.
 */
export function resultsAgainstSheet(results: TestResults, sheet: TestSheet, now: Date, at: Locate = byField): Problem[] {
	const problems: Problem[] = [];
	const today = localDay(now);
	if (results.tested_on > today) problems.push(problem('interlock-results-future', {date: results.tested_on, today}, at(['tested_on'])));
	// Where each step was first given: its line in a file, or its place in the list otherwise.
	const seen = new Map<number, string>();
	results.steps.forEach((entry, index) => {
		const path = ['steps', index];
		const step = sheet.steps.find((candidate) => candidate.number === entry.step);
		if (step === undefined) problems.push(problem('interlock-results-step-unknown', {step: entry.step, count: sheet.steps.length}, at([...path, 'step'])));
		else if (seen.has(entry.step)) problems.push(problem('interlock-results-step-twice', {step: entry.step, first: seen.get(entry.step)!}, at([...path, 'step'])));
		else {
			const where = at([...path, 'step']);
			seen.set(entry.step, where.line === undefined ? `steps.${index}` : `line ${where.line}`);
			problems.push(...stepProblems(entry, step, sheet, at, path));
		}
	});
	for (const step of sheet.steps) {
		if (!seen.has(step.number)) problems.push(problem('interlock-results-step-missing', {step: step.number, subject: step.subject}, at(['steps'])));
	}
	return problems;
}
