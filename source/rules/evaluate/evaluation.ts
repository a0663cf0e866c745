import type {Dimension} from '../../quantities/dimensions.js';

/** A value to show: SI number, dimension, and formatted text. */
export type Shown = {si: number; dimension: Dimension; text: string};

/** Verdict of one check. */
export type Verdict = 'pass' | 'fail' | 'advise' | 'open' | 'skip';

/** One check's result: verdict, and when evaluated, value, limit and margin. */
export type CheckResult = {
	id: string;
	step: string;
	title: string;
	severity: 'stop' | 'advise';
	explanation: string;
	basis: string;
	verdict: Verdict;
	relation?: 'at_most' | 'at_least';
	value?: Shown;
	limit?: Shown;
	/** How far from failing, in the check's unit, and as a fraction of the limit (null when the limit is zero). */
	margin?: Shown & {fraction: number | null};
	/** Inputs still missing, for an open check. */
	needs?: string[];
	/** The check's message with its placeholders filled, when it does not hold. */
	message?: string;
	/** Why it could not be evaluated properly (a non-finite value, a calculation refusing its inputs). */
	error?: string;
	/** Why a skipped check does not apply (the rule file's `skip_reason`). */
	reason?: string;
};

/** Status of one confirmation. */
export type ConfirmationStatus = 'yes' | 'no' | 'not_applicable' | 'unanswered' | 'skip' | 'open';

/** One confirmation's result. */
export type ConfirmationResult = {id: string; step: string; statement: string; basis: string; status: ConfirmationStatus; note?: string; needs?: string[]};

/** The outcome of a bench check. */
export type Outcome = 'clear_to_energize' | 'do_not_energize' | 'incomplete';

/** The outcome in the words a screen or report shows. */
export const outcomeWords: Record<Outcome, string> = {
	clear_to_energize: 'clear to energize',
	do_not_energize: 'do not energize',
	incomplete: 'incomplete',
};

/** A derived value's result. */
export type DerivedResult = {id: string; label: string; /** The step it is shown with, if any. */ step?: string} & ({status: 'value'; value: Shown} | {status: 'open'; needs: string[]} | {status: 'error'; error: string});

/** Everything the evaluation found, in the order of the rule file. */
export type Evaluation = {
	outcome: Outcome;
	checks: CheckResult[];
	confirmations: ConfirmationResult[];
	derived: DerivedResult[];
	/** Inputs that are asked (their condition holds) but not answered. */
	missingInputs: string[];
	/** Every input that is asked: no condition, or its condition holds. */
	askedInputs: string[];
};
