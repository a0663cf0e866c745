import {cleanup} from 'ink-testing-library';
import {resolve} from 'node:path';
import {afterEach, describe, expect, it} from 'vitest';
import {focusOn, keys, renderApp} from '../../helpers/screen-driver.js';

afterEach(() => cleanup());

const named = new Set<string>(Object.values(keys));

/** The frame with its line breaks and runs of spaces folded, for messages that wrap. */
const flat = (frame: string) => frame.replaceAll(/\s+/g, ' ');

/** The unfocused line of a field: its label, padding, then its value. */
const valueLine = (frame: string, label: string) => frame.split('\n').find((line) => line.startsWith(`  ${label}`))?.trimEnd() ?? '';

/** Opens the bench check on the diode ratings step (step 2), focused on the absolute maximum current. */
async function diodeStep() {
	const screen = await renderApp({startCheck: {}});
	await screen.press(keys.pageDown);
	expect(screen.frame()).toContain('Step 2 of 9: Laser diode ratings');
	expect(screen.frame()).toContain('› Absolute maximum forward current');
	return screen;
}

describe('typing a value into a quantity field', () => {
	const accepted = [
		{name: 'a current with its unit', keys: ['2.5 A', keys.enter], shown: '2.5 A'},
		{name: 'milliamps', keys: ['2500 mA', keys.enter], shown: '2500 mA'},
		{name: 'a typo corrected with backspace', keys: ['2.55', keys.backspace, ' A', keys.enter], shown: '2.5 A'},
		{name: 'the whole entry erased and typed again', keys: ['9 A', keys.backspace, keys.backspace, keys.backspace, '3 A', keys.enter], shown: '3 A'},
	];
	it.each(accepted)('accepts $name, shows it on the field line and moves the focus on', async ({keys: sequence, shown}) => {
		const screen = await diodeStep();
		for (const key of sequence) await (named.has(key) ? screen.press(key) : screen.type(key));
		const frame = screen.frame();
		expect(valueLine(frame, 'Absolute maximum forward current')).toMatch(new RegExp(`^  Absolute maximum forward current +${shown.replace('.', '\\.')}$`));
		expect(frame).toContain('› Maximum optical output power');
		expect(frame).not.toContain('✗');
	});

	const refused = [
		{name: 'a voltage for a current', typed: '2.5 V', says: ['"2.5 V" is a voltage', 'is a current']},
		{name: 'a value above the range', typed: '900 A', says: ['900 A is outside the allowed range', '100 µA to 200 A']},
		{name: 'a value below the range', typed: '1 uA', says: ['is outside the allowed range', '100 µA to 200 A']},
		{name: 'text that is not a number', typed: 'lots', says: ['"lots" is not a number with a unit', 'a current']},
	];
	it.each(refused)('refuses $name inline, naming the reason, and keeps the focus and the typed text', async ({typed, says}) => {
		const screen = await diodeStep();
		await screen.type(typed);
		const frame = await screen.press(keys.enter);
		const message = frame.split('\n').findIndex((line) => line.startsWith('  ✗ '));
		expect(message).toBeGreaterThan(0);
		for (const part of says) expect(flat(frame)).toContain(part);
		expect(frame).toContain('› Absolute maximum forward current');
		expect(frame).toContain(`  ${typed}▌`);
		expect(valueLine(frame, 'Maximum optical output power')).toMatch(/ —$/);
	});

	it('accepts the entry once the refused text is corrected', async () => {
		const screen = await diodeStep();
		await screen.type('2.5 V');
		await screen.press(keys.enter);
		await screen.press(keys.backspace);
		await screen.type('A');
		const frame = await screen.press(keys.enter);
		expect(frame).not.toContain('✗');
		expect(valueLine(frame, 'Absolute maximum forward current')).toMatch(/ 2\.5 A$/);
	});

	it('shows the expected dimension and range under the focused field', async () => {
		const screen = await diodeStep();
		expect(screen.frame()).toContain('  a current, e.g. 250 mA, 100 µA to 200 A');
	});
});

