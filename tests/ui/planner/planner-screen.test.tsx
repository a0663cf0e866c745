import chalk from 'chalk';
import {copyFileSync, existsSync, mkdtempSync, readdirSync, readFileSync, writeFileSync} from 'node:fs';
import {tmpdir} from 'node:os';
import {join, resolve} from 'node:path';
import {cleanup} from 'ink-testing-library';
import {afterEach, describe, expect, it} from 'vitest';
import {loadPlan} from '../../../source/interlock/plan/load-plan.js';
import {openSettings} from '../../../source/services/settings.js';
import {frameMatching, keys, renderApp, type AppScreen} from '../../helpers/screen-driver.js';
import {demoPlanFile} from '../../interlock/plan-fixture.js';

const level = chalk.level;
afterEach(() => {
	cleanup();
	chalk.level = level;
});

const demoText = readFileSync(demoPlanFile, 'utf8');

/** The demo plan copied to a fresh folder. */
function demoCopy(): string {
	const file = join(mkdtempSync(join(tmpdir(), 'prelase-planner-')), 'plan.yaml');
	copyFileSync(demoPlanFile, file);
	return file;
}

/** The planner on a copy of the demo, as `prelase plan FILE --edit` opens it. */
async function planner(): Promise<AppScreen & {file: string}> {
	const file = demoCopy();
	const screen = await renderApp({startPlan: file});
	return {...screen, file};
}

/** The list's line of an item: its finding mark, id and facts, without the selection marker. */
const itemLine = (frame: string, id: string) =>
	frame
		.split('\n')
		.find((line) => line.slice(4).startsWith(`${id} `))
		?.slice(2)
		.trimEnd();

/** Selects the item with this id in the list (access points, then devices). */
async function select(screen: AppScreen, id: string): Promise<string> {
	for (let step = 0; step < 14; step += 1) {
		if (itemLine(screen.frame(), id) && screen.frame().includes(`› `) && screen.frame().split('\n').some((line) => line.startsWith('› ') && line.slice(4).startsWith(`${id} `))) return screen.frame();
		await screen.press(keys.down);
	}
	throw new Error(`${id} was never selected:\n${screen.frame()}`);
}

/** Moves the form's focus to the field with this label. */
async function field(screen: AppScreen, label: string): Promise<string> {
	for (let step = 0; step < 20; step += 1) {
		if (screen.frame().includes(`› ${label}`)) return screen.frame();
		await screen.press(keys.down);
	}
	throw new Error(`no field ${label}:\n${screen.frame()}`);
}

