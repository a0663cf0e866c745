import {parseArgs} from 'node:util';
import {parallelAbove} from '../../services/audit-judge-task.js';
import {listAllUpTo, progressAbove} from './audit-limits.js';
import {commandHelp, helpOption, parseOptions, type Command, type Io} from '../command.js';


const options = {
	rules: {type: 'string', value: 'FILE', summary: 'The current rules; `shipped` for the shipped policy (default: the rulesFile setting, else the shipped rules/default.yaml)'},
	json: {type: 'boolean', summary: 'Print everything the audit found as JSON'},
	all: {type: 'boolean', summary: `List every record in full (by default, more than ${listAllUpTo} records are summarised: totals, findings, then the records with findings)`},
	remote: {type: 'boolean', summary: 'For a records repository: also compare its history with its remote (a rewritten history is a finding)'},
	jobs: {type: 'string', value: 'N', summary: `Judge the records of a summarised audit in N worker threads, 1 to 64 (default: one a core, at most 4, for more than ${parallelAbove} records); 1 judges them in one thread`},
	help: helpOption,
} as const;

/** `prelase audit PATH... [--rules FILE] [--json]`: returns the exit status (0, 1 or 3; 2 by UsageError). The audit's code is loaded only when an audit runs. */
export function runAudit(args: string[], io: Io): number | Promise<number> {
	const {values, positionals} = parseArgs({args, options: parseOptions(options), allowPositionals: true, strict: true});
	if (values.help) {
		io.stdout.write(`${commandHelp(auditCommand)}\n`);
		return 0;
	}
	return import('./audit-run.js').then(({auditNow}) => auditNow(values, positionals, io));
}

export const auditCommand: Command = {
	name: 'audit',
	summary: 'Check signed records: authentic, consistent, and what the current rules change',
	usage: 'prelase audit PATH... [--rules FILE] [--json] [--all] [--remote] [--jobs N]',
	options,
	help: {
		intro: `prelase audit — check signed records

Usage:
  prelase audit PATH... [--rules FILE] [--json] [--all] [--remote] [--jobs N]

PATH is a record file or a folder of records (searched recursively; dotfiles and *.tmp are
left out). For each record the audit checks:
  integrity      it parses and every signature verifies over its body; who signed, in what
                 role and meaning, and whether each key is yours or one you trust
                 (prelase keys trust); an untrusted key is a finding
  consistency    its inputs, re-evaluated under the rule file it was made with, give every
                 recorded value, verdict and the outcome (a difference is a finding: the
                 record's conclusions do not follow from its numbers)
  current rules  what would change under the site's current rules: verdicts, the outcome,
                 inputs and confirmations the record lacks (a changed verdict is a finding)
  history        amendments and the records they correct, a later record for the same
                 setup fingerprint, a setup whose fingerprint changed since its last record
  rule text      a record names the rule text it was made under by SHA-256; the text is
                 stored once in the records folder (rules/<sha256>.yaml): a text missing,
                 unreadable or not matching its hash is a finding
  repository     for a records folder that is a git repository (prelase records init): its
                 history, where a record changed or deleted after its commit, a record left
                 uncommitted, and with --remote a remote whose history was rewritten, are
                 findings that name the commit
Record age and interlock test dates are reported as not checked: rule files set no
validity period or test interval yet.

Up to ${listAllUpTo} records are listed in full. An audit of more than ${listAllUpTo} records is summarised:
the totals, each kind of finding and how often it occurs, then each record with findings.
--all lists every record in full (also in --json). A progress line is shown on a terminal
when more than ${progressAbove} records are audited.`,
		notes: `Exit status:
  0  every record is authentic and consistent, with no findings
  1  every record is authentic, with findings
  2  bad usage (no PATH, a PATH that does not exist, a current rule file with problems)
  3  integrity failure in a record (altered, unsigned or unreadable), or a records repository
     whose history shows a record changed or deleted, or a rewritten remote

The audit says whether a record is authentic and whether its conclusions follow from its
numbers; it never says a setup is safe. The laser safety officer has the final word.`,
	},
	run: runAudit,
};
