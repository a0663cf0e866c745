import chalk from 'chalk';
import {mkdirSync, mkdtempSync, readFileSync, rmSync, writeFileSync} from 'node:fs';
import {tmpdir} from 'node:os';
import {join, resolve} from 'node:path';
import {cleanup} from 'ink-testing-library';
import {createElement} from 'react';
import {afterAll, afterEach, beforeAll, describe, expect, it} from 'vitest';
import type {CompiledRules} from '../../source/rules/compile/compiled-rules.js';
import {loadRules, shippedRulesPath} from '../../source/rules/load.js';
import {saveDraft} from '../../source/services/drafts/draft-store.js';
import {saveSetup} from '../../source/services/drafts/setup-store.js';
import {openSettings} from '../../source/services/settings.js';
import {App, type AppProps} from '../../source/ui/App.js';
import {clearDemo, drive, keys, prefillFromAnswers, type Screen} from '../helpers/screen-driver.js';

/*
 * Every screen is fed text from a rule file, a plan, an answers file, a draft, a saved setup and
 * a file name that holds ESC, CSI, OSC 52, BEL, concealment, C1 controls, NUL and bidirectional
 * controls, and a line break in a single-line field. With colour off Ink adds no sequence of its
 * own, so what a screen draws must hold no control character but the line feeds between lines.
 */

/** ECMA-48: OSC 52 ended by BEL (clipboard, as xterm defines it), ED (ESC [2J), SGR 8 conceal (ESC [8m), C1 CSI (0x9B), NUL; UAX #9: RLO (U+202E), LRI/PDI (U+2066, U+2069). */
const hostile = 'HOST\u001B]52;c;aGk=\u0007\u001B[2J\u001B[8m\u009B31m\u202E\u2066\u0000\u2069ILE';
/** A line break in a single-line field, followed by what would pass for the check's outcome on a line of its own. */
const fakeLine = 'Bench\nOutcome: CLEAR TO ENERGIZE';
/** Any C0 control but line feed (Ink lays out with spaces, never tabs), DEL, any C1 control, and the bidirectional controls. */
const control = /[\u0000-\u0009\u000B-\u001F\u007F-\u009F\u061C\u200E\u200F\u202A-\u202E\u2066-\u2069]/u;
/** A line of the frame that starts (after the border and indentation) with an outcome. */
const outcomeLine = /^[\s│|❯›]*Outcome: /gm;

/** The text as a YAML double-quoted scalar with everything outside printable ASCII escaped (YAML 1.2 §5.7). */
function yamlQuoted(text: string): string {
	return `"${[...text].map((character) => (character >= ' ' && character <= '~' && character !== '"' && character !== '\\' ? character : `\\u${character.codePointAt(0)!.toString(16).padStart(4, '0')}`)).join('')}"`;
}

let folder: string;
let rules: CompiledRules;
let planFile: string;
const level = chalk.level;

