import type {DerivedResult, Evaluation} from './evaluation.js';

/** A derived value a step shows, with its value as text. */
export type ShownDerived = {entry: DerivedResult; text: string};

/**
 * The derived values a step shows (a converted or worst-case figure), label then `= value`; one
 * still open is left out, as the checks that use it already say what they need.
 */
export function shownDerived(evaluation: Evaluation, step: string): ShownDerived[] {
	return evaluation.derived
		.filter((entry) => entry.step === step && entry.status !== 'open')
		.map((entry) => ({entry, text: entry.status === 'value' ? valueText(entry) : entry.status === 'error' ? `not computable: ${entry.error}` : ''}));
}


/** A derived value as text; with ranged inputs, its span over their corners follows it. */
function valueText(entry: Extract<DerivedResult, {status: 'value'}>): string {
	return entry.span ? `${entry.value.text} (${entry.span.low.text} .. ${entry.span.high.text} over the ranges entered)` : entry.value.text;
}
