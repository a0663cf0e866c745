import {verdictWords} from '../rules/evaluate/verdict-words.js';
import {deferral} from '../shared/deferral.js';
import {displayPath} from '../shared/display-path.js';
import type {Paint} from '../shared/paint.js';
import {outcomeWords} from '../rules/evaluate/evaluation.js';
import {oneLine} from '../shared/one-line.js';
import {version} from '../shared/version.js';
import {wrap} from '../shared/wrap.js';
import type {AuditReport, RecordAudit} from '../audit/audit.js';
import type {PolicyChange} from '../audit/audit-policy.js';
import {shortFingerprint} from '../records/key-material.js';
import {describeProblem} from '../shared/problems.js';
import {repositoryLines} from './audit-repository-text.js';

/**
 * Text from a record (or a file name) on one line of the audit: line breaks shown as ⏎, other
 * white space folded, very long text cut (control characters are the terminal boundary's job).
 */
export function inline(text: string, max = 160): string {
	return oneLine(text, max);
}

export function count(n: number, noun: string): string {
	return `${n} ${noun}${n === 1 ? '' : 's'}`;
}


function row(term: string, text: string, width: number): string[] {
	const lines = wrap(text, width, ' '.repeat(17));
	lines[0] = `  ${term.padEnd(13)}  ${lines[0]!.trimStart()}`;
	return lines;
}

function changeLine(change: PolicyChange): string {
	const from = change.recorded === null ? 'not in the record' : `was ${change.recorded}`;
	const to = change.current === null ? 'not in the current rules' : verdictWords[change.current];
	const figures = change.value && change.limit ? ` · ${change.value}, limit ${change.relation === 'at_least' ? '≥' : '≤'} ${change.limit}` : '';
	return `${to} ${inline(change.title)} (${inline(change.id)}; ${from})${figures}`;
}

function policyLines(audit: RecordAudit, paint: Paint, width: number): string[] {
	const policy = audit.currentPolicy;
	if (!policy) return [];
	const where = displayPath(policy.rules.file);
	const same = policy.sameRules ? 'the same rule text as the record' : `sha256 ${policy.rules.sha256.slice(0, 16)}`;
	const changed = policy.checks.length > 0 || policy.outcome.current !== policy.outcome.recorded;
	const lines = row('Current rules', changed ? paint.advise(`! ${inline(where)} (${same}) would change this record:`) : `${paint.pass('✓')} no verdict or outcome would change under ${inline(where)} (${same})`, width);
	const detail = (text: string) => lines.push(...wrap(text, width, ' '.repeat(19)));
	if (policy.outcome.current !== policy.outcome.recorded) detail(`outcome: ${outcomeWords[policy.outcome.current]} instead of ${outcomeWords[policy.outcome.recorded]}`);
	for (const change of policy.checks) detail(changeLine(change));
	if (policy.inputsNeeded.length > 0) detail(`inputs the current rules need that the record lacks: ${policy.inputsNeeded.map((id) => inline(id)).join(', ')}`);
	for (const refused of policy.inputsRefused) detail(`input ${inline(refused.id)} "${inline(refused.entered, 60)}" refused: ${inline(refused.detail)}`);
	if (policy.confirmationsAdded.length > 0) detail(`confirmations added: ${policy.confirmationsAdded.map((entry) => `${inline(entry.id)} (${entry.status})`).join(', ')}`);
	return lines;
}

function signatureLines(audit: RecordAudit, paint: Paint, width: number): string[] {
	return audit.signatures.flatMap((signature) => {
		const who = `${inline(signature.signer.name, 80)}${signature.signer.role ? ` (${inline(signature.signer.role, 60)})` : ''}`;
		const granted = signature.granted && signature.granted.length > 0 ? ` (granted: ${signature.granted.map((role) => inline(role, 60)).join(', ')})` : '';
		const trust = signature.trust === 'own' ? 'your own key' : signature.trust === 'trusted' ? `trusted as ${inline(signature.trustedAs ?? '', 80)}${granted}` : paint.advise('! NOT a key you trust: intact, signer unknown');
		const mark = !signature.valid ? paint.fail('✗ INVALID') : signature.authentic ? paint.pass('✓ authentic') : paint.advise('! intact');
		return row(`Signature ${signature.index}`, `${mark} ${who}, ${signature.purpose}${signature.meaning ? ` (${signature.meaning})` : ''}, ${inline(signature.signedAt, 40)} · key ${shortFingerprint(signature.fingerprint)} · ${trust}`, width);
	});
}

