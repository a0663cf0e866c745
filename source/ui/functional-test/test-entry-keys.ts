import type {Key} from 'ink';
import type {TestResults} from '../../interlock/functional-test/results-schema.js';
import type {RecordedTest} from '../../services/record-functional-test.js';
import {entryResults, hasEntries, peopleFields, signRow, stepEntryProblem, type StepMark, type TestEntry} from './test-entry.js';
import {readAnswerKey, signAloneMessage, strayMessage} from '../answer-key.js';
import {typeInto, type Arrival} from '../text-buffer.js';

/** What the test's keys need from outside: signing writes a record, leaving and help change the screen. */
export type TestEntryActions = {
	sign(entry: TestEntry, results: TestResults): {ok: true; recorded: RecordedTest} | {ok: false; message: string};
	leave(notice: string): void;
	help(): void;
	now(): Date;
};

const marks: Record<string, StepMark> = {p: 'pass', f: 'fail', a: 'not_applicable'};


const withStep = (entry: TestEntry, changes: Partial<TestEntry['steps'][number]>): TestEntry => ({
	...entry,
	steps: entry.steps.map((step, index) => (index === entry.row ? {...step, ...changes} : step)),
});

/** Moves to another row; leaving a step checks it first (and stays, with the message, when refused). Typed text held on a result is dropped. */
function moveTo(entry: TestEntry, row: number): TestEntry {
	if (entry.row < entry.steps.length) {
		const problem = stepEntryProblem(entry, entry.row, entry.part !== 'note');
		if (problem) return {...entry, message: problem};
	}
	const {message: _, stray: __, ...rest} = entry;
	return {...rest, row: Math.max(0, Math.min(signRow(entry), row)), part: 'result'};
}

const refusedMessage = strayMessage('p, f or a');

/**
 * One key on a step: p f a mark it (pressed alone, with no typed text held: a chunk or text
 * typed there marks nothing), then its stop time and note are typed, each taken with Enter.
 */
function stepKey(entry: TestEntry, input: string, key: Key, arrival: Arrival, actions: TestEntryActions): TestEntry {
	const step = entry.steps[entry.row]!;
	if (entry.part === 'result') {
		const stray = entry.stray ?? '';
		if (input === '?' && arrival.alone && stray === '') {
			actions.help();
			return entry;
		}
		const read = readAnswerKey(marks, stray, input, key, arrival);
		if (read.kind === 'answer') return {...withStep(entry, {result: read.answer}), part: 'time', message: undefined};
		if (read.kind === 'refused') return {...entry, stray: read.stray, message: refusedMessage};
		if (read.kind === 'cleared') return {...entry, stray: undefined, message: undefined};
		if (!key.return) return entry;
		if (stray !== '') return {...entry, message: refusedMessage};
		if (!step.result) return {...entry, message: `Mark step ${entry.row + 1}: p pass, f fail, a n/a`};
		return {...entry, part: 'time', message: undefined};
	}
	if (key.leftArrow) return {...entry, part: entry.part === 'note' ? 'time' : 'result', message: undefined};
	const field = entry.part === 'time' ? 'stoppedIn' : 'note';
	const change = typeInto(step[field], input, key);
	const typed = withStep(entry, {[field]: change.text});
	if (!change.submit) return typed;
	if (entry.part === 'time') {
		const problem = stepEntryProblem(typed, entry.row, true);
		return problem ? {...typed, message: problem} : {...typed, part: 'note', message: undefined};
	}
	return moveTo(typed, entry.row + 1);
}

/**
 * One key while a test is entered: ↑ ↓ move between steps and fields, Enter takes a field and
 * moves on, and on the sign line holds every result against the sheet and signs. Esc asks
 * before entries are dropped. The notice shown on starting goes with the first change.
 */
export function testEntryKey(entry: TestEntry, input: string, key: Key, arrival: Arrival, actions: TestEntryActions): TestEntry {
	const next = entryKey(entry, input, key, arrival, actions);
	if (next === entry || !next.notice) return next;
	const {notice: _, ...rest} = next;
	return rest;
}

/** One key, as testEntryKey describes it, the notice left as it is. */
function entryKey(entry: TestEntry, input: string, key: Key, arrival: Arrival, actions: TestEntryActions): TestEntry {
	if (entry.recorded) {
		if (key.return || key.escape) actions.leave(`Recorded: ${entry.recorded.path}`);
		return entry;
	}
	if (entry.leaving) {
		// Discarding drops every entry: only a d pressed on its own does it.
		if (input === 'd' && arrival.alone) actions.leave('Test discarded; nothing was recorded');
		if (key.escape || input === 's') return {...entry, leaving: false};
		return entry;
	}
	if (key.escape) {
		if (!hasEntries(entry)) actions.leave('No test entered; nothing was recorded');
		return {...entry, leaving: true};
	}
	if (key.upArrow || key.downArrow) return moveTo(entry, entry.row + (key.upArrow ? -1 : 1));
	if (key.pageDown) return moveTo(entry, entry.steps.length);
	if (entry.row < entry.steps.length) return stepKey(entry, input, key, arrival, actions);
	if (entry.row < signRow(entry)) {
		const field = peopleFields[entry.row - entry.steps.length]!.key;
		const change = typeInto(entry.people[field], input, key);
		const typed = {...entry, people: {...entry.people, [field]: change.text}};
		return change.submit ? moveTo(typed, entry.row + 1) : typed;
	}
	if (input === '?') actions.help();
	if (!key.return) return entry;
	if (!arrival.alone) return {...entry, message: signAloneMessage};
	const results = entryResults(entry, actions.now());
	if (!results.ok) return {...entry, row: results.row, part: 'result', message: results.message};
	const signed = actions.sign(entry, results.results);
	if (!signed.ok) return {...entry, message: `Not recorded: ${signed.message}`};
	return {...entry, recorded: signed.recorded, message: undefined};
}
