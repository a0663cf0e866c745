import {combine, isQuantity, quantityOrNumber, scale, dimensionless, Quantity, type Exponents} from './quantity.js';
import type {ExpressionNode} from './expression-syntax.js';
import {findUnit} from './units.js';
import {describeValue} from './describe-value.js';
import {EvaluationError} from './evaluation-error.js';
import {siFromDecimal} from './exact-scale.js';
import {absoluteValueOfTemperature, addTemperatures, alignTemperatures, isTemperature, kelvinValue, negateTemperature, scaleTemperature, subtractTemperatures} from './temperature-kind.js';

export {EvaluationError};

/**
 * A name with no value in the scope (an input not given): the caller decides what that means.
 * Not an Error: it is thrown often while a check is open, and capturing a stack each time is slow.
 */
export class MissingValueError {
	readonly message: string;

	constructor(readonly missingName: string) {
		this.message = `"${missingName}" has no value`;
	}
}

/** A value a formula works with. */
export type FormulaValue = number | boolean | string | Quantity;

/** Relative tolerance for comparisons, so rounding in the last bits never flips a verdict. */
export const comparisonTolerance = 1e-12;

type Scope = ReadonlyMap<string, unknown>;

function parts(value: FormulaValue): {value: number; exponents: Exponents} | undefined {
	if (typeof value === 'number') return {value, exponents: dimensionless};
	if (isQuantity(value)) return {value: value.value, exponents: value.exponents};
	return undefined;
}

function numeric(value: FormulaValue, what: string) {
	const found = parts(value);
	if (!found) throw new EvaluationError('dimension-mismatch', `${what} needs a number or a quantity, got ${describeValue(value)}`);
	return found;
}

function sameDimension(left: FormulaValue, right: FormulaValue, what: string) {
	const a = numeric(left, what);
	const b = numeric(right, what);
	if (!a.exponents.every((exponent, index) => Math.abs(exponent - b.exponents[index]!) < 1e-9)) {
		throw new EvaluationError('dimension-mismatch', `${what} ${describeValue(left)} and ${describeValue(right)}`);
	}
	return [a, b] as const;
}

function compare(op: string, left: FormulaValue, right: FormulaValue): boolean {
	if (typeof left === 'string' || typeof right === 'string') {
		if (typeof left !== 'string' || typeof right !== 'string' || (op !== '==' && op !== '!=')) throw new EvaluationError('dimension-mismatch', 'text can only be compared with text, using == or !=');
		return op === '==' ? left === right : left !== right;
	}
	if (typeof left === 'boolean' || typeof right === 'boolean') {
		if (typeof left !== 'boolean' || typeof right !== 'boolean' || (op !== '==' && op !== '!=')) throw new EvaluationError('dimension-mismatch', 'true/false can only be compared with true/false, using == or !=');
		return op === '==' ? left === right : left !== right;
	}
	if (isTemperature(left) && isTemperature(right)) [left, right] = alignTemperatures(left, right, 'cannot compare');
	const [a, b] = sameDimension(left, right, 'cannot compare');
	// NaN compares false both ways, so `not (NaN > limit)` would read as true: refuse to decide.
	if (!Number.isFinite(a.value) || !Number.isFinite(b.value)) {
		const side = !Number.isFinite(a.value) ? `the left side (${describeNumber(a.value)})` : `the right side (${describeNumber(b.value)})`;
		throw new EvaluationError('not-finite', `cannot compare with ${op}: ${side} is not a finite number`);
	}
	const tolerance = comparisonTolerance * Math.max(Math.abs(a.value), Math.abs(b.value));
	const difference = a.value - b.value;
	switch (op) {
		case '<':
			return difference < -tolerance;
		case '<=':
			return difference <= tolerance;
		case '>':
			return difference > tolerance;
		case '>=':
			return difference >= -tolerance;
		case '==':
			return Math.abs(difference) <= tolerance;
		default:
			return Math.abs(difference) > tolerance;
	}
}

function describeNumber(value: number): string {
	return Number.isNaN(value) ? 'not a number, as from 0/0' : value > 0 ? 'infinite' : 'minus infinite';
}

