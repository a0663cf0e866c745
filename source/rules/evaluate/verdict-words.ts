import type {ConfirmationStatus, Verdict} from './evaluation.js';

/** A verdict as a symbol and a word: how every face shows it, so colour is never the only signal. */
export const verdictWords: Record<Verdict, string> = {pass: '✓ pass', fail: '✗ FAIL', advise: '! advise', open: '? open', skip: '- skip'};

/** A confirmation status as a symbol and a word, for terminal output. */
export const confirmationWords: Record<ConfirmationStatus, string> = {yes: '✓ yes', no: '✗ NO', not_applicable: '- n/a', unanswered: '? unanswered', skip: '- skip', open: '? open'};

/** How many checks have each verdict. */
export function countVerdicts(checks: ReadonlyArray<{verdict: Verdict}>): Record<Verdict, number> {
	const counts: Record<Verdict, number> = {pass: 0, fail: 0, advise: 0, open: 0, skip: 0};
	for (const check of checks) counts[check.verdict] += 1;
	return counts;
}
