import {cleanup} from 'ink-testing-library';
import {afterEach, describe, expect, it} from 'vitest';
import {loadDraft} from '../../../source/services/drafts/draft-store.js';
import {focusOn, keys, renderApp, type AppScreen} from '../../helpers/screen-driver.js';

afterEach(() => cleanup());

/** The frame with its line breaks and runs of spaces folded, for messages that wrap. */
const flat = (frame: string) => frame.replaceAll(/\s+/g, ' ');

/** The unfocused line of a field: its label, padding, then its value. */
const valueLine = (frame: string, label: string) => frame.split('\n').find((line) => line.startsWith(`  ${label}`))?.trimEnd() ?? '';

const strap = {id: 'wrist_strap_tested', label: 'The wrist strap was tested today'};
const mat = {id: 'grounded_mat', label: 'Work is on a grounded dissipative mat'};
const leads = {id: 'leads_shorted', label: "The diode's leads and case were shorted"};

/** The last step (ESD and transients), focused on the confirmation given; nothing answered yet. */
async function esdStep(label: string): Promise<AppScreen> {
	const screen = await renderApp({startCheck: {}});
	for (let step = 1; step < 9; step += 1) await screen.press(keys.pageDown);
	expect(screen.frame()).toContain('Step 9 of 9: ESD and transients');
	await focusOn(screen, label);
	return screen;
}

/** What the draft on disk holds for the ESD confirmations (the draft is what a resumed check starts from). */
function draftAnswers(screen: AppScreen): Record<string, unknown> {
	const confirmations = loadDraft(screen.settings.folder)?.confirmations ?? {};
	return Object.fromEntries([strap.id, mat.id, leads.id].filter((id) => id in confirmations).map((id) => [id, confirmations[id]]));
}

// The sentences an operator typed at an unanswered confirmation meaning to write a note; each holds
// an answer letter (the y of "by", the a of "Strap"). Behaviour required: nothing is answered.
const sentences = [
	{text: 'by Kim', at: mat, how: 'one chunk'},
	{text: 'by Kim', at: mat, how: 'separate keys'},
	{text: 'by Kim', at: strap, how: 'one chunk'},
	{text: 'by Kim', at: strap, how: 'separate keys'},
	{text: 'Strap tester ST-3', at: strap, how: 'one chunk'},
	{text: 'Strap tester ST-3', at: strap, how: 'separate keys'},
	{text: 'Strap tester ST-3', at: mat, how: 'one chunk'},
	{text: 'Strap tester ST-3', at: mat, how: 'separate keys'},
] as const;

