import type {Problem} from '../shared/problems.js';
import type {Result} from '../shared/result.js';
import {readSettings} from './settings.js';
import type {CompiledRules} from '../rules/compile/compiled-rules.js';
import {loadRules, ruleFileNamed, shippedRulesPath} from '../rules/load.js';

/** The rule file in force: the one asked for, else the settings' (site policy), else the shipped policy. */
export function rulesInForce(asked: string | undefined, env: NodeJS.ProcessEnv): Result<CompiledRules, Problem> {
	return loadRules(asked !== undefined ? ruleFileNamed(asked) : (readSettings(env).rulesFile ?? shippedRulesPath()));
}
