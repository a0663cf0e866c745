import {describe, expect, it} from 'vitest';
import {normaliseEntry} from '../../source/quantities/normalise-entry.js';
import {parseExpression} from '../../source/quantities/expression-parser.js';
import {FormulaSyntaxError} from '../../source/quantities/expression-syntax.js';
import {parseQuantity} from '../../source/quantities/parse-quantity.js';
import {loadAnswersFromText} from '../../source/rules/evaluate/load-answers.js';
import {loadRules, shippedRulesPath} from '../../source/rules/load.js';
import {parseYamlSource} from '../../source/shared/yaml-source.js';
import {growthOverLinear} from '../helpers/growth.js';

/**
 * Growth, not speed: the time for an input of about 100 kB against one of about 1 kB, as a
 * ratio of the fastest of several runs (the fastest is the least disturbed by a busy machine).
 * Linear work gives a ratio near 100; quadratic work near 10,000. The bound, 1,000, sits between.
 */
function growth(make: (bytes: number) => string, run: (input: string) => unknown): number {
	return growthOverLinear(make, run).timeRatio;
}

const rules = loadRules(shippedRulesPath());
if (!rules.ok) throw new Error('the shipped rules do not load');
const unknownKeys = (bytes: number) => `inputs:\n${Array.from({length: Math.ceil(bytes / 12)}, (_, index) => `  k${index}: 1\n`).join('')}`;

describe('time grows linearly with the size of each input', () => {
	it.each([
		{path: 'an answers file of unknown input ids (was quadratic: 40k keys took 17 s)', make: unknownKeys, run: (text: string) => loadAnswersFromText(text, 'answers.yaml', rules.value)},
		{path: 'a YAML mapping with many keys (duplicate-key search was pairwise)', make: unknownKeys, run: (text: string) => parseYamlSource(text, 'a.yaml', 'a test file')},
		{path: 'spaces before a degree sign in an entry (the pattern re-scanned the run)', make: (bytes: number) => `2${' '.repeat(bytes)}\u00B0C`, run: normaliseEntry},
	])('$path', ({make, run}) => {
		expect(growth(make, run)).toBeLessThan(1_000);
	});
});

describe('entries and files have size limits', () => {
	it('an entry longer than 100 characters is refused unread, not read as "2 A"', () => {
		expect(parseQuantity(`2${' '.repeat(100_000)}A`, 'current')).toEqual({ok: false, problem: {code: 'entry-too-long', length: 100_002, max: 100}});
		expect(parseQuantity(`2${' '.repeat(97)}A`, 'current')).toMatchObject({ok: true, value: {si: 2}});
	});

	it('a duplicate key is still found, with its line and path, and 1 and "1" are different keys', () => {
		const parsed = parseYamlSource('inputs:\n  a: 1\n  b: 2\n  a: 3\n', 'a.yaml', 'x');
		expect(parsed).toMatchObject({ok: false, errors: [{code: 'yaml-duplicate-key', data: {key: 'a'}, line: 4, column: 3, field: 'inputs.a'}]});
		expect(parseYamlSource('1: a\n"1": b\n', 'a.yaml', 'x').ok).toBe(true);
	});
});

describe('formulas have length and nesting limits, so a hostile one is a located message, not a stack overflow', () => {
	it.each([
		{name: '5,000 brackets deep', text: `${'('.repeat(5000)}1${')'.repeat(5000)}`, detail: /at most 2000/},
		{name: '900 brackets deep (within the length)', text: `${'('.repeat(900)}1${')'.repeat(900)}`, detail: /deeper than 32/},
		{name: '30,000-term sum', text: Array.from({length: 30_000}, () => '1').join('+'), detail: /at most 2000/},
		{name: '600-term sum (within the length)', text: Array.from({length: 600}, () => '1').join('+'), detail: /more than 200 operations/},
		{name: '50,000 nots', text: `${'not '.repeat(50_000)}true`, detail: /at most 2000/},
		{name: '100 nots', text: `${'not '.repeat(100)}true`, detail: /deeper than 32/},
	])('$name', ({text, detail}) => {
		let thrown: unknown;
		try {
			parseExpression(text);
		} catch (error) {
			thrown = error;
		}
		expect(thrown).toBeInstanceOf(FormulaSyntaxError);
		expect((thrown as FormulaSyntaxError).detail).toMatch(detail);
	});
});
