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
	/** Where in the ranges entered the check was judged: the worst corner (absent when none of its inputs is a range). */
	corner?: Corner;
};

/** One ranged input at the point a check was judged: its low or high end, a point inside its range that a search found worse, or either end (the other end gives the same verdict and margin). */
export type CornerInput = {id: string; end: 'low' | 'high' | 'inside' | 'either'; value: Shown};

/**
 * The point of the ranged inputs at which a check was judged. `corners`: every corner was
 * tried; `searched`: the inside of a range was searched too and was worse than every corner;
 * `capped`: too many ranged inputs to try every corner, so each input was set to its worse end
 * one at a time (a pass found so is not trusted: the check is open).
 */
export type Corner = {inputs: CornerInput[]; method: 'corners' | 'searched' | 'capped'};

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
export type DerivedResult = {id: string; label: string; /** The step it is shown with, if any. */ step?: string} & ({status: 'value'; value: Shown; /** Its lowest and highest over the corners of the ranged inputs it uses (the value is at their middle). */ span?: {low: Shown; high: Shown}} | {status: 'open'; needs: string[]} | {status: 'error'; error: string});

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
