import {describe, expect, it} from 'vitest';
import {compileFormula} from '../../../source/rules/compile/formula.js';
import {formulaFunctionNames} from '../../../source/rules/compile/compile.js';
import type {NameTable} from '../../../source/rules/compile/names.js';
import {quantity} from '../../../source/quantities/engine.js';

const names: NameTable = new Map([
	['limit', {kind: 'quantity', source: 'input'}],
	['maximum', {kind: 'quantity', source: 'input'}],
	['mode', {kind: 'choice', source: 'input', options: ['constant_current', 'constant_power']}],
] as const);

const refused: Array<{name: string; formula: string; code: string}> = [
	{name: 'import with an object', formula: 'import({x: 1})', code: 'construct-not-allowed'},
	{name: 'import by call', formula: 'import(limit)', code: 'unknown-function'},
	{name: 'createUnit', formula: 'createUnit("furlong")', code: 'unknown-function'},
	{name: 'evaluate', formula: 'evaluate("1 + 1")', code: 'unknown-function'},
	{name: 'parse', formula: 'parse("1")', code: 'unknown-function'},
	{name: 'compile', formula: 'compile("1")', code: 'unknown-function'},
	{name: 'simplify', formula: 'simplify("x")', code: 'unknown-function'},
	{name: 'a function outside the list', formula: 'cos(limit / 1 A)', code: 'unknown-function'},
	{name: 'assignment into the scope', formula: 'limit = 5 A', code: 'construct-not-allowed'},
	{name: 'function definition', formula: 'f(x) = x', code: 'construct-not-allowed'},
	{name: 'block', formula: '1; 2', code: 'construct-not-allowed'},
	{name: 'array', formula: '[1, 2]', code: 'construct-not-allowed'},
	{name: 'object', formula: '{a: 1}', code: 'construct-not-allowed'},
	{name: 'property access', formula: 'limit.value', code: 'construct-not-allowed'},
	{name: 'constructor escape', formula: 'cos.constructor("return process")()', code: 'construct-not-allowed'},
	{name: 'constructor escape through a call', formula: 'abs.constructor("return process")', code: 'construct-not-allowed'},
	{name: 'calling the result of a call', formula: 'abs(limit)(1)', code: 'construct-not-allowed'},
	{name: 'calling a parenthesised value', formula: '(abs)(limit)', code: 'construct-not-allowed'},
	{name: 'prototype name', formula: '__proto__', code: 'unknown-name'},
	{name: 'constructor name', formula: 'constructor', code: 'unknown-name'},
	{name: 'a call to constructor', formula: 'constructor(1)', code: 'unknown-function'},
	{name: 'a call to toString', formula: 'toString()', code: 'unknown-function'},
	{name: 'index escape', formula: 'limit["constructor"]', code: 'construct-not-allowed'},
	{name: 'string literal', formula: '"process"', code: 'string-not-allowed'},
	{name: 'unknown symbol process', formula: 'process', code: 'unknown-name'},
	{name: 'unknown symbol require', formula: 'require', code: 'unknown-name'},
	{name: 'range', formula: '1:3', code: 'construct-not-allowed'},
	{name: 'factorial operator', formula: '3!', code: 'construct-not-allowed'},
	{name: 'modulo', formula: '5 mod 2', code: 'formula-syntax'},
	{name: 'bitwise operator', formula: '1 & 2', code: 'construct-not-allowed'},
	{name: 'chained comparison', formula: '0 A < limit < maximum', code: 'construct-not-allowed'},
];

describe('rule formulas are restricted', () => {
	it.each(refused)('refuses $name', ({formula, code}) => {
		const compiled = compileFormula(formula, names, formulaFunctionNames);
		expect(compiled.ok).toBe(false);
		if (!compiled.ok) expect(compiled.problems.map((entry) => entry.code)).toContain(code);
	});

	it('cannot change the values it reads', () => {
		const compiled = compileFormula('limit <= maximum', names, formulaFunctionNames);
		expect(compiled.ok).toBe(true);
		if (!compiled.ok) return;
		const scope = new Map<string, unknown>([
			['limit', quantity(1, 'A')],
			['maximum', quantity(2, 'A')],
		]);
		expect(compiled.formula.evaluate(scope)).toBe(true);
		expect([...scope.keys()]).toEqual(['limit', 'maximum']);
	});

	it('compares a choice with one of its options exactly', () => {
		const compiled = compileFormula('mode == "constant_power"', names, formulaFunctionNames);
		expect(compiled.ok).toBe(true);
		if (!compiled.ok) return;
		expect(compiled.formula.evaluate(new Map([['mode', 'constant_power']]))).toBe(true);
		expect(compiled.formula.evaluate(new Map([['mode', 'constant_current']]))).toBe(false);
	});

	it('lists the names a formula uses', () => {
		const compiled = compileFormula('limit <= maximum * 0.9 and mode != "constant_power"', names, formulaFunctionNames);
		expect(compiled.ok && [...compiled.formula.names].sort()).toEqual(['limit', 'maximum', 'mode']);
	});

	it('treats unit names as units', () => {
		const compiled = compileFormula('limit <= 2 A', names, formulaFunctionNames);
		expect(compiled.ok).toBe(true);
	});
});