describe('choice and yes/no fields', () => {
	const choices = [
		{name: '→ twice then ← once', sequence: [keys.right, keys.right, keys.left], chosen: 'Class 1M'},
		{name: '← from the first option wraps to the last', sequence: [keys.left], chosen: 'Class 4'},
		{name: 'a digit picks that option', sequence: ['6'], chosen: 'Class 3B'},
	];
	it.each(choices)('a choice answered with $name and Enter', async ({sequence, chosen}) => {
		const screen = await renderApp({startCheck: {}});
		await focusOn(screen, 'Laser class');
		expect(screen.frame()).toContain('[Class 1]');
		for (const key of sequence) await screen.press(key);
		expect(screen.frame()).toContain(`[${chosen}]`);
		const frame = await screen.press(keys.enter);
		expect(valueLine(frame, 'Laser class')).toMatch(new RegExp(` ${chosen}$`));
		expect(frame).toContain('› Use of this laser on this bench is authorised');
	});

	const yesNo = [
		{key: 'y', shown: 'yes'},
		{key: 'n', shown: 'no'},
	];
	it.each(yesNo)('a yes/no field answered with $key reads $shown and moves on', async ({key, shown}) => {
		const screen = await renderApp({startCheck: {}});
		await screen.press(keys.pageDown, keys.pageDown);
		expect(screen.frame()).toContain('Step 3 of 9: Driver settings');
		await focusOn(screen, 'Reverse-voltage protection');
		const frame = await screen.press(key);
		expect(valueLine(frame, 'Reverse-voltage protection')).toMatch(new RegExp(` ${shown}$`));
		expect(frame).not.toContain('› Reverse-voltage protection');
	});
});

describe('confirmations', () => {
	/** Step 1 focused on its first confirmation (not applicable forbidden), then one that allows it. */
	async function confirmations() {
		const screen = await renderApp({startCheck: {}});
		await focusOn(screen, 'Use of this laser');
		return screen;
	}
	const authorised = 'Use of this laser on this bench is authorised';
	const sop = 'The standard operating procedure named above';

	const answers = [
		{key: 'y', shown: '✓ yes'},
		{key: 'Y', shown: '✓ yes'},
		{key: 'n', shown: '✗ NO'},
	];
	it.each(answers)('answers with $key: $shown, and the focus moves to the next confirmation', async ({key, shown}) => {
		const screen = await confirmations();
		const frame = await screen.press(key);
		expect(valueLine(frame, authorised)).toMatch(new RegExp(` ${shown}$`));
		expect(frame).toContain(`› ${sop}`);
	});

	it('refuses "not applicable" where the rules forbid it, and stays', async () => {
		const screen = await confirmations();
		const frame = await screen.press('a');
		expect(flat(frame)).toContain('cannot be answered "not applicable"; answer yes or no');
		expect(frame).toContain(`› ${authorised}`);
		expect(frame).toContain('  ? unanswered');
	});

	it('asks for a note with a, refuses an empty note, and keeps a note given', async () => {
		const screen = await confirmations();
		await screen.press('y');
		let frame = await screen.press('a');
		expect(frame).toContain(`› ${sop}`);
		expect(frame).toContain('note (required for not applicable) · Enter save · Esc cancel');
		frame = await screen.press(keys.enter);
		expect(flat(frame)).toContain('a "not applicable" answer needs a note saying why');
		expect(frame).toContain(`› ${sop}`);
		await screen.type('kept online');
		frame = await screen.press(keys.enter);
		expect(frame).not.toContain('✗');
		expect(valueLine(frame, sop)).toMatch(/ - n\/a \(kept online\)$/);
		expect(frame).toContain('› The operator is trained');
	});

	it('leaves the note with Esc without answering', async () => {
		const screen = await confirmations();
		await screen.press('y', 'a');
		await screen.type('x');
		const frame = await screen.press(keys.escape);
		expect(frame).not.toContain('note (required for not applicable)');
		expect(frame).toContain(`› ${sop}`);
		expect(frame).toContain('  ? unanswered');
	});

	it('does not answer a confirmation when Tab is pressed before it is answered', async () => {
		const screen = await confirmations();
		await screen.press('y');
		const frame = await screen.press(keys.tab);
		expect(frame).not.toContain('note (required for not applicable)');
		expect(flat(frame)).toContain('answer first (y, n or a)');
		expect(frame).toContain(`› ${sop}`);
		expect(frame).toContain('  ? unanswered');
	});

	it('adds a note to an answered confirmation with Tab', async () => {
		const screen = await confirmations();
		await screen.press('y', keys.up);
		expect(screen.frame()).toContain(`› ${authorised}`);
		await screen.press(keys.tab);
		await screen.type('signed 2 May');
		const frame = await screen.press(keys.enter);
		expect(valueLine(frame, authorised)).toMatch(/ ✓ yes \(signed 2 May\)$/);
	});
});

