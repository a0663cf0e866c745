import {describe, expect, it} from 'vitest';
import {deferral} from '../../source/shared/deferral.js';
import {testSheet} from '../../source/interlock/functional-test/test-sheet.js';
import {testSheetHtml} from '../../source/render/test-sheet-html.js';
import {terminalText} from '../../source/shared/terminal-text.js';
import {loadPlanUnderShippedPolicy as demo, doorSwitch, makePlan} from '../interlock/plan-fixture.js';

/** The cells of each row in the table body, as written in the page. */
function bodyRows(html: string): string[][] {
	const body = /<tbody>([\s\S]*?)<\/tbody>/.exec(html)?.[1] ?? '';
	return [...body.matchAll(/<tr>([\s\S]*?)<\/tr>/g)].map((row) => [...row[1]!.matchAll(/<td[^>]*>([\s\S]*?)<\/td>/g)].map((cell) => cell[1]!));
}

describe('the demo plan as an HTML test sheet', () => {
	const sheet = testSheet(demo());
	const html = testSheetHtml(sheet);

	it('has one row per step, in order, with its number, what it concerns and three blank cells', () => {
		const rows = bodyRows(html);
		expect(rows.map((cells) => cells[0])).toEqual(['1', '2', '3', '4', '5', '6', '7', '8', '9']);
		expect(rows.map((cells) => cells[1])).toEqual(sheet.steps.map((step) => step.subject));
		for (const cells of rows) expect(cells.slice(4)).toEqual(['', '', '']);
		expect(rows[0]!.slice(1, 4)).toEqual(['lid_switch', 'With emission on, open lid_switch (FH-LS2 tongue switch on the enclosure lid), then close it again.', 'Emission stops within 20 ms. After closing, emission stays off until the reset is pressed.']);
		expect(rows[2]!.slice(1, 3)).toEqual(['estop_bench', 'With emission on, press estop_bench (FH-ES1 mushroom emergency stop on the bench front) from the operator&#39;s position, then release it.']);
		expect(rows[8]![1]).toBe('bypass time-out: alignment_bypass');
		expect(rows[8]![2]).toContain('wait 4 h');
	});

	it.each([
		{name: 'the deferral, in the caution box', text: `<section class="caution" aria-label="Caution">\n<p class="deferral">${deferral}</p>`},
		{name: 'the procedure caution', text: 'Follow the laser safety officer&#39;s procedure for interlock tests (beam power, detector, eyewear, who is present).'},
		{name: 'the limit and interval', text: '<p>Largest response time (policy): 20 ms. Repeat this test at least every 180 days (policy), and after any change to the loop.</p>'},
		{name: 'the plan name as title and heading', text: '<h1>Interlock functional test — Fenwick Hollow B.112 bench 3 — enclosure and room loop</h1>'},
		{name: 'the tester, witness and date blanks', text: 'Tested by: <span class="blank long"></span> Witness: <span class="blank long"></span> Date: <span class="blank short"></span>'},
		{name: 'the column heads', text: '<th scope="col">#</th><th scope="col">Concerns</th><th scope="col">Do</th><th scope="col">Expect</th><th scope="col">Result (pass / fail)</th><th scope="col">Initials</th><th scope="col">Date</th>'},
		{name: 'what to do when a step fails', text: 'Every step must pass. A failed step: stop, tag the loop out of service, and tell the laser safety officer.'},
		{name: 'a signature line', text: 'Signature: <span class="blank long"></span>'},
		{name: 'a doctype', text: '<!doctype html>\n<html lang="en">'},
		{name: 'a content policy that forbids scripts', text: `content="default-src 'none'; style-src 'unsafe-inline'"`},
		{name: 'a page rule with margins', text: '@page { margin: 16mm 15mm 17mm 15mm;'},
		{name: 'a footer on each page naming the plan', text: 'content: "prelase interlock functional test · Fenwick Hollow B.112 bench 3  enclosure and room loop"'},
		{name: 'rows kept whole across pages', text: 'tr { break-inside: avoid; }'},
		{name: 'cells tall enough to write in', text: 'table.steps tbody td { height: 16mm; }'},
	])('has $name', ({text}) => {
		expect(html).toContain(text);
	});

	it.each([
		{name: 'no scripts', pattern: /<script/i},
		{name: 'no external files', pattern: /\s(src|href)=|@import|url\(|https?:\/\/|\/\//i},
		{name: 'no font files', pattern: /@font-face/i},
		{name: 'no images', pattern: /<img|<svg/i},
		{name: 'no word that calls the setup safe outside the deferral', pattern: /\bsafe\b/},
	])('has $name', ({pattern}) => {
		expect(html.replace(deferral, '')).not.toMatch(pattern);
	});
});

describe('hostile text from a plan file', () => {
	const hostile = 'lid <script>alert(1)</script> & "x" \u0007bell\u202eleft';
	const escaped = 'lid &lt;script&gt;alert(1)&lt;/script&gt; &amp; &quot;x&quot; bellleft';
	const bypassKey = {...doorSwitch('bypass'), kind: 'bypass_key', bypasses: 'door_switch', bypass: {owner: hostile, time_limit: '1 h'}};

	it.each([
		{name: 'in the plan name', changes: {name: hostile}, where: (html: string) => /<h1>(.*)<\/h1>/.exec(html)![1]!, expected: `Interlock functional test — ${escaped}`},
		{name: 'in a device description', changes: {devices: [doorSwitch('door_switch', {description: hostile})]}, where: (html: string) => bodyRows(html)[0]![2]!, expected: `With emission on, open door_switch (${escaped}), then close it again.`},
		{name: 'in a bypass owner', changes: {devices: [doorSwitch('door_switch'), bypassKey]}, where: (html: string) => bodyRows(html).at(-1)![2]!, expected: `Engage the bypass bypass as its owner (${escaped}) would, and wait 1 h.`},
	])('$name is escaped, its control characters stripped at the terminal boundary', ({changes, where, expected}) => {
		const html = terminalText(testSheetHtml(testSheet(makePlan(changes))));
		expect(where(html)).toBe(expected);
		expect(html).not.toContain('<script');
		expect(html).not.toMatch(/[\u0000-\u0008\u000b-\u001f\u007f-\u009f\u202a-\u202e\u2066-\u2069]/u);
	});
});
