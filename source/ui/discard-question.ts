import type {Arrival} from './text-buffer.js';

/**
 * Esc never drops a change silently: with something typed or chosen but not applied, Esc asks
 * this first, on the planner's forms, the check's steps and Settings alike.
 */
export function discardQuestion(what: string): string {
	return `Discard the change to ${what}? y discard it and go back · any other key keeps editing`;
}

/** The answer to the question: only a y pressed on its own discards (a y in a paste does not); any other key keeps editing. */
export function discardAnswer(input: string, arrival: Arrival): 'discard' | 'keep' {
	return input.toLowerCase() === 'y' && arrival.alone ? 'discard' : 'keep';
}
