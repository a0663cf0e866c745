import {cleanup} from 'ink-testing-library';
import {afterEach, describe, expect, it} from 'vitest';
import type {Prefill} from '../../../source/ui/bench-check/session.js';
import {clearDemo, keys, prefillFromAnswers, renderApp, type AppScreen} from '../../helpers/screen-driver.js';

afterEach(() => cleanup());

const demo = prefillFromAnswers(clearDemo);
const flat = (text: string) => text.replaceAll(/\s+/g, ' ').trim();

/** The demo's answers with some inputs changed (a value) or removed (undefined). */
function demoWith(changes: Record<string, string | undefined>): Prefill {
	const entries: Record<string, string> = {...demo.entries};
	for (const [id, value] of Object.entries(changes)) {
		if (value === undefined) delete entries[id];
		else entries[id] = value;
	}
	return {...demo, entries};
}

/** Resumes a draft of these answers on the last step and goes on to the summary. */
async function summaryOf(prefill: Prefill): Promise<AppScreen> {
	const screen = await renderApp({draft: {...prefill, step: 8}});
	expect(screen.frame()).toContain('❯ Resume the draft');
	await screen.press(keys.enter);
	expect(screen.frame()).toContain('Step 9 of 9');
	await screen.press(keys.pageDown);
	expect(screen.frame()).toMatch(/^Summary: /m);
	return screen;
}

const verdictLine = /^(✓ pass|✗ FAIL|! advise|\? open) {2,}(\S.*)$/;

/** Every check line of the summary, scrolling page by page, in the order shown. */
async function summaryChecks(screen: AppScreen): Promise<Array<{verdict: string; title: string}>> {
	const seen = new Map<string, string>();
	for (let page = 0; page < 20; page += 1) {
		for (const line of screen.frame().split('\n')) {
			const match = verdictLine.exec(line.trimEnd());
			if (match && !seen.has(match[2]!)) seen.set(match[2]!, match[1]!);
		}
		if (!/^↓ \d+ more$/m.test(screen.frame())) break;
		await screen.press(keys.pageDown);
	}
	return [...seen].map(([title, verdict]) => ({verdict, title}));
}

// What blocks energizing first: failures, then what is open, then advice, then passes.
const rank: Record<string, number> = {'✗ FAIL': 0, '? open': 1, '! advise': 2, '✓ pass': 3};

describe('the summary', () => {
	const cases = [
		{
			name: 'the clear demo',
			prefill: demo,
			counts: 'Summary: 0 fail · 0 unanswered · 0 open · 2 advise · 22 pass · 5 skip',
			outcome: 'CLEAR TO ENERGIZE',
			verdicts: ['! advise', '✓ pass'],
			failing: [],
		},
		{
			name: 'the demo with the limit too high and the ambient missing',
			prefill: demoWith({current_limit: '2.4 A', ambient_max: undefined}),
			counts: 'Summary: 2 fail · 0 unanswered · 2 open · 2 advise · 18 pass · 5 skip',
			outcome: 'DO NOT ENERGIZE',
			verdicts: ['✗ FAIL', '? open', '! advise', '✓ pass'],
			failing: ["Current limit below the diode's absolute maximum less the margin", "Optical power at the limit current, coldest case, within the diode's maximum power"],
		},
		{
			name: 'the demo with the ambient missing',
			prefill: demoWith({ambient_max: undefined}),
			counts: 'Summary: 0 fail · 0 unanswered · 2 open · 1 advise · 21 pass · 5 skip',
			outcome: 'INCOMPLETE',
			verdicts: ['? open', '! advise', '✓ pass'],
			failing: [],
		},
	];

	it.each(cases)('orders $name: fails, open, advice, passes; and says $outcome', async ({prefill, counts, outcome, verdicts, failing}) => {
		const screen = await summaryOf(prefill);
		const first = screen.frame();
		expect(first).toContain(counts);
		expect(first).toMatch(new RegExp(`^Outcome: ${outcome}$`, 'm'));
		const checks = await summaryChecks(screen);
		const shown = checks.map(({verdict}) => verdict);
		expect(shown).toEqual([...shown].sort((a, b) => rank[a]! - rank[b]!));
		expect([...new Set(shown)]).toEqual(verdicts);
		expect(checks.filter(({verdict}) => verdict === '✗ FAIL').map(({title}) => title)).toEqual(failing);
		const total = Number(/(\d+) pass/.exec(counts)![1]) + Number(/(\d+) fail/.exec(counts)![1]) + Number(/(\d+) advise/.exec(counts)![1]) + Number(/(\d+) open/.exec(counts)![1]);
		expect(checks).toHaveLength(total);
	});

	it('shows the failing check first, with its figures and message, and the reason under the outcome; the caution in one line', async () => {
		const screen = await summaryOf(demoWith({current_limit: '2.4 A'}));
		const lines = screen.frame().split('\n');
		const outcome = lines.findIndex((line) => line.startsWith('Outcome: '));
		// 2.4 A is above 2.5 A less the 10 % margin (2.25 A), and the power at 2.4 A exceeds 2 W: two stop checks fail.
		expect(lines[outcome + 1]).toMatch(/^ {2}2 stop checks fail: Current limit below the diode's absolute maximum/);
		const top = lines.findIndex((line, index) => index > outcome && line === '') + 1;
		expect(lines[top]).toMatch(/^✗ FAIL {4}Current limit below the diode's absolute maximum less the margin/);
		expect(lines[top + 1]!.trim()).toBe('2.4 A, limit ≤ 2.25 A · over the limit by 150 mA (6.67 %)');
		expect(lines[top + 2]!.trim()).toMatch(/^The limit 2\.4 A is above 2\.25 A/);
		expect(flat(screen.frame())).not.toContain(flat(screen.rules.rules.caution));
		expect(screen.frame()).toContain('? keys, caution in full · the laser safety officer and local codes decide');
	});

	it('lists inputs not given with what is open, and answers of n/a after the checks', async () => {
		const screen = await summaryOf(demoWith({ambient_max: undefined}));
		expect(screen.frame()).toContain('Inputs not given: ambient_max');
		await summaryChecks(screen);
		const frame = screen.frame();
		expect(frame).toContain('- n/a        Any interlock bypass');
		const lines = frame.split('\n');
		expect(lines.findIndex((line) => line.startsWith('- n/a'))).toBeGreaterThan(lines.findLastIndex((line) => verdictLine.test(line.trimEnd())));
	});

	it('shows the note of a "not applicable" answer in full', async () => {
		const screen = await summaryOf(demo);
		await summaryChecks(screen);
		expect(flat(screen.frame())).toContain('(No bypass is fitted on bench 3.)');
	});

	it('goes back to the steps on Esc and on to the sign-off on Enter', async () => {
		const screen = await summaryOf(demo);
		expect(await screen.press(keys.escape)).toContain('Step 9 of 9');
		await screen.press(keys.pageDown);
		expect(await screen.press(keys.enter)).toContain('Sign-off');
	});
});
