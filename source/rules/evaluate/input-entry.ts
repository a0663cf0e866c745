import {formatQuantity} from '../../quantities/format.js';
import {parseQuantity} from '../../quantities/parse-quantity.js';
import type {ConfirmationAnswer, InputAnswer} from './answers.js';
import {fieldWords} from '../../quantities/field-example.js';
import type {CompiledConfirmation, CompiledInput} from '../compile/compiled-rules.js';
import type {ProblemCode} from '../../shared/messages.js';
import {hasLineBreak} from '../../shared/one-line.js';
import {describeProblem} from '../../shared/problems.js';
import {looksLikeNumericRange, looksLikeRange, parseRange, withTolerance} from '../../quantities/range-entry.js';

/** Why an entry was refused: a message code and what fills it. */
export type EntryProblem = {code: ProblemCode; data: Record<string, string | number>};

type Entry<T> = {ok: true; value: T} | {ok: false; problem: EntryProblem};

const yesWords = new Set(['yes', 'y', 'true']);
const noWords = new Set(['no', 'n', 'false']);
const notApplicableWords = new Set(['not applicable', 'not_applicable', 'n/a', 'na']);

function describeRaw(raw: unknown): string {
	if (raw === null || raw === undefined) return 'nothing';
	if (Array.isArray(raw)) return 'a list';
	if (typeof raw === 'object') return 'a mapping';
	return `${typeof raw === 'string' ? 'the text' : typeof raw} ${JSON.stringify(raw)}`;
}

/**
 * Reads one entry for an input (from an answers file or a screen field) into its value,
 * enforcing its kind, dimension, options and range. Shared by every face of the tool.
 */
export function parseInputEntry(compiled: CompiledInput, raw: unknown): Entry<InputAnswer> {
	const {input} = compiled;
	const label = `${input.label} (${input.id})`;
	switch (input.kind) {
		case 'quantity': {
			const words = {label, ...fieldWords({dimension: input.dimension, ...(compiled.range ? {range: compiled.range} : {}), ...(compiled.defaultValue ? {default: compiled.defaultValue.si} : {})})};
			if (typeof raw !== 'string' && typeof raw !== 'number') return {ok: false, problem: {code: 'answers-not-quantity', data: {...words, expected: words.noun, received: describeRaw(raw)}}};
			const entered = String(raw);
			if (looksLikeRange(entered)) return rangeEntry(compiled, entered, words);
			const parsed = parseQuantity(entered, input.dimension);
			if (!parsed.ok) {
				const hint = parsed.problem.code === 'entry-wrong-dimension' && input.dimension === 'temperature' && /\dC$|\sC$/.test(entered.trim()) ? ' (C is coulomb; write degC for degrees Celsius)' : '';
				return {ok: false, problem: {code: parsed.problem.code, data: {...parsed.problem, ...words, hint}}};
			}
			const {range} = compiled;
			if (range && (parsed.value.si < range.min || parsed.value.si > range.max)) {
				return {ok: false, problem: {code: 'answers-out-of-range', data: {entered, label, min: formatQuantity(range.min, input.dimension), max: formatQuantity(range.max, input.dimension)}}};
			}
			const tolerated = compiled.tolerance && input.range_entry !== 'refused' ? withTolerance(parsed.value.si, compiled.tolerance) : undefined;
			return {ok: true, value: {kind: 'quantity', entered, si: parsed.value.si, dimension: input.dimension, ...(tolerated ? {range: {low: tolerated.low, high: tolerated.high}} : {})}};
		}
		case 'choice': {
			const allowed = Object.keys(input.options);
			if (typeof raw === 'string' && looksLikeNumericRange(raw)) return notNumeric(raw, label, 'a choice');
			if (typeof raw !== 'string' || !allowed.includes(raw.trim())) return {ok: false, problem: {code: 'answers-not-an-option', data: {entered: typeof raw === 'string' ? raw : describeRaw(raw), label, allowed: allowed.join(', ')}}};
			return {ok: true, value: {kind: 'choice', entered: raw, option: raw.trim()}};
		}
		case 'yes_no': {
			if (typeof raw === 'string' && looksLikeNumericRange(raw)) return notNumeric(raw, label, 'a yes or no answer');
			const word = typeof raw === 'boolean' ? String(raw) : typeof raw === 'string' ? raw.trim().toLowerCase() : '';
			if (yesWords.has(word)) return {ok: true, value: {kind: 'yes_no', entered: String(raw), value: true}};
			if (noWords.has(word)) return {ok: true, value: {kind: 'yes_no', entered: String(raw), value: false}};
			return {ok: false, problem: {code: 'answers-not-yes-no', data: {entered: typeof raw === 'string' ? raw : describeRaw(raw), label}}};
		}
		case 'text': {
			if (typeof raw !== 'string' && typeof raw !== 'number') return {ok: false, problem: {code: 'answers-not-text', data: {label, received: describeRaw(raw)}}};
			// Kept as written; the screens and text output strip control characters when they show it.
			const value = String(raw);
			if (looksLikeNumericRange(value)) return notNumeric(value, label, 'text');
			if (value.length > input.max_length) return {ok: false, problem: {code: 'answers-text-too-long', data: {label, length: value.length, max: input.max_length}}};
			if (hasLineBreak(value)) return {ok: false, problem: {code: 'single-line', data: {label}}};
			return {ok: true, value: {kind: 'text', entered: value, value}};
		}
	}
}