function historyLines(audit: RecordAudit, width: number): string[] {
	const history = audit.history;
	if (!history) return [];
	const items: string[] = [];
	if (history.amends) items.push(`amends ${inline(history.amends.file ? displayPath(history.amends.file) : `${history.amends.record} (not among the records audited)`)}: ${inline(history.amends.reason)}`);
	for (const by of history.amendedBy) items.push(`amended by ${inline(displayPath(by.file))}: ${inline(by.reason)}`);
	if (history.supersededBy) items.push(`superseded by ${inline(displayPath(history.supersededBy.file))} (${inline(history.supersededBy.createdAt, 40)})`);
	if (history.setupChangedFrom) items.push(`setup changed since ${inline(displayPath(history.setupChangedFrom.file))}: ${history.setupChangedFrom.changed.map((id) => inline(id)).join(', ') || 'other identifying inputs'}`);
	return items.flatMap((item, index) => row(index === 0 ? 'History' : '', item, width));
}

function findingLines(audit: RecordAudit, paint: Paint, width: number): string[] {
	const findings = audit.findings.filter((found) => found.kind !== 'integrity');
	if (findings.length === 0) return row('Findings', 'none', width);
	return findings.flatMap((found, index) => row(index === 0 ? 'Findings' : '', `${paint.advise('!')} [${found.kind}] ${inline(found.text, 400)}`, width));
}

function integrityLines(audit: RecordAudit, paint: Paint, width: number): string[] {
	const integrity = audit.findings.find((found) => found.kind === 'integrity');
	const unknown = audit.signatures.filter((signature) => !signature.authentic).map((signature) => signature.index);
	if (integrity) return row('Integrity', paint.fail(`✗ NOT AUTHENTIC: ${inline(integrity.text, 300)}`), width);
	// "Authentic" is said only of signatures by keys the auditor trusts.
	if (unknown.length > 0) return row('Integrity', `${paint.advise('!')} intact: every signature verifies over the body; signature ${unknown.join(', ')} not by a key you trust (signer unknown) or made after its key was revoked`, width);
	return row('Integrity', `${paint.pass('✓')} authentic: every signature verifies over the body`, width);
}

const person = (who: {name: string; role: string}) => `${inline(who.name, 80)}${who.role ? `, ${inline(who.role, 60)}` : ''}`;

/** An interlock test record's summary: which plan, who tested, the outcome, whether it is authentic and follows from its steps. */
function interlockTestText(audit: RecordAudit, paint: Paint, width: number): string[] {
	const test = audit.interlockTest!;
	const unverified = audit.authentic ? '' : ' (unverified)';
	const out = [paint.bold(inline(displayPath(audit.file), 300))];
	out.push(...row('Plan tested', `interlock test of ${inline(test.plan.name)}${unverified} · plan sha256 ${test.plan.sha256.slice(0, 16)}`, width));
	out.push(...row('Location', test.location === null ? 'none recorded: this test answers no bench check' : `${inline(test.location, 200)}${unverified}`, width));
	out.push(...row('Tested', `${inline(test.testedOn, 20)} by ${person(test.tester)}${test.witness ? `, witnessed by ${person(test.witness)}${audit.signatures.some((signature) => signature.valid && signature.purpose === 'witness') ? '' : ' (named, not signed)'}` : ''}${unverified}`, width));
	out.push(...row('Created', `${inline(test.createdAt, 40)} with ${inline(test.tool.name, 20)} ${inline(test.tool.version, 20)}`, width));
	out.push(...row('Outcome', `${inline(test.outcomeText, 300)} (as recorded${audit.authentic ? '' : ', unverified'})`, width));
	out.push(...signatureLines(audit, paint, width));
	out.push(...integrityLines(audit, paint, width));
	if (!audit.authentic) return out;
	const consistency = audit.consistency!;
	if (consistency.consistent) out.push(...row('Consistency', `${paint.pass('✓')} the plan's findings, the test steps and the outcome follow from the embedded plan under the recorded policy`, width));
	else out.push(...row('Consistency', paint.fail(`✗ the record's conclusions do not follow from its embedded plan and steps${consistency.reevaluated ? '' : '; the plan was not re-worked'}`), width));
	test.exceptions.forEach((entry, index) => out.push(...row(index === 0 ? 'Steps' : '', `${entry.result === 'fail' ? '✗ fail' : '- n/a'}: step ${entry.number} (${inline(entry.subject)})${entry.note ? ` — note: ${inline(entry.note, 300)}` : ''}`, width)));
	out.push(...findingLines(audit, paint, width));
	return out;
}

