import {copyFileSync, existsSync, mkdtempSync, readdirSync, readFileSync} from 'node:fs';
import {tmpdir} from 'node:os';
import {join} from 'node:path';
import {cleanup} from 'ink-testing-library';
import {afterEach, describe, expect, it} from 'vitest';
import {clearDemo, keys, prefillFromAnswers, renderApp, type AppScreen} from '../../helpers/screen-driver.js';
import {demoPlanFile} from '../../interlock/plan-fixture.js';

afterEach(() => cleanup());

const flat = (frame: string) => frame.replaceAll(/\s+/g, ' ');

/** The planner on a copy of the demo plan. */
async function planner(): Promise<AppScreen & {file: string}> {
	const file = join(mkdtempSync(join(tmpdir(), 'prelase-stray-')), 'plan.yaml');
	copyFileSync(demoPlanFile, file);
	const screen = await renderApp({startPlan: file});
	return {...screen, file};
}

/** The planner on a copy of the demo plan, recording its test, on step 1. */
async function testOfDemo(): Promise<AppScreen & {file: string}> {
	const screen = await planner();
	expect(await screen.press('t')).toContain('Step 1 of 9: lid_switch');
	return screen;
}

const records = (screen: AppScreen, folder = join(screen.home, 'records')) => (existsSync(folder) ? readdirSync(folder).filter((name) => name.endsWith('.json')) : []);

/** A step's line in the list: number, subject, then its mark ('·' while unmarked). */
const stepMark = (frame: string, number: number, subject: string) => new RegExp(`${String(number).padStart(2)} ${subject} +${'·'}`).test(frame);

describe('text typed on a step result of the interlock test', () => {
	const texts = [
		{text: 'Strap tester ST-3', how: 'one chunk'},
		{text: 'Strap tester ST-3', how: 'separate keys'},
		{text: 'pass', how: 'one chunk'},
		{text: 'by Kim', how: 'separate keys'},
		{text: 'pf', how: 'one chunk'},
	] as const;
	it.each(texts)('"$text" as $how marks nothing, says so, and Enter after it stays', async ({text, how}) => {
		const screen = await testOfDemo();
		const typed = how === 'one chunk' ? await screen.paste(text) : await screen.type(text);
		expect(stepMark(typed, 1, 'lid_switch')).toBe(true);
		expect(typed).toContain('Result      (p pass · f fail · a n/a)');
		expect(flat(typed)).toContain(`typed "${text}", not taken`);
		expect(flat(typed)).toContain('typed text is not an answer: Backspace clears it, then press p, f or a');
		const entered = await screen.press(keys.enter);
		expect(entered).toContain('Step 1 of 9: lid_switch');
		expect(entered).toMatch(/› Result/);
		expect(stepMark(entered, 1, 'lid_switch')).toBe(true);
		expect(stepMark(entered, 2, 'fibre_sense')).toBe(true);
	});

	it('marks the step once Backspace has cleared the typed text', async () => {
		const screen = await testOfDemo();
		await screen.type('ok');
		let frame = await screen.press(keys.backspace);
		expect(frame).not.toContain('not taken');
		frame = await screen.press('p');
		expect(frame).toMatch(/ 1 lid_switch +✓ pass/);
	});
});

describe('signing and discarding need a key pressed alone', () => {
	/** Marks every step pass (one key each), then fills the tester in one chunk that runs on to the sign line. */
	async function markedAndFilled(screen: AppScreen): Promise<void> {
		for (let step = 0; step < 9; step += 1) {
			await screen.press('p');
			await screen.press(keys.enter);
			await screen.press(keys.enter);
		}
		expect(screen.frame()).toContain('Steps: 9 pass');
	}

	it('an Enter pasted with the tester name onto the sign line of the test does not sign', async () => {
		const screen = await testOfDemo();
		await markedAndFilled(screen);
		const frame = await screen.paste('Orla Penhaligon\rlaser technician\r\r\r\r\r\r');
		expect(frame).toContain('[ Sign and write the record ]');
		expect(flat(frame)).toContain('Enter arrived with other keys: press Enter on its own to sign');
		expect(records(screen)).toEqual([]);
		expect(await screen.press(keys.enter)).toContain('PASSED');
		expect(records(screen)).toHaveLength(1);
	});

	it('a d pasted on the question to leave the test does not discard the entries', async () => {
		const screen = await testOfDemo();
		await screen.press('p');
		await screen.press(keys.escape);
		const frame = await screen.pressStill('dd');
		expect(frame).toContain('Leave without recording?');
		expect(frame).not.toContain('Test discarded');
		expect(await screen.press('d')).toContain('✓ Test discarded; nothing was recorded');
	});

	it('a y pasted on the question to remove an item removes nothing', async () => {
		const screen = await planner();
		await screen.press('x');
		expect(screen.frame()).toContain('from the plan?');
		const frame = await screen.paste('yy');
		expect(frame).toContain('✓ Nothing removed');
		expect(readFileSync(screen.file, 'utf8')).toBe(readFileSync(demoPlanFile, 'utf8'));
	});

	it('a d pasted on the question to leave unsaved changes does not discard them', async () => {
		const screen = await planner();
		await screen.press(keys.down, keys.down, keys.down, keys.down, keys.down, keys.down, keys.down);
		await screen.press(']');
		expect(await screen.press(keys.escape)).toContain('Save them before leaving?');
		const frame = await screen.pressStill('dd');
		expect(frame).toContain('Save them before leaving?');
		expect(frame).not.toContain('Start a bench check');
	});

	it('an Enter pasted onto the sign button of the bench check does not sign', async () => {
		const demo = prefillFromAnswers(clearDemo);
		const screen = await renderApp({draft: {...demo, step: 8}, settings: {operator: 'Ada Quist', role: 'bench technician'}});
		await screen.press(keys.enter, keys.pageDown);
		await screen.press(keys.enter);
		expect(screen.frame()).toContain('Sign-off');
		const frame = await screen.paste('\r\r\r\r\r\r\r');
		expect(frame).toContain('[ Sign and write the record ]');
		expect(flat(frame)).toContain('Enter arrived with other keys: press Enter on its own to sign');
		expect(records(screen, join(screen.settings.folder, 'records'))).toEqual([]);
		expect(await screen.press(keys.enter)).toContain('✓ Signed record written');
	});
});
