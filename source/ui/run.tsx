import {render} from 'ink';
import {formatProblem} from '../shared/problems.js';
import {openSettings} from '../services/settings.js';
import {rulesForScreens} from '../services/rule-file-setting.js';
import {App} from './App.js';
import {auditInWorker} from './audit-worker.js';


/** Options of the screens: where they start. */
export type ScreenOptions = {env: NodeJS.ProcessEnv; rules?: string; startCheck?: {setup?: string}; startPlan?: string; audit?: (folder: string) => Promise<string[]>; stderr: NodeJS.WriteStream};

/** Runs the interactive screens until the operator leaves; returns the exit status and the line to print after the screens (where the drafts are), if any. */
export async function runScreens(options: ScreenOptions): Promise<{code: number; farewell?: string}> {
	const settings = openSettings(options.env);
	// A broken rule file named in the settings still opens the home screen, which says so; one asked for on the command line does not.
	const rules = rulesForScreens(options.rules, settings);
	if (!rules.ok) {
		for (const found of rules.errors) options.stderr.write(`${formatProblem(found)}\n`);
		options.stderr.write('prelase: the rule file has problems; fix them before starting a check\n');
		return {code: 2};
	}
	const audit =
		options.audit ??
		// The audit runs in a worker thread of this same program (this module's file is the bundle), so a signal is honoured at once while it works.
		((folder: string) => auditInWorker({folder, rulesFile: rules.value.file, settingsFolder: settings.folder, columns: process.stdout.columns ?? 80}, new URL(import.meta.url)));
	let code = 0;
	let farewell: string | undefined;
	// In the bundle, Yoga's WebAssembly is ready a moment after Ink is loaded (scripts/top-level-await-patches.mjs); unbundled, at once.
	await (globalThis as {__prelaseYogaReady?: Promise<void>}).__prelaseYogaReady;
	const instance = render(<App rules={rules.value.rules} {...(rules.value.broken ? {brokenRules: {file: rules.value.broken.file, settingsPath: rules.value.broken.settingsPath, problems: rules.value.broken.problems.map(formatProblem)}} : {})} settings={settings} env={options.env} {...(options.startCheck ? {startCheck: options.startCheck} : {})} {...(options.startPlan === undefined ? {} : {startPlan: options.startPlan})} audit={audit} onExit={(value, line) => {
				code = value;
				farewell = line;
			}} />, {exitOnCtrlC: false});
	await instance.waitUntilExit();
	return farewell === undefined ? {code} : {code, farewell};
}
