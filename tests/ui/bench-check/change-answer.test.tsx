import {cleanup} from 'ink-testing-library';
import {afterEach, expect, it} from 'vitest';
import {clearDemo, fillStep, focusOn, keys, prefillFromAnswers, renderApp} from '../../helpers/screen-driver.js';

afterEach(() => cleanup());

const demo = prefillFromAnswers(clearDemo);
const limitCheck = "Current limit below the diode's absolute maximum less the margin";
const coldPowerCheck = "Optical power at the limit current, coldest case, within the diode's maximum power";

/** The verdict drawn in front of a check's title in the checks panel, and the figures line under it. */
function verdictOf(frame: string, title: string): {verdict: string; figures: string} {
	const lines = frame.split('\n');
	const index = lines.findIndex((line) => line.slice(10).startsWith(title));
	if (index < 0) return {verdict: 'not shown', figures: ''};
	return {verdict: lines[index]!.slice(0, 10).trim(), figures: lines[index + 1]!.trim()};
}

it('re-evaluates the checks when an earlier answer is changed', async () => {
	const screen = await renderApp({startCheck: {}});
	await screen.press(keys.pageDown);
	await fillStep(screen, screen.rules, 1, demo);
	expect(screen.frame()).toContain('Step 3 of 9: Driver settings');
	await fillStep(screen, screen.rules, 2, demo);
	expect(screen.frame()).toContain('Step 4 of 9: Supply and wiring');

	// Back to the driver step, where the limit check passes with the demo's 2 A.
	let frame = await screen.press(keys.pageUp);
	expect(frame).toContain('Step 3 of 9: Driver settings');
	expect(verdictOf(frame, limitCheck)).toEqual({verdict: '✓ pass', figures: '2 A ≤ 2.25 A · margin 250 mA (11.1 %)'});

	// ↑ from the step's first field goes back to the diode step, where the cold-power check passes too.
	frame = await screen.press(keys.up);
	expect(frame).toContain('Step 2 of 9: Laser diode ratings');
	expect(verdictOf(frame, coldPowerCheck).verdict).toBe('✓ pass');
	await screen.press(keys.pageDown);

	await focusOn(screen, 'Current limit as set');
	expect(screen.frame()).toContain('  2 A▌');
	await screen.press(keys.backspace, keys.backspace, keys.backspace);
	await screen.type('2.4 A');
	frame = await screen.press(keys.enter);
	expect(frame).toContain('› Current setpoint');
	const limit = verdictOf(frame, limitCheck);
	expect(limit.verdict).toBe('✗ FAIL');
	expect(limit.figures).toBe('2.4 A, limit ≤ 2.25 A · over the limit by 150 mA (6.67 %)');
	expect(verdictOf(frame, 'Current limit within what the driver can deliver')).toEqual({verdict: '✓ pass', figures: '2.4 A ≤ 5 A · margin 2.6 A (52 %)'});
	expect(verdictOf(frame, 'Current setpoint at or below the limit').figures).toBe('1.6 A ≤ 2.4 A · margin 800 mA (33.3 %)');
	frame = await screen.press(keys.up);
	expect(frame).toContain('› Current limit as set\n  a current, e.g. 250 mA, 0 A to 500 A\n  2.4 A▌');

	// Everything that depends on the limit follows, in whichever step it is shown.
	frame = await screen.press(keys.pageUp);
	expect(frame).toContain('Step 2 of 9: Laser diode ratings');
	expect(verdictOf(frame, coldPowerCheck).verdict).toBe('✗ FAIL');
});

it('clears an answer when its text is erased, and its checks go back to open', async () => {
	const screen = await renderApp({draft: {...demo, step: 2}});
	await screen.press(keys.enter);
	expect(verdictOf(screen.frame(), limitCheck).verdict).toBe('✓ pass');
	await focusOn(screen, 'Current limit as set');
	await screen.press(keys.backspace, keys.backspace, keys.backspace);
	const frame = await screen.press(keys.enter);
	expect(frame).toContain('› Current setpoint');
	expect(await screen.press(keys.up)).toContain('› Current limit as set\n  a current, e.g. 250 mA, 0 A to 500 A\n  ▌');
	const limit = verdictOf(frame, limitCheck);
	expect(limit.verdict).toBe('? open');
	expect(limit.figures).toContain('current_limit');
});

// PgDn and PgUp leave the step as ↑ ↓ leave a field: a value typed and not yet entered is entered
// first, and one that is refused keeps the cursor on it with the reason; it is never dropped.
it.each([
	['PgDn', keys.pageDown, 'Step 4 of 9: Supply and wiring'],
	['PgUp', keys.pageUp, 'Step 2 of 9: Laser diode ratings'],
])('%s enters the value typed before it leaves the step', async (_label, key, arrived) => {
	const screen = await renderApp({draft: {...demo, step: 2}});
	await screen.press(keys.enter);
	await focusOn(screen, 'Current limit as set');
	await screen.press(keys.backspace, keys.backspace, keys.backspace);
	await screen.type('2.4 A');
	let frame = await screen.press(key);
	expect(frame).toContain(arrived);
	frame = await screen.press(key === keys.pageDown ? keys.pageUp : keys.pageDown);
	expect(frame).toContain('Step 3 of 9: Driver settings');
	expect(verdictOf(frame, limitCheck).verdict).toBe('✗ FAIL');
	expect(await focusOn(screen, 'Current limit as set')).toContain('  2.4 A▌');
});

it('PgDn with a value that is refused stays on the field with the reason', async () => {
	const screen = await renderApp({draft: {...demo, step: 2}});
	await screen.press(keys.enter);
	await focusOn(screen, 'Current limit as set');
	await screen.press(keys.backspace, keys.backspace, keys.backspace);
	await screen.type('2.4 V');
	const frame = await screen.press(keys.pageDown);
	expect(frame).toContain('Step 3 of 9: Driver settings');
	expect(frame).toContain('› Current limit as set');
	expect(frame).toContain('2.4 V▌');
	expect(frame).toMatch(/current/i);
	expect(verdictOf(frame, limitCheck).verdict).toBe('✓ pass');
});
