import {Box, type Key} from 'ink';
import {Text} from '../Text.js';
import {useEffect, useRef} from 'react';
import {useRefState} from '../use-ref-state.js';
import {deferringEdits, type PendingEdit} from '../../interlock/plan/edit-deferral.js';
import {runInSlices} from '../../services/run-in-slices.js';
import {displayPath} from '../../shared/display-path.js';
import type {PlanEditing} from '../../interlock/plan/plan-edit.js';
import {savePlanEditing} from '../../interlock/plan/save-plan.js';
import {HelpOverlay} from '../HelpOverlay.js';
import {PlanFindings} from './PlanFindings.js';
import {PlanForm} from './PlanForm.js';
import {PlanList} from './PlanList.js';
import {formKey} from './planner-form-keys.js';
import {leaveKey, listKey, removeKey, type ListActions} from './planner-list-keys.js';
import {itemId, type PlannerState, type View} from './planner-state.js';
import {startTestEntry, type TestEntry} from '../functional-test/test-entry.js';
import {testEntryKey} from '../functional-test/test-entry-keys.js';
import {followTestEntry, type TestDrafts} from '../functional-test/test-drafts.js';
import type {TestRecorder} from '../functional-test/test-recorder.js';
import {testKeyLine, TestRecordScreen} from '../functional-test/TestRecordScreen.js';
import {useKeystrokes, type Arrival} from '../use-keystrokes.js';

/** Props of the interlock planner. */
export type PlannerScreenProps = {
	editing: PlanEditing;
	/** Name of the rule file the interlock policy comes from. */
	rulesName: string;
	rows: number;
	width: number;
	/** Reads the plan as saved and signs test records. */
	recorder: TestRecorder;
	/** Keeps unsaved edits on disk after every change, so a crash or Ctrl-C loses none. */
	drafts: PlanDrafts;
	/** Keeps the entries of a test in progress on disk after every change. */
	testDrafts: TestDrafts;
	/** A notice to show first (a draft restored, or one that no longer applies). */
	notice?: {text: string; error?: boolean} | undefined;
	/** Leave the planner (after saving or discarding, when there were changes). */
	onLeave(): void;
};

/** Where the planner keeps unsaved edits between changes. */
export type PlanDrafts = {save(editing: PlanEditing): void; clear(file: string): void};

const keyLines: Record<Exclude<View['name'], 'record'>, string> = {
	list: 'Enter edit · a/d add · x remove · [ ] move · s save · t test · ? help',
	form: 'Enter apply · ↑ ↓ field · ← → choose · Esc back to the list · ? help',
	remove: 'y remove · any other key keeps it',
	leave: 's save and leave · d discard changes and leave · Esc stay',
	findings: '↑ ↓ scroll · Esc back',
};

/** Saves the plan; the notice says where, or why not. */
function save(state: PlannerState): PlannerState {
	const saved = savePlanEditing(state.editing);
	if (!saved.ok) return {...state, notice: {text: `Not saved: ${saved.message}`, error: true}};
	return {...state, editing: saved.editing, notice: {text: `Saved ${displayPath(saved.editing.file)}`}};
}

/** Starts recording a test of the plan file as it is on disk; a file that no longer loads is said in the notice. */
function startTest(state: PlannerState, recorder: TestRecorder, drafts: TestDrafts): PlannerState {
	const opened = recorder.open(state.editing.file);
	if (!opened.ok) return {...state, notice: {text: `No test: ${opened.message}`, error: true}};
	return {...state, view: {name: 'record', entry: drafts.start(startTestEntry(opened.tested, recorder.tester(), new Date()))}};
}

/** One key while a test is entered; the planner's list comes back when it is left or recorded. */
function recordKey(state: PlannerState, entry: TestEntry, input: string, key: Key, arrival: Arrival, recorder: TestRecorder): PlannerState {
	let left: string | undefined;
	let help = false;
	const next = testEntryKey(entry, input, key, arrival, {
		sign: (current, results) => recorder.sign(current.tested, results, current.people.witnessKey.trim() || undefined),
		leave: (text) => (left = text),
		help: () => (help = true),
		now: () => new Date(),
	});
	if (left !== undefined) return {...state, view: {name: 'list'}, notice: {text: left}};
	return next === entry && !help ? state : {...state, help, view: {name: 'record', entry: next}};
}

