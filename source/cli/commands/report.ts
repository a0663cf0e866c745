import {createFileAtomically} from '../../shared/atomic-file.js';
import {FileWriteError} from '../../shared/file-write-error.js';
import {extname} from 'node:path';
import {parseArgs} from 'node:util';
import {ownFingerprint, readTrusted} from '../../records/key-files.js';
import {interlockReportHtml, interlockReportMarkdown} from '../../render/interlock-report.js';
import {readRecord} from '../../records/read-record.js';
import {withValuesShown, withRuleWords} from '../../records/record-words.js';
import {loadRulesFromText} from '../../rules/load.js';
import {findRuleText} from '../../records/rule-texts.js';
import {reportHtml} from '../../render/report-html.js';
import {reportMarkdown} from '../../render/report-markdown.js';
import {openSettings} from '../../services/settings.js';
import {terminalText} from '../../shared/terminal-text.js';
import {UsageError} from '../usage-error.js';
import {commandHelp, helpOption, parseOptions, type Command, type Io} from '../command.js';

const writers = {md: reportMarkdown, html: reportHtml} as const;
const interlockWriters = {md: interlockReportMarkdown, html: interlockReportHtml} as const;

/** The format asked for, else the one the output file's extension names, else Markdown. */
function chooseFormat(format: string | undefined, out: string | undefined): keyof typeof writers {
	if (format !== undefined) {
		if (format === 'md' || format === 'html') return format;
		throw new UsageError(`unknown format "${format}"; use --format md or --format html`);
	}
	return out && ['.html', '.htm'].includes(extname(out).toLowerCase()) ? 'html' : 'md';
}

const options = {
	format: {type: 'string', value: 'md|html', summary: 'Markdown (default), or one self-contained HTML file that prints on A4 and Letter (default html when --out ends in .html)'},
	out: {type: 'string', value: 'FILE', summary: 'Write the page to FILE instead of printing it; an existing FILE is never overwritten'},
	help: helpOption,
} as const;

/** `prelase report RECORD [--format md|html] [--out FILE]`: returns the exit status. */
export function runReport(args: string[], io: Io): number {
	const {values, positionals} = parseArgs({args, options: parseOptions(options), allowPositionals: true, strict: true});
	if (values.help) {
		io.stdout.write(`${commandHelp(reportCommand)}\n`);
		return 0;
	}
	if (positionals.length !== 1) throw new UsageError(positionals.length === 0 ? 'name the record to print: prelase report RECORD [--format md|html]' : 'prelase report prints one record at a time; name one RECORD');
	const format = chooseFormat(values.format, values.out);
	const [path] = positionals as [string];

	const integrity = readRecord(path);
	if (!integrity.ok) {
		io.stderr.write(`prelase: ${path} fails its integrity check: ${integrity.reason}\nNo report was printed; a record that fails its integrity check cannot be relied on (prelase audit ${path} says more).\n`);
		return 3;
	}
	const settings = openSettings(io.env);
	const trust = {own: ownFingerprint(settings.folder), trusted: readTrusted(settings.folder)};
	let {body} = integrity.record;
	// A record names its rule text by hash; the page's titles, statements and labels come from the stored text.
	if (body.kind === 'bench-check') {
		const stored = body.rules.text === undefined ? findRuleText(path, body.rules.sha256) : undefined;
		const text = body.rules.text ?? (stored?.status === 'ok' ? stored.text : undefined);
		const loaded = text === undefined ? undefined : loadRulesFromText(text, body.rules.file);
		const rules = loaded?.ok ? loaded.value : null;
		body = withValuesShown(withRuleWords({...body, rules: {...body.rules, ...(text === undefined ? {} : {text})}}, rules), rules);
	}
	const page =
		body.kind === 'interlock-test'
			? interlockWriters[format]({...integrity.record, body}, integrity.signatures, trust)
			: writers[format]({...integrity.record, body}, integrity.signatures, trust);

	if (values.out === undefined) {
		io.stdout.write(page);
		return 0;
	}
	let created: boolean;
	try {
		// Whole or not at all (a write cut short leaves no part of a report under its name); a report
		// file is read in a terminal too (cat, less), so it passes the same boundary as stdout.
		created = createFileAtomically(values.out, terminalText(page), 0o644);
	} catch (error) {
		if (error instanceof FileWriteError) throw error;
		throw new UsageError(`cannot write ${values.out} (${(error as NodeJS.ErrnoException).code ?? (error as Error).message})`);
	}
	if (!created) throw new UsageError(`${values.out} already exists; prelase does not overwrite it (choose another --out FILE)`);
	io.stdout.write(`Report written: ${values.out}\n`);
	return 0;
}

export const reportCommand: Command = {
	name: 'report',
	summary: 'A printable page (Markdown or HTML) of a signed record',
	usage: 'prelase report RECORD [--format md|html] [--out FILE]',
	options,
	help: {
		intro: `prelase report — a printable page of a record

Usage:
  prelase report RECORD [--format md|html] [--out FILE]

Checks the record's integrity, then prints it: the outcome, the caution and the deferral,
failures first in a summary, the setup and its fingerprint, operator and time, the rule
file's name and SHA-256, every input, every check by step with verdict, value, limit and
margin, confirmations with notes, and each signature with whether it verifies and whether
its key is yours or one you trust (prelase keys). An interlock test record (prelase plan
--record-test) prints its outcome, steps not passed first, the tester and witness, the plan and
its SHA-256, the policy, every step with its result, stop time and note, and the signatures.`,
		notes: `Exit status:
  0  the report was printed or written
  2  bad usage (no RECORD, unknown format, FILE exists)
  3  the record fails its integrity check (altered, unsigned, unreadable); nothing is printed
  74 the --out FILE could not be written (disk full, file size limit, read-only or denied folder);
     no file is left`,
	},
	run: runReport,
};
