import {writeFileSync} from 'node:fs';
import {extname} from 'node:path';
import {parseArgs} from 'node:util';
import {ownFingerprint, readTrusted} from '../../records/key-store.js';
import {interlockReportHtml, interlockReportMarkdown} from '../../render/interlock-report.js';
import {readRecord} from '../../records/read-record.js';
import {reportHtml} from '../../render/report-html.js';
import {reportMarkdown} from '../../render/report-markdown.js';
import {openSettings} from '../../services/settings.js';
import {stripControl} from '../../shared/text.js';
import {UsageError} from '../usage-error.js';
import type {Io} from '../io.js';
import {helpTexts} from './help.js';

const writers = {md: reportMarkdown, html: reportHtml} as const;
const interlockWriters = {md: interlockReportMarkdown, html: interlockReportHtml} as const;

/** The format asked for, else the one the output file's extension names, else Markdown. */
function chooseFormat(format: string | undefined, out: string | undefined): keyof typeof writers {
	if (format !== undefined) {
		if (format === 'md' || format === 'html') return format;
		throw new UsageError(`unknown format "${stripControl(format)}"; use --format md or --format html`);
	}
	return out && ['.html', '.htm'].includes(extname(out).toLowerCase()) ? 'html' : 'md';
}

/** `prelase report RECORD [--format md|html] [--out FILE]`: returns the exit status. */
export function runReport(args: string[], io: Io): number {
	const {values, positionals} = parseArgs({args, options: {format: {type: 'string'}, out: {type: 'string'}, help: {type: 'boolean', short: 'h'}}, allowPositionals: true, strict: true});
	if (values.help) {
		io.stdout.write(`${helpTexts.report}\n`);
		return 0;
	}
	if (positionals.length !== 1) throw new UsageError(positionals.length === 0 ? 'name the record to print: prelase report RECORD [--format md|html]' : 'prelase report prints one record at a time; name one RECORD');
	const format = chooseFormat(values.format, values.out);
	const [path] = positionals as [string];

	const integrity = readRecord(path);
	if (!integrity.ok) {
		io.stderr.write(`prelase: ${stripControl(path)} fails its integrity check: ${stripControl(integrity.reason)}\nNo report was printed; a record that fails its integrity check cannot be relied on (prelase audit ${stripControl(path)} says more).\n`);
		return 3;
	}
	const settings = openSettings(io.env);
	const trust = {own: ownFingerprint(settings.folder), trusted: readTrusted(settings.folder)};
	const {body} = integrity.record;
	const page =
		body.kind === 'interlock-test'
			? interlockWriters[format]({...integrity.record, body}, integrity.signatures, trust)
			: writers[format]({...integrity.record, body}, integrity.signatures, trust);

	if (values.out === undefined) {
		io.stdout.write(page);
		return 0;
	}
	try {
		writeFileSync(values.out, page, {flag: 'wx'});
	} catch (error) {
		const code = (error as NodeJS.ErrnoException).code;
		if (code === 'EEXIST') throw new UsageError(`${values.out} already exists; prelase does not overwrite it (choose another --out FILE)`);
		throw new UsageError(`cannot write ${values.out} (${code ?? (error as Error).message})`);
	}
	io.stdout.write(`Report written: ${values.out}\n`);
	return 0;
}
