import {writeFileSync} from 'node:fs';
import {parseArgs} from 'node:util';
import {formatProblem} from '../../shared/problems.js';
import type {CompiledRules} from '../../rules/compiled-rules.js';
import {diffRules} from '../../rules/diff.js';
import {siteFileTemplate} from '../../rules/init-template.js';
import {loadRules, shippedRulesPath} from '../../rules/load.js';
import {ruleFileJsonSchema, siteFileJsonSchema} from '../../rules/rule-json-schema.js';
import {showRules} from '../../rules/show.js';
import {openSettings} from '../../services/settings.js';
import {terminalSafeJson} from '../../shared/text.js';
import {UsageError} from '../usage-error.js';
import type {Io} from '../io.js';
import {helpTexts} from './help.js';
import {diffText} from '../../render/rules-diff-text.js';
import {showText} from '../../render/rules-show-text.js';

/** A rule file named on the command line: `shipped` is the shipped policy. */
function ruleFileArgument(name: string): string {
	return name === 'shipped' ? shippedRulesPath() : name;
}

/** Loads rules for show or diff; problems are the user's to fix (exit 2). */
function loadOrRefuse(file: string): CompiledRules {
	const loaded = loadRules(file);
	if (!loaded.ok) throw new UsageError(`the rule file ${file} has problems; prelase rules validate ${file} lists them`, loaded.errors);
	return loaded.value;
}

/** `prelase rules schema|validate|init|show|diff`: returns the exit status. */
export function runRules(args: string[], io: Io): number {
	const {values, positionals} = parseArgs({args, options: {help: {type: 'boolean', short: 'h'}, json: {type: 'boolean'}, site: {type: 'boolean'}}, allowPositionals: true, strict: true});
	const [action, ...files] = positionals;
	if (values.help || action === undefined) {
		io.stdout.write(`${helpTexts.rules}\n`);
		return values.help ? 0 : 2;
	}
	if (values.json && action !== 'show' && action !== 'diff') throw new UsageError('--json goes with rules show or rules diff');
	if (values.site && action !== 'schema') throw new UsageError('--site goes with rules schema');
	switch (action) {
		case 'schema': {
			io.stdout.write(`${JSON.stringify(values.site ? siteFileJsonSchema() : ruleFileJsonSchema(), null, 2)}\n`);
			return 0;
		}
		case 'validate': {
			if (files.length === 0) throw new UsageError('name at least one rule file: prelase rules validate FILE...');
			let problems = 0;
			for (const file of files) {
				const loaded = loadRules(ruleFileArgument(file));
				const found = loaded.ok ? loaded.warnings : loaded.errors;
				for (const entry of found) io.stdout.write(`${formatProblem(entry)}\n`);
				if (!loaded.ok) problems += loaded.errors.length;
				else {
					const rules = loaded.value;
					const off = rules.switchedOff.length > 0 ? `, ${rules.switchedOff.length} switched off` : '';
					const base = rules.provenance.chain.length > 1 ? `; extends ${rules.provenance.chain.slice(1).length} file(s)` : '';
					io.stdout.write(`${file}: ok (${rules.checks.length} checks${off}, ${rules.inputs.size} inputs, ${rules.confirmations.size} confirmations${base})\n`);
				}
			}
			if (problems > 0) io.stdout.write(`${problems} problem${problems === 1 ? '' : 's'} found.\n`);
			return problems > 0 ? 1 : 0;
		}
		case 'init': {
			if (files.length !== 1) throw new UsageError('name the file to write: prelase rules init FILE');
			const text = siteFileTemplate(loadOrRefuse(shippedRulesPath()));
			try {
				writeFileSync(files[0]!, text, {flag: 'wx'});
			} catch (error) {
				const code = (error as NodeJS.ErrnoException).code;
				throw new UsageError(code === 'EEXIST' ? `${files[0]} already exists; prelase rules init never overwrites a file` : `cannot write ${files[0]} (${(error as Error).message})`);
			}
			io.stdout.write(`Wrote ${files[0]}: a site rule file that extends the shipped policy and changes nothing yet.\nEdit it, then: prelase rules validate ${files[0]}\n`);
			return 0;
		}
		case 'show': {
			if (files.length > 1) throw new UsageError('show takes at most one rule file: prelase rules show [FILE]');
			const file = files[0] === undefined ? (openSettings(io.env).read().rulesFile ?? shippedRulesPath()) : ruleFileArgument(files[0]);
			const shown = showRules(loadOrRefuse(file));
			io.stdout.write(`${values.json ? terminalSafeJson(shown) : showText(shown)}\n`);
			return 0;
		}
		case 'diff': {
			if (files.length !== 2) throw new UsageError('diff compares two rule files: prelase rules diff A B ("shipped" names the shipped policy)');
			const diff = diffRules(loadOrRefuse(ruleFileArgument(files[0]!)), loadOrRefuse(ruleFileArgument(files[1]!)));
			io.stdout.write(`${values.json ? terminalSafeJson(diff) : diffText(diff)}\n`);
			return diff.equal ? 0 : 1;
		}
		default:
			throw new UsageError(`unknown rules action "${action}"; actions are init, show, diff, schema or validate`);
	}
}
