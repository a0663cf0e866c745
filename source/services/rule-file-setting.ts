import {resolve} from 'node:path';
import type {CompiledRules} from '../rules/compile/compiled-rules.js';
import {loadRules, ruleFileNamed, shippedRulesPath} from '../rules/load.js';
import type {Problem} from '../shared/problems.js';
import {failure, success, type Result} from '../shared/result.js';
import type {SettingsStore} from './settings.js';

/** A rule file named in the settings that does not load: which file, where the settings live, and why. */
export type BrokenRuleSetting = {file: string; settingsPath: string; problems: Problem[]};

/**
 * Checks a rule file typed into the settings before it is saved: the path is made absolute
 * (against `base`, the working folder) and the file must load without a problem. Empty means the
 * shipped policy. The rules loaded come back too, so the screens can use them at once.
 */
export function checkRuleFileSetting(typed: string, base: string): Result<{file: string; rules: CompiledRules}, Problem> {
	const trimmed = typed.trim();
	const file = trimmed === '' ? '' : resolve(base, trimmed);
	const loaded = loadRules(file === '' ? shippedRulesPath() : file);
	return loaded.ok ? success({file, rules: loaded.value}, loaded.warnings) : failure(loaded.errors);
}

/**
 * The rules the screens start with. A rule file asked for on the command line must load; one named
 * in the settings that does not load is reported as `broken` and the shipped policy is loaded in
 * its place, so the home screen still opens (Settings can fix it; no check starts on it).
 */
export function rulesForScreens(asked: string | undefined, settings: SettingsStore): Result<{rules: CompiledRules; file: string; broken?: BrokenRuleSetting}, Problem> {
	const named = asked === undefined ? settings.read().rulesFile : undefined;
	const file = (asked === undefined ? undefined : ruleFileNamed(asked)) ?? named ?? shippedRulesPath();
	const loaded = loadRules(file);
	if (loaded.ok) return success({rules: loaded.value, file});
	if (named === undefined) return failure(loaded.errors);
	const shipped = loadRules(shippedRulesPath());
	if (!shipped.ok) return failure([...loaded.errors, ...shipped.errors]);
	return success({rules: shipped.value, file: shippedRulesPath(), broken: {file: named, settingsPath: settings.path, problems: loaded.errors}});
}
