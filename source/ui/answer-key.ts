import type {Arrival} from './text-buffer.js';

/**
 * What one key does to a question answered by single keys (a confirmation's y n a, a yes/no
 * input, a test step's p f a):
 * - `answer`: the key is one of the question's own keys, pressed alone, with no typed text held;
 * - `refused`: a printable key that is not an answer, a key of a chunk (a paste or keys typed
 *   ahead), or any key after such text: it is held as `stray` text, shown, and answers nothing;
 * - `cleared`: Backspace or Delete dropped the held text; the question can be answered again;
 * - `other`: not printable (Enter, Tab, arrows…), left to the screen.
 */
export type AnswerKey<A> = {kind: 'answer'; answer: A} | {kind: 'refused'; stray: string} | {kind: 'cleared'} | {kind: 'other'};

/** How much held text is kept: enough to show what was typed, never a whole paste. */
const strayLimit = 60;

const printable = (input: string) => input !== '' && !/[\u0000-\u001F\u007F-\u009F]/.test(input);

/**
 * Reads one key on a question. One key pressed alone answers one question; a chunk answers
 * none, and text typed before an answer key keeps that key from answering until it is cleared:
 * "by Kim" never answers yes, nor "Strap tester" not applicable.
 */
export function readAnswerKey<A>(answers: Readonly<Record<string, A>>, stray: string, input: string, key: {backspace?: boolean; delete?: boolean}, arrival: Arrival): AnswerKey<A> {
	if (key.backspace || key.delete) return stray === '' ? {kind: 'other'} : {kind: 'cleared'};
	if (!printable(input)) return {kind: 'other'};
	const answer = Object.hasOwn(answers, input.toLowerCase()) ? answers[input.toLowerCase()] : undefined;
	if (answer === undefined || !arrival.alone || stray !== '') return {kind: 'refused', stray: (stray + input).slice(0, strayLimit)};
	return {kind: 'answer', answer};
}

/** The message shown while typed text is held on a question: it is not an answer, and how to answer. */
export function strayMessage(keys: string, after = ''): string {
	return `typed text is not an answer: Backspace clears it, then press ${keys}${after}`;
}

/** The held text as the question's value line shows it. */
export function strayShown(stray: string): string {
	return stray === '' ? '' : ` · typed "${stray}", not taken`;
}

/** Said when an Enter of a paste or of keys typed ahead reaches a sign line: signing takes an Enter pressed alone. */
export const signAloneMessage = 'Enter arrived with other keys: press Enter on its own to sign';