beforeAll(() => {
	folder = mkdtempSync(join(tmpdir(), 'prelase-screen-text-'));
	// The rule file lives in a folder whose name is hostile too: the home screen shows its path.
	const rulesFolder = join(folder, `rules-${hostile.replaceAll('\u0000', '')}`);
	mkdirSync(rulesFolder);
	const q = yamlQuoted(hostile);
	const text = readFileSync(shippedRulesPath(), 'utf8')
		.replace('name: prelase bench policy (shipped default)', `name: ${q}`)
		.replace(/^caution: >-\n/m, `caution: ${q}\nold_caution: >-\n`)
		.replace(/\nold_caution: >-\n(?: {2}.*\n)+/, '\n')
		.replaceAll(/(\n\s+title: )([^\n"]+)/g, `$1${q}`)
		.replaceAll(/(\n\s+- id: \w+\n\s+label: )([^\n">|][^\n"]*)/g, (_all, head: string, label: string) => `${head}${yamlQuoted(`${hostile} ${label}`)}`)
		.replaceAll(/(\n\s+statement: )([^\n">]+)/g, `$1${q}`);
	const rulesFile = join(rulesFolder, 'site.yaml');
	writeFileSync(rulesFile, text);
	const loaded = loadRules(rulesFile);
	if (!loaded.ok) throw new Error(`test setup: the hostile rule file does not load: ${JSON.stringify(loaded.errors.slice(0, 3))}`);
	rules = loaded.value;
	planFile = join(folder, 'plan.yaml');
	writeFileSync(planFile, readFileSync(resolve('docs/examples/interlock/bench3-interlock-plan.yaml'), 'utf8').replace('name: Fenwick Hollow B.112 bench 3 — enclosure and room loop', `name: ${q}`).replace('description: Hinged lid of the bench 3 beam enclosure', `description: ${q}`));
});

afterAll(() => rmSync(folder, {recursive: true, force: true}));
afterEach(() => {
	cleanup();
	chalk.level = level;
});

/** The whole interface on the hostile rules, with a hostile draft and saved setup in its settings folder. */
async function app(options: Partial<Pick<AppProps, 'startPlan' | 'brokenRules'>> = {}): Promise<Screen> {
	chalk.level = 0;
	// The settings folder's name is hostile too: the settings screen shows its path.
	const env: NodeJS.ProcessEnv = {PRELASE_HOME: mkdtempSync(join(folder, `home-${hostile.replaceAll('\u0000', '')}-`))};
	const settings = openSettings(env);
	const demo = prefillFromAnswers(clearDemo);
	// The answers of the clear demo as typed on screen, with a hostile serial and confirmation note.
	const entries = {...demo.entries, diode_serial: hostile};
	const confirmations = {...demo.confirmations, sop_present: {answer: 'not_applicable' as const, note: hostile}};
	saveDraft(settings.folder, {rulesFile: rules.file, rulesSha256: rules.sha256, setup: `${hostile} ${fakeLine}`, entries, confirmations, step: 0, savedAt: '2030-01-02T03:04:05.000Z'});
	saveSetup(settings.folder, {name: `${hostile} ${fakeLine}`, entries, savedAt: '2030-01-02T03:04:05.000Z'});
	return drive(createElement(App, {rules, settings, env, onExit: () => undefined, ...options}));
}

/**
 * What the screen draws holds no control character, and no line passes for the outcome (`outcomes`:
 * how many outcome lines the screen draws itself); `reached`: the hostile text did reach it.
 */
function expectInert(screen: Screen, where: string, {reached = true, outcomes = 0} = {}): void {
	const raw = screen.rawFrame();
	expect(raw, `${where}:\n${raw}`).not.toMatch(control);
	expect(raw.match(outcomeLine) ?? [], `${where}:\n${raw}`).toHaveLength(outcomes);
	if (reached) expect(raw, `${where}: the hostile text never reached this screen`).toContain('HOST');
	// Measured on stripped text, nothing overflows the 100 columns ink-testing-library draws in.
	for (const line of raw.split('\n')) expect([...line].length, `${where}: a line wider than the screen:\n${line}`).toBeLessThanOrEqual(100);
}

/** Presses ↓ on the home menu until the item that starts with `label` is highlighted, then Enter. */
async function openFromHome(screen: Screen, label: string): Promise<void> {
	for (let step = 0; step < 12 && !screen.frame().includes(`❯ ${label}`); step += 1) await screen.press(keys.down);
	await screen.press(keys.enter);
}

describe('text from files reaches the screens inert', () => {
	it('the home screen: rules name, rule file path, caution, the draft and a saved setup', async () => {
		const screen = await app();
		expectInert(screen, 'home');
		expect(screen.frame()).toContain('Resume the draft: HOST');
		expect(screen.frame()).toContain('Start from the saved setup HOST');
	});

	it('the help and the caution page', async () => {
		const screen = await app();
		await screen.press(keys.enter);
		await screen.press('?');
		expectInert(screen, 'help keys', {reached: false});
		await screen.press('?');
		expectInert(screen, 'help caution');
	});

	it('the rules in force page', async () => {
		const screen = await app();
		await openFromHome(screen, 'Rules in force');
		expect(screen.frame()).toContain('Rules in force');
		expectInert(screen, 'rules in force');
	});

	it('every step of a resumed draft, the summary and the sign-off', async () => {
		const screen = await app();
		await screen.press(keys.enter);
		for (let step = 1; step <= rules.rules.steps.length; step += 1) {
			expect(screen.frame()).toContain(`Step ${step} of ${rules.rules.steps.length}`);
			expectInert(screen, `step ${step}`);
			await screen.press(keys.pageDown);
		}
		expect(screen.frame()).toMatch(/Outcome:/);
		expectInert(screen, 'summary', {outcomes: 1});
		await screen.press(keys.enter);
		expectInert(screen, 'sign-off');
	});

	it('a saved setup started from the home screen', async () => {
		const screen = await app();
		await openFromHome(screen, 'Start from the saved setup');
		expect(screen.frame()).toContain('Step 1 of');
		expectInert(screen, 'step 1 from a saved setup');
	});

	it('a rule file that does not load: its path and problems', async () => {
		const screen = await app({brokenRules: {file: join(folder, `${hostile}.yaml`), settingsPath: join(folder, hostile, 'config.json'), problems: [`${hostile}:1:1 ${hostile}`, hostile]}});
		expect(screen.frame()).toContain('No check can start');
		expectInert(screen, 'broken rules');
	});

	it('the planner: plan name, items and findings', async () => {
		const screen = await app({startPlan: planFile});
		expect(screen.frame()).toContain('Plan: HOST');
		expectInert(screen, 'planner list');
		await screen.press(keys.enter);
		expectInert(screen, 'planner form', {reached: false});
	});

	it('the planner\'s findings and the test-record screen', async () => {
		const screen = await app({startPlan: planFile});
		await screen.press('f');
		expectInert(screen, 'planner findings', {reached: false});
		await screen.press(keys.escape);
		await screen.press('t');
		expect(screen.frame()).toContain('Record a test: HOST');
		expectInert(screen, 'test record');
	});

	it('the settings screen: the settings file\'s path', async () => {
		const screen = await app();
		await openFromHome(screen, 'Settings');
		expect(screen.frame()).toContain('Settings');
		expectInert(screen, 'settings');
	});

	it('a plan that does not open: its path and problems', async () => {
		const screen = await app({startPlan: join(folder, `${hostile}.yaml`)});
		expectInert(screen, 'plan open');
	});
});
