import {isQuantity, isUnitName, mathConstants, mathFunctions} from '../../quantities/engine.js';
import {evaluateExpression} from '../../quantities/expression-evaluate.js';
import {parseExpression} from '../../quantities/expression-parser.js';
import {FormulaSyntaxError, type ExpressionNode} from '../../quantities/expression-syntax.js';
import type {ProblemCode} from '../../shared/messages.js';
import {didYouMean} from '../../shared/did-you-mean.js';
import type {NameTable} from './names.js';

/** A problem with a formula, before the caller adds where the formula is; `name` is the text to point at. */
export type FormulaProblem = {code: ProblemCode; data: Record<string, string | number>; name?: string};

/** A checked, compiled formula. */
export type CompiledFormula = {
	text: string;
	/** Names of inputs, policy, derived values and tables it uses directly. */
	names: ReadonlySet<string>;
	evaluate(scope: Map<string, unknown>): unknown;
	/**
	 * Sub-expressions that evaluation may skip (branches of a ? b : c, operands of and/or),
	 * so the linter can evaluate each on its own; branches come in pairs that must agree.
	 */
	parts: ReadonlyArray<{text: string; evaluate(scope: Map<string, unknown>): unknown; pairedWith?: number}>;
};

/**
 * Parses a rule formula and checks every name and call against what the rules define; the
 * grammar itself cannot express assignment, lists, objects or property access. Text in
 * quotes is allowed only as the option in a choice comparison (`mode == "constant_power"`).
 */
export function compileFormula(text: string, names: NameTable, functions: ReadonlySet<string>): {ok: true; formula: CompiledFormula} | {ok: false; problems: FormulaProblem[]} {
	let tree: ExpressionNode;
	try {
		tree = parseExpression(text);
	} catch (error) {
		if (!(error instanceof FormulaSyntaxError)) throw error;
		const fragment = text.slice(error.offset).match(/^\S+/)?.[0];
		const data: Record<string, string> = error.code === 'construct-not-allowed' ? {construct: error.detail} : {detail: error.detail};
		return {ok: false, problems: [{code: error.code, data, ...(fragment ? {name: fragment.slice(0, 1)} : {})}]};
	}
	const problems: FormulaProblem[] = [];
	const used = new Set<string>();
	// The names are listed only for a suggestion, when a name is unknown: a copy for every formula made compiling n formulas n².
	let known: string[] | undefined;

	const visit = (node: ExpressionNode, choiceAllowed = false): void => {
		switch (node.kind) {
			case 'number':
			case 'measure':
			case 'boolean':
				return;
			case 'string':
				if (!choiceAllowed) problems.push({code: 'string-not-allowed', data: {}, name: `"${node.value}"`});
				return;
			case 'name': {
				const entry = names.get(node.name);
				if (entry) {
					used.add(node.name);
					if (entry.kind === 'text') problems.push({code: 'text-in-formula', data: {name: node.name}, name: node.name});
					if (entry.kind === 'choice' && !choiceAllowed) problems.push({code: 'choice-misuse', data: {name: node.name, allowed: entry.options.join(', ')}, name: node.name});
					if (entry.kind === 'option_list') problems.push({code: 'options-misuse', data: {name: node.name, choice: entry.choice}, name: node.name});
					return;
				}
				if (mathConstants.has(node.name) || isUnitName(node.name)) return;
				problems.push({code: 'unknown-name', data: {name: node.name, hint: didYouMean(node.name, (known ??= [...names.keys()]))}, name: node.name});
				return;
			}
			case 'group':
				visit(node.inner, choiceAllowed);
				return;
			case 'conditional':
				visit(node.condition);
				visit(node.then);
				visit(node.otherwise);
				return;
			case 'unary':
				visit(node.arg);
				return;
			case 'call':
				if (node.name === 'one_of') {
					const problem = oneOfProblem(node.args, names);
					if (problem) problems.push({code: 'one-of-arguments', data: {detail: problem}, name: 'one_of'});
					else for (const arg of node.args) used.add((unwrap(arg) as {name: string}).name);
					return;
				}
				if (!functions.has(node.name)) {
					problems.push({code: 'unknown-function', data: {name: node.name, allowed: [...functions].sort().join(', ')}, name: node.name});
					return;
				}
				for (const arg of node.args) visit(arg);
				return;
			case 'binary': {
				const pair = choicePair(node, names);
				if (pair && !pair.options.includes(pair.option)) problems.push({code: 'unknown-option', data: {name: pair.name, option: pair.option, allowed: pair.options.join(', ')}, name: pair.option});
				visit(node.left, Boolean(pair));
				visit(node.right, Boolean(pair));
			}
		}
	};
	visit(tree);
	const constant = nonFiniteConstant(tree, names);
	if (constant) {
		const fragment = text.slice(constant.node.at, constant.node.end);
		problems.push({code: 'formula-not-finite', data: {detail: `${fragment} is ${constant.what}`}, name: fragment});
	}
	if (problems.length > 0) return {ok: false, problems};
	return {
		ok: true,
		formula: {text, names: used, evaluate: (scope) => evaluateExpression(tree, scope), parts: lazyParts(tree, text)},
	};
}

