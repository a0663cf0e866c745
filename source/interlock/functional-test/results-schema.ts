// Named imports (not the z namespace) let the bundler drop the parts of zod prelase does not use.
import {array, literal, number, object, string, enum as oneOf} from 'zod';
import type {z} from 'zod';
import {lazySchema, once} from '../../shared/lazy-schema.js';
import {quantityOf} from '../plan/plan-schema.js';
import {singleLinePattern} from '../../shared/one-line.js';

/** Every results schema, built on first use: most runs of prelase read no test results. */
const schemas = once(() => {
	const words = string().trim().min(1, 'this text cannot be empty');
	/** Names, roles and what a step concerns: one line, since a line break would print as a line of its own. */
	const line = words.regex(singleLinePattern, 'this is one line of text but holds a line break; write it on one line');
	const person = object({name: line, role: string().trim().regex(singleLinePattern, 'a role is one line of text but holds a line break; write it on one line').default('')}).strict();

	const dayPattern = /^\d{4}-\d{2}-\d{2}$/;

	/** A calendar date as written on a test sheet. */
	const isoDate = string().regex(dayPattern, 'write the date as YYYY-MM-DD, e.g. 2026-11-30').refine((text) => {
		// Text not written YYYY-MM-DD already has its problem; one mistake, one message.
		if (!dayPattern.test(text)) return true;
		const date = new Date(`${text}T00:00:00Z`);
		return !Number.isNaN(date.getTime()) && date.toISOString().startsWith(text);
	}, 'not a calendar date');

	/** One step of a filled-in test sheet. */
	const stepResultSchema = object({
			step: number().int().positive().describe('The step number on the test sheet'),
			concerns: line.describe('What the step concerns, as on the sheet (a device id, "emergency stop", ...): guards against results for another sheet'),
			result: oneOf(['pass', 'fail', 'not_applicable']),
			stopped_in: quantityOf('time').optional().describe('Measured time until emission stopped'),
			note: words.optional(),
		})
		.strict();

	/** The results of one functional test of an interlock loop, as the tester wrote them down. */
	const testResultsSchema = object({
			format: literal(1),
			tested_on: isoDate.describe('The day of the test, YYYY-MM-DD'),
			tested_by: person,
			witness: person.optional(),
			steps: array(stepResultSchema).min(1, 'the results need the steps of the test sheet'),
		})
		.strict();
	return {stepResultSchema, testResultsSchema};
});

export const stepResultSchema = lazySchema(() => schemas().stepResultSchema);
export const testResultsSchema = lazySchema(() => schemas().testResultsSchema);

/** Validated test results, every quantity in SI. */
export type TestResults = z.output<typeof testResultsSchema>;
/** One validated step result. */
export type StepResult = TestResults['steps'][number];