describe('the interlock planner', () => {
	it('opens from the home screen on the path typed, remembers it, and lists the demo with its figures and no findings', async () => {
		const file = demoCopy();
		const screen = await renderApp();
		await screen.press(keys.up, keys.up);
		expect(screen.frame()).toContain('❯ Interlock planner (open a plan file)');
		let frame = await screen.press(keys.enter);
		expect(frame).toMatch(/^› Plan file ▌$/m);
		frame = await screen.paste(`${file}\r`);
		expect(frame).toContain('Plan: Fenwick Hollow B.112 bench 3 — enclosure and room loop');
		expect(frame).toContain('Loop      3.42 Ω of 75 Ω allowed · current 10 mA');
		expect(frame).toContain('Response  16.5 ms at the slowest (chiller_flow) · policy limit 20 ms');
		expect(frame).toContain('Findings: 0 stop · 0 advise');
		expect(frame).toContain('Access points (5)');
		expect(itemLine(frame, 'enclosure_lid')).toBe('  enclosure_lid      beam reachable · interlock → lid_switch');
		expect(itemLine(frame, 'lid_switch')).toBe('  lid_switch         lid switch · N/C · series · 80 mΩ · opens 8 ms');
		expect(itemLine(frame, 'estop_bench')).toBe('  estop_bench        emergency stop · N/C · series · 20 mΩ · opens 5 ms');
		// The caution in one line with its key; in full on the home screen and behind ? ?.
		expect(frame).not.toContain('it never says a setup is safe');
		expect(frame).toContain('? keys, caution in full · the laser safety officer and local codes decide');
		expect(openSettings(screen.env).read().planFile).toBe(resolve(file));
	});

	it('offers the last plan opened, and shows why a path cannot be opened', async () => {
		const screen = await renderApp({settings: {planFile: '/nowhere/plan.yaml'}});
		await screen.press(keys.up, keys.up);
		let frame = await screen.press(keys.enter);
		expect(frame).toMatch(/^› Plan file \/nowhere\/plan\.yaml▌$/m);
		frame = await screen.press(keys.enter);
		expect(frame).toContain('✗ /nowhere/plan.yaml: error: cannot read the file');
		expect(frame).toContain('Interlock planner');
	});

	it('shows a stop finding naming the device as soon as its contact is made normally open', async () => {
		const screen = await planner();
		await select(screen, 'estop_bench');
		let frame = await screen.press(keys.enter);
		expect(frame).toContain('Device 3 of 7 in wiring order: estop_bench');
		await field(screen, 'Contact');
		frame = await screen.press(keys.right);
		expect(frame).toMatch(/› Contact +‹ normally_open › 2 of 2/);
		frame = await screen.press(keys.enter);
		expect(frame).toContain('Findings for estop_bench: 1 stop · 0 advise (plan: 1 stop)');
		expect(frame).toContain('✗ STOP    a normally-open contact in the loop');
		frame = await screen.press(keys.escape);
		expect(frame).toContain('Findings: 1 stop · 0 advise');
		expect(frame).toContain('✗ STOP    device estop_bench: a normally-open contact in the loop');
		expect(itemLine(frame, 'estop_bench')).toBe('✗ estop_bench        emergency stop · N/O · series · 20 mΩ · opens 5 ms');
		expect(frame).toContain('(not saved)');
		expect(readFileSync(screen.file, 'utf8')).toBe(demoText);
	});

	it('refuses a voltage typed for an opening time, says why beside the field, and changes nothing', async () => {
		const screen = await planner();
		await select(screen, 'estop_bench');
		await screen.press(keys.enter);
		await field(screen, 'Opening time');
		await screen.paste(keys.backspace.repeat(4));
		await screen.paste('8 V\r');
		// The edit is worked out in steps (it yields to the event loop): wait for its answer, not only for the keys' frames.
		const refused = /› Opening time +8 V▌\n {2}✗ "8 V" is a voltage, but this field is a time, for example "3 s"/;
		let frame = await frameMatching(screen, refused);
		expect(frame).toMatch(refused);
		// The refused entry is still in the field: Esc asks before dropping it.
		expect(await screen.press(keys.escape)).toContain('Discard the change to opening time? y discard it and go back');
		frame = await screen.press('y');
		expect(itemLine(frame, 'estop_bench')).toBe('  estop_bench        emergency stop · N/C · series · 20 mΩ · opens 5 ms');
		expect(frame).toContain('Findings: 0 stop · 0 advise');
		expect(frame).not.toContain('(not saved)');
		// Nothing to save, so Esc leaves without asking.
		frame = await screen.press(keys.escape);
		expect(frame).toContain('❯ Start a bench check');
	});

	it('adds an unsecured access point a beam can reach: a coverage stop finding; saving keeps the comments and reloads with both changes', async () => {
		const screen = await planner();
		await select(screen, 'estop_bench');
		await screen.press(keys.enter);
		await field(screen, 'Contact');
		await screen.press(keys.right, keys.enter, keys.escape);
		let frame = await screen.press('a');
		expect(frame).toContain('New access point');
		await screen.paste('rear_hatch\r');
		await screen.paste('Rear service hatch\r');
		await screen.press('y', keys.enter);
		frame = await screen.press(keys.left);
		expect(frame).toMatch(/› Secured by +‹ none › 3 of 3/);
		await screen.press(keys.enter, keys.enter);
		expect(screen.frame()).toContain('› [ Add to the plan ]');
		frame = await screen.press(keys.enter);
		expect(frame).toContain('✓ Added rear_hatch, a new access point');
		expect(frame).toContain('Findings: 2 stop · 0 advise');
		expect(frame).toContain('✗ STOP    access point rear_hatch: a beam can be reached through this access point');
		expect(itemLine(frame, 'rear_hatch')).toBe('✗ rear_hatch         beam reachable · not secured');

		frame = await screen.press('s');
		expect(frame).toContain(`✓ Saved ${screen.file}`);
		expect(frame).not.toContain('(not saved)');
		const saved = loadPlan(screen.file);
		if (!saved.ok) throw new Error(JSON.stringify(saved.errors));
		expect(saved.value.access_points.at(-1)).toEqual({id: 'rear_hatch', description: 'Rear service hatch', beam_reachable: true, secured_by: 'none'});
		expect(saved.value.devices.find((device) => device.id === 'estop_bench')?.contact).toBe('normally_open');
		const text = readFileSync(screen.file, 'utf8');
		expect(text).toContain('# Invented demo: Fenwick Hollow Photonics Lab');
		expect(text).toContain('wire_temperature: 30 degC        # warmest the cable tray gets');
		expect(text).toContain('devices:                         # in wiring order, from the input and back to it');
	});

	it('refuses to add a new item with a required field missing, and points at it', async () => {
		const screen = await planner();
		await screen.press('a');
		await screen.paste('rear_hatch\r');
		await screen.press(keys.down, keys.down, keys.down, keys.down);
		expect(screen.frame()).toContain('› [ Add to the plan ]');
		const frame = await screen.press(keys.enter);
		expect(frame).toMatch(/› Description +▌\n {2}✗ needed: this field cannot be left empty/);
		await screen.press(keys.escape);
		expect(itemLine(screen.frame(), 'rear_hatch')).toBeUndefined();
	});

	it('asks before leaving with unsaved changes: Esc stays, d discards', async () => {
		const screen = await planner();
		await select(screen, 'lid_switch');
		let frame = await screen.press(']');
		expect(frame).toContain('✓ Moved lid_switch to place 2 of 7 in the wiring order');
		const devices = frame.split('\n').filter((line) => /^[› ] [ ✗!] (lid_switch|fibre_sense) /.test(line));
		expect(devices.map((line) => line.slice(4, 22).trim())).toEqual(['fibre_sense', 'lid_switch']);
		frame = await screen.press(keys.escape);
		expect(frame).toContain(`Unsaved changes to ${screen.file}. Save them before leaving?`);
		expect(frame).toContain('s save and leave · d discard changes and leave · Esc stay');
		frame = await screen.press(keys.escape);
		expect(frame).toContain('(not saved)');
		await screen.press(keys.escape);
		frame = await screen.press('d');
		expect(frame).toContain('❯ Start a bench check');
		expect(readFileSync(screen.file, 'utf8')).toBe(demoText);
	});

	it('removes an item only when confirmed', async () => {
		const screen = await planner();
		await select(screen, 'cable_gland');
		let frame = await screen.press('x');
		expect(frame).toContain('Remove the access point cable_gland from the plan?');
		frame = await screen.press('n');
		expect(frame).toContain('✓ Nothing removed');
		expect(itemLine(frame, 'cable_gland')).toBeDefined();
		await screen.press('x');
		frame = await screen.press('y');
		expect(frame).toContain('✓ Removed the access point cable_gland');
		expect(itemLine(frame, 'cable_gland')).toBeUndefined();
		frame = await screen.press(keys.up, keys.up, keys.up, keys.up);
		expect(frame).toContain('Access points (4)');
	});

	it('reads the same without colour: findings and marks are words and symbols', async () => {
		chalk.level = 0;
		const screen = await planner();
		await select(screen, 'estop_bench');
		await screen.press(keys.enter);
		await field(screen, 'Contact');
		await screen.press(keys.right, keys.enter, keys.escape);
		const raw = screen.rawFrame();
		expect(raw).not.toContain('\u001B[');
		expect(raw).toContain('✗ STOP    device estop_bench');
		expect(raw).toContain('› ✗ estop_bench');
	});
});

