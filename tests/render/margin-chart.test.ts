import {describe, expect, it} from 'vitest';
import {marginBar, marginChartLines, marginRows, marginWords} from '../../source/render/margin-chart.js';

const check = (id: string, verdict: string, relation: 'at_most' | 'at_least', value: number, limit: number) => ({id, verdict, relation, value: {si: value, text: `${value}`}, limit: {si: limit, text: `${limit}`}});

describe('marginRows', () => {
	it('orders the checks by how close they are to failing, failing first, and leaves out what has no ratio', () => {
		const rows = marginRows([
			check('roomy', 'pass', 'at_most', 1, 4), // (4 − 1)/4 = 75 % left (hand arithmetic)
			check('tight', 'pass', 'at_least', 5, 4.5), // (5 − 4.5)/4.5 = 11.1 % left (hand arithmetic)
			check('over', 'fail', 'at_most', 2.4, 2.25), // (2.25 − 2.4)/2.25 = −6.67 % (hand arithmetic)
			check('no limit', 'pass', 'at_most', 0, 0), // a zero limit has no ratio
			{id: 'holds only', verdict: 'pass'},
			check('skipped', 'skip', 'at_most', 1, 2),
		]);
		expect(rows.map((row) => row.id)).toEqual(['over', 'tight', 'roomy']);
		expect(rows.map((row) => Number(row.margin.toFixed(4)))).toEqual([-0.0667, 0.1111, 0.75]);
		expect(rows[0]!.ratio).toBeCloseTo(2.4 / 2.25, 12); // 1.0667 (hand arithmetic)
	});
});

describe('marginBar', () => {
	it.each([
		{ratio: 0.5, filled: 10, text: `${'█'.repeat(10)}${' '.repeat(10)}│${' '.repeat(10)}`}, // half the limit: 10 of 20 cells (hand arithmetic)
		{ratio: 1, filled: 20, text: `${'█'.repeat(20)}│${' '.repeat(10)}`},
		{ratio: 1.25, filled: 25, text: `${'█'.repeat(20)}│${'█'.repeat(5)}${' '.repeat(5)}`}, // 1.25 × 20 = 25 cells
		{ratio: 3, filled: 29, text: `${'█'.repeat(20)}│${'█'.repeat(9)}»`}, // beyond 1.5 × the limit: full, then »
	])('value/limit $ratio', ({ratio, text}) => {
		expect(marginBar(ratio)).toBe(text);
	});

	it('words the margin and fits a line in 80 columns with a mark that reads without colour', () => {
		expect(marginWords(0.13)).toBe('13 % left');
		expect(marginWords(-0.0667)).toBe('6.67 % over');
		const lines = marginChartLines(marginRows([check('a_very_long_check_identifier_indeed', 'fail', 'at_most', 3, 2)]), 80);
		// 24 columns for the name (23 characters and …); 3/2 = 1.5 of the limit fills every cell (» only beyond it); (2 − 3)/2 = −50 % (hand arithmetic)
		expect(lines[1]).toBe(`✗ a_very_long_check_ident… ${'█'.repeat(20)}│${'█'.repeat(10)} 50 % over`);
		for (const line of lines) expect([...line].length).toBeLessThanOrEqual(80);
	});
});
