import {parseArgs} from 'node:util';
import {paintFor} from '../../shared/paint.js';
import {formatProblem} from '../../shared/problems.js';
import {auditRecords} from '../../audit/audit.js';
import {listRecordFiles} from '../../audit/audit-files.js';
import {auditText, inline} from '../../render/audit-text.js';
import {ownFingerprint, readTrusted} from '../../records/key-store.js';
import {loadRules, shippedRulesPath} from '../../rules/load.js';
import {openSettings} from '../../services/settings.js';
import {terminalSafeJson} from '../../shared/text.js';
import {UsageError} from '../usage-error.js';
import type {Io} from '../io.js';
import {helpTexts} from './help.js';

/** Records audited before a progress line is worth showing. */
const progressAbove = 50;

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
			io.stderr.write(`\rAuditing records: ${done} of ${total} (${Math.floor((done / total) * 100)} %)`);
		},
		end() {
			if (shown) io.stderr.write('\r\u001B[2K');
		},
	};
}

/** `prelase audit PATH... [--rules FILE] [--json]`: returns the exit status (0, 1 or 3; 2 by UsageError). */
export function runAudit(args: string[], io: Io): number {
	const {values, positionals} = parseArgs({args, options: {rules: {type: 'string'}, json: {type: 'boolean'}, help: {type: 'boolean', short: 'h'}}, allowPositionals: true, strict: true});
	if (values.help) {
		io.stdout.write(`${helpTexts.audit}\n`);
		return 0;
	}
	if (positionals.length === 0) throw new UsageError('name the records to audit: prelase audit PATH... (record files or folders of them)');
	const {files, missing} = listRecordFiles(positionals);
	if (missing.length > 0) throw new UsageError(`no such file or folder: ${missing.map((path) => inline(path, 200)).join(', ')}`);
	if (files.length === 0) throw new UsageError(`no record files in ${positionals.map((path) => inline(path, 200)).join(', ')} (dotfiles and *.tmp are left out)`);

	const settings = openSettings(io.env);
	const rulesFile = values.rules ?? settings.read().rulesFile ?? shippedRulesPath();
	const current = loadRules(rulesFile);
	if (!current.ok) throw new UsageError(`the current rule file ${rulesFile} has problems`, current.errors);
	for (const found of current.warnings) io.stderr.write(`${formatProblem(found)}\n`);

	const bar = io.stderr.isTTY && files.length > progressAbove ? progress(io) : undefined;
	const report = auditRecords(files, {
		current: current.value,
		trust: {own: ownFingerprint(settings.folder), trusted: readTrusted(settings.folder)},
		...(bar ? {onProgress: bar.update} : {}),
	});
	bar?.end();
	io.stdout.write(`${values.json ? terminalSafeJson(report) : auditText(report, paintFor(io.stdout, io.env), io.stdout.columns ?? 100)}\n`);
	return report.exitCode;
}