describe('moving around', () => {
	it('opens the help overlay on ? and closes it on any key', async () => {
		const screen = await renderApp({startCheck: {}});
		await screen.press(keys.pageDown);
		let frame = await screen.press('?');
		expect(frame).toContain('Keys');
		expect(frame).toContain('PgDn PgUp      next / previous step');
		expect(frame).toContain('Any key closes this help.');
		expect(frame).not.toContain('Step 2 of 9');
		frame = await screen.press('x');
		expect(frame).not.toContain('Any key closes this help.');
		expect(frame).toContain('Step 2 of 9: Laser diode ratings');
		expect(frame).toContain('  ▌');
	});

	it('keeps the focused field when the help closes', async () => {
		const screen = await renderApp({startCheck: {}});
		await screen.press(keys.pageDown);
		await focusOn(screen, 'Series resistance above the knee');
		await screen.press('?', 'x');
		expect(screen.frame()).toContain('› Series resistance above the knee');
	});

	it('goes through the steps with PgDn and PgUp', async () => {
		const screen = await renderApp({startCheck: {}});
		const seen: string[] = [];
		for (let index = 0; index < 3; index += 1) seen.push(/Step \d+ of 9: [^\n]+/.exec(await screen.press(keys.pageDown))![0]);
		seen.push(/Step \d+ of 9: [^\n]+/.exec(await screen.press(keys.pageUp))![0]);
		expect(seen).toEqual(['Step 2 of 9: Laser diode ratings', 'Step 3 of 9: Driver settings', 'Step 4 of 9: Supply and wiring', 'Step 3 of 9: Driver settings']);
	});

	it('stays on step 1 with PgUp', async () => {
		const screen = await renderApp({startCheck: {}});
		await screen.type('SN-1');
		const frame = await screen.pressStill(keys.pageUp);
		expect(frame).toContain('Step 1 of 9');
		expect(frame).toContain('  SN-1▌');
	});

	it('returns home on Esc from step 1', async () => {
		const screen = await renderApp({startCheck: {}});
		const frame = await screen.press(keys.escape);
		expect(frame).not.toContain('Step 1 of 9');
		expect(frame).toContain('Start a bench check');
		expect(frame).toContain('Rules: prelase bench policy (shipped default)');
	});

	it('goes back a step on Esc from step 2', async () => {
		const screen = await renderApp({startCheck: {}});
		await screen.press(keys.pageDown);
		expect(await screen.press(keys.escape)).toContain('Step 1 of 9');
	});
});

describe('a confirmation answered from the interlock test record', () => {
	it('says so on the field, and y or n typed there is not taken', async () => {
		const screen = await renderApp({startCheck: {}});
		// the bench's location, as the demo plan names it (a test answers only a check there)
		await screen.press(keys.down);
		await screen.press(keys.down);
		expect(screen.frame()).toContain('› Room and bench');
		await screen.type('Room B.112, bench 3');
		await screen.press(keys.enter);
		for (let step = 1; step < 7; step += 1) await screen.press(keys.pageDown);
		expect(screen.frame()).toContain('Step 7 of 9: Enclosure interlock');
		// the demo plan, named by its absolute path; the screen's records folder has no test record of it
		await screen.type(resolve('docs/examples/interlock/bench3-interlock-plan.yaml'));
		await screen.press(keys.enter);
		await screen.press(keys.down);
		const focused = flat(screen.frame());
		expect(focused).toContain('› The interlock loop passed its functional test');
		expect(focused).toContain('answered from the interlock test record · to answer it yourself, clear the interlock plan');
		expect(focused).toContain('✗ NO (no interlock test record of this plan');
		const after = flat(await screen.type('y'));
		expect(after).toContain('› The interlock loop passed its functional test');
		expect(after).toContain('✗ NO (no interlock test record of this plan');
	});
});
