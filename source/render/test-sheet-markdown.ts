import {deferral} from '../shared/deferral.js';
import {markdownText} from './report-markdown.js';
import {policyLine, sheetWords, type TestSheet} from '../interlock/functional-test/test-sheet.js';

const cell = (text: string) => markdownText(text, true);

/** The functional test sheet as Markdown, with blanks for the result, initials and date of every step. */
export function testSheetMarkdown(sheet: TestSheet): string {
	const lines = [
		`# Interlock functional test — ${markdownText(sheet.name)}`,
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
