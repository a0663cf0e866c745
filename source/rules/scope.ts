import {CalculationInputError} from '../calculations/calculation.js';
import {formulaFunctions, FormulaCallError} from '../calculations/formula-functions.js';
import {isUnit} from '../quantities/engine.js';
import {describeDimension} from '../quantities/parse-quantity.js';

/** A fresh formula scope holding the calculation functions. */
export function newScope(): Map<string, unknown> {
	return new Map<string, unknown>(formulaFunctions);
}

/** Why a formula could not be evaluated, sorted into a dimension problem or another failure. */
export function classifyError(error: unknown): {code: 'dimension-mismatch' | 'formula-failed'; detail: string} {
	if (error instanceof FormulaCallError) return {code: 'dimension-mismatch', detail: error.detail};
	if (error instanceof CalculationInputError) return {code: 'formula-failed', detail: error.message};
	const message = error instanceof Error ? error.message : String(error);
	// mathjs reports unit clashes only in its message text; this is the one place that reads it.
	if (/Units do not match|different base|Unexpected type of argument|Unit .* expected|cannot be converted/i.test(message)) {
		return {code: 'dimension-mismatch', detail: message.replace(/\s*\(expected:.*$/, '')};
	}
	return {code: 'formula-failed', detail: message};
}

/** Describes a formula result in words for messages: "a current", "true or false", "a plain number". */
export function describeResult(value: unknown): string {
	if (typeof value === 'boolean') return 'true or false';
	if (typeof value === 'number') return 'a plain number';
	if (isUnit(value)) return describeDimension(value);
	return 'something that is not a number';
}
