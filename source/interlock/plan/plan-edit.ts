import {isMap, isSeq, type Document} from 'yaml';
import {describeProblem, type Problem} from '../../shared/problems.js';
import {failure, success, type Result} from '../../shared/result.js';
import type {CompiledRules} from '../../rules/compile/compiled-rules.js';
import {readTextFile} from '../../shared/yaml-source.js';
import {analysePlan, type PlanAnalysis} from '../analysis/analyse.js';
import {finish, type Steps} from '../../shared/steps.js';
import {deferredEdit} from './edit-deferral.js';
import {loadPlanFromTextSteps, planFileExpected} from './load-plan.js';
import type {Plan} from './plan-schema.js';
import {planDocumentSteps, planDocumentText} from './plan-yaml.js';
import {interlockPolicy, type InterlockPolicy} from './policy.js';

/** The two lists of a plan that the planner edits item by item. */
export type PlanList = 'access_points' | 'devices';

/**
 * A plan open for editing: its YAML document (comments and key order kept), the plan it
 * validates to under the policy in force, and the analysis of that plan. Never invalid: an
 * edit that the plan schema refuses is not applied.
 */
export type PlanEditing = {
	file: string;
	/** The text as read or last saved; unchanged lines keep their layout from it. */
	original: string;
	document: Document;
	policy: InterlockPolicy;
	plan: Plan;
	analysis: PlanAnalysis;
	/** True when there are edits not yet saved. */
	dirty: boolean;
	/** The text of `document` worked out by the edit that made it, so a draft save need not write it again. */
	written?: {document: Document; original: string; text: string};
};

/** An edit applied, or refused with the message to show beside the field. */
export type EditResult = {ok: true; editing: PlanEditing} | {ok: false; message: string; field?: string};

/** Opens a plan file for editing under the interlock policy of the rule file in force. */
export function openPlanForEditing(file: string, rules: CompiledRules): Result<PlanEditing, Problem> {
	return finish(openPlanForEditingSteps(file, rules));
}

/** The same, in steps (read, parse, validate, parse for editing, analyse: long for a plan near the size limit). */
export function* openPlanForEditingSteps(file: string, rules: CompiledRules): Steps<Result<PlanEditing, Problem>> {
	const policy = interlockPolicy(rules);
	if (!policy.ok) return policy;
	const text = readTextFile(file, planFileExpected);
	if (!text.ok) return text;
	yield;
	return yield* planEditingFromTextSteps(text.value, file, policy.value);
}

/** The same, for text already in hand (and after a save). */
export function planEditingFromText(text: string, file: string, policy: InterlockPolicy): Result<PlanEditing, Problem> {
	return finish(planEditingFromTextSteps(text, file, policy));
}

/** The same, in steps. */
export function* planEditingFromTextSteps(text: string, file: string, policy: InterlockPolicy): Steps<Result<PlanEditing, Problem>> {
	const loaded = yield* loadPlanFromTextSteps(text, file);
	if (!loaded.ok) return loaded;
	const plan = {...loaded.value, policy};
	yield;
	const document = yield* planDocumentSteps(text);
	yield;
	return success({file, original: text, document, policy, plan, analysis: analysePlan(plan), dirty: false}, loaded.warnings);
}

/** The text the plan would be saved as. */
export function planEditingText(editing: PlanEditing): string {
	const {written} = editing;
	if (written && written.document === editing.document && written.original === editing.original) return written.text;
	return planDocumentText(editing.document, editing.original);
}

/** What an edit says while it is still being worked out (shown by no one: the planner asks again when it is done). */
const stillChecking = 'the plan is still being checked';

/**
 * Applies a change to a copy of the document and validates the whole plan again, exactly as
 * loading the file would. `field` (a dotted path) picks the problem to report when refused.
 */
function attempt(editing: PlanEditing, key: unknown[], change: (document: Document) => void, field?: string): EditResult {
	const steps = () => attemptSteps(editing, change, field);
	// Inside the planner's key handling a long edit is worked out a part at a time (edit-deferral.ts).
	const deferred = deferredEdit(editing, JSON.stringify([...key, field ?? null]), steps);
	if (deferred === 'pending') return {ok: false, message: stillChecking};
	return deferred ? deferred.result : finish(steps());
}

/** The steps of an edit; each of the four is long for a plan near the size limit (clone, write, parse, validate). */
function* attemptSteps(editing: PlanEditing, change: (document: Document) => void, field: string | undefined): Steps<EditResult> {
	const document = editing.document.clone();
	change(document);
	yield;
	const text = planDocumentText(document, editing.original);
	yield;
	const loaded = yield* loadPlanFromTextSteps(text, editing.file);
	if (!loaded.ok) return refusal(loaded.errors, field);
	const plan = {...loaded.value, policy: editing.policy};
	return {ok: true, editing: {...editing, document, plan, analysis: analysePlan(plan), dirty: true, written: {document, original: editing.original, text}}};
}

