import {describeProblem, problem} from '../shared/problems.js';
import type {Answers, ConfirmationAnswer, InputAnswer} from '../rules/evaluate/answers.js';
import type {CompiledInput, CompiledRules} from '../rules/compile/compiled-rules.js';
import {parseInputEntry} from '../rules/evaluate/input-entry.js';
import {foldLegacyTolerances, foldsTolerances} from '../rules/evaluate/legacy-tolerance.js';
import {confirmationList, inputEntry, type RecordBody} from '../records/record-schema.js';

/** An input the rules refuse as entered (outside a range, not an option, wrong dimension). */
export type RefusedInput = {id: string; entered: string; detail: string};

/** A record's inputs and confirmations read again under some rules, and what did not fit them. */
export type RecordAnswers = {
	answers: Answers;
	/** Inputs the record gives that the rules do not have. */
	unknownInputs: string[];
	refusedInputs: RefusedInput[];
	/** Confirmations the record answers that the rules do not have. */
	unknownConfirmations: string[];
};

const answered = new Set(['yes', 'no', 'not_applicable']);

// Reading an entry is pure in the input's definition and the text entered, and a folder of
// records repeats the same diode, driver and supply values: read each distinct entry once.
const entries = new WeakMap<CompiledInput, Map<string, ReturnType<typeof parseInputEntry>>>();

function readEntry(compiled: CompiledInput, entered: string): ReturnType<typeof parseInputEntry> {
	let known = entries.get(compiled);
	if (!known) entries.set(compiled, (known = new Map()));
	let entry = known.get(entered);
	if (!entry) known.set(entered, (entry = parseInputEntry(compiled, entered)));
	return entry;
}

/**
 * Reads a record's inputs as the operator entered them (through the same entry parser as the
 * answers file and the screens) and its answered confirmations, under the given rules.
 */
export function answersFromRecord(rules: CompiledRules, body: RecordBody): RecordAnswers {
	const inputs = new Map<string, InputAnswer>();
	const unknownInputs: string[] = [];
	const refusedInputs: RefusedInput[] = [];
	// A record from before ranges, re-read under rules that fold its separate tolerance into the value's range.
	const folded = foldsTolerances(rules) ? foldLegacyTolerances(Object.fromEntries(Object.entries(body.inputs).map(([id, value]) => [id, inputEntry(value)!.entered])), rules).entries : undefined;
	for (const id of Object.keys(folded ?? body.inputs)) {
		const entry = folded ? {entered: String(folded[id])} : inputEntry(body.inputs[id])!;
		const compiled = rules.inputs.get(id);
		if (!compiled) {
			unknownInputs.push(id);
			continue;
		}
		const parsed = readEntry(compiled, entry.entered);
		if (parsed.ok) inputs.set(id, parsed.value);
		else refusedInputs.push({id, entered: entry.entered, detail: describeProblem(problem(parsed.problem.code, parsed.problem.data))});
	}
	const confirmations = new Map<string, ConfirmationAnswer>();
	const unknownConfirmations: string[] = [];
	for (const entry of confirmationList(body)) {
		if (!answered.has(entry.status)) continue;
		if (!rules.confirmations.has(entry.id)) {
			unknownConfirmations.push(entry.id);
			continue;
		}
		const answer = entry.status as ConfirmationAnswer['answer'];
		confirmations.set(entry.id, entry.note ? {answer, note: entry.note} : {answer});
	}
	const answers: Answers = {...(body.setup.name ? {setup: body.setup.name} : {}), inputs, confirmations};
	return {answers, unknownInputs, refusedInputs, unknownConfirmations};
}