/** The interlock planner: the plan's items and findings, forms to change them, saving, and recording a test. Findings follow every applied change. */
export function PlannerScreen({editing, rulesName, rows, width, recorder, drafts, testDrafts, notice: first, onLeave}: PlannerScreenProps) {
	// Keys are handled against a ref, not render state: several keys can arrive before the next frame.
	const state = useRefState<PlannerState>(() => ({editing, selected: 0, view: {name: 'list'}, help: false, ...(first ? {notice: first} : {})}));
	// Leaving follows a save or a discard: either way the draft has served.
	const leave = () => {
		drafts.clear(state.current.editing.file);
		onLeave();
	};
	const actions: ListActions = {save, leave, recordTest: (current) => startTest(current, recorder, testDrafts)};
	// A long edit (a plan near the size limit) is worked out a part at a time, so a signal is honoured
	// meanwhile; keys that come in the while wait for it, in order.
	const working = useRef<{queue: Array<[string, Key, Arrival]>; stop: AbortController} | undefined>(undefined);
	useEffect(() => () => working.current?.stop.abort(), []);
	useKeystrokes(handleKey, {isActive: !state.current.help});
	function handleKey(input: string, key: Key, arrival: Arrival) {
		if (working.current) return void working.current.queue.push([input, key, arrival]);
		if (key.ctrl) return;
		const current = state.current;
		const {view} = current;
		let next = current;
		if (view.name !== 'record') {
			const handled = deferringEdits(() => viewKey(current, input, key, arrival));
			if (handled.pending) return workOut(handled.pending, current, [input, key, arrival]);
			next = handled.value;
		} else {
			next = recordKey(current, view.entry, input, key, arrival, recorder);
			const refused = followTestEntry(testDrafts, view.entry, next.view.name === 'record' ? next.view.entry : undefined);
			// The entries could not be saved (disk full, read-only folder): the test goes on, and the screen says why.
			if (refused !== undefined && next.view.name === 'record') next = {...next, view: {...next.view, entry: {...next.view.entry, notice: {text: `the entries could not be saved as a draft: ${refused}`, error: true}}}};
		}
		if (next.editing !== current.editing) {
			if (next.editing.dirty) drafts.save(next.editing);
			else drafts.clear(next.editing.file);
		}
		if (next !== current) state.set(next);
	}

	/** The next state for a key in any view but a test being recorded; free of side effects up to its edits (see deferringEdits). */
	function viewKey(current: PlannerState, input: string, key: Key, arrival: Arrival): PlannerState {
		const {view} = current;
		if (view.name === 'list') return listKey(current, input, key, actions);
		if (view.name === 'form') return formKey(current, view.form, input, key, arrival);
		if (view.name === 'remove') return removeKey(current, view.ref, input, arrival);
		if (view.name === 'leave') return leaveKey(current, input, key, arrival, actions);
		if (view.name !== 'findings') return current;
		if (key.escape) return {...current, view: {name: 'list'}};
		if (key.upArrow || key.downArrow) return {...current, view: {name: 'findings', offset: Math.max(0, view.offset + (key.upArrow ? -1 : 1))}};
		if (input === '?') return {...current, help: true};
		return current;
	}

	/** Works out a long edit a part at a time, then handles the key that asked for it again, and the keys that came meanwhile. */
	function workOut(pending: PendingEdit, before: PlannerState, asked: [string, Key, Arrival]) {
		const stop = new AbortController();
		working.current = {queue: [], stop};
		// Shown meanwhile: the list says so (a question already answered gives way to it); a form stays as it is.
		state.set({...before, ...(before.view.name === 'remove' || before.view.name === 'leave' ? {view: {name: 'list'}} : {}), notice: {text: 'Checking the plan…'}});
		runInSlices(pending.steps, stop.signal).then(
			(result) => {
				if (stop.signal.aborted) return;
				pending.settle(result);
				const queued = working.current?.queue ?? [];
				working.current = undefined;
				state.set(before);
				handleKey(...asked);
				for (const key of queued) handleKey(...key);
			},
			// A bug in the edit is a bug: thrown where nothing catches it, as it would be without the slices.
			(error: unknown) => setImmediate(() => {
				throw error;
			}),
		);
	}

	const {view, notice} = state.current;
	const current = state.current.editing;
	const body = rows - 1;
	const noticeLine = notice ? (
		<Text wrap="truncate" {...(notice.error ? {color: 'red'} : {})}>
			{notice.error ? '✗ ' : '✓ '}
			{notice.text}
		</Text>
	) : (
		<Text> </Text>
	);
	let shown;
	if (view.name === 'form') shown = <PlanForm editing={current} form={view.form} rows={body - 1} />;
	else if (view.name === 'record') shown = <TestRecordScreen entry={view.entry} rows={body} width={width} />;
	else if (view.name === 'findings') shown = <PlanFindings editing={current} offset={view.offset} rows={body} width={width} />;
	else {
		let prompt = noticeLine;
		if (view.name === 'remove') {
			const what = view.ref.list === 'devices' ? 'device' : 'access point';
			prompt = <Text bold wrap="truncate">Remove the {what} {itemId(current, view.ref)} from the plan?</Text>;
		} else if (view.name === 'leave') prompt = <Text bold wrap="truncate">Unsaved changes to {displayPath(current.file)}. Save them before leaving?</Text>;
		shown = <PlanList editing={current} rulesName={rulesName} selected={state.current.selected} rows={body} width={width} prompt={prompt} />;
	}
	const close = () => state.patch({help: false});
	return (
		<Box flexDirection="column">
			{state.current.help ? <HelpOverlay screen={view.name === 'form' ? 'plan-form' : view.name === 'record' ? 'plan-test' : 'planner'} onClose={close} /> : null}
			<Box display={state.current.help ? 'none' : 'flex'} flexDirection="column">
				{shown}
				{view.name === 'form' ? noticeLine : null}
			</Box>
			<Text dimColor wrap="truncate">
				{view.name === 'record' ? testKeyLine(view.entry) : keyLines[view.name]}
			</Text>
		</Box>
	);
}
