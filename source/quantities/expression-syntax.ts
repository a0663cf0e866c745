/** A node of a parsed formula; `at` and `end` are offsets into the formula text. */
export type ExpressionNode = {at: number; end: number} & (
	| {kind: 'number'; value: number}
	| {kind: 'measure'; value: number; text: string; unit: string}
	| {kind: 'string'; value: string}
	| {kind: 'boolean'; value: boolean}
	| {kind: 'name'; name: string}
	| {kind: 'call'; name: string; args: ExpressionNode[]}
	| {kind: 'unary'; op: '-' | '+' | 'not'; arg: ExpressionNode}
	| {kind: 'binary'; op: BinaryOperator; left: ExpressionNode; right: ExpressionNode}
	| {kind: 'conditional'; condition: ExpressionNode; then: ExpressionNode; otherwise: ExpressionNode}
	| {kind: 'group'; inner: ExpressionNode}
);

/** Operators between two operands. */
export type BinaryOperator = '+' | '-' | '*' | '/' | '^' | '<' | '<=' | '>' | '>=' | '==' | '!=' | 'and' | 'or';

/** Why a formula could not be read; `offset` is where in the text. */
export class FormulaSyntaxError extends Error {
	constructor(
		readonly code: 'formula-syntax' | 'construct-not-allowed',
		readonly detail: string,
		readonly offset: number,
	) {
		super(detail);
	}
}