function truth(value: FormulaValue, what: string): boolean {
	if (typeof value !== 'boolean') throw new EvaluationError('dimension-mismatch', `${what} needs true or false, got ${describeValue(value)}`);
	return value;
}

function plainNumber(value: FormulaValue, name: string): number {
	const found = numeric(value, `${name}()`);
	if (found.exponents.some((exponent) => Math.abs(exponent) > 1e-9)) throw new EvaluationError('dimension-mismatch', `${name}() needs a plain number, got ${describeValue(value)}`);
	return found.value;
}

const builtins: Record<string, (args: FormulaValue[]) => FormulaValue> = {
	min: (args) => extreme(args, 'min', (a, b) => a < b),
	max: (args) => extreme(args, 'max', (a, b) => a > b),
	abs: ([value]) => {
		if (isTemperature(value)) return absoluteValueOfTemperature(value);
		const found = numeric(value!, 'abs()');
		return quantityOrNumber(Math.abs(found.value), found.exponents);
	},
	sqrt: ([value]) => {
		const found = numeric(value!, 'sqrt()');
		if (found.value < 0) throw new EvaluationError('formula-failed', 'sqrt() of a negative value');
		return quantityOrNumber(Math.sqrt(found.value), scale(found.exponents, 0.5));
	},
	exp: ([value]) => Math.exp(plainNumber(value!, 'exp')),
	log: ([value]) => positiveLog(plainNumber(value!, 'log'), Math.log, 'log'),
	log10: ([value]) => positiveLog(plainNumber(value!, 'log10'), Math.log10, 'log10'),
};

const arity: Record<string, [number, number]> = {min: [1, 99], max: [1, 99], abs: [1, 1], sqrt: [1, 1], exp: [1, 1], log: [1, 1], log10: [1, 1]};

/** Names of the math functions formulas may call. */
export const builtinFunctions: ReadonlySet<string> = new Set(Object.keys(builtins));

function positiveLog(value: number, fn: (x: number) => number, name: string): number {
	if (!(value > 0)) throw new EvaluationError('formula-failed', `${name}() of a value that is not positive`);
	return fn(value);
}

function extreme(given: FormulaValue[], name: string, better: (a: number, b: number) => boolean): FormulaValue {
	const args = alignAll(given, `${name}() cannot mix`);
	// A value that is not finite wins, so the comparison that uses the result refuses to decide.
	const notFinite = args.find((arg) => !Number.isFinite(parts(arg)?.value ?? 0));
	if (notFinite !== undefined) {
		for (const candidate of args) sameDimension(candidate, notFinite, `${name}() cannot mix`);
		return notFinite;
	}
	let best = args[0]!;
	for (const candidate of args.slice(1)) {
		const [a, b] = sameDimension(candidate, best, `${name}() cannot mix`);
		if (better(a.value, b.value)) best = candidate;
	}
	numeric(best, `${name}()`);
	return best;
}

/** Temperatures among the arguments made comparable with each other (literals read as differences beside a difference). */
function alignAll(args: FormulaValue[], what: string): FormulaValue[] {
	const temperatures = args.filter(isTemperature);
	if (temperatures.length < 2) return args;
	const anchor = temperatures.find((value) => value.kind === 'difference') ?? temperatures.find((value) => value.kind === 'absolute') ?? temperatures[0]!;
	return args.map((value) => (isTemperature(value) ? alignTemperatures(value, anchor, what)[0] : value));
}

function measure(text: string, unit: string): FormulaValue {
	const definition = {offset: 0, ...findUnit(unit)!};
	// A number typed in degC or degF carries both readings until what it meets decides.
	if (definition.scale) return new Quantity(siFromDecimal(text, definition, 'absolute'), definition.exponents, undefined, siFromDecimal(text, definition, 'difference'));
	return quantityOrNumber(siFromDecimal(text, definition), definition.exponents);
}

