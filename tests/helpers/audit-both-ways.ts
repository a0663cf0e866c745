import {expect} from 'vitest';
import {auditRecords, type AuditOptions, type AuditReport} from '../../source/audit/audit.js';

/**
 * Audits the records with every record's audit kept (`all`) and as a summary (`summary`, the
 * default for a large folder, which keeps a short form of each record and relates them from
 * it), and holds the two to the same result: the same records with findings, the same
 * findings, the same totals and exit status. Returns the full report.
 */
export function auditBothWays(files: readonly string[], options: Omit<AuditOptions, 'listing'>): AuditReport {
	const all = auditRecords(files, {...options, listing: 'all'});
	const summary = auditRecords(files, {...options, listing: 'summary'});
	const fromAll = all.records
		.filter((record) => record.findings.length > 0)
		.map((record) => ({file: record.file, authentic: record.authentic, findings: record.findings.map(({kind, code, data}) => ({kind, code, data}))}));
	const fromSummary = summary.withFindings.map((record) => ({file: record.file, authentic: record.authentic, findings: record.findings.map(({kind, code, data}) => ({kind, code, data}))}));
	expect(fromSummary).toEqual(fromAll);
	expect(summary.totals).toEqual(all.totals);
	expect([summary.status, summary.exitCode]).toEqual([all.status, all.exitCode]);
	return all;
}
