import {describe, expect, it} from 'vitest';
import {testSheet} from '../../source/interlock/functional-test/test-sheet.js';
import {testSheetMarkdown} from '../../source/render/test-sheet-markdown.js';
import {doorSwitch, makePlan} from '../interlock/plan-fixture.js';

/** The cells of each numbered row of the step table, split on unescaped bars (CommonMark GFM tables: `\|` is a literal bar). */
function stepRows(markdown: string): string[][] {
	return markdown
		.split('\n')
		.filter((line) => /^\| \d+ \|/.test(line))
		.map((line) => line.slice(2, -2).split(/(?<!\\)\|/).map((cell) => cell.trim()));
}

describe('hostile text from a plan file in the Markdown test sheet', () => {
	const image = '<img src=x onerror=alert(1)>';
	const frame = '<iframe src="//example.invalid"></iframe>';
	const bypassKey = {...doorSwitch('bypass'), kind: 'bypass_key', bypasses: 'door_switch', bypass: {owner: `${frame} | x`, time_limit: '1 h'}};

	it.each([
		{name: 'the plan name', changes: {name: `Loop ${image}`}, where: (md: string) => md.split('\n')[0]!, expected: '# Interlock functional test — Loop &lt;img src=x onerror=alert(1)&gt;'},
		{name: 'a device description', changes: {devices: [doorSwitch('door_switch', {description: `${image} *bold* [link](javascript:x)`})]}, where: (md: string) => stepRows(md)[0]![2]!, expected: 'With emission on, open door_switch (&lt;img src=x onerror=alert(1)&gt; \\*bold\\* \\[link\\](javascript:x)), then close it again.'},
		{name: 'a bypass owner', changes: {devices: [doorSwitch('door_switch'), bypassKey]}, where: (md: string) => stepRows(md).at(-1)![2]!, expected: 'Engage the bypass bypass as its owner (&lt;iframe src="//example.invalid"&gt;&lt;/iframe&gt; \\| x) would, and wait 1 h.'},
	])('$name is escaped as the record reports escape it', ({changes, where, expected}) => {
		const markdown = testSheetMarkdown(testSheet(makePlan(changes)));
		expect(where(markdown)).toBe(expected);
		expect(markdown).not.toMatch(/<img|<iframe/i);
		// Every step row keeps its seven cells: a bar in the text cannot add one (GFM tables).
		for (const row of stepRows(markdown)) expect(row).toHaveLength(7);
	});
});