describe('unsaved planner edits survive the program ending', () => {
	/** The planner on a copy of the demo with estop_bench made normally open, not saved; returns the screen and the file. */
	async function editedAndLeftUnsaved(): Promise<AppScreen & {file: string}> {
		const screen = await planner();
		await select(screen, 'estop_bench');
		await screen.press(keys.enter);
		await field(screen, 'Contact');
		await screen.press(keys.right, keys.enter, keys.escape);
		expect(screen.frame()).toContain('Findings: 1 stop · 0 advise');
		return screen;
	}
	const draftsOf = (home: string) => (existsSync(join(home, 'drafts')) ? readdirSync(join(home, 'drafts')).filter((name) => name.startsWith('plan-')) : []);

	it('a change is kept as a draft at once; opening the plan again restores it, and saving clears it', async () => {
		const first = await editedAndLeftUnsaved();
		expect(draftsOf(first.home)).toHaveLength(1);
		// the program ends without saving (Ctrl-C, a closed terminal, a crash)
		cleanup();
		const again = await renderApp({startPlan: first.file, home: first.home});
		let frame = again.frame();
		expect(frame).toMatch(/✓ Unsaved edits from \d{4}-\d{2}-\d{2} \d{2}:\d{2} restored: s saves them/);
		expect(frame).toContain('Findings: 1 stop · 0 advise');
		expect(readFileSync(first.file, 'utf8')).toBe(demoText);
		frame = await again.press('s');
		expect(frame).toContain(`✓ Saved`);
		expect(loadPlan(first.file)).toMatchObject({ok: true, value: {devices: expect.arrayContaining([expect.objectContaining({id: 'estop_bench', contact: 'normally_open'})]) as unknown}});
		expect(draftsOf(first.home)).toEqual([]);
	});

	it('a draft made from a file that has changed since is kept, not applied, and said so', async () => {
		const first = await editedAndLeftUnsaved();
		cleanup();
		writeFileSync(first.file, `${demoText}# edited by hand meanwhile\n`);
		const again = await renderApp({startPlan: first.file, home: first.home});
		const frame = again.frame().replaceAll(/\s+/g, ' ');
		expect(frame).toContain('✗ Unsaved edits from');
		expect(frame).toContain('were not restored: the file changed since');
		expect(frame).toContain('Findings: 0 stop · 0 advise');
		expect(draftsOf(first.home)).toHaveLength(1);
	});

	it('discarding the changes when leaving removes the draft', async () => {
		const first = await editedAndLeftUnsaved();
		await first.press(keys.escape);
		expect(first.frame()).toContain('s save and leave · d discard changes and leave · Esc stay');
		await first.press('d');
		expect(draftsOf(first.home)).toEqual([]);
		expect(readFileSync(first.file, 'utf8')).toBe(demoText);
	});
});
