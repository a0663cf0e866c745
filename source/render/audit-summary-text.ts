import {displayPath} from '../shared/display-path.js';
import {describeProblem} from '../shared/problems.js';
import type {Paint} from '../shared/paint.js';
import {outcomeWords, type Outcome} from '../rules/evaluate/evaluation.js';
import {version} from '../shared/version.js';
import {wrap} from '../shared/wrap.js';
import type {AuditReport, RecordWithFindings} from '../audit/audit.js';
import {count, inline, resultLines, totalsLine} from './audit-text.js';

function what(entry: RecordWithFindings): string {
	if (entry.kind === 'bench-check') return outcomeWords[entry.outcome as Outcome];
	if (entry.kind === 'interlock-test') return `interlock test ${inline(entry.outcome ?? '', 20)}`;
	return 'not a readable record';
}

/**
 * A summarised audit, for many records: the totals, each kind of finding with how often it
 * occurs (and its words the first time), then each record with findings in a few lines. The
 * lines come one record at a time, so a long audit is written out as it is made.
 */
export function* auditSummaryLines(report: AuditReport, paint: Paint, width = 100): Generator<string> {
	yield paint.bold(`prelase ${version} · audit`);
	yield `Current rules  ${inline(report.currentRules.name, 80)} · ${inline(displayPath(report.currentRules.file), 200)} · sha256 ${report.currentRules.sha256.slice(0, 16)}`;
	yield '';
	yield `Summary of ${count(report.totals.records, 'record')}; prelase audit PATH --all lists every record in full`;
	yield totalsLine(report);
	if (report.findingCodes.length > 0) {
		yield '';
		yield 'Findings:';
		const widest = String(report.findingCodes[0]!.count).length;
		for (const entry of report.findingCodes) {
			const pad = ' '.repeat(widest - String(entry.count).length);
			yield* wrap(`${entry.count} × [${entry.kind}] ${entry.code}${entry.count > 1 ? ', the first' : ''}: ${inline(entry.example, 400)}`, width, ' '.repeat(widest + 5)).map((line, index) => (index === 0 ? `  ${pad}${line.trimStart()}` : line));
		}
	}
	yield '';
	yield `Records with findings: ${report.withFindings.length} of ${report.totals.records}`;
	for (const entry of report.withFindings) {
		const mark = entry.authentic ? '' : `${paint.fail('✗ NOT AUTHENTIC')} · `;
		yield `  ${mark}${inline(displayPath(entry.file), 300)} · ${what(entry)} · ${count(entry.findings.length, 'finding')}`;
		for (const found of entry.findings) {
			const text = `${found.kind === 'integrity' ? paint.fail('✗') : paint.advise('!')} [${found.kind}] ${inline(describeProblem(found), 400)}`;
			yield* wrap(text, width, '      ').map((line, index) => (index === 0 ? `    ${line.trimStart()}` : line));
		}
	}
	yield '';
	yield* resultLines(report, paint, width);
}
