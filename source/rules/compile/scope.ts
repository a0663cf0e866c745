import {CalculationInputError} from '../../calculations/calculation.js';
import {formulaFunctions, FormulaCallError} from '../../calculations/formula-functions.js';
import {EvaluationError} from '../../quantities/evaluation-error.js';

/** `one_of(choice, list)`: whether a choice's answer is one of the options a policy value lists. */
function oneOf(option: unknown, list: unknown): boolean {
	return typeof option === 'string' && Array.isArray(list) && list.includes(option);
}

/** A fresh formula scope holding the calculation functions, one_of() and the policy's option lists. */
export function newScope(optionLists: ReadonlyMap<string, readonly string[]> = new Map()): Map<string, unknown> {
	return new Map<string, unknown>([...formulaFunctions, ['one_of', oneOf], ...optionLists]);
}

/** Why a formula could not be evaluated, sorted into a dimension problem or another failure. */
export function classifyError(error: unknown): {code: 'dimension-mismatch' | 'temperature-kind-mismatch' | 'formula-not-finite' | 'formula-failed'; detail: string} {
	if (error instanceof FormulaCallError) return {code: 'dimension-mismatch', detail: error.detail};
	if (error instanceof CalculationInputError) return {code: 'formula-failed', detail: error.message};
	if (error instanceof EvaluationError) return {code: error.code === 'not-finite' ? 'formula-not-finite' : error.code, detail: error.detail};
	return {code: 'formula-failed', detail: error instanceof Error ? error.message : String(error)};
}

