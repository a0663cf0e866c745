import type {Key} from 'ink';
import {addItem, draftFieldProblem, setItemField} from '../../interlock/plan/plan-edit.js';
import {choicesOf, shownValue, typedValue, type PlanField} from './plan-fields.js';
import {focusField, formFields, formList, formValue, itemId, selectionOf, withValue, type Form, type PlannerState} from './planner-state.js';
import {typeInto, type Arrival} from '../text-buffer.js';
import {discardAnswer} from '../discard-question.js';
import {planProblemWords} from './plan-problem-words.js';
import {openRunForm, runKey} from './planner-run-keys.js';

const withForm = (state: PlannerState, form: Form): PlannerState => ({...state, view: {name: 'form', form}});

/** What is in the field now as the file would hold it: the typed text, or the chosen option. */
function entered(field: PlanField, form: Form, value: unknown): string | undefined {
	if (field.kind !== 'choice') return form.buffer;
	return form.choice < 0 ? undefined : choicesOf(field, value)[form.choice];
}

/**
 * Applies the field in focus: to the plan for an item being edited (refused with the schema's
 * message, and nothing changed, when the plan would not load), or to the new item's values.
 * Returns undefined when refused; the state then carries the message.
 */
function commit(state: PlannerState, form: Form): {state: PlannerState; applied: boolean} {
	const {editing} = state;
	const field = formFields(editing, form.target)[form.focus];
	if (!field || field.kind === 'run') return {state, applied: true};
	const current = formValue(editing, form.target, field);
	const entry = entered(field, form, current);
	if (entry === undefined || entry.trim() === shownValue(field, current)) return {state: withForm(state, {...form, message: undefined}), applied: true};
	const value = typedValue(field, entry);
	const path = value === undefined && field.removes ? field.removes : field.path;
	if (form.target.kind === 'add') {
		const values = withValue(form.target.values, path, value);
		const problem = draftFieldProblem(editing, form.target.list, values, field.path);
		if (problem) return {state: withForm(state, {...form, message: planProblemWords(problem, editing.plan)}), applied: false};
		return {state: withForm(state, {...form, target: {...form.target, values}, message: undefined}), applied: true};
	}
	const {list, index} = form.target.ref;
	const result = setItemField(editing, list, index, path, value);
	if (!result.ok) return {state: withForm(state, {...form, message: planProblemWords(result.message, editing.plan)}), applied: false};
	const notice = {text: `${itemId(result.editing, form.target.ref)}: ${field.label.toLowerCase()} ${value === undefined ? 'left out' : `set to ${shownValue(field, value)}`}`};
	return {state: {...state, editing: result.editing, notice, view: {name: 'form', form: {...form, message: undefined}}}, applied: true};
}

function moveTo(state: PlannerState, form: Form, focus: number): PlannerState {
	const last = formFields(state.editing, form.target).length - (form.target.kind === 'add' ? 0 : 1);
	return withForm(state, focusField(state.editing, form.target, Math.max(0, Math.min(last, focus))));
}

/** Adds the new item; a refusal names the field and moves the focus to it. */
function add(state: PlannerState, form: Form): PlannerState {
	if (form.target.kind !== 'add') return state;
	const list = formList(form.target);
	const result = addItem(state.editing, list, form.target.values);
	if (!result.ok) {
		const fields = formFields(state.editing, form.target);
		const prefix = `${list}.${list === 'devices' ? state.editing.plan.devices.length : state.editing.plan.access_points.length}.`;
		const focus = fields.findIndex((field) => result.field === `${prefix}${field.path.join('.')}` || result.field?.startsWith(`${prefix}${field.path.join('.')}.`));
		const message = planProblemWords(focus >= 0 ? result.message.replace(`${result.field}: `, '') : result.message, state.editing.plan);
		return withForm(state, {...focusField(state.editing, form.target, focus >= 0 ? focus : form.focus), message});
	}
	const ref = {list, index: (list === 'devices' ? result.editing.plan.devices.length : result.editing.plan.access_points.length) - 1};
	const what = list === 'devices' ? 'device (at the end of the wiring order; [ ] moves it)' : 'access point';
	return {...state, editing: result.editing, selected: selectionOf(result.editing, ref), view: {name: 'list'}, notice: {text: `Added ${itemId(result.editing, ref)}, a new ${what}`}};
}

/** True when the form holds something not yet in the plan: a field typed or chosen and not applied, or a new item's values. */
export function formPending(state: PlannerState, form: Form): boolean {
	if (form.target.kind === 'add' && Object.keys(form.target.values).length > 0) return true;
	const field = formFields(state.editing, form.target)[form.focus];
	if (!field || field.kind === 'run') return false;
	const current = formValue(state.editing, form.target, field);
	const entry = entered(field, form, current);
	return entry !== undefined && entry.trim() !== shownValue(field, current);
}

/** One key in the form. */
export function formKey(state: PlannerState, form: Form, input: string, key: Key, arrival: Arrival): PlannerState {
	const fields = formFields(state.editing, form.target);
	const field = fields[form.focus];
	if (form.run) return runKey(state, form, form.run, input, key, arrival);
	if (form.asking) return discardAnswer(input, arrival) === 'discard' ? {...state, view: {name: 'list'}} : withForm(state, {...form, asking: false});
	// Esc never drops a change silently: it asks first.
	if (key.escape) return formPending(state, form) ? withForm(state, {...form, asking: true}) : {...state, view: {name: 'list'}};
	if (!field) {
		if (key.return) return add(state, form);
		if (key.upArrow) return moveTo(state, form, form.focus - 1);
		if (input === '?') return {...state, help: true};
		return state;
	}
	if (field.kind === 'run' && key.return) return openRunForm(state, form);
	const typing = field.kind !== 'choice' && field.kind !== 'run';
	if (input === '?' && (!typing || form.buffer === '')) return {...state, help: true};
	if (key.upArrow || key.downArrow || key.tab) {
		const committed = commit(state, form);
		if (!committed.applied) return committed.state;
		return moveTo(committed.state, form, form.focus + (key.upArrow ? -1 : 1));
	}
	if (field.kind === 'choice') {
		const options = choicesOf(field, formValue(state.editing, form.target, field));
		if (key.leftArrow || key.rightArrow || input === ' ') {
			const step = key.leftArrow ? options.length - 1 : 1;
			const from = form.choice < 0 ? (key.leftArrow ? 0 : options.length - 1) : form.choice;
			return withForm(state, {...form, choice: (from + step) % options.length, message: undefined});
		}
		const yes = options[0] === 'yes' ? ['y', 'n'].indexOf(input.toLowerCase()) : -1;
		if (yes >= 0) return withForm(state, {...form, choice: yes, message: undefined});
		if (!key.return) return state;
	}
	if (field.kind === 'run') return state;
	const change = field.kind === 'choice' ? {text: form.buffer, submit: true} : typeInto(form.buffer, input, key);
	const typed = {...form, buffer: change.text};
	if (!change.submit) return withForm(state, typed);
	const committed = commit(state, typed);
	if (!committed.applied) return committed.state;
	const view = committed.state.view;
	return view.name === 'form' ? moveTo(committed.state, view.form, form.focus + 1) : committed.state;
}
