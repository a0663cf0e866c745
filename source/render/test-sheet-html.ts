import {deferral} from '../shared/deferral.js';
import {htmlText} from './report-html.js';
import {pageHead, pageStyle} from './report-style.js';
import {policyLine, sheetWords, type TestSheet} from '../interlock/functional-test/test-sheet.js';

const h = htmlText;

/** Bordered cells tall enough to write in by hand; the step columns take what is left. */
const sheetStyle = `
table.steps th, table.steps td { border: 0.5px solid #000; }
table.steps thead th { border-bottom-width: 1.5px; }
table.steps tbody td { height: 16mm; }
col.c-number { width: 7mm; } col.c-subject { width: 26mm; } col.c-result { width: 20mm; } col.c-initials { width: 15mm; } col.c-date { width: 20mm; }
.blank { display: inline-block; border-bottom: 1px solid #000; margin-right: 4mm; }
.blank.long { width: 42mm; } .blank.short { width: 28mm; }
.fields, .closing p { margin: 5mm 0; line-height: 2; }
.closing { break-inside: avoid; }
`;

/** A label with a line after it to write on. */
const blank = (label: string, size: 'long' | 'short' = 'long') => `${label}: <span class="blank ${size}"></span>`;

/**
 * The functional test sheet as one self-contained printable HTML page (inline style, no
 * scripts, fonts or images), with tall blank cells for the result, initials and date of every step.
 */
export function testSheetHtml(sheet: TestSheet): string {
	const title = `Interlock functional test — ${h(sheet.name)}`;
	const rows = sheet.steps.map((step) => `<tr><td class="number">${step.number}</td><td>${h(step.subject)}</td><td>${h(step.action)}</td><td>${h(step.expect)}</td><td></td><td></td><td></td></tr>`);
	return [
		...pageHead(title, `${pageStyle(`prelase interlock functional test · ${sheet.name}`)}${sheetStyle}`),
		`<h1>${title}</h1>`,
		'<section class="caution" aria-label="Caution">',
		`<p class="deferral">${h(deferral)}</p>`,
		`<p>${h(sheetWords.procedure)}</p>`,
		'</section>',
		`<p>${h(policyLine(sheet))}</p>`,
		`<p class="fields">${blank('Tested by')} ${blank('Witness')} ${blank('Date', 'short')}</p>`,
		'<table class="steps">',
		'<colgroup><col class="c-number"><col class="c-subject"><col><col><col class="c-result"><col class="c-initials"><col class="c-date"></colgroup>',
		'<thead><tr><th scope="col">#</th><th scope="col">Concerns</th><th scope="col">Do</th><th scope="col">Expect</th><th scope="col">Result (pass / fail)</th><th scope="col">Initials</th><th scope="col">Date</th></tr></thead>',
		`<tbody>${rows.join('\n')}</tbody>`,
		'</table>',
		'<section class="closing">',
		`<p>${h(sheetWords.failed)}</p>`,
		`<p>${blank('Signature')}</p>`,
		'</section>',
		'</body>',
		'</html>',
		'',
	].join('\n');
}