/** Evaluates a parsed formula against a scope of values and functions. */
export function evaluateExpression(node: ExpressionNode, scope: Scope): FormulaValue {
	switch (node.kind) {
		case 'number':
		case 'string':
		case 'boolean':
			return node.value;
		case 'measure':
			return measure(node.text, node.unit);
		case 'group':
			return evaluateExpression(node.inner, scope);
		case 'name': {
			if (scope.has(node.name)) return scope.get(node.name) as FormulaValue;
			if (node.name === 'pi') return Math.PI;
			const unit = findUnit(node.name);
			if (!unit) throw new MissingValueError(node.name);
			if (unit.offset) throw new EvaluationError('dimension-mismatch', `${node.name} has an offset and can only follow a number (25 ${node.name}); use K for differences`);
			return quantityOrNumber(unit.factor, unit.exponents);
		}
		case 'call': {
			const args = node.args.map((arg) => evaluateExpression(arg, scope));
			const fromScope = scope.get(node.name);
			if (typeof fromScope === 'function') return fromScope(...args) as FormulaValue;
			const builtin = builtins[node.name];
			if (!builtin) throw new EvaluationError('formula-failed', `no function "${node.name}"`);
			const [least, most] = arity[node.name]!;
			if (args.length < least || args.length > most) throw new EvaluationError('formula-failed', `${node.name}() takes ${least === most ? least : `${least} or more`} argument${most === 1 ? '' : 's'}, got ${args.length}`);
			return builtin(args);
		}
		case 'unary': {
			const value = evaluateExpression(node.arg, scope);
			if (node.op === 'not') return !truth(value, 'not');
			const found = numeric(value, `unary ${node.op}`);
			if (node.op === '-' && isTemperature(value)) return negateTemperature(value);
			return node.op === '-' ? quantityOrNumber(-found.value, found.exponents) : value;
		}
		case 'conditional':
			return truth(evaluateExpression(node.condition, scope), 'the condition of a ? b : c') ? evaluateExpression(node.then, scope) : evaluateExpression(node.otherwise, scope);
		case 'binary':
			return binary(node.op, node.left, node.right, scope);
	}
}

function product(op: '*' | '/', left: FormulaValue, right: FormulaValue): FormulaValue {
	const a = numeric(left, op === '*' ? 'multiplying' : 'dividing');
	const b = numeric(right, op === '*' ? 'multiplying' : 'dividing');
	const value = op === '*' ? a.value * b.value : a.value / b.value;
	const exponents = combine(a.exponents, b.exponents, op === '*' ? 1 : -1);
	const result = quantityOrNumber(value, exponents);
	if (!isTemperature(result)) return result;
	// A temperature scaled by a plain number keeps what it was; kelvin made of other quantities
	// (K/W × W, K/s × s) is a rise, a difference.
	if (isTemperature(left) && typeof right === 'number') return scaleTemperature(left, op === '*' ? right : 1 / right);
	if (isTemperature(right) && typeof left === 'number' && op === '*') return scaleTemperature(right, left);
	return kelvinValue(value, 'difference');
}

function binary(op: string, leftNode: ExpressionNode, rightNode: ExpressionNode, scope: Scope): FormulaValue {
	if (op === 'and') return truth(evaluateExpression(leftNode, scope), 'and') ? truth(evaluateExpression(rightNode, scope), 'and') : false;
	if (op === 'or') return truth(evaluateExpression(leftNode, scope), 'or') ? true : truth(evaluateExpression(rightNode, scope), 'or');
	const left = evaluateExpression(leftNode, scope);
	const right = evaluateExpression(rightNode, scope);
	switch (op) {
		case '+':
		case '-': {
			if (isTemperature(left) && isTemperature(right)) return op === '+' ? addTemperatures(left, right) : subtractTemperatures(left, right);
			const [a, b] = sameDimension(left, right, op === '+' ? 'cannot add' : 'cannot subtract');
			return quantityOrNumber(op === '+' ? a.value + b.value : a.value - b.value, a.exponents);
		}
		case '*':
		case '/':
			return product(op, left, right);
		case '^': {
			const base = numeric(left, 'a power');
			const exponent = plainNumber(right, 'a power (^)');
			return quantityOrNumber(base.value ** exponent, scale(base.exponents, exponent));
		}
		default:
			return compare(op, left, right);
	}
}
