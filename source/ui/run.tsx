import {render} from 'ink';
import {loadRules, shippedRulesPath} from '../rules/load.js';
import {formatProblem} from '../problems.js';
import {openSettings} from '../settings.js';
import {App} from './App.js';

/** Options of the screens: where they start. */
export type ScreenOptions = {env: NodeJS.ProcessEnv; rules?: string; startCheck?: {setup?: string}; audit?: (folder: string) => string[]; stderr: NodeJS.WriteStream};

/** Runs the interactive screens until the operator leaves; returns the exit status. */
export async function runScreens(options: ScreenOptions): Promise<number> {
	const settings = openSettings(options.env);
	const rulesPath = options.rules ?? settings.read().rulesFile ?? shippedRulesPath();
	const rules = loadRules(rulesPath);
	if (!rules.ok) {
		for (const found of rules.errors) options.stderr.write(`${formatProblem(found)}\n`);
		options.stderr.write('prelase: the rule file has problems; fix them before starting a check\n');
		return 2;
	}
	let code = 0;
	const instance = render(<App rules={rules.value} settings={settings} env={options.env} {...(options.startCheck ? {startCheck: options.startCheck} : {})} {...(options.audit ? {audit: options.audit} : {})} onExit={(value) => (code = value)} />, {exitOnCtrlC: false});
	await instance.waitUntilExit();
	return code;
}
