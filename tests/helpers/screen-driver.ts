import {mkdtempSync, readFileSync} from 'node:fs';
import {tmpdir} from 'node:os';
import {join} from 'node:path';
import {stripVTControlCharacters} from 'node:util';
import {render} from 'ink-testing-library';
import {createElement, type ReactElement} from 'react';
import {parse} from 'yaml';
import {saveDraft} from '../../source/services/drafts/draft-store.js';
import type {CompiledRules} from '../../source/rules/compile/compiled-rules.js';
import {loadRules, shippedRulesPath} from '../../source/rules/load.js';
import {openSettings, type Settings, type SettingsStore} from '../../source/services/settings.js';
import {App, type AppProps} from '../../source/ui/App.js';
import type {Prefill} from '../../source/ui/bench-check/session.js';

/** The keys a test presses, as a terminal sends them. */
export const keys = {
	enter: '\r',
	escape: '\u001B',
	up: '\u001B[A',
	down: '\u001B[B',
	right: '\u001B[C',
	left: '\u001B[D',
	pageDown: '\u001B[6~',
	pageUp: '\u001B[5~',
	tab: '\t',
	backspace: '\u007F',
	ctrlC: '\u0003',
} as const;

/** How long to wait for a frame before giving up, and how long the frames must stay still after it. */
const deadlineMs = 1500;
const settleMs = 20;
const stillMs = 150;

const sleep = (ms: number) => new Promise((resolve) => setTimeout(resolve, ms));

/** A rendered tree driven from the keyboard. */
export type Screen = {
	/** The last frame, without colour. */
	frame(): string;
	/** Every frame drawn so far, without colour. */
	frames(): string[];
	/** Writes each key in turn, waiting after each for the frame to change and settle; returns the last frame. */
	press(...sequence: string[]): Promise<string>;
	/** Types text one character at a time, as a keyboard does. */
	type(text: string): Promise<string>;
	/** Writes text in one chunk, as a paste or a fast terminal delivers it. */
	paste(text: string): Promise<string>;
	/** Writes a key that should leave the frame as it is, and waits a fixed while instead of for a change. */
	pressStill(key: string): Promise<string>;
	/** The raw last frame, colour codes included. */
	rawFrame(): string;
};

/** Renders a tree and waits for its first frame: nothing is written to stdin before it. */
export async function drive(tree: ReactElement): Promise<Screen> {
	const instance = render(tree);
	const changed = async (beforeFrame: string | undefined, beforeCount: number) => {
		const deadline = Date.now() + deadlineMs;
		while (instance.lastFrame() === beforeFrame && instance.frames.length === beforeCount && Date.now() < deadline) await sleep(2);
		// Ink attaches input handlers in a passive effect after the commit; let it, and any follow-up render, run.
		let count = -1;
		while (count !== instance.frames.length && Date.now() < deadline) {
			count = instance.frames.length;
			await sleep(settleMs);
		}
	};
	await changed(undefined, 0);
	const write = async (chunk: string) => {
		const beforeFrame = instance.lastFrame();
		const beforeCount = instance.frames.length;
		instance.stdin.write(chunk);
		await changed(beforeFrame, beforeCount);
	};
	const screen: Screen = {
		frame: () => stripVTControlCharacters(instance.lastFrame() ?? ''),
		frames: () => instance.frames.map((frame) => stripVTControlCharacters(frame)),
		rawFrame: () => instance.lastFrame() ?? '',
		async press(...sequence) {
			for (const key of sequence) await write(key);
			return screen.frame();
		},
		async type(text) {
			for (const character of text) await write(character);
			return screen.frame();
		},
		async pressStill(key) {
			instance.stdin.write(key);
			await sleep(stillMs);
			return screen.frame();
		},
		async paste(text) {
			await write(text);
			return screen.frame();
		},
	};
	return screen;
}

/**
 * The frame once it matches `pattern`: for what a screen draws after work done in steps (the
 * planner's edits yield to the event loop between slices), which may come after the frames of the
 * keystroke have settled on a busy machine. Gives the last frame after `timeoutMs` otherwise.
 */
export async function frameMatching(screen: Screen, pattern: RegExp, timeoutMs = 5000): Promise<string> {
	const deadline = Date.now() + timeoutMs;
	while (!pattern.test(screen.frame()) && Date.now() < deadline) await sleep(10);
	return screen.frame();
}

let shipped: CompiledRules | undefined;

/** The shipped rule file, compiled once per test file. */
export function shippedRules(): CompiledRules {
	if (!shipped) {
		const loaded = loadRules(shippedRulesPath());
		if (!loaded.ok) throw new Error(`the shipped rules do not load: ${JSON.stringify(loaded.errors)}`);
		shipped = loaded.value;
	}
	return shipped;
}

/** Where a rendered App keeps its settings, and what it reported on leaving. */
export type AppScreen = Screen & {env: NodeJS.ProcessEnv; home: string; settings: SettingsStore; rules: CompiledRules; exits: number[]};

