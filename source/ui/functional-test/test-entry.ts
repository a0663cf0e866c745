import type {PlanAsTested, RecordedTest} from '../../services/record-functional-test.js';
import {analysePlan} from '../../interlock/analysis/analyse.js';
import {localDay, resultsAgainstSheet, stepProblems} from '../../interlock/functional-test/load-results.js';
import {stepResultSchema, testResultsSchema, type TestResults} from '../../interlock/functional-test/results-schema.js';
import {testOutcome, testOutcomeText} from '../../interlock/functional-test/test-record.js';
import {testSheet, type TestSheet} from '../../interlock/functional-test/test-sheet.js';
import {describeProblem} from '../../shared/problems.js';

/** A step's result as marked on screen. */
export type StepMark = 'pass' | 'fail' | 'not_applicable';

/** One step as entered: the result, and the stop time and note as typed. */
export type StepEntry = {result?: StepMark; stoppedIn: string; note: string};

/** The sign-off fields after the steps, in the order shown. */
export const peopleFields = [
	{key: 'name', label: 'Tester name'},
	{key: 'role', label: 'Tester role'},
	{key: 'witnessName', label: 'Witness name (optional)'},
	{key: 'witnessRole', label: 'Witness role'},
	{key: 'witnessKey', label: 'Witness key file (optional)'},
	{key: 'date', label: 'Test date (YYYY-MM-DD)'},
] as const;

/** A sign-off field's key. */
export type PersonField = (typeof peopleFields)[number]['key'];

/**
 * A functional test being entered. `row` is a step (0 to steps − 1), a sign-off field after
 * them, or the sign line last; on a step, `part` is the part in focus.
 */
export type TestEntry = {
	tested: PlanAsTested;
	sheet: TestSheet;
	/** Stop findings of the plan as tested: with any, the record's outcome is failed. */
	stops: number;
	steps: StepEntry[];
	row: number;
	part: 'result' | 'time' | 'note';
	people: Record<PersonField, string>;
	message?: string;
	/** Text typed on a step's result: held, shown as not taken, and never a mark. */
	stray?: string;
	/** Said above the entries until the first change: entries restored from a draft, or why not. */
	notice?: {text: string; error?: boolean};
	/** Asking whether to discard the entries and leave. */
	leaving?: boolean;
	recorded?: RecordedTest;
};

/** A new test of the plan as saved, the tester prefilled, dated today. */
export function startTestEntry(tested: PlanAsTested, tester: {name: string; role: string}, now: Date): TestEntry {
	const sheet = testSheet(tested.plan);
	return {
		tested,
		sheet,
		stops: analysePlan(tested.plan).stops,
		steps: sheet.steps.map(() => ({stoppedIn: '', note: ''})),
		row: 0,
		part: 'result',
		people: {name: tester.name, role: tester.role, witnessName: '', witnessRole: '', witnessKey: '', date: localDay(now)},
	};
}

/**
 * A new test given the entries of an earlier one of the same plan text, the focus on the first
 * step without a result (or the tester's name, when every step has one).
 */
export function resumeTestEntry(entry: TestEntry, earlier: {steps: StepEntry[]; people: TestEntry['people']}): TestEntry {
	const open = earlier.steps.findIndex((step) => step.result === undefined);
	return {...entry, steps: earlier.steps, people: earlier.people, row: open < 0 ? earlier.steps.length : open, part: 'result'};
}

/** The row of the sign line. */
export const signRow = (entry: TestEntry) => entry.steps.length + peopleFields.length;

/** True once anything was entered: leaving then asks first. */
export function hasEntries(entry: TestEntry): boolean {
	return entry.steps.some((step) => step.result !== undefined || step.stoppedIn.trim() !== '' || step.note.trim() !== '');
}

/** A step as the results file would hold it (text as typed), or undefined before it has a result. */
function stepData(entry: TestEntry, index: number): Record<string, unknown> | undefined {
	const step = entry.sheet.steps[index];
	const given = entry.steps[index];
	if (!step || !given?.result) return undefined;
	const time = given.stoppedIn.trim();
	const note = given.note.trim();
	return {step: step.number, concerns: step.subject, result: given.result, ...(time ? {stopped_in: time} : {}), ...(note ? {note} : {})};
}

