import {FormulaSyntaxError, type BinaryOperator, type ExpressionNode} from './expression-syntax.js';
import {isUnitName} from './units.js';

type Token = {type: 'number' | 'name' | 'string' | 'operator' | 'end'; text: string; at: number; end: number};

const refusedCharacters: Record<string, string> = {
	'=': 'assignment (=); compare with ==',
	'[': 'a list [ ]',
	']': 'a list [ ]',
	'{': 'an object { }',
	'}': 'an object { }',
	';': 'a block of several expressions (;)',
	'!': 'the ! operator; write not, or != to compare',
	'%': 'the % sign in a formula; write fractions (0.1 for 10 %)',
	'&': 'bitwise operators; write and',
	'|': 'bitwise operators; write or',
	'.': 'property access (a.b)',
	'#': 'a # comment inside the formula',
	'\\': 'a backslash',
	'@': 'the @ sign',
	$: 'the $ sign',
	'`': 'a backquote',
	'\n': 'a line break inside a name or number',
};

const operators = ['<=', '>=', '==', '!=', '<', '>', '+', '-', '*', '/', '^', '(', ')', ',', '?', ':'];

function tokenize(text: string): Token[] {
	const tokens: Token[] = [];
	let index = 0;
	while (index < text.length) {
		const rest = text.slice(index);
		const space = /^\s+/.exec(rest);
		if (space) {
			index += space[0].length;
			continue;
		}
		const number = /^(?:\d+\.?\d*|\.\d+)(?:[eE][-+]?\d+)?/.exec(rest);
		if (number) {
			tokens.push({type: 'number', text: number[0], at: index, end: index + number[0].length});
			index += number[0].length;
			continue;
		}
		const name = /^[A-Za-z_][A-Za-z0-9_]*/.exec(rest);
		if (name) {
			tokens.push({type: 'name', text: name[0], at: index, end: index + name[0].length});
			index += name[0].length;
			if (text[index] === '.' && /[A-Za-z_]/.test(text[index + 1] ?? '')) throw new FormulaSyntaxError('construct-not-allowed', refusedCharacters['.']!, index);
			continue;
		}
		const quote = rest[0] === '"' || rest[0] === "'" ? rest[0] : undefined;
		if (quote) {
			const close = rest.indexOf(quote, 1);
			if (close < 0) throw new FormulaSyntaxError('formula-syntax', 'a quoted text is not closed', index);
			tokens.push({type: 'string', text: rest.slice(1, close), at: index, end: index + close + 1});
			index += close + 1;
			continue;
		}
		const operator = operators.find((candidate) => rest.startsWith(candidate));
		if (operator) {
			tokens.push({type: 'operator', text: operator, at: index, end: index + operator.length});
			index += operator.length;
			continue;
		}
		const refused = refusedCharacters[rest[0]!];
		throw new FormulaSyntaxError(refused ? 'construct-not-allowed' : 'formula-syntax', refused ?? `unexpected character "${rest[0]}"`, index);
	}
	tokens.push({type: 'end', text: '', at: text.length, end: text.length});
	return tokens;
}

/** The longest formula, in characters: the shipped policy's longest is a few hundred. */
export const maxFormulaLength = 2000;
/** The deepest nesting of brackets, calls, not, signs and powers in a formula. */
export const maxFormulaNesting = 32;
/** The most chained operations (+ - * / and or) in one formula. */
export const maxFormulaTerms = 200;

const comparisons = new Set(['<', '<=', '>', '>=', '==', '!=']);
const keywords = new Set(['and', 'or', 'not', 'true', 'false']);

/**
 * Parses a rule formula into a tree. The grammar has only what rules need: numbers with
 * units, names, calls, + - * / ^, comparisons, and/or/not and a ? b : c. Anything else
 * (assignment, lists, objects, property access, blocks) cannot be written.
 */
