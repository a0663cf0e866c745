import type {ConfirmationStatus, Verdict} from '../rules/evaluation.js';

/** Word, symbol and colour of a verdict: the word and symbol carry the meaning, the colour only helps. */
export const verdictStyle: Record<Verdict, {label: string; color: string}> = {
	pass: {label: '✓ pass', color: 'green'},
	fail: {label: '✗ FAIL', color: 'red'},
	advise: {label: '! advise', color: 'yellow'},
	open: {label: '? open', color: 'cyan'},
	skip: {label: '- skip', color: 'gray'},
};

/** The same for confirmation statuses. */
export const confirmationStyle: Record<ConfirmationStatus, {label: string; color: string}> = {
	yes: {label: '✓ yes', color: 'green'},
	no: {label: '✗ NO', color: 'red'},
	not_applicable: {label: '- n/a', color: 'gray'},
	unanswered: {label: '? unanswered', color: 'cyan'},
	skip: {label: '- skip', color: 'gray'},
	open: {label: '? open', color: 'cyan'},
};

/** The outcome in words and its colour. */
export const outcomeStyle = {
	clear_to_energize: {label: 'CLEAR TO ENERGIZE', color: 'green'},
	do_not_energize: {label: 'DO NOT ENERGIZE', color: 'red'},
	incomplete: {label: 'INCOMPLETE', color: 'cyan'},
} as const;
