import {cleanup} from 'ink-testing-library';
import {afterEach, describe, expect, it} from 'vitest';
import {clearDemo, keys, prefillFromAnswers, renderApp} from '../../helpers/screen-driver.js';

afterEach(() => cleanup());

const demo = prefillFromAnswers(clearDemo);

/** Resumes a draft of these answers on the people step (step 8). */
async function peopleStep(entries: Record<string, string>) {
	const screen = await renderApp({draft: {...demo, entries: {...demo.entries, ...entries}, step: 7}});
	await screen.press(keys.enter);
	expect(screen.frame()).toContain('Step 8 of 9: People around the bench');
	return screen;
}

describe('the people step shows the figures its checks use', () => {
	it('shows the assessed power and each beam 1/e divergence above the checks', async () => {
		const frame = (await peopleStep({})).frame();
		// max(2 W typed, 1.74 W at the limit, coldest) = 2 W (hand arithmetic in tests/rules/people-inputs.test.ts)
		expect(frame).toMatch(/^= 2 W +Beam 1 power the people checks use/m);
		// 150 mrad given at 1/e stays 150 mrad; 1 mrad at 1/e² is 1/√2 = 0.707 mrad at 1/e (Gaussian, hand arithmetic)
		expect(frame).toMatch(/^= 150 mrad +Beam 1 divergence at the 1\/e points/m);
		expect(frame).toMatch(/^= 707 µrad +Beam 2 divergence at the 1\/e points/m);
	});

	it('shows the worst case when the typed power is below it', async () => {
		// typed 1 W; 1.1 W/A × (2 A − 0.45 A × exp(−10/140)) = 1.74 W at the limit, coldest
		const frame = (await peopleStep({beam1_power: '1 W'})).frame();
		expect(frame).toMatch(/^= 1\.74 W +Beam 1 power the people checks use/m);
	});
});
