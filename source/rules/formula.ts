import {isUnitName, mathConstants, mathFunctions, parse, type MathNode} from '../quantities/engine.js';
import type {ProblemCode} from '../messages.js';
import {didYouMean, type NameTable} from './names.js';

/** A problem with a formula, before the caller adds where the formula is. */
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

const allowedOperators = new Set([
	'add',
	'subtract',
	'multiply',
	'divide',
	'pow',
	'unaryMinus',
	'unaryPlus',
	'smaller',
	'larger',
	'smallerEq',
	'largerEq',
	'equal',
	'unequal',
	'and',
	'or',
	'not',
	'to',
]);

type Node = MathNode & Record<string, unknown>;

const constructNames: Record<string, string> = {
	AssignmentNode: 'assignment (=)',
	FunctionAssignmentNode: 'defining a function',
	BlockNode: 'a block of several expressions (; or newline)',
	ArrayNode: 'a list [ ]',
	ObjectNode: 'an object { }',
	AccessorNode: 'property access (a.b or a[b])',
	IndexNode: 'indexing',
	RangeNode: 'a range (a:b)',
	RelationalNode: 'a chained comparison (a < b < c); write (a < b) and (b < c)',
};

/**
 * Parses a rule formula and checks every node against the allowed constructs and known
 * names; only then compiles it. Choice comparisons (`mode == "constant_power"`) are
 * rewritten to exact text comparisons.
 */
export function compileFormula(text: string, names: NameTable, functions: ReadonlySet<string>): {ok: true; formula: CompiledFormula} | {ok: false; problems: FormulaProblem[]} {
	let tree: MathNode;
	try {
		tree = parse(text);
	} catch (error) {
		return {ok: false, problems: [{code: 'formula-syntax', data: {detail: (error as Error).message}}]};
	}
	const problems: FormulaProblem[] = [];
	const used = new Set<string>();
	const known = [...names.keys()];

	const visit = (node: Node, parentAllowsChoice = false): void => {
		switch (node.type) {
			case 'ConstantNode': {
				const value = node['value'];
				if (typeof value === 'string' && !parentAllowsChoice) problems.push({code: 'string-not-allowed', data: {}});
				else if (typeof value !== 'number' && typeof value !== 'boolean' && typeof value !== 'string') problems.push({code: 'construct-not-allowed', data: {construct: `the constant ${String(value)}`}});
				return;
			}
			case 'SymbolNode': {
				const name = String(node['name']);
				const entry = names.get(name);
				if (entry) {
					used.add(name);
					if (entry.kind === 'text') problems.push({code: 'text-in-formula', data: {name}, name});
					if (entry.kind === 'choice' && !parentAllowsChoice) problems.push({code: 'choice-misuse', data: {name, allowed: entry.options.join(', ')}, name});
					return;
				}
				if (mathConstants.has(name) || isUnitName(name)) return;
				problems.push({code: 'unknown-name', data: {name, hint: didYouMean(name, known)}, name});
				return;
			}
			case 'ParenthesisNode':
				visit(node['content'] as Node, parentAllowsChoice);
				return;
			case 'ConditionalNode':
				visit(node['condition'] as Node);
				visit(node['trueExpr'] as Node);
				visit(node['falseExpr'] as Node);
				return;
			case 'OperatorNode': {
				const fn = String(node['fn']);
				const args = node['args'] as Node[];
				if (!allowedOperators.has(fn)) {
					problems.push({code: 'construct-not-allowed', data: {construct: `the operator ${String(node['op'])}`}});
					return;
				}
				if (fn === 'equal' || fn === 'unequal') {
					checkChoiceComparison(args, names, problems);
					for (const arg of args) visit(arg, isChoicePair(args, names));
					return;
				}
				for (const arg of args) visit(arg);
				return;
			}
			case 'FunctionNode': {
				const fnNode = node['fn'] as Node;
				const name = fnNode.type === 'SymbolNode' ? String(fnNode['name']) : '';
				if (!functions.has(name)) {
					const allowed = [...functions].sort().join(', ');
					problems.push({code: 'unknown-function', data: {name: name || 'this call', allowed}, name});
					return;
				}
				for (const arg of node['args'] as Node[]) visit(arg);
				return;
			}
			default:
				problems.push({code: 'construct-not-allowed', data: {construct: constructNames[node.type] ?? node.type}});
		}
	};
	visit(tree as Node);
	if (problems.length > 0) return {ok: false, problems};

	const rewritten = tree.transform((node) => rewriteChoiceComparison(node as Node, names));
	const code = rewritten.compile();
	return {ok: true, formula: {text, names: used, evaluate: (scope) => code.evaluate(scope), parts: lazyParts(rewritten as Node)}};
}

function unwrap(node: Node): Node {
	return node.type === 'ParenthesisNode' ? unwrap(node['content'] as Node) : node;
}

function choiceOf(node: Node, names: NameTable) {
	const inner = unwrap(node);
	if (inner.type !== 'SymbolNode') return undefined;
	const entry = names.get(String(inner['name']));
	return entry?.kind === 'choice' ? {name: String(inner['name']), options: entry.options} : undefined;
}

function isChoicePair(args: Node[], names: NameTable): boolean {
	const [left, right] = args.map(unwrap);
	if (!left || !right) return false;
	const leftChoice = choiceOf(left, names);
	const rightChoice = choiceOf(right, names);
	return Boolean((leftChoice && right.type === 'ConstantNode' && typeof right['value'] === 'string') || (rightChoice && left.type === 'ConstantNode' && typeof left['value'] === 'string'));
}

function checkChoiceComparison(args: Node[], names: NameTable, problems: FormulaProblem[]): void {
	if (!isChoicePair(args, names)) return;
	const [left, right] = args.map(unwrap) as [Node, Node];
	const choice = choiceOf(left, names) ?? choiceOf(right, names)!;
	const option = String((left.type === 'ConstantNode' ? left : right)['value']);
	if (!choice.options.includes(option)) problems.push({code: 'unknown-option', data: {name: choice.name, option, allowed: choice.options.join(', ')}, name: option});
}

function rewriteChoiceComparison(node: Node, names: NameTable): MathNode {
	if (node.type !== 'OperatorNode') return node;
	const fn = String(node['fn']);
	const args = node['args'] as Node[];
	if ((fn !== 'equal' && fn !== 'unequal') || !isChoicePair(args, names)) return node;
	const [left, right] = args.map(unwrap) as [Node, Node];
	const symbol = choiceOf(left, names) ? left : right;
	const option = String((symbol === left ? right : left)['value']);
	// A choice holds its option id as text; compare it exactly, as a boolean.
	const comparison = `equalText(${String(symbol['name'])}, ${JSON.stringify(option)})`;
	return parse(fn === 'equal' ? comparison : `not ${comparison}`);
}

function lazyParts(tree: Node): CompiledFormula['parts'] {
	const parts: Array<{text: string; evaluate(scope: Map<string, unknown>): unknown; pairedWith?: number}> = [];
	const add = (node: Node) => {
		const code = node.compile();
		parts.push({text: node.toString(), evaluate: (scope) => code.evaluate(scope)});
		return parts.length - 1;
	};
	tree.traverse((raw) => {
		const node = raw as Node;
		if (node.type === 'ConditionalNode') {
			const first = add(node['trueExpr'] as Node);
			const second = add(node['falseExpr'] as Node);
			parts[first]!.pairedWith = second;
		} else if (node.type === 'OperatorNode' && (node['fn'] === 'and' || node['fn'] === 'or')) {
			for (const arg of node['args'] as Node[]) add(arg);
		}
	});
	return parts;
}