/** How to start the App under test. */
export type AppOptions = {
	/** Start in the bench check (as `prelase check`) instead of the home screen. */
	startCheck?: AppProps['startCheck'];
	/** Start in the interlock planner on this plan file (as `prelase plan FILE --edit`). */
	startPlan?: string;
	/** Settings written before the App starts. */
	settings?: Settings;
	/** A draft saved before the App starts, resumable from the home screen. */
	draft?: Prefill & {step?: number};
	/** Extra environment (NO_COLOR and the like). */
	env?: NodeJS.ProcessEnv;
	/** The settings folder (PRELASE_HOME) of an earlier run, to start again where it stopped; a fresh folder when absent. */
	home?: string;
};

/** Renders the whole interface with the shipped rules and a fresh settings folder. */
export async function renderApp(options: AppOptions = {}): Promise<AppScreen> {
	const home = options.home ?? mkdtempSync(join(tmpdir(), 'prelase-ui-'));
	const env: NodeJS.ProcessEnv = {...options.env, PRELASE_HOME: home};
	const settings = openSettings(env);
	if (options.settings) settings.write(options.settings);
	const rules = shippedRules();
	if (options.draft) {
		const {step, setup, entries, confirmations} = options.draft;
		saveDraft(settings.folder, {rulesFile: rules.file, rulesSha256: rules.sha256, setup: setup ?? '', entries: {...entries}, confirmations: {...confirmations}, step: step ?? 0, savedAt: '2030-01-02T03:04:05.000Z'});
	}
	const exits: number[] = [];
	const props: AppProps = {rules, settings, env, onExit: (code) => exits.push(code), ...(options.startCheck ? {startCheck: options.startCheck} : {}), ...(options.startPlan === undefined ? {} : {startPlan: options.startPlan})};
	const screen = await drive(createElement(App, props));
	return {...screen, env, home, settings, rules, exits};
}

/** An answers file read as the screens hold it: inputs as typed text, confirmations as answers. */
export function prefillFromAnswers(file: string): Prefill & {entries: Record<string, string>; confirmations: NonNullable<Prefill['confirmations']>} {
	const data = parse(readFileSync(file, 'utf8')) as {setup?: string; inputs?: Record<string, unknown>; confirmations?: Record<string, unknown>};
	const entries = Object.fromEntries(Object.entries(data.inputs ?? {}).map(([id, value]) => [id, String(value)]));
	const confirmations = Object.fromEntries(
		Object.entries(data.confirmations ?? {}).map(([id, value]) => {
			const raw = typeof value === 'object' && value !== null ? (value as {answer: string; note?: string}) : {answer: String(value)};
			const answer = raw.answer.replaceAll(' ', '_') as 'yes' | 'no' | 'not_applicable';
			return [id, raw.note ? {answer, note: raw.note} : {answer}];
		}),
	);
	return {...(data.setup ? {setup: data.setup} : {}), entries, confirmations};
}

/** The clear demo of the docs: every stop check holds. */
export const clearDemo = join(import.meta.dirname, '..', '..', 'docs', 'examples', 'bench3-808nm-clear.yaml');

/** Moves the focus down the current step until the field whose label starts with `label` is focused. */
export async function focusOn(screen: Screen, label: string, limit = 20): Promise<string> {
	for (let step = 0; step < limit; step += 1) {
		if (screen.frame().includes(`› ${label}`)) return screen.frame();
		await screen.press(keys.down);
	}
	throw new Error(`no field "${label}" came into focus:\n${screen.frame()}`);
}

/**
 * Answers a step's fields from the top, in the rule file's order, with the values given (inputs
 * as typed text, confirmations as answers); fields without a value are left alone and skipped.
 * Starts on the step's first field and leaves the step when its last field is answered.
 */
export async function fillStep(screen: Screen, rules: CompiledRules, stepIndex: number, values: Prefill): Promise<void> {
	const step = rules.rules.steps[stepIndex];
	if (!step) throw new Error(`no step ${stepIndex}`);
	for (const input of step.inputs) {
		const text = values.entries?.[input.id];
		if (text === undefined) continue;
		if (input.kind === 'choice') {
			const index = Object.keys(input.options).indexOf(text);
			if (index < 0) throw new Error(`${input.id} has no option ${text}`);
			const initial = input.default === undefined ? 0 : Object.keys(input.options).indexOf(input.default);
			const moves = (index - initial + Object.keys(input.options).length) % Object.keys(input.options).length;
			if (moves > 0) await screen.paste(keys.right.repeat(moves));
			await screen.press(keys.enter);
		} else if (input.kind === 'yes_no') {
			await screen.press(text === 'yes' ? 'y' : 'n');
		} else {
			const prefilled = input.kind === 'quantity' && input.default !== undefined ? String(input.default) : '';
			if (prefilled) await screen.paste(keys.backspace.repeat([...prefilled].length));
			await screen.paste(`${text}\r`);
		}
	}
	for (const confirmation of step.confirmations) {
		const answer = values.confirmations?.[confirmation.id];
		if (!answer) continue;
		if (answer.answer === 'not_applicable') {
			await screen.press('a');
			await screen.paste(`${answer.note ?? ''}\r`);
		} else await screen.press(answer.answer === 'yes' ? 'y' : 'n');
	}
	// After its last answer a step with checks stays to show their verdicts; Enter moves on.
	if (screen.frame().includes('Enter or PgDn: on to')) await screen.press(keys.enter);
}