/**
 * Why a step cannot be accepted as entered, in the words a results file would get: a stop time
 * that is not a time, a pass slower than the policy, not applicable without a note. Undefined
 * when it is fine. `noteYet` leaves out the missing note while the note is still to be typed.
 */
export function stepEntryProblem(entry: TestEntry, index: number, noteYet = false): string | undefined {
	const step = entry.sheet.steps[index];
	const data = stepData(entry, index);
	if (!step || !data) return undefined;
	const parsed = stepResultSchema.safeParse(data);
	if (!parsed.success) {
		const issue = parsed.error.issues[0];
		return `Step ${step.number}: ${issue?.path.join('.') === 'stopped_in' ? 'stopped in' : issue?.path.join('.')}: ${issue?.message}`;
	}
	const problems = stepProblems(parsed.data, step, entry.sheet).filter((found) => !(noteYet && found.code === 'interlock-results-na-note'));
	return problems[0] ? capital(describeProblem(problems[0])) : undefined;
}

const capital = (text: string) => text.charAt(0).toUpperCase() + text.slice(1);

/** How many steps are marked each way, and how many are still to do. */
export function entryCounts(entry: TestEntry): {pass: number; fail: number; notApplicable: number; open: number} {
	const count = (mark: StepMark | undefined) => entry.steps.filter((step) => step.result === mark).length;
	return {pass: count('pass'), fail: count('fail'), notApplicable: count('not_applicable'), open: count(undefined)};
}

/** The outcome the record would have, from the core's own rule, once every step has a result. */
export function entryOutcome(entry: TestEntry): {outcome: 'passed' | 'failed'; text: string} | undefined {
	if (entry.steps.some((step) => step.result === undefined)) return undefined;
	const steps = entry.sheet.steps.map((step, index) => ({number: step.number, subject: step.subject, result: entry.steps[index]!.result!}));
	return {outcome: testOutcome(entry.stops, steps), text: testOutcomeText(entry.stops, steps)};
}

/**
 * The entries as validated test results, held against the sheet exactly as a results file is;
 * refused with the first problem and the row to go back to.
 */
export function entryResults(entry: TestEntry, now: Date): {ok: true; results: TestResults} | {ok: false; message: string; row: number} {
	const {people} = entry;
	const answered = entry.steps.map((_, index) => stepData(entry, index)).filter((data) => data !== undefined);
	const data = {
		format: 1,
		tested_on: people.date.trim(),
		tested_by: {name: people.name, role: people.role},
		...(people.witnessName.trim() || people.witnessRole.trim() ? {witness: {name: people.witnessName, role: people.witnessRole}} : {}),
		steps: answered,
	};
	const rowOf = (path: ReadonlyArray<PropertyKey>): number => {
		const [head, index] = path;
		if (head === 'steps') {
			const step = typeof index === 'number' ? (answered[index]?.['step'] as number | undefined) : entry.steps.findIndex((given) => !given.result) + 1;
			return Math.max(0, (step ?? 1) - 1);
		}
		const field = head === 'tested_on' ? 'date' : head === 'witness' ? (path[1] === 'role' ? 'witnessRole' : 'witnessName') : path[1] === 'role' ? 'role' : 'name';
		return entry.steps.length + peopleFields.findIndex((candidate) => candidate.key === field);
	};
	const labelOf = (row: number) => (row < entry.steps.length ? `Step ${row + 1}` : peopleFields[row - entry.steps.length]?.label ?? '');
	if (answered.length === 0) return {ok: false, message: 'No step has a result yet: mark each step p pass, f fail or a n/a', row: 0};
	const validated = testResultsSchema.safeParse(data);
	if (!validated.success) {
		const issue = validated.error.issues[0]!;
		const row = rowOf(issue.path);
		return {ok: false, message: `${labelOf(row)}: ${issue.message}`, row};
	}
	const found = resultsAgainstSheet(validated.data, entry.sheet, now)[0];
	if (found) return {ok: false, message: capital(describeProblem(found)), row: rowOf(found.field?.split('.').map((part) => (/^\d+$/.test(part) ? Number(part) : part)) ?? [])};
	if (people.witnessKey.trim() && !validated.data.witness) return {ok: false, message: "Witness key file: the witness's name is needed with their key", row: entry.steps.length + 2};
	return {ok: true, results: validated.data};
}
