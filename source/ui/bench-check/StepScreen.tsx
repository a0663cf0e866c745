import {Box, type Key} from 'ink';
import {Text} from '../Text.js';
import {useKeystrokes, type Arrival} from '../use-keystrokes.js';
import {readAnswerKey, strayMessage} from '../answer-key.js';
import {useRef} from 'react';
import {useRefState} from '../use-ref-state.js';
import {shownDerived} from '../../rules/evaluate/shown-derived.js';
import {wrap} from '../../shared/wrap.js';
import {ChecksPanel, derivedLines} from './ChecksPanel.js';
import {FieldList} from './FieldList.js';
import {answerConfirmation, answeredByRecord, enterInput, stepFields, type Field, type Session} from './session.js';
import {typeInto} from '../text-buffer.js';
import {discardAnswer, discardQuestion} from '../discard-question.js';

/** Props of one step of the bench check. */
export type StepScreenProps = {
	session: Session;
	/** The latest session, even before React has re-rendered (keys can arrive faster than frames). */
	getSession(): Session;
	stepIndex: number;
	rows: number;
	width: number;
	onSession(session: Session): void;
	/** Go to another step; past the last one means the summary. */
	onStep(index: number): void;
	onBack(): void;
	onHelp(): void;
	/** False while the help overlay covers the step: keys go to the overlay, and the field in focus is kept. @default true */
	active?: boolean;
};

/**
 * `suggested`: the buffer holds a default not typed by the operator; the first key replaces it.
 * `stray`: text typed on a question answered by single keys; held, shown, and never an answer.
 */
type Editor = {focus: number; buffer: string; choice: number; message?: string; noteMode: boolean; suggested?: boolean; stray: string; /** While the step's verdicts are reviewed: the first check shown. */ reviewFrom?: number; /** Esc was pressed with a change not entered: the step asks whether to discard it. */ asking?: boolean};

const confirmationKeys = {y: 'yes', n: 'no', a: 'not_applicable'} as const;
const yesNoKeys = {y: 'yes', n: 'no'} as const;

/** The keys that answer a confirmation, as the messages name them. */
const confirmationKeyWords = (field: Field) => (field.kind === 'confirmation' && field.confirmation.not_applicable === 'forbidden' ? 'y or n' : 'y, n or a');

function initialBuffer(session: Session, field: Field | undefined): string {
	if (!field || field.kind !== 'input') return '';
	const entry = session.entries[field.id];
	if (entry !== undefined) return entry;
	const fallback = field.input.kind === 'quantity' ? field.input.default : undefined;
	return fallback === undefined ? '' : String(fallback);
}

function initialChoice(session: Session, field: Field | undefined): number {
	if (!field || field.kind !== 'input' || field.input.kind !== 'choice') return 0;
	const options = Object.keys(field.input.options);
	const current = session.entries[field.id] ?? field.input.default;
	return Math.max(0, current === undefined ? 0 : options.indexOf(current));
}

/** True when the field in focus holds a value typed or chosen and not yet entered (a suggested default is not a change). */
function pendingChange(session: Session, field: Field | undefined, editor: Editor): boolean {
	if (!field || field.kind !== 'input' || editor.suggested) return false;
	if (field.input.kind === 'choice') return editor.choice !== initialChoice(session, field);
	if (field.input.kind === 'yes_no') return false;
	return editor.buffer.trim() !== (session.entries[field.id] ?? initialBuffer(session, field)).trim();
}

/** A field's label, short enough for the question to fit its line. */
function shortLabel(field: Field): string {
	// Drawn through the screens' Text, which strips what came from the rule file.
	const label = field.kind === 'input' ? field.input.label : field.confirmation.statement;
	return label.length > 40 ? `${label.slice(0, 39)}…` : label;
}

function editorFor(session: Session, field: Field | undefined, focus: number): Editor {
	const suggested = field?.kind === 'input' && session.entries[field.id] === undefined && initialBuffer(session, field) !== '';
	return {focus, buffer: initialBuffer(session, field), choice: initialChoice(session, field), noteMode: false, suggested, stray: ''};
}

