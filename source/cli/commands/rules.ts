import {createFileAtomically} from '../../shared/atomic-file.js';
import {FileWriteError} from '../../shared/file-write-error.js';
import {parseArgs} from 'node:util';
import {formatProblem} from '../../shared/problems.js';
import type {CompiledRules} from '../../rules/compile/compiled-rules.js';
import {diffRules} from '../../rules/inspect/diff.js';
import {siteFileTemplate} from '../../rules/inspect/init-template.js';
import {loadRules, ruleFileNamed, shippedRulesPath} from '../../rules/load.js';
import {ruleFileJsonSchema, siteFileJsonSchema} from '../../rules/file/rule-json-schema.js';
import {showRules} from '../../rules/inspect/outline.js';
import {openSettings} from '../../services/settings.js';
import {terminalSafeJson} from '../../shared/text.js';
import {UsageError} from '../usage-error.js';
import {commandHelp, helpOption, parseOptions, type Command, type Io} from '../command.js';
import {diffText} from '../../render/rules-diff-text.js';
import {showText} from '../../render/rules-show-text.js';


/** Loads rules for show or diff; problems are the user's to fix (exit 2). */
function loadOrRefuse(file: string): CompiledRules {
	const loaded = loadRules(file);
	if (!loaded.ok) throw new UsageError(`the rule file ${file} has problems; prelase rules validate ${file} lists them`, loaded.errors);
	return loaded.value;
}

const options = {
	json: {type: 'boolean', summary: 'With show or diff: print it as JSON'},
	site: {type: 'boolean', summary: 'With schema: the JSON Schema of site rule files (those with extends)'},
	help: helpOption,
} as const;

/** `prelase rules schema|validate|init|show|diff`: returns the exit status. */
export function runRules(args: string[], io: Io): number {
	const {values, positionals} = parseArgs({args, options: parseOptions(options), allowPositionals: true, strict: true});
	const [action, ...files] = positionals;
	if (values.help || action === undefined) {
		io.stdout.write(`${commandHelp(rulesCommand)}\n`);
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
				const loaded = loadRules(ruleFileNamed(file));
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
			let created: boolean;
			try {
				// Whole or not at all: a write cut short (a full disk) leaves no part of the file under its name.
				created = createFileAtomically(files[0]!, text, 0o644);
			} catch (error) {
				if (error instanceof FileWriteError) throw error;
				throw new UsageError(`cannot write ${files[0]} (${(error as Error).message})`);
			}
			if (!created) throw new UsageError(`${files[0]} already exists; prelase rules init never overwrites a file`);
			io.stdout.write(`Wrote ${files[0]}: a site rule file that extends the shipped policy and changes nothing yet.\nEdit it, then: prelase rules validate ${files[0]}\n`);
			return 0;
		}
		case 'show': {
			if (files.length > 1) throw new UsageError('show takes at most one rule file: prelase rules show [FILE]');
			const file = files[0] === undefined ? (openSettings(io.env).read().rulesFile ?? shippedRulesPath()) : ruleFileNamed(files[0]);
			const shown = showRules(loadOrRefuse(file));
			io.stdout.write(`${values.json ? terminalSafeJson(shown) : showText(shown)}\n`);
			return 0;
		}
		case 'diff': {
			if (files.length !== 2) throw new UsageError('diff compares two rule files: prelase rules diff A B ("shipped" names the shipped policy)');
			const diff = diffRules(loadOrRefuse(ruleFileNamed(files[0]!)), loadOrRefuse(ruleFileNamed(files[1]!)));
			io.stdout.write(`${values.json ? terminalSafeJson(diff) : diffText(diff)}\n`);
			return diff.equal ? 0 : 1;
		}
		default:
			throw new UsageError(`unknown rules action "${action}"; actions are init, show, diff, schema or validate`);
	}
}

export const rulesCommand: Command = {
	name: 'rules',
	summary: 'Site policy: derive, validate, show and compare rule files; the JSON Schema',
	usage: 'prelase rules init FILE | validate FILE... | show [FILE] | diff A B | schema',
	options,
	help: {
		intro: `prelase rules — rule files

Usage:
  prelase rules init FILE           Write a site rule file that extends the shipped policy, with
                                    every policy value, its default, unit and meaning commented
                                    out; never overwrites a file
  prelase rules validate FILE...    Load, resolve extends, lint and report every problem with
                                    file:line:column
  prelase rules show [FILE] [--json]
                                    The effective rules step by step: inputs, confirmations,
                                    checks with their condition, severity and basis, policy
                                    values, switched-off checks with reasons, and the file each
                                    part came from (default: the rule file in force, from
                                    settings, else the shipped policy)
  prelase rules diff A B [--json]   What differs in meaning from A to B: policy values (old →
                                    new), checks added, removed, switched off or changed,
                                    inputs and confirmations added or removed
  prelase rules schema [--site]     Print the JSON Schema of rule files (--site: of site rule
                                    files, those with extends), for editors

FILE may be "shipped" for the shipped policy. A site rule file names its base with
extends: shipped (or a path relative to itself) and lists only what it changes; see
docs/rule-file.md. The laser safety officer decides the site policy.`,
		notes: `Exit status:
  validate  0 no problems, 1 problems found, 2 bad usage
  diff      0 no differences in meaning, 1 differences, 2 bad usage or a file with problems
  init, show, schema  0 done, 2 bad usage (init: the file exists)
  init      74 the file could not be written (disk full, file size limit, read-only or denied
            folder); no file is left`,
	},
	run: runRules,
};
