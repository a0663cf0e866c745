import {htmlText as h, signatureSection as signatureHtml} from './report-html.js';
import {markdownText, signatureSection as signatureMarkdown, table} from './report-markdown.js';
import {previousText, signatureRowsOf, signaturesSummary, type SignatureRow, type SignatureStatus, type TrustInfo} from './report-model.js';
import type {InterlockTestRecord} from '../records/record-schema.js';
import {pageHead, reportStyle} from './report-style.js';
import {witnessSigned} from '../records/signature-purpose.js';

/** Step results as a word with a symbol, so they read without colour. */
const resultWords = {pass: '✓ pass', fail: '✗ FAIL', not_applicable: '– not applicable'} as const;

/** One step of the test as printed. */
type StepRow = {number: number; subject: string; action: string; expect: string; result: keyof typeof resultWords; resultText: string; stoppedIn: string; note: string};

/** Everything the printed interlock test record shows; the writers only lay it out. */
export type InterlockReportModel = {
	title: string;
	planName: string;
	outcome: 'passed' | 'failed';
	outcomeText: string;
	caution: string;
	deferral: string;
	details: Array<[string, string]>;
	/** Steps that failed or were accepted as not applicable: what a reviewer reads first. */
	exceptions: StepRow[];
	steps: StepRow[];
	signatures: SignatureRow[];
};

/** Prepares an interlock test record for printing: every text stripped of control characters, each signature with its verification and trust. */
export function interlockReportModel(record: InterlockTestRecord, signatures: readonly SignatureStatus[], trust: TrustInfo): InterlockReportModel {
	const body = record.body;
	const person = (who: {name: string; role: string}) => [who.name, who.role].filter(Boolean).join(', ');
	const steps = body.steps.map((step): StepRow => ({
		number: step.number,
		subject: step.subject,
		action: step.action,
		expect: step.expect,
		result: step.result,
		resultText: resultWords[step.result],
		stoppedIn: step.stoppedIn ? step.stoppedIn.text : '',
		note: step.note ?? '',
	}));
	const rows = signatureRowsOf(record, signatures, trust);
	const policy = body.policy;
	return {
		title: `Interlock test record: ${body.plan.name}`,
		planName: body.plan.name,
		outcome: body.outcome,
		outcomeText: body.outcomeText,
		caution: body.caution,
		deferral: body.deferral,
		details: [
			['Tested on', body.testedOn],
			['Tested by', person(body.tester)],
			['Witness', body.witness ? `${person(body.witness)}${witnessSigned(record) ? '' : ' (named, not signed)'}` : '(none)'],
			['Plan', body.plan.name],
			['Plan file', body.plan.file],
			['Plan SHA-256', body.plan.sha256],
			['Plan findings', `${body.planFindings.stops} stop, ${body.planFindings.advises} advise${body.planFindings.codes.length > 0 ? ` (${body.planFindings.codes.join(', ')})` : ''}`],
			['Policy', `largest response ${policy.maxResponseTime.text} · resistance margin ${policy.resistanceMargin.text} · test every ${policy.testInterval.text} · longest bypass ${policy.longestBypass.text}`],
			['Rule file', `${policy.rules.name} (${policy.rules.file}, SHA-256 ${policy.rules.sha256})`],
			['Created', body.createdAt],
			['Tool', `${body.tool.name} ${body.tool.version}`],
			['Signatures', signaturesSummary(rows)],
			['Previous record of the signing key', previousText(body.previous)],
		],
		exceptions: steps.filter((step) => step.result !== 'pass'),
		steps,
		signatures: rows,
	};
}