function notNumeric(entered: string, label: string, kind: string): Entry<InputAnswer> {
	return {ok: false, problem: {code: 'range-not-numeric', data: {entered, label, kind}}};
}

/** A quantity entered as a range: both ends read in the input's dimension and within its range. */
function rangeEntry(compiled: CompiledInput, entered: string, words: Record<string, string>): Entry<InputAnswer> {
	const {input} = compiled;
	if (input.kind !== 'quantity') throw new Error('a range is read only for a quantity input');
	const label = words['label']!;
	if (input.range_entry === 'refused') return {ok: false, problem: {code: 'range-not-allowed', data: {entered, label}}};
	const parsed = parseRange(entered, input.dimension);
	if (!parsed.ok) {
		const {problem} = parsed;
		if (problem.code === 'range-end-refused') {
			const detail = describeProblem({code: problem.problem.code, data: {...problem.problem, ...words, hint: ''}});
			return {ok: false, problem: {code: problem.code, data: {entered, end: problem.end, detail}}};
		}
		const {code, ...data} = problem;
		return {ok: false, problem: {code, data: {...words, ...data, entered}}};
	}
	const {range} = compiled;
	const {low, high, middle} = parsed.value;
	if (range && (low < range.min || high > range.max)) {
		return {ok: false, problem: {code: 'answers-out-of-range', data: {entered, label, min: formatQuantity(range.min, input.dimension), max: formatQuantity(range.max, input.dimension)}}};
	}
	return {ok: true, value: {kind: 'quantity', entered, si: middle, dimension: input.dimension, range: {low, high}}};
}

/** Reads an answer to a confirmation: yes, no or not applicable (the last needs a note). */
export function parseConfirmationEntry(compiled: CompiledConfirmation, rawAnswer: unknown, rawNote: unknown): Entry<ConfirmationAnswer> {
	const word = typeof rawAnswer === 'boolean' ? String(rawAnswer) : typeof rawAnswer === 'string' ? rawAnswer.trim().toLowerCase() : '';
	const written = typeof rawNote === 'string' || typeof rawNote === 'number' ? String(rawNote) : undefined;
	const note = written !== undefined && written.trim() !== '' ? written : undefined;
	const withNote = (answer: ConfirmationAnswer['answer']): ConfirmationAnswer => (note ? {answer, note} : {answer});
	if (yesWords.has(word)) return {ok: true, value: withNote('yes')};
	if (noWords.has(word)) return {ok: true, value: withNote('no')};
	if (notApplicableWords.has(word)) {
		if (compiled.confirmation.not_applicable === 'forbidden') return {ok: false, problem: {code: 'answers-not-applicable-forbidden', data: {}}};
		if (!note) return {ok: false, problem: {code: 'answers-note-required', data: {}}};
		return {ok: true, value: withNote('not_applicable')};
	}
	return {ok: false, problem: {code: 'answers-bad-answer', data: {entered: typeof rawAnswer === 'string' ? rawAnswer : describeRaw(rawAnswer)}}};
}
