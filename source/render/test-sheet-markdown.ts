import {deferral} from '../shared/deferral.js';
import {stripControl} from '../shared/text.js';
import {policyLine, sheetWords, type TestSheet} from '../interlock/functional-test/test-sheet.js';

const cell = (text: string) => stripControl(text).replaceAll('|', '\\|').replaceAll('\n', ' ');

/** The functional test sheet as Markdown, with blanks for the result, initials and date of every step. */
export function testSheetMarkdown(sheet: TestSheet): string {
	const lines = [
		`# Interlock functional test — ${cell(sheet.name)}`,
		'',
		`> ${deferral}`,
		'',
		sheetWords.procedure,
		'',
		policyLine(sheet),
		'',
		'Tested by: ____________________   Witness: ____________________   Date: ____________',
		'',
		'| # | Concerns | Do | Expect | Result (pass / fail) | Initials | Date |',
		'|---|---|---|---|---|---|---|',
		...sheet.steps.map((step) => `| ${step.number} | ${cell(step.subject)} | ${cell(step.action)} | ${cell(step.expect)} |  |  |  |`),
		'',
		sheetWords.failed,
		'',
		'Signature: ____________________',
	];
	return `${lines.join('\n')}\n`;
}
