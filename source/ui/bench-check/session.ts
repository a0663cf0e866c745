import type {InterlockLink} from '../../interlock/functional-test/test-link.js';
import type {Answers, ConfirmationAnswer, InputAnswer} from '../../rules/evaluate/answers.js';
import type {CompiledRules} from '../../rules/compile/compiled-rules.js';
import {evaluate} from '../../rules/evaluate/evaluate.js';
import type {Evaluation} from '../../rules/evaluate/evaluation.js';
import {parseConfirmationEntry, parseInputEntry} from '../../rules/evaluate/input-entry.js';
import {foldLegacyTolerances} from '../../rules/evaluate/legacy-tolerance.js';
import {describeProblem, problem} from '../../shared/problems.js';
import type {Confirmation, Input, Step} from '../../rules/file/schema.js';

/** Everything the bench-check screens hold; pure data, changed only through the functions below. */
export type Session = {
	rules: CompiledRules;
	setup: string;
	/** What the operator typed for each input, as typed. */
	entries: Readonly<Record<string, string>>;
	/** Confirmation answers with their notes. */
	confirmations: Readonly<Record<string, ConfirmationAnswer>>;
	answers: Answers;
	evaluation: Evaluation;
	/** The interlock test the answers were taken from, when the setup names its interlock plan. */
	interlockTest: InterlockLink | null;
	/** Answers confirmations from the interlock test record (reads files); absent in tests that do not need it. */
	linker?: Linker | undefined;
};

/** Takes answers and gives them back with the confirmations the interlock test answers. */
export type Linker = (answers: Answers) => {answers: Answers; link: InterlockLink | null};

/** What a session starts from: a draft, a saved setup, or nothing. */
export type Prefill = {setup?: string; entries?: Record<string, string>; confirmations?: Record<string, ConfirmationAnswer>};

/** A field of a step: an input that is asked, or a confirmation that applies. */
export type Field = {kind: 'input'; id: string; input: Input} | {kind: 'confirmation'; id: string; confirmation: Confirmation};

function build(rules: CompiledRules, setup: string, entries: Record<string, string>, confirmations: Record<string, ConfirmationAnswer>, linker?: Linker): Session {
	const inputs = new Map<string, InputAnswer>();
	for (const [id, text] of Object.entries(entries)) {
		const compiled = rules.inputs.get(id);
		if (!compiled || text.trim() === '') continue;
		const parsed = parseInputEntry(compiled, text);
		if (parsed.ok) inputs.set(id, parsed.value);
	}
	const given: Answers = {setup, inputs, confirmations: new Map(Object.entries(confirmations).filter(([id]) => rules.confirmations.has(id)))};
	const {answers, link} = linker ? linker(given) : {answers: given, link: null};
	return {rules, setup, entries, confirmations, answers, evaluation: evaluate(rules, answers), interlockTest: link, linker};
}

/** A new session, prefilled from a draft or a saved setup when given. */
export function startSession(rules: CompiledRules, prefill: Prefill = {}, linker?: Linker): Session {
	// A draft or saved setup from before ranges may still give the supply's tolerance as an entry of its own.
	const entries = Object.fromEntries(Object.entries(foldLegacyTolerances({...prefill.entries}, rules).entries).map(([id, text]) => [id, String(text)]));
	return build(rules, prefill.setup ?? '', entries, {...prefill.confirmations}, linker);
}

/** The result of entering a value: the new session, or why the entry was refused (the session unchanged). */
export type EntryResult = {ok: true; session: Session} | {ok: false; message: string};

/** Enters text for an input; an empty entry clears it. A refused entry changes nothing. */
export function enterInput(session: Session, id: string, text: string): EntryResult {
	const compiled = session.rules.inputs.get(id);
	if (!compiled) return {ok: false, message: `no input ${id}`};
	const entries = {...session.entries};
	if (text.trim() === '') {
		delete entries[id];
		return {ok: true, session: build(session.rules, session.setup, entries, {...session.confirmations}, session.linker)};
	}
	const parsed = parseInputEntry(compiled, text);
	if (!parsed.ok) return {ok: false, message: describeProblem(problem(parsed.problem.code, parsed.problem.data))};
	entries[id] = text.trim();
	return {ok: true, session: build(session.rules, session.setup, entries, {...session.confirmations}, session.linker)};
}

/** Answers a confirmation (yes, no, not applicable with a note). */
export function answerConfirmation(session: Session, id: string, answer: ConfirmationAnswer['answer'], note?: string): EntryResult {
	const compiled = session.rules.confirmations.get(id);
	if (!compiled) return {ok: false, message: `no confirmation ${id}`};
	const parsed = parseConfirmationEntry(compiled, answer === 'not_applicable' ? 'not applicable' : answer, note);
	if (!parsed.ok) return {ok: false, message: describeProblem(problem(parsed.problem.code, parsed.problem.data))};
	return {ok: true, session: build(session.rules, session.setup, {...session.entries}, {...session.confirmations, [id]: parsed.value}, session.linker)};
}

/** Names the setup. */
export function nameSetup(session: Session, setup: string): Session {
	return build(session.rules, setup.trim(), {...session.entries}, {...session.confirmations}, session.linker);
}

/** The steps of the rules, in order. */
export function steps(session: Session): readonly Step[] {
	return session.rules.rules.steps;
}

/** The fields of a step that apply now: asked inputs, then confirmations that are not skipped. */
export function stepFields(session: Session, stepIndex: number): Field[] {
	const step = session.rules.rules.steps[stepIndex];
	if (!step) return [];
	const asked = new Set(session.evaluation.askedInputs);
	const skipped = new Set(session.evaluation.confirmations.filter(({status}) => status === 'skip').map(({id}) => id));
	return [
		...step.inputs.filter((input) => asked.has(input.id)).map((input): Field => ({kind: 'input', id: input.id, input})),
		...step.confirmations.filter((confirmation) => !skipped.has(confirmation.id)).map((confirmation): Field => ({kind: 'confirmation', id: confirmation.id, confirmation})),
	];
}

/** True when a confirmation is answered from the interlock test record (the setup names its plan), not by the operator. */
export function answeredByRecord(session: Session, id: string): boolean {
	return session.interlockTest !== null && session.rules.confirmations.get(id)?.confirmation.answered_by === 'interlock_test';
}
