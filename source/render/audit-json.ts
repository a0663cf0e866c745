import type {AuditReport} from '../audit/audit.js';
import {describeProblem} from '../shared/problems.js';
import {terminalSafeJson} from '../shared/text.js';

/** A value as terminal-safe JSON, indented to sit `depth` levels in. */
function nested(value: unknown, depth: number): string {
	return terminalSafeJson(value).replaceAll('\n', `\n${'  '.repeat(depth)}`);
}

/**
 * The audit report as JSON, in lines (the same data and layout as JSON.stringify with two
 * spaces): a record with findings at a time, with each finding put in words as it is written
 * (`text`), so that a large audit never holds the whole output, or the words of every finding,
 * at once.
 */
export function* auditJsonLines(report: AuditReport): Generator<string> {
	const keys = Object.keys(report) as Array<keyof AuditReport>;
	yield '{';
	for (const [at, key] of keys.entries()) {
		const comma = at < keys.length - 1 ? ',' : '';
		const value = report[key];
		if (key !== 'withFindings' || report.withFindings.length === 0) {
			yield `  ${JSON.stringify(key)}: ${nested(value, 1)}${comma}`;
			continue;
		}
		yield `  "withFindings": [`;
		for (const [index, entry] of report.withFindings.entries()) {
			const worded = {...entry, findings: entry.findings.map((found) => ({...found, text: describeProblem(found)}))};
			yield `    ${nested(worded, 2)}${index < report.withFindings.length - 1 ? ',' : ''}`;
		}
		yield `  ]${comma}`;
	}
	yield '}';
}
