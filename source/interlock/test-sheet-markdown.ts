import {deferral} from '../deferral.js';
import {stripControl} from '../text.js';
import type {TestSheet} from './test-sheet.js';

const cell = (text: string) => stripControl(text).replaceAll('|', '\\|').replaceAll('\n', ' ');

/** The functional test sheet as Markdown, with blanks for the result, initials and date of every step. */
export function testSheetMarkdown(sheet: TestSheet): string {
	const lines = [
		`# Interlock functional test — ${cell(sheet.name)}`,
		'',
		`> ${deferral}`,
		'',
		'Follow the laser safety officer\'s procedure for interlock tests (beam power, detector, eyewear, who is present). Time each stop with a detector on the beam or the driver\'s output current.',
		'',
		`Largest response time (policy): ${sheet.limit}. Repeat this test at least every ${sheet.interval} (policy), and after any change to the loop.`,
		'',
		'Tested by: ____________________   Witness: ____________________   Date: ____________',
		'',
		'| # | Concerns | Do | Expect | Result (pass / fail) | Initials | Date |',
		'|---|---|---|---|---|---|---|',
		...sheet.steps.map((step) => `| ${step.number} | ${cell(step.subject)} | ${cell(step.action)} | ${cell(step.expect)} |  |  |  |`),
		'',
		'Every step must pass. A failed step: stop, tag the loop out of service, and tell the laser safety officer.',
		'',
		'Signature: ____________________',
	];
	return `${lines.join('\n')}\n`;
}
