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
import {auditInParallel, defaultJobs} from '../../services/audit-parallel.js';
import {parallelAbove} from '../../services/audit-judge-task.js';
import {UsageError} from '../usage-error.js';
import type {Io} from '../command.js';
import {listAllUpTo, progressAbove} from './audit-limits.js';


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

/** The number of worker threads --jobs asks for: a whole number from 1 to 64. */
function jobsOption(text: string | undefined): number {
	if (text === undefined) return defaultJobs();
	const jobs = Number(text);
	if (!/^\d+$/.test(text.trim()) || !Number.isInteger(jobs) || jobs < 1 || jobs > 64) throw new UsageError(`--jobs must be a whole number of worker threads from 1 to 64, not "${inline(text, 40)}"`);
	return jobs;
}

/** The options of `prelase audit` as parsed (see audit.ts). */
export type AuditValues = {rules?: string | undefined; json?: boolean | undefined; all?: boolean | undefined; remote?: boolean | undefined; jobs?: string | undefined};

/**
 * `prelase audit PATH...` once its options are read: loaded only when an audit runs (the help,
 * and every other command, need none of the audit's code). Returns the exit status, or a
 * promise of it when the records are judged in worker threads.
 */
export function auditNow(values: AuditValues, positionals: string[], io: Io): number | Promise<number> {
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
