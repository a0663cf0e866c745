/** Why a formula could not be evaluated: a dimension clash, absolute and difference temperatures mixed, a non-finite operand, or another failure. */
export class EvaluationError extends Error {
	constructor(
		readonly code: 'dimension-mismatch' | 'temperature-kind-mismatch' | 'not-finite' | 'formula-failed',
		readonly detail: string,
	) {
		super(detail);
	}
}