/** One record's summary: what it is, who signed it, whether it is authentic and consistent, and what would change. */
export function recordText(audit: RecordAudit, paint: Paint, width = 100): string[] {
	if (audit.interlockTest) return interlockTestText(audit, paint, width);
	const out = [paint.bold(inline(displayPath(audit.file), 300))];
	const record = audit.record;
	const unverified = audit.authentic ? '' : ' (unverified)';
	if (record) {
		out.push(...row('Setup', `${inline(record.setup.name ?? '(no name)')}${unverified} · fingerprint ${record.setup.fingerprint.replace(/^sha256:/, '').slice(0, 16)}`, width));
		out.push(...row('Operator', `${inline(record.operator.name, 80)}${record.operator.role ? `, ${inline(record.operator.role, 60)}` : ''}${unverified}`, width));
		out.push(...row('Created', `${inline(record.createdAt, 40)} with ${inline(record.tool.name, 20)} ${inline(record.tool.version, 20)}`, width));
		out.push(...row('Outcome', `${outcomeWords[record.outcome]} (as recorded${audit.authentic ? '' : ', unverified'})`, width));
		out.push(...signatureLines(audit, paint, width));
	}
	out.push(...integrityLines(audit, paint, width));
	if (!audit.authentic || !record) return out;

	const consistency = audit.consistency!;
	const rulesText = `${inline(record.rules.name, 80)}, sha256 ${record.rules.sha256.slice(0, 16)}`;
	if (consistency.consistent) out.push(...row('Consistency', `${paint.pass('✓')} the recorded values, verdicts and outcome follow from the recorded inputs under the embedded rules (${rulesText})`, width));
	else out.push(...row('Consistency', paint.fail(`✗ the record's conclusions do not follow from its numbers under the embedded rules (${rulesText})${consistency.reevaluated ? '' : '; not re-evaluated'}`), width));
	out.push(...policyLines(audit, paint, width));
	record.exceptions.forEach((entry, index) => out.push(...row(index === 0 ? 'Answered' : '', `${entry.status === 'no' ? '✗ no' : '- n/a'}: ${inline(entry.statement)}${entry.note ? ` — note: ${inline(entry.note, 300)}` : ''}`, width)));
	out.push(...historyLines(audit, width));
	out.push(...row('Not checked', audit.notChecked.map((item) => item.text).join('; '), width));
	out.push(...findingLines(audit, paint, width));
	return out;
}

/**
 * The records side by side: a table when it fits the width, else a block per record (its file
 * on its own lines, then the same columns as words), so nothing wraps into "Outcome (reco / rded)".
 */
