import {cleanup} from 'ink-testing-library';
import {afterEach, describe, expect, it} from 'vitest';
import {openSettings} from '../../source/services/settings.js';
import {keys, renderApp} from '../helpers/screen-driver.js';

afterEach(() => cleanup());

/** Opens the settings from the home screen (fourth item when there is no draft). */
async function settingsScreen(initial?: Parameters<typeof renderApp>[0]) {
	const screen = await renderApp(initial);
	await screen.press(keys.down, keys.down, keys.down);
	expect(screen.frame()).toContain('❯ Settings');
	const frame = await screen.press(keys.enter);
	expect(frame).toMatch(/^Settings$/m);
	return screen;
}

describe('the settings screen', () => {
	const edits = [
		{name: 'the operator name', moves: 0, typed: 'Ada Quist', key: 'operator', label: 'Operator name saved.'},
		{name: 'the role', moves: 1, typed: 'bench technician', key: 'role', label: 'Role saved.'},
		{name: 'the records folder', moves: 2, typed: '/srv/bench3/records', key: 'recordsFolder', label: 'Records folder saved.'},
	] as const;
	it.each(edits)('saves $name on Enter', async ({moves, typed, key, label}) => {
		const screen = await settingsScreen();
		for (let index = 0; index < moves; index += 1) await screen.press(keys.down);
		await screen.paste(typed);
		expect(openSettings(screen.env).read()[key]).toBeUndefined();
		const frame = await screen.press(keys.enter);
		expect(frame).toContain(`✓ ${label}`);
		expect(openSettings(screen.env).read()[key]).toBe(typed);
	});

	it('shows what is saved and edits it in place', async () => {
		const screen = await settingsScreen({settings: {operator: 'Ada Quist'}});
		expect(screen.frame()).toMatch(/^› Operator name +Ada Quist▌$/m);
		await screen.press(keys.backspace, keys.backspace, keys.backspace, keys.backspace, keys.backspace);
		await screen.type('Okafor');
		await screen.press(keys.enter);
		expect(openSettings(screen.env).read().operator).toBe('Ada Okafor');
		expect(screen.frame()).toMatch(/^ {2}Operator name +Ada Okafor$/m);
	});

	it('does not save a field left with Esc', async () => {
		const screen = await settingsScreen();
		await screen.type('Nobody');
		// Esc asks first: a value typed and not saved is never dropped without a word.
		expect(await screen.press(keys.escape)).toContain('Discard the change to operator name? y discard it and go back');
		const frame = await screen.press('y');
		// Back on the home menu, on the item that led to the settings.
		expect(frame).toContain('❯ Settings (operator, role, records folder, rule file)');
		expect(openSettings(screen.env).read().operator).toBeUndefined();
	});
});
