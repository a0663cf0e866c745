import type {Dimension} from '../../quantities/dimensions.js';

/** An input as the operator gave it, with its parsed value. */
export type InputAnswer =
	| {kind: 'quantity'; entered: string; si: number; dimension: Dimension; /** When entered as a range (or given one by the rules' default tolerance): its ends in SI; `si` is then its middle. */ range?: {low: number; high: number}}
	| {kind: 'choice'; entered: string; option: string}
	| {kind: 'yes_no'; entered: string; value: boolean}
	| {kind: 'text'; entered: string; value: string};

/** How a confirmation was answered. */
export type ConfirmationAnswer = {answer: 'yes' | 'no' | 'not_applicable'; note?: string};

/** Everything the operator said about one setup. */
export type Answers = {
	setup?: string;
	inputs: ReadonlyMap<string, InputAnswer>;
	confirmations: ReadonlyMap<string, ConfirmationAnswer>;
};
