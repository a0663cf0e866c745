import type {Key} from 'ink';
import {discardAnswer} from '../discard-question.js';
import type {Arrival} from '../text-buffer.js';
import {draftFieldProblem, setWireRun} from '../../interlock/plan/plan-edit.js';
import {typeInto} from '../text-buffer.js';
import {planProblemWords} from './plan-problem-words.js';
import {itemId, runValue, withValue, type Form, type PlannerState} from './planner-state.js';
import {entryProblem, parseRun, runEntries, runFields, runSummary, type RunForm} from './wire-run-entry.js';

const applyLine = runFields.length;

const withRun = (state: PlannerState, form: Form, run: RunForm | undefined): PlannerState => ({...state, view: {name: 'form', form: run ? {...form, run} : {...form, run: undefined}}});

/** The form of a device's wire run, opened on the run in the file (or the new device's). */
export function openRunForm(state: PlannerState, form: Form): PlannerState {
	const entries = runEntries(runValue(state.editing, form.target));
	return withRun(state, form, {entries, opened: entries, focus: 0});
}

/** Which entry of the form a refused part of the run belongs to. */
function entryOf(message: string): number {
	const part = /wire_to_next\.([a-z_]+)/.exec(message)?.[1];
	return part === 'length' ? 1 : part === 'conductors' ? 2 : 0;
}

/** Applies the run as a whole: to the plan for a device being edited (refused in words when the plan would not load), or to the new device's values. */
function apply(state: PlannerState, form: Form, run: RunForm): PlannerState {
	const parsed = parseRun(run.entries);
	if (!parsed.ok) return withRun(state, form, {...run, focus: parsed.at, message: parsed.message});
	const {editing} = state;
	const said = parsed.run ? `set to ${runSummary(parsed.run)}` : 'left out';
	if (form.target.kind === 'add') {
		const values = withValue(form.target.values, ['wire_to_next'], parsed.run);
		const problem = draftFieldProblem(editing, form.target.list, values, ['wire_to_next']);
		if (problem) return withRun(state, form, {...run, focus: entryOf(problem), message: planProblemWords(problem, editing.plan)});
		return {...state, notice: {text: `the new device: wire run to the next device ${said}`}, view: {name: 'form', form: {...form, target: {...form.target, values}, run: undefined, message: undefined}}};
	}
	const result = setWireRun(editing, form.target.ref.index, parsed.run);
	if (!result.ok) return withRun(state, form, {...run, focus: entryOf(result.message), message: planProblemWords(result.message, editing.plan)});
	const notice = {text: `${itemId(result.editing, form.target.ref)}: wire run to the next device ${said}`};
	return {...state, editing: result.editing, notice, view: {name: 'form', form: {...form, run: undefined, message: undefined}}};
}

/** One key in the wire run's form: type the size, length and conductors; Enter on the Apply line applies the three together. */
export function runKey(state: PlannerState, form: Form, run: RunForm, input: string, key: Key, arrival: Arrival): PlannerState {
	if (run.asking) return discardAnswer(input, arrival) === 'discard' ? withRun(state, form, undefined) : withRun(state, form, {...run, asking: false});
	if (key.escape) {
		const changed = runFields.some(({key: entry}) => run.entries[entry].trim() !== run.opened[entry].trim());
		return withRun(state, form, changed ? {...run, asking: true} : undefined);
	}
	if (key.upArrow || key.downArrow || key.tab) return withRun(state, form, {...run, focus: Math.max(0, Math.min(applyLine, run.focus + (key.upArrow ? -1 : 1)))});
	const entry = runFields[run.focus];
	if (!entry) {
		if (key.return) return apply(state, form, run);
		if (input === '?') return {...state, help: true};
		return state;
	}
	if (input === '?' && run.entries[entry.key] === '') return {...state, help: true};
	const change = typeInto(run.entries[entry.key], input, key);
	const entries = {...run.entries, [entry.key]: change.text};
	if (change.submit && change.text.trim() !== '') {
		// An entry that cannot be what its field asks for is refused at once, where it was typed.
		const message = entryProblem(entry.key, change.text);
		if (message) return withRun(state, form, {...run, entries, message});
	}
	return withRun(state, form, {...run, entries, ...(change.submit ? {focus: run.focus + 1} : {}), message: undefined});
}
