import type {BenchRecord} from '../records/record-schema.js';
import {reportModel, type CheckRow, type ConfirmationRow, type SignatureRow, type SignatureStatus, type TrustInfo} from './report-model.js';
import {pageHead, reportStyle} from './report-style.js';
import {marginChartSection, sensitivitySection} from './report-charts-html.js';

const entities: Record<string, string> = {'&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;'};

/** Escapes text for HTML element content and attribute values. */
export function htmlText(text: string): string {
	return text.replaceAll(/[&<>"']/g, (found) => entities[found]!);
}

const h = htmlText;
/** Only known words become class names; nothing from the record reaches an attribute unescaped. */
const token = (text: string) => text.replaceAll(/[^a-z_]/g, '');

function checkHead(): string {
	return '<colgroup><col class="c-verdict"><col class="c-title"><col class="c-value"><col class="c-limit"><col class="c-margin"><col class="c-fraction"></colgroup><thead><tr><th scope="col">Verdict</th><th scope="col">Check</th><th scope="col">Value</th><th scope="col">Limit</th><th scope="col">Margin</th><th scope="col">Fraction</th></tr></thead>';
}

function checkBody(check: CheckRow): string {
	const notes = check.notes.map((note) => `<p class="message">${h(note)}</p>`).join('');
	return [
		`<tbody class="check verdict-${token(check.verdict)}">`,
		`<tr><td class="verdict">${h(check.verdictText)}</td><td>${h(check.title)}<br><code>${h(check.id)}</code> · ${h(check.severity)}</td>`,
		`<td class="number">${h(check.value)}</td><td class="number">${h(check.limit)}</td><td class="margin">${h(check.margin)}</td><td class="number">${h(check.fraction)}</td></tr>`,
		`<tr class="detail"><td></td><td colspan="5">${notes}<p class="basis">Basis: ${h(check.basis)}</p></td></tr>`,
		'</tbody>',
	].join('');
}

function checkTable(checks: CheckRow[], caption: string): string {
	return `<table class="checks"><caption>${h(caption)}</caption>${checkHead()}${checks.map(checkBody).join('')}</table>`;
}

function confirmationTable(entries: ConfirmationRow[], caption: string): string {
	const rows = entries.map((entry) => `<tr class="answer-${token(entry.status)}"><td class="verdict">${h(entry.answerText)}</td><td>${h(entry.statement)}<br><code>${h(entry.id)}</code></td><td>${h(entry.note)}</td></tr>`);
	return `<table class="confirmations"><caption>${h(caption)}</caption><colgroup><col class="c-verdict"><col class="c-statement"><col></colgroup><thead><tr><th scope="col">Answer</th><th scope="col">Confirmation</th><th scope="col">Note</th></tr></thead><tbody>${rows.join('')}</tbody></table>`;
}

/** The record as one self-contained printable HTML page (inline style, no scripts, fonts or images). */
export function reportHtml(record: BenchRecord, signatures: readonly SignatureStatus[], trust: TrustInfo): string {
	const model = reportModel(record, signatures, trust);
	const out: string[] = [];
	out.push(
		...pageHead(`${h(model.title)} — ${h(model.outcomeText)}`, reportStyle(`prelase record · setup ${model.setupKey} · ${model.outcomeText.toUpperCase()}`)),
		'<header>',
		`<p class="kind">prelase · bench check record</p>`,
		`<h1>${h(model.setupName)}</h1>`,
		`<p class="outcome outcome-${token(model.outcome)}">Outcome: <strong>${h(model.outcomeText.toUpperCase())}</strong></p>`,
		'</header>',
		`<section class="caution" aria-label="Caution"><h2>Caution</h2><p>${h(model.caution)}</p><p class="deferral">${h(model.deferral)}</p></section>`,
		'<section class="summary"><h2>Summary</h2>',
		`<p>Checks: ${h(model.countsText)}</p>`,
	);
	if (model.attention.length > 0) out.push(checkTable(model.attention, 'Checks that do not hold or are open, failures first'));
	if (model.attentionConfirmations.length > 0) out.push(confirmationTable(model.attentionConfirmations, 'Confirmations not answered yes'));
	if (model.missingInputs.length > 0) out.push(`<p>Inputs not given: ${model.missingInputs.map((id) => `<code>${h(id)}</code>`).join(', ')}</p>`);
	if (model.attention.length === 0 && model.attentionConfirmations.length === 0) out.push('<p>Every check that applies holds.</p>');
	out.push('</section>');

	out.push(marginChartSection(record.body), sensitivitySection(record.body));

	out.push('<section class="record"><h2>Record</h2><table class="details"><tbody>');
	for (const [field, value] of model.details) out.push(`<tr><th scope="row">${h(field)}</th><td>${h(value)}</td></tr>`);
	if (model.amendment) out.push(`<tr><th scope="row">Amends</th><td>${h(model.amendment.record)} (body SHA-256 ${h(model.amendment.bodySha256)}): ${h(model.amendment.reason)}</td></tr>`);
	out.push('</tbody></table></section>');

	model.steps.forEach((step, index) => {
		out.push(`<section class="step"><h2>${index + 1}. ${h(step.title)}</h2>`);
		if (step.inputs.length > 0) {
			const rows = step.inputs.map((input) => `<tr><td>${h(input.label)}<br><code>${h(input.id)}</code></td><td>${h(input.entered)}</td><td>${h(input.value)}</td><td class="number">${h(input.si)}</td></tr>`);
			out.push(`<table class="inputs"><caption>Inputs</caption><colgroup><col class="c-label"><col><col><col class="c-si"></colgroup><thead><tr><th scope="col">Input</th><th scope="col">Entered</th><th scope="col">Value</th><th scope="col">SI</th></tr></thead><tbody>${rows.join('')}</tbody></table>`);
		}
		if (step.checks.length > 0) out.push(checkTable(step.checks, 'Checks'));
		if (step.confirmations.length > 0) out.push(confirmationTable(step.confirmations, 'Confirmations'));
		out.push('</section>');
	});

	if (model.derived.length > 0) {
		const rows = model.derived.map((entry) => `<tr><td>${h(entry.label)}<br><code>${h(entry.id)}</code></td><td>${h(entry.value)}</td></tr>`);
		out.push(`<section class="derived"><h2>Derived values</h2><table class="derived-values"><colgroup><col class="c-derived"><col></colgroup><thead><tr><th scope="col">Value</th><th scope="col">Result</th></tr></thead><tbody>${rows.join('')}</tbody></table></section>`);
	}

	out.push(
		signatureSection(model.signatures),
		`<footer><p>${h(model.deferral)}</p></footer>`,
		'</body>',
		'</html>',
		'',
	);
	return out.join('\n');
}

/** The signatures of a record, each with its verification and trust, as an HTML section. */
export function signatureSection(rows: readonly SignatureRow[]): string {
	const bodies = rows.map((row) =>
		[
			`<tbody class="signature ${row.verified ? 'verified' : 'not-verified'}">`,
			`<tr><td>${row.number}</td><td>${h(row.name)}${row.role ? `<br>${h(row.role)}` : ''}</td><td>${h(row.meaning)}</td><td class="number">${h(row.signedAt)}</td><td class="verdict">${h(row.verifiedText)}</td><td>${h(row.trustText)}</td></tr>`,
			`<tr class="detail"><td></td><td colspan="5">Key ${h(row.key)} · <code class="hash">${h(row.fingerprint)}</code></td></tr>`,
			'</tbody>',
		].join(''),
	);
	return `<section class="signatures"><h2>Signatures</h2><table class="signature-table"><colgroup><col class="c-number"><col><col class="c-meaning"><col class="c-when"><col class="c-verified"><col class="c-trust"></colgroup><thead><tr><th scope="col">#</th><th scope="col">Signer and role</th><th scope="col">Purpose</th><th scope="col">Signed at</th><th scope="col">Verified</th><th scope="col">Trust</th></tr></thead>${bodies.join('')}</table></section>`;
}
