import {cleanup} from 'ink-testing-library';
import {afterEach, describe, expect, it} from 'vitest';
import {clearDemo, keys, prefillFromAnswers, renderApp, type AppScreen} from '../../helpers/screen-driver.js';

afterEach(() => cleanup());

const demo = prefillFromAnswers(clearDemo);

async function summary(): Promise<AppScreen> {
	const screen = await renderApp({draft: {...demo, step: 8}, env: {NO_COLOR: '1'}});
	await screen.press(keys.enter);
	await screen.press(keys.pageDown);
	expect(screen.frame()).toMatch(/^Summary: /m);
	return screen;
}

/** Every line seen while paging down to the end. */
async function pageThrough(screen: AppScreen): Promise<string[]> {
	const seen: string[] = [...screen.frame().split('\n')];
	for (let page = 0; page < 40 && /↓ \d+ more/.test(screen.frame()); page += 1) seen.push(...(await screen.press(keys.pageDown)).split('\n'));
	return seen;
}

describe('the summary screen: margin chart and what-if key', () => {
	it('shows on w the margin chart in block characters, closest to failing first, marked without colour', async () => {
		const screen = await summary();
		await screen.press('w');
		const lines = await pageThrough(screen);
		const start = lines.findIndex((line) => line.startsWith('Margins: each value against its limit'));
		expect(start).toBeGreaterThan(0);
		// Bench 3: emission delay 3 s against the 3 s minimum (site policy) is 0 % left, the closest of all passing bars after the advice.
		expect(lines.some((line) => /^✓ emission_delay_long_eno… █{20}│ +0 % left$/.test(line.trimEnd()))).toBe(true);
		// The ceiling: 2 A of 2.25 A = 0.889 of the limit → 18 of 20 cells, 11.1 % left (hand arithmetic).
		expect(lines.some((line) => /^✓ limit_below_diode_maxim… █{18} {2}│ +11\.1 % left$/.test(line.trimEnd()))).toBe(true);
	});

	it('shows what would flip each verdict on w, and the list again on w', async () => {
		const screen = await summary();
		expect(screen.frame()).toContain('w what-if');
		const lines = (await screen.press('w')).split('\n');
		expect(lines.join('\n')).toContain('WHAT WOULD FLIP EACH VERDICT');
		const all = [...lines, ...(await pageThrough(screen))].join('\n');
		expect(all).toContain('1. Emission delay at or above the policy minimum');
		// Ambient flip: 125 °C − 100 K·6.7 W/10 W = 58 °C (hand arithmetic, linear derating).
		expect(all).toContain('fails if ambient_max > 58 °C (now 35 °C)');
		expect(all).toMatch(/ambient_max +·+│█ +no flip \/ \+7\.46 %/);
		expect(all).toContain('laser safety officer');
		const back = await screen.press('w');
		expect(back).not.toContain('WHAT WOULD FLIP EACH VERDICT');
		expect(back).toMatch(/^! advise/m);
	});
});
