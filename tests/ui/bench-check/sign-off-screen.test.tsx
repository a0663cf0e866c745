import {existsSync, mkdtempSync, readdirSync} from 'node:fs';
import {tmpdir} from 'node:os';
import {join} from 'node:path';
import {cleanup} from 'ink-testing-library';
import {afterEach, describe, expect, it} from 'vitest';
import {draftPath} from '../../../source/services/drafts/draft-store.js';
import {listSetups} from '../../../source/services/drafts/setup-store.js';
import {readRecord} from '../../../source/records/read-record.js';
import type {Settings} from '../../../source/services/settings.js';
import type {Prefill} from '../../../source/ui/bench-check/session.js';
import {clearDemo, keys, prefillFromAnswers, renderApp, type AppScreen} from '../../helpers/screen-driver.js';

afterEach(() => cleanup());

const demo = prefillFromAnswers(clearDemo);
const flat = (text: string) => text.replaceAll(/\s+/g, ' ').trim();

/** Resumes a draft of these answers, goes through the summary, and opens the sign-off. */
async function signOff(prefill: Prefill, settings?: Settings): Promise<AppScreen> {
	const screen = await renderApp({draft: {...prefill, step: 8}, ...(settings ? {settings} : {})});
	await screen.press(keys.enter, keys.pageDown);
	expect(screen.frame()).toMatch(/^Summary: /m);
	await screen.press(keys.enter);
	expect(screen.frame()).toContain('Sign-off');
	return screen;
}

/** The value on a sign-off field's line, and whether the line has the focus. */
function field(frame: string, label: string): {value: string; focused: boolean} {
	const lines = frame.split('\n');
	const index = lines.findIndex((text) => text.slice(2).startsWith(label));
	let line = lines[index] ?? '';
	const focused = line.startsWith('› ');
	// The focused field wraps: its value runs on to the line with the cursor.
	for (let next = index + 1; focused && !line.includes('▌') && next < lines.length; next += 1) line = `${line.trimEnd()} ${lines[next]!.trimStart()}`;
	return {value: line.slice(2 + 46 + 1).replace(/▌$/, '').trimEnd(), focused};
}