/** An interlock test record as a printable Markdown page. */
export function interlockReportMarkdown(record: InterlockTestRecord, signatures: readonly SignatureStatus[], trust: TrustInfo): string {
	const model = interlockReportModel(record, signatures, trust);
	const cell = (text: string) => markdownText(text, true);
	const stepTable = (rows: StepRow[]) =>
		table(
			['#', 'Concerns', 'Did', 'Expected', 'Result', 'Stopped in', 'Note'],
			rows.map((step) => [String(step.number), cell(step.subject), cell(step.action), cell(step.expect), `**${step.resultText}**`, cell(step.stoppedIn), cell(step.note)]),
		);
	const out = [`# ${markdownText(model.title)}`, '', `**Outcome: ${model.outcome === 'passed' ? 'PASSED' : 'FAILED'}**`, '', markdownText(model.outcomeText), ''];
	out.push(`> **CAUTION.** ${markdownText(model.caution)}`, '>', `> ${markdownText(model.deferral)}`, '');
	if (model.exceptions.length > 0) out.push('## Steps not passed', '', ...stepTable(model.exceptions), '');
	out.push('## Record', '', ...table(['Field', 'Value'], model.details.map(([field, value]) => [field, cell(value)])), '');
	out.push('## Steps', '', ...stepTable(model.steps), '');
	out.push(...signatureMarkdown(model.signatures), `*${markdownText(model.deferral)}*`, '');
	return out.join('\n');
}

/** An interlock test record as one self-contained printable HTML page (inline style, no scripts, fonts or images). */
export function interlockReportHtml(record: InterlockTestRecord, signatures: readonly SignatureStatus[], trust: TrustInfo): string {
	const model = interlockReportModel(record, signatures, trust);
	const verdict = model.outcome === 'passed' ? 'PASSED' : 'FAILED';
	const stepTable = (rows: StepRow[], caption: string) => {
		const body = rows.map((step) => `<tr class="answer-${step.result === 'pass' ? 'yes' : step.result === 'fail' ? 'no' : 'not_applicable'}"><td class="number">${step.number}</td><td>${h(step.subject)}</td><td>${h(step.action)}</td><td>${h(step.expect)}</td><td class="verdict">${h(step.resultText)}</td><td class="number">${h(step.stoppedIn)}</td><td>${h(step.note)}</td></tr>`);
		return `<table class="steps"><caption>${h(caption)}</caption><thead><tr><th scope="col">#</th><th scope="col">Concerns</th><th scope="col">Did</th><th scope="col">Expected</th><th scope="col">Result</th><th scope="col">Stopped in</th><th scope="col">Note</th></tr></thead><tbody>${body.join('')}</tbody></table>`;
	};
	const out = [
		...pageHead(`${h(model.title)} — ${verdict}`, reportStyle(`prelase interlock test record · ${model.planName} · ${verdict}`)),
		'<header>',
		'<p class="kind">prelase · interlock test record</p>',
		`<h1>${h(model.planName)}</h1>`,
		`<p class="outcome outcome-${model.outcome === 'passed' ? 'clear_to_energize' : 'do_not_energize'}">Outcome: <strong>${verdict}</strong></p>`,
		`<p>${h(model.outcomeText)}</p>`,
		'</header>',
		`<section class="caution" aria-label="Caution"><h2>Caution</h2><p>${h(model.caution)}</p><p class="deferral">${h(model.deferral)}</p></section>`,
	];
	if (model.exceptions.length > 0) out.push(`<section class="summary"><h2>Steps not passed</h2>${stepTable(model.exceptions, 'Failed or not applicable')}</section>`);
	out.push('<section class="record"><h2>Record</h2><table class="details"><tbody>');
	for (const [field, value] of model.details) out.push(`<tr><th scope="row">${h(field)}</th><td>${h(value)}</td></tr>`);
	out.push('</tbody></table></section>');
	out.push(`<section class="step"><h2>Steps</h2>${stepTable(model.steps, 'Every step of the functional test, in sheet order')}</section>`);
	out.push(signatureHtml(model.signatures), `<footer><p>${h(model.deferral)}</p></footer>`, '</body>', '</html>', '');
	return out.join('\n');
}
