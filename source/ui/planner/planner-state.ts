import {itemValue, type PlanEditing, type PlanList} from '../../interlock/plan/plan-edit.js';
import {choicesOf, fieldsOf, shownValue, type PlanField} from './plan-fields.js';
import type {TestEntry} from '../functional-test/test-entry.js';
import type {RunForm} from './wire-run-entry.js';

/** An access point or a device, by its list and place. */
export type ItemRef = {list: PlanList; index: number};

/** What the form edits: an item of the plan (each field applied on Enter), or a new one (added as a whole). */
export type FormTarget = {kind: 'edit'; ref: ItemRef} | {kind: 'add'; list: PlanList; values: Record<string, unknown>};

/** The form: the field in focus, what is typed or chosen in it, and why it was refused. `focus` equal to the field count is the Add line. */
export type Form = {target: FormTarget; focus: number; buffer: string; choice: number; message?: string; /** The wire run's own small form, while it is open. */ run?: RunForm; /** Esc was pressed with a change not applied: the form asks whether to discard it. */ asking?: boolean};

/** What the planner shows. */
export type View = {name: 'list'} | {name: 'form'; form: Form} | {name: 'remove'; ref: ItemRef} | {name: 'leave'} | {name: 'findings'; offset: number} | {name: 'record'; entry: TestEntry};

/** The planner's whole state, kept in a ref: keys can arrive faster than frames. */
export type PlannerState = {editing: PlanEditing; selected: number; view: View; notice?: {text: string; error?: boolean}; help: boolean};

/** Every item in the order the list shows them: access points, then devices in wiring order. */
export function itemRefs(editing: PlanEditing): ItemRef[] {
	return [...editing.plan.access_points.map((_, index) => ({list: 'access_points' as const, index})), ...editing.plan.devices.map((_, index) => ({list: 'devices' as const, index}))];
}

/** The id of an item. */
export function itemId(editing: PlanEditing, ref: ItemRef): string {
	return (ref.list === 'devices' ? editing.plan.devices[ref.index]?.id : editing.plan.access_points[ref.index]?.id) ?? '';
}

/** Where an item is in the list's order. */
export function selectionOf(editing: PlanEditing, ref: ItemRef): number {
	return (ref.list === 'devices' ? editing.plan.access_points.length : 0) + ref.index;
}

/** The list a form works on. */
export function formList(target: FormTarget): PlanList {
	return target.kind === 'edit' ? target.ref.list : target.list;
}

/** The fields of the form's item. */
export function formFields(editing: PlanEditing, target: FormTarget): PlanField[] {
	return fieldsOf(formList(target), editing.plan, target.kind === 'edit' ? itemId(editing, target.ref) : undefined);
}

/** A value at a path of a nested object, or undefined. */
export function valueAt(values: Record<string, unknown>, path: readonly string[]): unknown {
	let value: unknown = values;
	for (const part of path) value = value && typeof value === 'object' ? (value as Record<string, unknown>)[part] : undefined;
	return value;
}

/** A copy of a nested object with one value set (or, with undefined, removed, along with a parent left empty). */
export function withValue(values: Record<string, unknown>, path: readonly string[], value: unknown): Record<string, unknown> {
	const [head, ...rest] = path;
	if (head === undefined) return values;
	const next = {...values};
	if (rest.length === 0) {
		if (value === undefined) delete next[head];
		else next[head] = value;
		return next;
	}
	const child = withValue((values[head] as Record<string, unknown> | undefined) ?? {}, rest, value);
	if (Object.keys(child).length === 0) delete next[head];
	else next[head] = child;
	return next;
}

/** The value a field holds now, in the file or in the new item. */
export function formValue(editing: PlanEditing, target: FormTarget, field: PlanField): unknown {
	return target.kind === 'edit' ? itemValue(editing, target.ref.list, target.ref.index, field.path) : valueAt(target.values, field.path);
}

/** The form with the focus on a field: its text, or the place of its value among the choices (-1: none chosen yet). */
export function focusField(editing: PlanEditing, target: FormTarget, focus: number, message?: string): Form {
	const field = formFields(editing, target)[focus];
	const form: Form = {target, focus, buffer: '', choice: -1, ...(message ? {message} : {})};
	if (!field || field.kind === 'run') return form;
	const value = formValue(editing, target, field);
	if (field.kind !== 'choice') return {...form, buffer: value === undefined ? '' : String(value)};
	const unset = value === undefined && !field.optional;
	return {...form, choice: unset ? -1 : choicesOf(field, value).indexOf(shownValue(field, value))};
}

/** The device's wire run to the next device as plain values (as written in the file, or in the new item), or undefined. */
export function runValue(editing: PlanEditing, target: FormTarget): Record<string, unknown> | undefined {
	const value = target.kind === 'edit' ? itemValue(editing, target.ref.list, target.ref.index, ['wire_to_next']) : valueAt(target.values, ['wire_to_next']);
	const plain = value && typeof value === 'object' && 'toJSON' in value ? (value as {toJSON(): unknown}).toJSON() : value;
	return plain && typeof plain === 'object' ? (plain as Record<string, unknown>) : undefined;
}