describe('the sign-off', () => {
	it('prefills the operator from the settings and the setup from the check', async () => {
		const screen = await signOff(demo, {operator: 'Ada Quist', role: 'bench technician'});
		const frame = screen.frame();
		expect(field(frame, 'Setup name')).toEqual({value: 'Fenwick Hollow bench 3 — FH-808-2 on LD-5L, constant current', focused: true});
		expect(field(frame, 'Your name')).toEqual({value: 'Ada Quist', focused: false});
		expect(field(frame, 'Your role')).toEqual({value: 'bench technician', focused: false});
		expect(flat(frame)).toContain('I, Ada Quist (bench technician), performed this bench check of Fenwick Hollow bench 3 — FH-808-2 on LD-5L, constant current under prelase bench policy (shipped default). Its outcome is clear to energize.');
	});

	const outcomes = [
		{name: 'the clear demo', prefill: demo, words: 'clear to energize'},
		{name: 'a limit above the ceiling', prefill: {...demo, entries: {...demo.entries, current_limit: '2.4 A'}}, words: 'do not energize'},
		{name: 'a confirmation unanswered', prefill: {...demo, confirmations: Object.fromEntries(Object.entries(demo.confirmations).filter(([id]) => id !== 'grounded_mat'))}, words: 'incomplete'},
	];
	it.each(outcomes)('states the outcome of $name in words: $words', async ({prefill, words}) => {
		const screen = await signOff(prefill, {operator: 'Ada Quist'});
		expect(flat(screen.frame())).toContain(`Its outcome is ${words}. The answers are true`);
	});

	it('takes a typed name and role, signs, writes a record that verifies, removes the draft and shows the path', async () => {
		const screen = await signOff(demo);
		expect(existsSync(draftPath(screen.settings.folder))).toBe(true);
		expect(field(screen.frame(), 'Your name').value).toBe('');
		await screen.press(keys.down);
		await screen.type('Ben Okafor');
		await screen.press(keys.enter);
		await screen.type('lab lead');
		let frame = await screen.press(keys.enter);
		expect(field(frame, 'Your name').value).toBe('Ben Okafor');
		expect(field(frame, 'Your role').value).toBe('lab lead');
		expect(field(frame, 'Second signer (optional): name').focused).toBe(true);
		expect(flat(frame)).toContain('I, Ben Okafor (lab lead), performed this bench check');
		await screen.press(keys.down, keys.down, keys.down);
		expect(screen.frame()).toContain('[ Sign and write the record ]');
		frame = await screen.press(keys.enter);
		expect(frame).toContain('✓ Signed record written');

		const folder = join(screen.settings.folder, 'records');
		const files = readdirSync(folder).filter((file) => file.endsWith('.json'));
		expect(files).toHaveLength(1);
		const path = join(folder, files[0]!);
		expect(frame.replaceAll('\n', '')).toContain(path);
		expect(frame).toContain('Outcome: CLEAR TO ENERGIZE');
		const read = readRecord(path);
		if (!read.ok) throw new Error(`the record does not verify: ${read.reason}`);
		if (read.record.body.kind !== 'bench-check') throw new Error('expected a bench-check record');
		expect(read.record.body.operator).toEqual({name: 'Ben Okafor', role: 'lab lead'});
		expect(read.record.body.outcome).toBe('clear_to_energize');
		expect(read.record.body.setup.name).toBe(demo.setup);
		expect(read.signatures).toHaveLength(1);
		expect(existsSync(draftPath(screen.settings.folder))).toBe(false);
		expect(screen.settings.read()).toMatchObject({operator: 'Ben Okafor', role: 'lab lead'});
	});

	it('writes to the records folder of the settings when one is set', async () => {
		const records = mkdtempSync(join(tmpdir(), 'prelase-records-'));
		const screen = await signOff(demo, {operator: 'Ada Quist', role: 'bench technician', recordsFolder: records});
		await screen.press(keys.up);
		for (let index = 0; index < 6; index += 1) await screen.press(keys.down);
		const frame = await screen.press(keys.enter);
		expect(frame).toContain('✓ Signed record written');
		const files = readdirSync(records).filter((file) => file.endsWith('.json'));
		expect(files).toHaveLength(1);
		expect(readRecord(join(records, files[0]!)).ok).toBe(true);
		expect(existsSync(join(screen.settings.folder, 'records'))).toBe(false);
	});

	it('refuses to sign without a name', async () => {
		const screen = await signOff(demo);
		for (let index = 0; index < 6; index += 1) await screen.press(keys.down);
		const frame = await screen.press(keys.enter);
		expect(frame).toContain('✗ Your name is needed to sign.');
		expect(frame).not.toContain('Signed record written');
		expect(existsSync(join(screen.settings.folder, 'records'))).toBe(false);
		expect(existsSync(draftPath(screen.settings.folder))).toBe(true);
	});

	it('saves the inputs as a named setup with s, which the next check can start from', async () => {
		const screen = await signOff(demo, {operator: 'Ada Quist'});
		await screen.press(keys.backspace.repeat(80));
		await screen.type('Bench 3 rig');
		for (let index = 0; index < 6; index += 1) await screen.press(keys.down);
		await screen.press(keys.enter);
		expect(screen.frame()).toContain('s: save these inputs as the setup “Bench 3 rig” for the next check');
		const frame = await screen.press('s');
		expect(frame).toMatch(/✓ Setup saved: .*bench-3-rig\.json/s);
		expect(listSetups(screen.settings.folder)).toEqual(['Bench 3 rig']);
		const home = await screen.press(keys.enter);
		expect(home).toContain('Start from the saved setup Bench 3 rig');
		expect(home).not.toContain('Resume the draft');
	});
});
