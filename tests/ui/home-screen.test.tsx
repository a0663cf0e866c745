import {cleanup} from 'ink-testing-library';
import {afterEach, describe, expect, it} from 'vitest';
import {keys, renderApp, type AppOptions} from '../helpers/screen-driver.js';

afterEach(() => cleanup());

const flat = (text: string) => text.replaceAll(/\s+/g, ' ').trim();

/** The menu of the home screen, as drawn: the highlighted item marked. */
const menu = (frame: string) =>
	frame
		.split('\n')
		.filter((line) => /^[❯ ] \S/.test(line))
		.map((line) => line.trimEnd());

describe('the home screen', () => {
	it('shows the rules in force and the caution', async () => {
		const screen = await renderApp();
		const frame = screen.frame();
		expect(frame).toContain('Rules: prelase bench policy (shipped default)');
		expect(frame).toMatch(/^Caution$/m);
		expect(flat(frame)).toContain(flat(screen.rules.rules.caution));
	});

	const drafts: Array<{name: string; draft: AppOptions['draft']; first: string; resume: boolean}> = [
		{name: 'no draft', draft: undefined, first: '❯ Start a bench check', resume: false},
		{name: 'a draft', draft: {setup: 'Bench 7', entries: {diode_serial: 'SN-77'}, step: 0}, first: '❯ Resume the draft: Bench 7 (saved 2030-01-02 03:04)', resume: true},
		{name: 'a draft without a setup name', draft: {entries: {}, step: 0}, first: '❯ Resume the draft: unnamed setup (saved 2030-01-02 03:04)', resume: true},
	];
	it.each(drafts)('with $name, offers to resume only when there is one', async ({draft, first, resume}) => {
		const screen = await renderApp(draft ? {draft} : {});
		const items = menu(screen.frame());
		expect(items[0]).toBe(first);
		expect(items.some((item) => item.includes('Resume the draft'))).toBe(resume);
		expect(items).toContain('  Quit');
	});

	it('restores the entries, the answers and the step of the draft it resumes', async () => {
		const screen = await renderApp({
			draft: {setup: 'Bench 7', entries: {diode_max_current: '3 A', diode_max_power: '1.5 W'}, confirmations: {use_authorised: {answer: 'yes'}}, step: 1},
		});
		let frame = await screen.press(keys.enter);
		expect(frame).toContain('Step 2 of 9: Laser diode ratings');
		expect(frame).toContain('› Absolute maximum forward current');
		expect(frame).toContain('  3 A▌');
		expect(frame).toMatch(/^ {2}Maximum optical output power +1\.5 W$/m);
		expect(frame).toContain('Bench 7');
		frame = await screen.press(keys.pageUp);
		expect(frame).toMatch(/^ {2}Use of this laser on this bench is authorised.* ✓ yes$/m);
	});

	it('starts an empty check from "Start a bench check" even when a draft exists', async () => {
		const screen = await renderApp({draft: {entries: {diode_serial: 'SN-77'}, step: 0}});
		await screen.press(keys.down);
		const frame = await screen.press(keys.enter);
		expect(frame).toContain('Step 1 of 9');
		expect(frame).toContain('› Laser diode part and serial number');
		expect(frame).not.toContain('SN-77');
	});

	it('shows the rules in force and comes back on Esc', async () => {
		const screen = await renderApp();
		await screen.press(keys.down, keys.down);
		let frame = await screen.press(keys.enter);
		expect(frame).toContain('Rules in force');
		expect(frame).toMatch(/SHA-256 [0-9a-f]{64}/);
		expect(frame).toContain(`9 steps, ${screen.rules.inputs.size} inputs`);
		frame = await screen.press(keys.escape);
		// The menu keeps its place: the cursor is on the item that led here.
		expect(frame).toContain('❯ Rules in force');
	});

	it('takes every key of a burst: Down Down Down sent at once moves three items', async () => {
		const screen = await renderApp();
		// One chunk, as a fast typist or a paste delivers it.
		const frame = await screen.press(`${keys.down}${keys.down}${keys.down}`);
		expect(frame).toContain('❯ Settings (operator, role, records folder, rule file)');
	});

	it('quits with status 0 from Quit and 130 from Ctrl-C', async () => {
		const first = await renderApp();
		await first.press(keys.up);
		expect(first.frame()).toContain('❯ Quit');
		await first.pressStill(keys.enter);
		expect(first.exits).toEqual([0]);
		const second = await renderApp();
		await second.pressStill(keys.ctrlC);
		expect(second.exits).toEqual([130]);
	});
});
