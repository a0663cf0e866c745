import type {ConfirmationStatus, Verdict} from '../rules/evaluate/evaluation.js';
import {confirmationWords, verdictWords} from '../rules/evaluate/verdict-words.js';

/** Word, symbol and colour of a verdict: the word and symbol carry the meaning, the colour only helps. */
export const verdictStyle: Record<Verdict, {label: string; color: string}> = {
	pass: {label: verdictWords.pass, color: 'green'},
	fail: {label: verdictWords.fail, color: 'red'},
	advise: {label: verdictWords.advise, color: 'yellow'},
	open: {label: verdictWords.open, color: 'cyan'},
	skip: {label: verdictWords.skip, color: 'gray'},
};

/** The same for confirmation statuses. */
export const confirmationStyle: Record<ConfirmationStatus, {label: string; color: string}> = {
	yes: {label: confirmationWords.yes, color: 'green'},
	no: {label: confirmationWords.no, color: 'red'},
	not_applicable: {label: confirmationWords.not_applicable, color: 'gray'},
	unanswered: {label: confirmationWords.unanswered, color: 'cyan'},
	skip: {label: confirmationWords.skip, color: 'gray'},
	open: {label: confirmationWords.open, color: 'cyan'},
};

/** The outcome in words and its colour. */
export const outcomeStyle = {
	clear_to_energize: {label: 'CLEAR TO ENERGIZE', color: 'green'},
	do_not_energize: {label: 'DO NOT ENERGIZE', color: 'red'},
	incomplete: {label: 'INCOMPLETE', color: 'cyan'},
} as const;
