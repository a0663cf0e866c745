import type {BenchRecord} from '../records/record-schema.js';
import {sensitivityMarkdown} from './report-sensitivity-markdown.js';
import {reportModel, type CheckRow, type ConfirmationRow, type SignatureRow, type SignatureStatus, type TrustInfo} from './report-model.js';

/**
 * Escapes text for Markdown: entities for < > (and for & where it would start an entity) so no
 * HTML reaches a renderer, a backslash before the characters that start emphasis, links,
 * code or table cells (an underscore only at a word's edge), and line breaks
 * turned into spaces (or `<br>` in a table cell) so text cannot start a heading or list.
 */
export function markdownText(text: string, inCell = false): string {
	return text
		.replaceAll(/&(?=#?\w+;)/g, '&amp;')
		.replaceAll('<', '&lt;')
		.replaceAll('>', '&gt;')
		.replaceAll(/[\\`*[\]|~]|(?<![\p{L}\p{N}])_|_(?![\p{L}\p{N}])/gu, (found) => `\\${found}`)
		.replaceAll(/\r\n|\r|\n|\u2028|\u2029/g, inCell ? '<br>' : ' ');
}

const cell = (text: string) => markdownText(text, true);
const code = (text: string) => (/^[\w.-]+$/.test(text) ? `\`${text}\`` : cell(text));

/** A Markdown table (cells already escaped). */
export function table(head: string[], rows: string[][]): string[] {
	return [`| ${head.join(' | ')} |`, `|${head.map(() => '---').join('|')}|`, ...rows.map((row) => `| ${row.join(' | ')} |`)];
}

function checkNotes(check: CheckRow): string {
	return [...check.notes, `Basis: ${check.basis}`].map(cell).join('<br>');
}

function checkTable(checks: CheckRow[]): string[] {
	return table(
		['Verdict', 'Check', 'Value', 'Limit', 'Margin', 'Fraction', 'Message and basis'],
		checks.map((check) => [`**${check.verdictText}**`, `${cell(check.title)} (${code(check.id)}, ${check.severity})`, cell(check.value), cell(check.limit), cell(check.margin), cell(check.fraction), checkNotes(check)]),
	);
}

function confirmationTable(entries: ConfirmationRow[]): string[] {
	return table(['Answer', 'Confirmation', 'Note'], entries.map((entry) => [`**${entry.answerText}**`, `${cell(entry.statement)} (${code(entry.id)})`, cell(entry.note)]));
}

/** The record as a printable Markdown page. */
export function reportMarkdown(record: BenchRecord, signatures: readonly SignatureStatus[], trust: TrustInfo): string {
	const model = reportModel(record, signatures, trust);
	const out: string[] = [];
	out.push(`# ${markdownText(model.title)}`, '', `**Outcome: ${markdownText(model.outcomeText.toUpperCase())}**`, '');
	out.push(`> **CAUTION.** ${markdownText(model.caution)}`, '>', `> ${markdownText(model.deferral)}`, '');

	out.push('## Summary', '', `Checks: ${markdownText(model.countsText)}`, '');
	if (model.attention.length > 0) out.push(...checkTable(model.attention), '');
	if (model.attentionConfirmations.length > 0) out.push(...confirmationTable(model.attentionConfirmations), '');
	if (model.missingInputs.length > 0) out.push(`Inputs not given: ${model.missingInputs.map(code).join(', ')}`, '');
	if (model.attention.length === 0 && model.attentionConfirmations.length === 0) out.push('Every check that applies holds.', '');

	out.push(...sensitivityMarkdown(record.body, markdownText));

	out.push('## Record', '', ...table(['Field', 'Value'], model.details.map(([field, value]) => [field, cell(value)])), '');
	if (model.amendment) {
		const {record: corrected, bodySha256, reason} = model.amendment;
		out.push(`**Amends** ${markdownText(corrected)} (body SHA-256 ${bodySha256}): ${markdownText(reason)}`, '');
	}

	model.steps.forEach((step, index) => {
		out.push(`## ${index + 1}. ${markdownText(step.title)}`, '');
		if (step.inputs.length > 0) out.push(...table(['Input', 'Entered', 'Value', 'SI'], step.inputs.map((input) => [`${cell(input.label)} (${code(input.id)})`, cell(input.entered), cell(input.value), cell(input.si)])), '');
		if (step.checks.length > 0) out.push(...checkTable(step.checks), '');
		if (step.confirmations.length > 0) out.push(...confirmationTable(step.confirmations), '');
	});

	if (model.derived.length > 0) out.push('## Derived values', '', ...table(['Value', 'Result'], model.derived.map((entry) => [`${cell(entry.label)} (${code(entry.id)})`, cell(entry.value)])), '');

	out.push(...signatureSection(model.signatures));
	out.push(`*${markdownText(model.deferral)}*`, '');
	return out.join('\n');
}

/** The signatures of a record, each with its verification and trust, as a Markdown section. */
export function signatureSection(rows: readonly SignatureRow[]): string[] {
	return [
		'## Signatures',
		'',
		...table(
			['#', 'Signer', 'Role', 'Purpose', 'Signed at', 'Key', 'Verified', 'Trust'],
			rows.map((row) => [String(row.number), cell(row.name), cell(row.role), row.meaning, cell(row.signedAt), `${row.key}<br>${row.fingerprint}`, `**${cell(row.verifiedText)}**`, cell(row.trustText)]),
		),
		'',
	];
}