describe('text typed at an unanswered confirmation', () => {
	it.each(sentences)('"$text" as $how at "$at.label" answers nothing, says so, and Enter after it does not move on', async ({text, at, how}) => {
		const screen = await esdStep(at.label);
		const typed = how === 'one chunk' ? await screen.paste(text) : await screen.type(text);
		expect(typed).toContain(`› ${at.label}`);
		expect(flat(typed)).toContain('typed text is not an answer');
		expect(flat(typed)).toContain(`typed "${text}", not taken`);
		expect(typed).not.toContain('note (required for not applicable)');
		expect(draftAnswers(screen)).toEqual({});
		const entered = await screen.press(keys.enter);
		expect(entered).toContain(`› ${at.label}`);
		expect(entered).toContain('  ? unanswered');
		for (const other of [strap, mat, leads].filter((field) => field !== at)) expect(valueLine(entered, other.label)).toMatch(/\? unanswered$/);
		expect(draftAnswers(screen)).toEqual({});
	});

	it('takes y once Backspace has cleared the typed text', async () => {
		const screen = await esdStep(mat.label);
		await screen.type('by Kim');
		let frame = await screen.press(keys.backspace);
		expect(frame).not.toContain('not taken');
		expect(frame).not.toContain('✗');
		frame = await screen.press('y');
		expect(valueLine(frame, mat.label)).toMatch(/✓ yes$/);
		expect(draftAnswers(screen)).toEqual({[mat.id]: {answer: 'yes'}});
	});

	it('forgets the typed text when the focus moves, and answers nothing on the way', async () => {
		const screen = await esdStep(mat.label);
		await screen.type('ok Kim');
		const frame = await screen.press(keys.up);
		expect(frame).toContain(`› ${strap.label}`);
		expect(frame).not.toContain('not taken');
		expect(valueLine(frame, mat.label)).toMatch(/\? unanswered$/);
		expect(draftAnswers(screen)).toEqual({});
	});

	const chunks = [
		{name: 'y twice', chunk: 'yy'},
		{name: 'y and Enter', chunk: 'y\r'},
		{name: 'n twice', chunk: 'nn'},
		{name: 'a with a note and Enter', chunk: 'akept online\r'},
		{name: 'yes, no and n/a letters', chunk: 'yna'},
	];
	it.each(chunks)('a chunk of answer keys ($name) answers nothing', async ({chunk}) => {
		const screen = await esdStep(strap.label);
		const frame = await screen.paste(chunk);
		expect(frame).toContain(`› ${strap.label}`);
		expect(flat(frame)).toContain('typed text is not an answer');
		for (const field of [strap, mat, leads]) expect(flat(frame)).not.toMatch(new RegExp(`${field.label}[^\\n]*(✓ yes|✗ NO|n/a)`));
		expect(draftAnswers(screen)).toEqual({});
	});

	// The terminal splits a chunk at each escape sequence (an arrow key), so "y↓y" reaches the
	// screen as three events in one read: none of its keys was pressed alone.
	const mixed = [
		{name: 'y, ↓, y', chunk: `y${keys.down}y`, held: true},
		{name: 'n, ↓, n, ↓', chunk: `n${keys.down}n${keys.down}`, held: false},
		{name: '↓ then y', chunk: `${keys.down}y`, held: true},
	];
	it.each(mixed)('keys read together with an arrow key ($name) answer nothing', async ({chunk, held}) => {
		const screen = await esdStep(strap.label);
		const frame = await screen.paste(chunk);
		// Text held on the confirmation in focus at the end is shown; moving away forgets it.
		expect(flat(frame).includes('typed text is not an answer')).toBe(held);
		for (const field of [strap, mat, leads]) expect(flat(frame)).not.toMatch(new RegExp(`${field.label}[^\\n]*(✓ yes|✗ NO)`));
		expect(draftAnswers(screen)).toEqual({});
	});

	it('still answers one confirmation per key typed alone, one after the other', async () => {
		const screen = await esdStep(strap.label);
		await screen.press('y');
		const frame = await screen.press('n');
		expect(valueLine(frame, strap.label)).toMatch(/✓ yes$/);
		expect(valueLine(frame, mat.label)).toMatch(/✗ NO$/);
		expect(frame).toContain(`› ${leads.label}`);
		expect(draftAnswers(screen)).toEqual({[strap.id]: {answer: 'yes'}, [mat.id]: {answer: 'no'}});
	});

	it('makes typed text the start of a note with Tab once the confirmation is answered', async () => {
		const screen = await esdStep(mat.label);
		await screen.press('y', keys.up);
		expect(screen.frame()).toContain(`› ${mat.label}`);
		await screen.type('by Kim');
		let frame = await screen.press(keys.tab);
		expect(frame).toContain('  by Kim▌');
		frame = await screen.press(keys.enter);
		expect(valueLine(frame, mat.label)).toMatch(/✓ yes \(by Kim\)$/);
		expect(draftAnswers(screen)).toEqual({[mat.id]: {answer: 'yes', note: 'by Kim'}});
	});
});

describe('text typed at a yes/no input', () => {
	const hows = [{how: 'one chunk'}, {how: 'separate keys'}] as const;
	it.each(hows)('"by Kim" as $how does not answer it', async ({how}) => {
		const screen = await renderApp({startCheck: {}});
		await screen.press(keys.pageDown, keys.pageDown);
		await focusOn(screen, 'Reverse-voltage protection');
		const frame = how === 'one chunk' ? await screen.paste('by Kim') : await screen.type('by Kim');
		expect(frame).toContain('› Reverse-voltage protection');
		expect(flat(frame)).toContain('typed text is not an answer');
		const entered = await screen.press(keys.enter);
		expect(entered).toContain('› Reverse-voltage protection');
		expect(loadDraft(screen.settings.folder)?.entries['reverse_protection']).toBeUndefined();
	});
});

describe('keys typed ahead of a change of step', () => {
	it('PgDn three times in one read goes three steps on', async () => {
		const screen = await renderApp({startCheck: {}});
		const frame = await screen.paste(keys.pageDown.repeat(3));
		expect(frame).toContain('Step 4 of 9: Supply and wiring');
	});

	it('a value typed in the same read after PgDn is not entered into the step just left', async () => {
		const screen = await renderApp({startCheck: {}});
		await screen.paste(`${keys.pageDown}SN-9\r`);
		expect(loadDraft(screen.settings.folder)?.entries['diode_serial']).toBeUndefined();
		await screen.press(keys.pageUp);
		expect(screen.frame()).toContain('Step 1 of 9');
		expect(screen.frame()).not.toContain('SN-9');
	});
});
