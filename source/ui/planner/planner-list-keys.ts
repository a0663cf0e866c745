import type {Key} from 'ink';
import {moveDevice, removeItem} from '../../interlock/plan/plan-edit.js';
import type {Arrival} from '../text-buffer.js';
import {planProblemWords} from './plan-problem-words.js';
import {focusField, itemId, itemRefs, selectionOf, type ItemRef, type PlannerState} from './planner-state.js';

/** What the list's keys need from outside: saving writes a file, leaving changes screen, a test starts from the file on disk. */
export type ListActions = {save(state: PlannerState): PlannerState; leave(): void; recordTest(state: PlannerState): PlannerState};

const what = (ref: ItemRef) => (ref.list === 'devices' ? 'device' : 'access point');

/** One key on the list of access points and devices. */
export function listKey(state: PlannerState, input: string, key: Key, actions: ListActions): PlannerState {
	const refs = itemRefs(state.editing);
	const ref = refs[Math.min(state.selected, refs.length - 1)];
	const quiet = {...state, notice: undefined};
	if (key.escape) {
		if (state.editing.dirty) return {...quiet, view: {name: 'leave'}};
		actions.leave();
		return state;
	}
	if (key.upArrow) return {...quiet, selected: Math.max(0, state.selected - 1)};
	if (key.downArrow) return {...quiet, selected: Math.min(refs.length - 1, state.selected + 1)};
	if (input === '?') return {...state, help: true};
	if (input === 's') return actions.save(state);
	if (input === 'f') return {...quiet, view: {name: 'findings', offset: 0}};
	if (input === 't') {
		// A test is of the plan as wired, and the record holds the file's exact text: never of edits not yet saved.
		if (state.editing.dirty) return {...state, notice: {text: 'The plan has unsaved changes: save them first (s); a test records the plan as saved', error: true}};
		return actions.recordTest(quiet);
	}
	if (input === 'a' || input === 'd') {
		const target = {kind: 'add' as const, list: input === 'a' ? ('access_points' as const) : ('devices' as const), values: {}};
		return {...quiet, view: {name: 'form', form: focusField(state.editing, target, 0)}};
	}
	if (!ref) return state;
	if (key.return) return {...quiet, view: {name: 'form', form: focusField(state.editing, {kind: 'edit', ref}, 0)}};
	if (input === 'x' || key.delete) return {...quiet, view: {name: 'remove', ref}};
	if (input === '[' || input === ']') {
		if (ref.list !== 'devices') return {...state, notice: {text: 'Only devices have a wiring order; [ ] move a device', error: true}};
		const moved = moveDevice(state.editing, ref.index, input === '[' ? -1 : 1);
		if (!moved.ok) return {...state, notice: {text: `${itemId(state.editing, ref)} is ${moved.message}`, error: true}};
		const at = {list: 'devices' as const, index: ref.index + (input === '[' ? -1 : 1)};
		return {...quiet, editing: moved.editing, selected: selectionOf(moved.editing, at), notice: {text: `Moved ${itemId(moved.editing, at)} to place ${at.index + 1} of ${moved.editing.plan.devices.length} in the wiring order`}};
	}
	return state;
}

/** One key on the question whether to remove an item: y pressed alone removes, anything else (a y of a paste too) keeps it. */
export function removeKey(state: PlannerState, ref: ItemRef, input: string, arrival: Arrival): PlannerState {
	if (input.toLowerCase() !== 'y' || !arrival.alone) return {...state, view: {name: 'list'}, notice: {text: 'Nothing removed'}};
	const id = itemId(state.editing, ref);
	const removed = removeItem(state.editing, ref.list, ref.index);
	if (!removed.ok) return {...state, view: {name: 'list'}, notice: {text: `${id} not removed: ${planProblemWords(removed.message, state.editing.plan)}`, error: true}};
	const count = itemRefs(removed.editing).length;
	return {...state, editing: removed.editing, selected: Math.min(state.selected, count - 1), view: {name: 'list'}, notice: {text: `Removed the ${what(ref)} ${id}`}};
}

/** One key on the question asked when leaving with unsaved changes: s save and leave, d discard and leave (each pressed alone), Esc stay. */
export function leaveKey(state: PlannerState, input: string, key: Key, arrival: Arrival, actions: ListActions): PlannerState {
	if (!arrival.alone) return state;
	if (input === 's') {
		const saved = actions.save({...state, view: {name: 'list'}});
		if (!saved.editing.dirty) actions.leave();
		return saved;
	}
	if (input === 'd') {
		actions.leave();
		return state;
	}
	if (key.escape || input === 'n') return {...state, view: {name: 'list'}};
	return state;
}