function tableText(report: AuditReport, width: number): string[] {
	const cells = report.records.map((audit, index) => [
		String(index + 1),
		inline(displayPath(audit.file), 300),
		audit.record ? inline(audit.record.createdAt, 25) : audit.interlockTest ? inline(audit.interlockTest.createdAt, 25) : '',
		audit.record ? outcomeWords[audit.record.outcome] : audit.interlockTest ? `interlock test ${audit.interlockTest.outcome}` : '',
		audit.authentic ? 'authentic' : 'FAILED',
		!audit.consistency ? '-' : audit.consistency.consistent ? 'yes' : 'NO',
		!audit.currentPolicy ? '-' : audit.currentPolicy.checks.length > 0 || audit.currentPolicy.outcome.current !== audit.currentPolicy.outcome.recorded ? 'changes' : 'same',
		String(audit.findings.length),
	]);
	const header = ['#', 'File', 'Created', 'Outcome (recorded)', 'Integrity', 'Consistent', 'Current rules', 'Findings'];
	const widths = header.map((title, column) => Math.max(title.length, ...cells.map((cell) => cell[column]!.length)));
	const line = (cell: string[]) => cell.map((text, column) => (column === 0 || column === 7 ? text.padStart(widths[column]!) : text.padEnd(widths[column]!))).join('  ').trimEnd();
	const table = [line(header), line(widths.map((size) => '-'.repeat(size))), ...cells.map(line)];
	if (table.every((text) => [...text].length <= width)) return table;
	return cells.flatMap(([number, file, created, outcome, integrity, consistent, current, findings]) => {
		const head = `${number}. `;
		const fileLines = [...file!].length + head.length <= width ? [`${head}${file}`] : [head.trimEnd(), ...foldText(file!, width - 3).map((piece) => `   ${piece}`)];
		const facts = [created, outcome, integrity, `consistent ${consistent}`, `current rules ${current}`, count(Number(findings), 'finding')].filter(Boolean).join(' · ');
		return [...fileLines, ...wrap(facts, width, '   ')];
	});
}

/** The audit for a person: each record's summary, a table with totals for several records, and the result. */
export function auditText(report: AuditReport, paint: Paint, width = 100): string {
	const out = [paint.bold(`prelase ${version} · audit`), `Current rules  ${inline(report.currentRules.name, 80)} · ${inline(displayPath(report.currentRules.file), 200)} · sha256 ${report.currentRules.sha256.slice(0, 16)}`, ''];
	for (const audit of report.records) out.push(...recordText(audit, paint, width), '');
	for (const repository of report.repositories ?? []) out.push(...repositoryLines(repository, paint, width), '');
	const {totals} = report;
	if (totals.records > 1) out.push(...tableText(report, width), '');
	out.push(totalsLine(report), ...resultLines(report, paint, width));
	return out.join('\n');
}

/** The totals of an audit on one line. */
export function totalsLine(report: AuditReport): string {
	const {totals} = report;
	const kinds = Object.entries(totals.findings).filter(([, count]) => count > 0).map(([kind, count]) => `${count} ${kind}`);
	const line = `Totals: ${count(totals.records, 'record')} · ${totals.authentic} authentic · ${count(totals.integrityFailures, 'integrity failure')} · ${totals.consistent} consistent · ${totals.withFindings} authentic with findings${kinds.length > 0 ? ` (findings: ${kinds.join(', ')})` : ''}`;
	// Records from before the chain cannot show a deletion: said under the totals, once.
	return totals.beforeChain > 0 ? `${line}\n${describeProblem({code: 'audit-not-checked-chain', data: {count: totals.beforeChain}})}` : line;
}

/** The result of an audit in words, and the deferral to the laser safety officer. */
export function resultLines(report: AuditReport, paint: Paint, width: number): string[] {
	const result = {
		integrity_failure: paint.fail('Result: INTEGRITY FAILURE — at least one record is altered, unsigned or unreadable; do not rely on it.'),
		authentic_with_findings: paint.advise('Result: authentic, with findings — read each finding above.'),
		authentic_and_consistent: paint.pass('Result: every record is authentic and its conclusions follow from its numbers.'),
	}[report.status];
	return [result, ...wrap(`The audit says whether records are authentic and whether their conclusions follow from their numbers. ${deferral}`, width, '  ')];
}

/** Cuts text with no spaces to break at (a path) into pieces of at most `width` characters. */
function foldText(text: string, width: number): string[] {
	const characters = [...text];
	const pieces: string[] = [];
	for (let start = 0; start < characters.length; start += Math.max(10, width)) pieces.push(characters.slice(start, start + Math.max(10, width)).join(''));
	return pieces;
}