function related(problemField: string | undefined, field: string): boolean {
	if (problemField === undefined) return false;
	return problemField === field || field.startsWith(`${problemField}.`) || problemField.startsWith(`${field}.`);
}

function refusal(problems: Problem[], field: string | undefined): EditResult {
	const found = (field === undefined ? undefined : problems.find((entry) => related(entry.field, field))) ?? problems[0]!;
	const message = found.field === undefined || found.field === field ? describeProblem(found) : `${found.field}: ${describeProblem(found)}`;
	return {ok: false, message, ...(found.field === undefined ? {} : {field: found.field})};
}

/** Sets (or, with undefined, removes) one field of an item; a nested map left empty is removed too. */
export function setItemField(editing: PlanEditing, list: PlanList, index: number, path: readonly string[], value: unknown): EditResult {
	const at = [list, index, ...path];
	return attempt(
		editing,
		['set', list, index, path, value === undefined ? {left: 'out'} : {value}],
		(document) => {
			if (value !== undefined) return document.setIn(at, value);
			document.deleteIn(at);
			const parent = at.slice(0, -1);
			const left = path.length > 1 ? document.getIn(parent) : undefined;
			if (isMap(left) && left.items.length === 0) document.deleteIn(parent);
		},
		at.join('.'),
	);
}

/** Sets (or, with undefined, removes) a device's wire run to the next device as a whole, written as a flow map like the demo's. */
export function setWireRun(editing: PlanEditing, index: number, run: Record<string, unknown> | undefined): EditResult {
	const at = ['devices', index, 'wire_to_next'];
	return attempt(
		editing,
		['wire', index, run === undefined ? {left: 'out'} : {run}],
		(document) => {
			if (run === undefined) return document.deleteIn(at);
			const node = document.createNode(run);
			node.flow = true;
			document.setIn(at, node);
		},
		at.join('.'),
	);
}

/** Adds an item at the end of its list (a device: at the end of the wiring order). Wire runs are written as flow maps. */
export function addItem(editing: PlanEditing, list: PlanList, values: Record<string, unknown>): EditResult {
	const index = list === 'devices' ? editing.plan.devices.length : editing.plan.access_points.length;
	return attempt(editing, ['add', list, values], (document) => {
		const node = document.createNode(values);
		for (const pair of node.items) if (isMap(pair.value) && String(pair.key) === 'wire_to_next') pair.value.flow = true;
		document.addIn([list], node);
	}, `${list}.${index}`);
}

/** The problem with one field of an item not yet added, or undefined when that field is fine (other fields may still be missing). */
export function draftFieldProblem(editing: PlanEditing, list: PlanList, values: Record<string, unknown>, path: readonly string[]): string | undefined {
	const index = list === 'devices' ? editing.plan.devices.length : editing.plan.access_points.length;
	const field = [list, index, ...path].join('.');
	const result = attempt(editing, ['draft', list, values], (document) => document.addIn([list], document.createNode(values)), field);
	if (result.ok || !related(result.field, field) || result.field === `${list}.${index}`) return undefined;
	return result.message;
}

/** Removes an item. Removing the last device is refused (a loop needs one). */
export function removeItem(editing: PlanEditing, list: PlanList, index: number): EditResult {
	return attempt(editing, ['remove', list, index], (document) => document.deleteIn([list, index]), list);
}

/** Moves a device one place earlier (-1) or later (+1) in the wiring order; its comments move with it. */
export function moveDevice(editing: PlanEditing, index: number, delta: -1 | 1): EditResult {
	const target = index + delta;
	if (target < 0 || target >= editing.plan.devices.length) return {ok: false, message: delta < 0 ? 'already first in the wiring order' : 'already last in the wiring order'};
	return attempt(editing, ['move', index, delta], (document) => {
		const devices = document.get('devices', true);
		if (!isSeq(devices)) return;
		const [moved] = devices.items.splice(index, 1);
		devices.items.splice(target, 0, moved);
	});
}

/** An item's value at a path as written in the file (a string, number or boolean), or undefined. */
export function itemValue(editing: PlanEditing, list: PlanList, index: number, path: readonly string[]): unknown {
	return editing.document.getIn([list, index, ...path]);
}

/** The editing state after a save of `text`: nothing left unsaved. */
export function savedEditing(editing: PlanEditing, text: string): Result<PlanEditing, Problem> {
	const reopened = planEditingFromText(text, editing.file, editing.policy);
	return reopened.ok ? success(reopened.value) : failure(reopened.errors);
}
