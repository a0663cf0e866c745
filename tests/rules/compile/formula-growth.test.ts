import {describe, expect, it} from 'vitest';
import {compileFormula} from '../../../source/rules/compile/formula.js';
import {formulaFunctionNames} from '../../../source/rules/compile/compile.js';
import type {NameKind} from '../../../source/rules/compile/names.js';

// A rule file of n formulas over n names must compile in time near n, not n²: one formula's
// compilation may not cost time in proportion to every name the rules define. (A 1 MiB rule file
// of 4,500 inputs and derived values spent 2.8 s of 5.6 s collecting garbage before.)

/** The fastest of several runs, in ms (the least disturbed by a busy machine). */
function fastest(run: () => unknown, rounds: number): number {
	let best = Number.POSITIVE_INFINITY;
	for (let round = 0; round < rounds; round += 1) {
		const start = performance.now();
		run();
		best = Math.min(best, performance.now() - start);
	}
	return best;
}

const table = (size: number) => new Map<string, NameKind>(Array.from({length: size}, (_, index) => [`typed_${index}`, {kind: 'quantity', source: 'input'} as NameKind]));

describe('compiling one formula', () => {
	it('takes about the same time with 10 names as with 100,000 (1,000 formulas each)', () => {
		const few = table(10);
		const many = table(100_000);
		const compileAll = (names: ReadonlyMap<string, NameKind>) => () => {
			for (let index = 0; index < 1000; index += 1) compileFormula('typed_1 * 2', names, formulaFunctionNames);
		};
		fastest(compileAll(few), 3);
		fastest(compileAll(many), 1);
		const ratio = fastest(compileAll(many), 3) / Math.max(fastest(compileAll(few), 10), 0.05);
		// A copy of 100,000 names per formula makes this ratio several hundred; a lookup keeps it near 1.
		expect(ratio).toBeLessThan(10);
	});

	it('still suggests a close name for a mistyped one', () => {
		const result = compileFormula('typd_5 * 2', table(10), formulaFunctionNames);
		expect(result.ok ? [] : result.problems.map((found) => found.data['hint'])).toEqual([expect.stringContaining('"typed_5"')]);
	});
});