/** One step: its fields, typed into with the keyboard, and its checks updating as answers change. */
export function StepScreen({session, getSession, stepIndex, rows, width, onSession, onStep: toStep, onBack: back, onHelp, active = true}: StepScreenProps) {
	// Keys are handled against a ref, not render state: several keys can arrive before the next frame.
	const editor = useRefState<Editor>(() => editorFor(session, stepFields(session, stepIndex)[0], 0));
	// Once this step is left, keys still in the same read belong to the screen that follows, not to
	// this step's fields: PgDn PgUp carry on from the step gone to, anything else is dropped.
	const left = useRef<number | undefined>(undefined);
	const onStep = (index: number) => {
		left.current = index;
		toStep(index);
	};
	const onBack = () => {
		left.current = -1;
		back();
	};

	const update = editor.patch;
	const fieldsNow = () => stepFields(getSession(), stepIndex);
	const focusTo = (index: number) => {
		const current = getSession();
		editor.set(editorFor(current, stepFields(current, stepIndex)[index], index));
	};
	/** After the last answer the step stays, showing its verdicts, until the user moves on. */
	const hasVerdicts = () => session.evaluation.checks.some((check) => check.step === session.rules.rules.steps[stepIndex]!.id);
	const move = (delta: number) => {
		const next = editor.current.focus + delta;
		const count = fieldsNow().length;
		if (next === count && count > 0 && hasVerdicts()) editor.set({...editorFor(getSession(), undefined, count)});
		else if (next >= count) onStep(stepIndex + 1);
		else if (next < 0) {
			if (stepIndex > 0) onStep(stepIndex - 1);
		} else focusTo(next);
	};
	const apply = (result: ReturnType<typeof enterInput>): boolean => {
		if (!result.ok) {
			update({message: result.message});
			return false;
		}
		editor.current = {...editor.current, message: undefined};
		onSession(result.session);
		return true;
	};
	/** Commits what was typed; false when it was refused (the cursor stays). */
	const commit = (field: Field, text: string): boolean => {
		if (field.kind !== 'input') return true;
		const current = getSession();
		if ((current.entries[field.id] ?? '') === text.trim()) return true;
		return apply(enterInput(current, field.id, text));
	};
	const confirm = (field: Field, answer: 'yes' | 'no' | 'not_applicable', note?: string): boolean => {
		if (field.kind !== 'confirmation') return false;
		const current = getSession();
		return apply(answerConfirmation(current, field.id, answer, note ?? current.confirmations[field.id]?.note));
	};

	useKeystrokes(handleKey, {isActive: active});
	function handleKey(input: string, key: Key, arrival: Arrival) {
		if (key.ctrl) return;
		if (left.current !== undefined) {
			const gone = left.current;
			const last = session.rules.rules.steps.length - 1;
			if (gone >= 0 && gone <= last && key.pageDown) onStep(gone + 1);
			else if (gone > 0 && gone <= last && key.pageUp) onStep(gone - 1);
			return;
		}
		const state = editor.current;
		const fields = fieldsNow();
		const field = fields[Math.min(state.focus, fields.length - 1)];
		if (state.noteMode && field) {
			if (key.escape) return update({noteMode: false});
			const change = typeInto(state.buffer, input, key);
			update({buffer: change.text});
			if (!change.submit) return;
			const answered = field.kind === 'confirmation' ? getSession().confirmations[field.id]?.answer : undefined;
			if (confirm(field, answered ?? 'not_applicable', change.text)) move(1);
			return;
		}
		if (state.asking) return discardAnswer(input, arrival) === 'discard' ? onBack() : update({asking: false});
		if (key.pageDown || key.pageUp) {
			if (key.pageUp && stepIndex === 0) return;
			// As ↑ ↓ leave a field: a value typed and not yet entered is entered first; refused, the cursor stays with the reason.
			if (field?.kind === 'input' && (field.input.kind === 'quantity' || field.input.kind === 'text') && pendingChange(getSession(), field, state) && !commit(field, state.buffer)) return;
			return onStep(stepIndex + (key.pageDown ? 1 : -1));
		}
		// Esc never drops a change silently: it asks first.
		if (key.escape) return pendingChange(getSession(), field, state) ? update({asking: true}) : onBack();
		if (fields.length > 0 && state.focus >= fields.length) {
			// Reviewing the step's verdicts: on, or back to the last field.
			const from = state.reviewFrom ?? 0;
			const checkCount = session.evaluation.checks.filter((check) => check.step === session.rules.rules.steps[stepIndex]!.id).length;
			if (key.return) onStep(stepIndex + 1);
			else if (key.downArrow) update({reviewFrom: Math.min(Math.max(0, checkCount - 1), from + 1)});
			else if (key.upArrow) return from > 0 ? update({reviewFrom: from - 1}) : focusTo(fields.length - 1);
			else if (input === '?' && arrival.alone) onHelp();
			return;
		}
		if (!field) {
			if (key.return) onStep(stepIndex + 1);
			return;
		}
		const typing = field.kind === 'input' && (field.input.kind === 'quantity' || field.input.kind === 'text');
		if (input === '?' && arrival.alone && state.stray === '' && (!typing || state.buffer === '')) return onHelp();
		if (key.upArrow || key.downArrow) {
			if (typing && !commit(field, state.buffer)) return;
			return move(key.upArrow ? -1 : 1);
		}
		if (field.kind === 'confirmation' && answeredByRecord(getSession(), field.id)) {
			// The interlock test record answers it; a key typed here would be overruled, so it is not taken.
			if (key.return) move(1);
			return;
		}
		if (field.kind === 'confirmation') {
			const read = readAnswerKey(confirmationKeys, state.stray, input, key, arrival);
			const words = confirmationKeyWords(field);
			if (read.kind === 'refused') return update({stray: read.stray, message: strayMessage(words, '; Tab adds a note to an answer')});
			if (read.kind === 'cleared') return update({stray: '', message: undefined});
			if (read.kind === 'answer') {
				if (read.answer === 'not_applicable' && field.confirmation.not_applicable !== 'forbidden' && !getSession().confirmations[field.id]?.note) {
					return update({buffer: '', noteMode: true});
				}
				if (confirm(field, read.answer)) move(1);
				return;
			}
			if (key.tab) {
				const answered = getSession().confirmations[field.id];
				// A note belongs to an answer: saving one must not answer the confirmation on the operator's behalf.
				if (!answered) return update({message: `answer first (${words}${state.stray ? ', once Backspace has cleared the typed text' : ''}); Tab adds a note to the answer`});
				// Typed text becomes the note only now, on purpose, and is saved only with Enter.
				return update({buffer: [answered.note, state.stray].filter(Boolean).join(' '), noteMode: true, stray: '', message: undefined});
			}
			if (key.return) return state.stray ? update({message: strayMessage(words, '; Tab adds a note to an answer')}) : move(1);
			return;
		}
		if (field.input.kind === 'choice') {
			const options = Object.keys(field.input.options);
			if (key.leftArrow || key.rightArrow) return update({choice: (state.choice + (key.rightArrow ? 1 : options.length - 1)) % options.length});
			const digit = Number(input);
			if (digit >= 1 && digit <= options.length) return update({choice: digit - 1});
			if (key.return && commit(field, options[state.choice]!)) move(1);
			return;
		}
		if (field.input.kind === 'yes_no') {
			const read = readAnswerKey(yesNoKeys, state.stray, input, key, arrival);
			if (read.kind === 'refused') return update({stray: read.stray, message: strayMessage('y or n')});
			if (read.kind === 'cleared') return update({stray: '', message: undefined});
			if (read.kind === 'answer') return commit(field, read.answer) ? move(1) : undefined;
			if (key.return) return state.stray ? update({message: strayMessage('y or n')}) : move(1);
			return;
		}
		// A suggested default is accepted with Enter, or replaced by the first key typed.
		const start = state.suggested && !key.return && (input !== '' || key.backspace || key.delete) ? '' : state.buffer;
		const change = typeInto(start, input, key);
		editor.current = {...state, buffer: change.text, suggested: false};
		if (change.submit && commit(field, change.text)) return move(1);
		editor.redraw();
	}

	const fields = stepFields(session, stepIndex);
	const step = session.rules.rules.steps[stepIndex]!;
	const state = editor.current;
	const checks = session.evaluation.checks.filter((check) => check.step === step.id);
	// On a short terminal the checks panel gives way so that more fields stay in view.
	const panelRows = Math.min(rows < 30 ? 6 : 8, Math.max(2, checks.length * 2));
	const derived = shownDerived(session.evaluation, step.id);
	const summary = step.summary ? wrap(step.summary, width) : [];
	const steps = session.rules.rules.steps;
	if (fields.length > 0 && state.focus >= fields.length) {
		const next = steps[stepIndex + 1];
		// Title, the answered line, two blank lines, the line to go on, and the "… more" line of the panel.
		return (
			<Box flexDirection="column">
				<Text bold>
					Step {stepIndex + 1} of {steps.length}: {step.title}
				</Text>
				<Text dimColor wrap="truncate">
					{(state.reviewFrom ?? 0) > 0 ? `↑ ${state.reviewFrom} more checks above` : `All ${fields.length} fields of this step answered · ↑ back to the last field`}
				</Text>
				<Box marginTop={1} flexDirection="column">
					<ChecksPanel checks={checks} rows={Math.max(4, rows - derived.reduce((sum, shown) => sum + derivedLines(shown, width, true).length, 0) - 7)} derived={derived} width={width} full from={state.reviewFrom ?? 0} />
				</Box>
				<Box marginTop={1}>
					<Text bold wrap="truncate">
						{next ? `Enter or PgDn: on to step ${stepIndex + 2}: ${next.title}` : 'Enter or PgDn: on to the summary'}
					</Text>
				</Box>
			</Box>
		);
	}
	return (
		<Box flexDirection="column">
			<Text bold>
				Step {stepIndex + 1} of {session.rules.rules.steps.length}: {step.title}
			</Text>
			{summary.length > 0 ? <Text dimColor lines>{summary.join('\n')}</Text> : null}
			{state.asking && fields[state.focus] ? (
				<Text bold wrap="wrap">
					{discardQuestion(`"${shortLabel(fields[state.focus]!)}"`)}
				</Text>
			) : null}
			<Box marginTop={1} flexDirection="column">
				{fields.length === 0 ? <Text dimColor>Nothing to answer in this step for this setup. Enter or PgDn to go on.</Text> : null}
				<FieldList
					session={session}
					fields={fields}
					focus={Math.min(state.focus, Math.max(0, fields.length - 1))}
					buffer={state.buffer}
					choice={state.choice}
					{...(state.message ? {message: state.message} : {})}
					noteMode={state.noteMode}
					stray={state.stray}
					rows={Math.max(5, rows - panelRows - derived.length - 6 - summary.length - (state.asking ? 2 : 0))}
					width={width}
				/>
			</Box>
			<Box marginTop={1} flexDirection="column">
				<ChecksPanel checks={checks} rows={panelRows} derived={derived} width={width} />
			</Box>
		</Box>
	);
}
