import {parseArgs} from 'node:util';
import {paintFor} from '../../shared/paint.js';
import {formatProblem} from '../../shared/problems.js';
import {auditRecords, type AuditReport} from '../../audit/audit.js';
import {listRecordFiles} from '../../audit/audit-files.js';
import {auditText, inline} from '../../render/audit-text.js';
import {auditJsonLines} from '../../render/audit-json.js';
import {auditSummaryLines} from '../../render/audit-summary-text.js';
import {ownFingerprint, readTrusted} from '../../records/key-files.js';
import {loadRules, ruleFileNamed, shippedRulesPath} from '../../rules/load.js';
import {openSettings} from '../../services/settings.js';
import {isRecordsRepository} from '../../services/records-repository.js';
import {readRepositoryHistory} from '../../services/records-history.js';
import {ownControl} from '../../shared/terminal-text.js';
import {isBundled} from '../../shared/version.js';
import {auditInParallel, defaultJobs, parallelAbove} from '../../services/audit-parallel.js';
import {UsageError} from '../usage-error.js';
import {commandHelp, helpOption, parseOptions, type Command, type Io} from '../command.js';

/** Records audited before a progress line is worth showing. */
const progressAbove = 1000;
/** Records listed in full by default; a larger audit is summarised unless --all asks for every record. */
const listAllUpTo = 20;

/** Writes lines in chunks, so a long summary goes out as it is made instead of as one string. */
function writeLines(io: Io, lines: Iterable<string>): void {
	let chunk: string[] = [];
	for (const line of lines) {
		chunk.push(line);
		if (chunk.length >= 2000) {
			io.stdout.write(`${chunk.join('\n')}\n`);
			chunk = [];
		}
	}
	if (chunk.length > 0) io.stdout.write(`${chunk.join('\n')}\n`);
}

/** A progress line on stderr, redrawn at most ten times a second, cleared at the end. */
function progress(io: Io): {update(done: number, total: number): void; end(): void} {
	let last = 0;
	let shown = false;
	return {
		update(done, total) {
			const now = Date.now();
			if (done < total && now - last < 100) return;
			last = now;
			shown = true;
			io.stderr.write(`${ownControl('\r')}Auditing records: ${done} of ${total} (${Math.floor((done / total) * 100)} %)`);
		},
		end() {
			if (shown) io.stderr.write(ownControl('\r\u001B[2K'));
		},
	};
}

const options = {
	rules: {type: 'string', value: 'FILE', summary: 'The current rules; `shipped` for the shipped policy (default: the rulesFile setting, else the shipped rules/default.yaml)'},
	json: {type: 'boolean', summary: 'Print everything the audit found as JSON'},
	all: {type: 'boolean', summary: `List every record in full (by default, more than ${listAllUpTo} records are summarised: totals, findings, then the records with findings)`},
	remote: {type: 'boolean', summary: 'For a records repository: also compare its history with its remote (a rewritten history is a finding)'},
	jobs: {type: 'string', value: 'N', summary: `Judge the records of a summarised audit in N worker threads, 1 to 64 (default: one a core, at most 4, for more than ${parallelAbove} records); 1 judges them in one thread`},
	help: helpOption,
} as const;

/** The number of worker threads --jobs asks for: a whole number from 1 to 64. */
function jobsOption(text: string | undefined): number {
	if (text === undefined) return defaultJobs();
	const jobs = Number(text);
	if (!/^\d+$/.test(text.trim()) || !Number.isInteger(jobs) || jobs < 1 || jobs > 64) throw new UsageError(`--jobs must be a whole number of worker threads from 1 to 64, not "${inline(text, 40)}"`);
	return jobs;
}

/** `prelase audit PATH... [--rules FILE] [--json]`: returns the exit status (0, 1 or 3; 2 by UsageError). */
export function runAudit(args: string[], io: Io): number | Promise<number> {
	const {values, positionals} = parseArgs({args, options: parseOptions(options), allowPositionals: true, strict: true});
	if (values.help) {
		io.stdout.write(`${commandHelp(auditCommand)}\n`);
		return 0;
	}
	if (positionals.length === 0) throw new UsageError('name the records to audit: prelase audit PATH... (record files or folders of them)');
	const jobs = jobsOption(values.jobs);
	const {files, missing} = listRecordFiles(positionals);
	if (missing.length > 0) throw new UsageError(`no such file or folder: ${missing.map((path) => inline(path, 200)).join(', ')}`);
	if (files.length === 0) throw new UsageError(`no record files in ${positionals.map((path) => inline(path, 200)).join(', ')} (dotfiles and *.tmp are left out)`);

	const folders = positionals.filter((path) => isRecordsRepository(path));
	if (values.remote && folders.length === 0) throw new UsageError('--remote compares a records repository with its remote, and none of the folders given is one (prelase records init)');
	const settings = openSettings(io.env);
	const rulesFile = (values.rules === undefined ? undefined : ruleFileNamed(values.rules)) ?? settings.read().rulesFile ?? shippedRulesPath();
	const current = loadRules(rulesFile);
	if (!current.ok) throw new UsageError(`the current rule file ${rulesFile} has problems`, current.errors);
	for (const found of current.warnings) io.stderr.write(`${formatProblem(found)}\n`);

	const bar = io.stderr.isTTY && files.length > progressAbove ? progress(io) : undefined;
	const listing = values.all || files.length <= listAllUpTo ? 'all' : 'summary';
	const given = {
		current: current.value,
		trust: {own: ownFingerprint(settings.folder), trusted: readTrusted(settings.folder)},
		...(bar ? {onProgress: bar.update} : {}),
		repositories: folders.map((folder) => readRepositoryHistory(folder, values.remote ?? false, io.env)),
	};
	// A large summarised audit is judged in worker threads of this program (the bundle's own file); from source, in this thread.
	const parallel = listing === 'summary' && jobs > 1 && (values.jobs !== undefined || files.length > parallelAbove) && isBundled;
	// An answer at once, unless the records are judged in worker threads.
	const written = (report: AuditReport) => {
		bar?.end();
		const paint = paintFor(io.stdout, io.env);
		const width = io.stdout.columns ?? 100;
		if (values.json) writeLines(io, auditJsonLines(report));
		else if (report.listing === 'summary') writeLines(io, auditSummaryLines(report, paint, width));
		else io.stdout.write(`${auditText(report, paint, width)}\n`);
		return report.exitCode;
	};
	return parallel ? auditInParallel(files, given, rulesFile, jobs, new URL(import.meta.url)).then(written) : written(auditRecords(files, {...given, listing}));
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