export function parseExpression(text: string): ExpressionNode {
	if (text.length > maxFormulaLength) throw new FormulaSyntaxError('formula-syntax', `it is ${text.length} characters long; a formula may be at most ${maxFormulaLength} (split it into derived values)`, maxFormulaLength);
	const tokens = tokenize(text);
	let position = 0;
	let depth = 0;
	/** Parses one nested part (brackets, a call's arguments, not, a sign, an exponent), refusing nesting deeper than the limit. */
	const nested = <T>(at: number, parse: () => T): T => {
		if (depth >= maxFormulaNesting) throw new FormulaSyntaxError('formula-syntax', `it nests deeper than ${maxFormulaNesting} levels (brackets, calls, not, signs and powers); split it into derived values`, at);
		depth += 1;
		try {
			return parse();
		} finally {
			depth -= 1;
		}
	};
	let terms = 0;
	/** Counts a term of a chain (a + b + ..., a * b * ..., a and b and ...): the tree grows one level with each. */
	const chained = (at: number) => {
		terms += 1;
		if (terms > maxFormulaTerms) throw new FormulaSyntaxError('formula-syntax', `it has more than ${maxFormulaTerms} operations; split it into derived values`, at);
	};
	const peek = () => tokens[position]!;
	const next = () => tokens[position++]!;
	const isOperator = (value: string) => peek().type === 'operator' && peek().text === value;
	const isWord = (value: string) => peek().type === 'name' && peek().text === value;
	const expect = (value: string) => {
		const token = next();
		if (token.type !== 'operator' || token.text !== value) throw new FormulaSyntaxError('formula-syntax', `expected "${value}" but found ${describe(token)}`, token.at);
	};

	const conditional = (): ExpressionNode => {
		const condition = or();
		if (!isOperator('?')) return condition;
		next();
		const then = nested(condition.at, conditional);
		expect(':');
		const otherwise = nested(condition.at, conditional);
		return {kind: 'conditional', condition, then, otherwise, at: condition.at, end: otherwise.end};
	};
	const logical = (word: 'and' | 'or', operand: () => ExpressionNode) => (): ExpressionNode => {
		let left = operand();
		while (isWord(word)) {
			chained(next().at);
			const right = operand();
			left = {kind: 'binary', op: word, left, right, at: left.at, end: right.end};
		}
		return left;
	};
	const not = (): ExpressionNode => {
		if (isWord('not')) {
			const token = next();
			const arg = nested(token.at, not);
			return {kind: 'unary', op: 'not', arg, at: token.at, end: arg.end};
		}
		return comparison();
	};
	const and = logical('and', not);
	const or = logical('or', and);
	const comparison = (): ExpressionNode => {
		const left = additive();
		if (peek().type !== 'operator' || !comparisons.has(peek().text)) return left;
		const op = next().text as BinaryOperator;
		const right = additive();
		if (peek().type === 'operator' && comparisons.has(peek().text)) {
			throw new FormulaSyntaxError('construct-not-allowed', 'a chained comparison (a < b < c); write (a < b) and (b < c)', peek().at);
		}
		return {kind: 'binary', op, left, right, at: left.at, end: right.end};
	};
	const additive = (): ExpressionNode => {
		let left = multiplicative();
		while (isOperator('+') || isOperator('-')) {
			const token = next();
			chained(token.at);
			const op = token.text as '+' | '-';
			const right = multiplicative();
			left = {kind: 'binary', op, left, right, at: left.at, end: right.end};
		}
		return left;
	};
	const multiplicative = (): ExpressionNode => {
		let left = unary();
		while (isOperator('*') || isOperator('/')) {
			const token = next();
			chained(token.at);
			const op = token.text as '*' | '/';
			const right = unary();
			left = {kind: 'binary', op, left, right, at: left.at, end: right.end};
		}
		return left;
	};
	const unary = (): ExpressionNode => {
		if (isOperator('-') || isOperator('+')) {
			const token = next();
			const arg = nested(token.at, unary);
			// -20 degC is the temperature 20 degrees below zero, not the negative of 293.15 K.
			if (token.text === '-' && arg.kind === 'measure' && !arg.text.startsWith('-')) return {...arg, value: -arg.value, text: `-${arg.text}`, at: token.at};
			return {kind: 'unary', op: token.text as '-' | '+', arg, at: token.at, end: arg.end};
		}
		return power();
	};
	const power = (): ExpressionNode => {
		const base = primary();
		if (!isOperator('^')) return base;
		const caret = next();
		const exponent = nested(caret.at, unary);
		return {kind: 'binary', op: '^', left: base, right: exponent, at: base.at, end: exponent.end};
	};
	const primary = (): ExpressionNode => {
		const token = next();
		if (token.type === 'number') {
			const value = Number(token.text);
			// A number followed by a unit is one measure: 2 V, 25 degC, 0.5 K (then / W).
			if (peek().type === 'name' && !keywords.has(peek().text) && tokens[position + 1]?.text !== '(') {
				const unit = next();
				if (!isUnitName(unit.text)) throw new FormulaSyntaxError('formula-syntax', `"${unit.text}" after a number is not a unit; write ${token.text} * ${unit.text} to multiply`, unit.at);
				return {kind: 'measure', value, text: token.text, unit: unit.text, at: token.at, end: unit.end};
			}
			return {kind: 'number', value, at: token.at, end: token.end};
		}
		if (token.type === 'string') return {kind: 'string', value: token.text, at: token.at, end: token.end};
		if (token.type === 'name') {
			if (token.text === 'true' || token.text === 'false') return {kind: 'boolean', value: token.text === 'true', at: token.at, end: token.end};
			if (keywords.has(token.text)) throw new FormulaSyntaxError('formula-syntax', `"${token.text}" needs something before it`, token.at);
			if (isOperator('(')) {
				next();
				const args: ExpressionNode[] = [];
				if (!isOperator(')')) {
					args.push(nested(token.at, conditional));
					while (isOperator(',')) {
						next();
						args.push(nested(token.at, conditional));
					}
				}
				const close = peek();
				expect(')');
				return {kind: 'call', name: token.text, args, at: token.at, end: close.end};
			}
			return {kind: 'name', name: token.text, at: token.at, end: token.end};
		}
		if (token.type === 'operator' && token.text === '(') {
			const inner = nested(token.at, conditional);
			const close = peek();
			expect(')');
			return {kind: 'group', inner, at: token.at, end: close.end};
		}
		throw new FormulaSyntaxError('formula-syntax', token.type === 'end' ? 'the formula ends too early' : `unexpected ${describe(token)}`, token.at);
	};

	const tree = conditional();
	if (peek().type !== 'end') {
		const token = peek();
		if (token.type === 'operator' && token.text === ':') throw new FormulaSyntaxError('construct-not-allowed', 'a range (a:b)', token.at);
		if (token.type === 'operator' && token.text === '(') throw new FormulaSyntaxError('construct-not-allowed', 'a call on something that is not a function name', token.at);
		throw new FormulaSyntaxError('formula-syntax', `unexpected ${describe(token)} after a complete formula`, token.at);
	}
	return tree;
}

function describe(token: Token): string {
	if (token.type === 'end') return 'the end of the formula';
	if (token.type === 'string') return 'quoted text';
	return `"${token.text}"`;
}
