import {render} from 'ink';
import {loadRules, shippedRulesPath} from '../rules/load.js';
import {formatProblem} from '../shared/problems.js';
import {openSettings} from '../services/settings.js';
import {App} from './App.js';
import {plain} from '../shared/paint.js';


/** Options of the screens: where they start. */
export type ScreenOptions = {env: NodeJS.ProcessEnv; rules?: string; startCheck?: {setup?: string}; startPlan?: string; audit?: (folder: string) => Promise<string[]>; stderr: NodeJS.WriteStream};

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
	const audit =
		options.audit ??
		(async (folder: string) => {
			// The audit is loaded when asked for, not before the home screen's first frame.
			const [{listRecordFiles}, {auditRecords}, {auditText}, {ownFingerprint, readTrusted}] = await Promise.all([
				import('../audit/audit-files.js'),
				import('../audit/audit.js'),
				import('../render/audit-text.js'),
				import('../records/key-files.js'),
			]);
			const {files} = listRecordFiles([folder]);
			if (files.length === 0) return [`No records in ${folder} yet.`];
			const report = auditRecords(files, {current: rules.value, trust: {own: ownFingerprint(settings.folder), trusted: readTrusted(settings.folder)}});
			return auditText(report, plain, process.stdout.columns ?? 80).split('\n');
		});
	let code = 0;
	const instance = render(<App rules={rules.value} settings={settings} env={options.env} {...(options.startCheck ? {startCheck: options.startCheck} : {})} {...(options.startPlan === undefined ? {} : {startPlan: options.startPlan})} audit={audit} onExit={(value) => (code = value)} />, {exitOnCtrlC: false});
	await instance.waitUntilExit();
	return code;
}