/** True when a part of a formula names no input, policy value or calculation: its value is fixed. */
function isConstant(node: ExpressionNode, names: NameTable): boolean {
	switch (node.kind) {
		case 'name':
			return !names.has(node.name);
		case 'group':
			return isConstant(node.inner, names);
		case 'unary':
			return isConstant(node.arg, names);
		case 'binary':
			return isConstant(node.left, names) && isConstant(node.right, names);
		case 'conditional':
			return [node.condition, node.then, node.otherwise].every((part) => isConstant(part, names));
		case 'call':
			return mathFunctions.has(node.name) && node.args.every((arg) => isConstant(arg, names));
		default:
			return true;
	}
}

/** The outermost fixed part of a formula that is infinite or not a number (`1 A / 0`, `0/0`, `exp(1000)`). */
function nonFiniteConstant(node: ExpressionNode, names: NameTable): {node: ExpressionNode; what: string} | undefined {
	if (isConstant(node, names)) {
		try {
			const value = evaluateExpression(node, new Map());
			const number = typeof value === 'number' ? value : isQuantity(value) ? value.value : 0;
			if (!Number.isFinite(number)) return {node, what: Number.isNaN(number) ? 'not a number' : 'infinite'};
		} catch {
			// A fixed part that fails for another reason is reported by the sample lint.
		}
	}
	const children = node.kind === 'group' ? [node.inner] : node.kind === 'unary' ? [node.arg] : node.kind === 'binary' ? [node.left, node.right] : node.kind === 'conditional' ? [node.condition, node.then, node.otherwise] : node.kind === 'call' ? node.args : [];
	for (const child of children) {
		const found = nonFiniteConstant(child, names);
		if (found) return found;
	}
	return undefined;
}

/** Why a call of one_of() is not `one_of(choice, list of that choice's options)`, or undefined when it is. */
function oneOfProblem(args: readonly ExpressionNode[], names: NameTable): string | undefined {
	if (args.length !== 2) return `; it has ${args.length} argument${args.length === 1 ? '' : 's'}`;
	const [choice, list] = args.map(unwrap) as [ExpressionNode, ExpressionNode];
	const choiceEntry = choice.kind === 'name' ? names.get(choice.name) : undefined;
	if (choice.kind !== 'name' || choiceEntry?.kind !== 'choice') return `; "${choice.kind === 'name' ? choice.name : 'its first argument'}" is not a choice input`;
	const listEntry = list.kind === 'name' ? names.get(list.name) : undefined;
	if (list.kind !== 'name' || listEntry?.kind !== 'option_list') return `; "${list.kind === 'name' ? list.name : 'its second argument'}" is not a policy list of options`;
	if (listEntry.choice !== choice.name) return `; "${list.name}" lists options of ${listEntry.choice}, not of ${choice.name}`;
	return undefined;
}

function unwrap(node: ExpressionNode): ExpressionNode {
	return node.kind === 'group' ? unwrap(node.inner) : node;
}

/** A choice compared with a quoted option: `mode == "constant_power"` (either way round). */
function choicePair(node: ExpressionNode, names: NameTable): {name: string; option: string; options: readonly string[]} | undefined {
	if (node.kind !== 'binary' || (node.op !== '==' && node.op !== '!=')) return undefined;
	const [left, right] = [unwrap(node.left), unwrap(node.right)];
	const [symbol, option] = left.kind === 'name' ? [left, right] : [right, left];
	if (symbol.kind !== 'name' || option.kind !== 'string') return undefined;
	const entry = names.get(symbol.name);
	return entry?.kind === 'choice' ? {name: symbol.name, option: option.value, options: entry.options} : undefined;
}

function lazyParts(tree: ExpressionNode, text: string): CompiledFormula['parts'] {
	const parts: Array<{text: string; evaluate(scope: Map<string, unknown>): unknown; pairedWith?: number}> = [];
	const add = (node: ExpressionNode) => {
		parts.push({text: text.slice(node.at, node.end), evaluate: (scope) => evaluateExpression(node, scope)});
		return parts.length - 1;
	};
	const walk = (node: ExpressionNode): void => {
		switch (node.kind) {
			case 'conditional': {
				const first = add(node.then);
				parts[first]!.pairedWith = add(node.otherwise);
				walk(node.condition);
				walk(node.then);
				walk(node.otherwise);
				return;
			}
			case 'binary':
				if (node.op === 'and' || node.op === 'or') {
					add(node.left);
					add(node.right);
				}
				walk(node.left);
				walk(node.right);
				return;
			case 'group':
				walk(node.inner);
				return;
			case 'unary':
				walk(node.arg);
				return;
			case 'call':
				for (const arg of node.args) walk(arg);
				return;
			default:
		}
	};
	walk(tree);
	return parts;
}
