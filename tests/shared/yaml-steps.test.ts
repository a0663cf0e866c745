import {readFileSync} from 'node:fs';
import {LineCounter, parseDocument, type Document} from 'yaml';
import {describe, expect, it} from 'vitest';
import {finish} from '../../source/shared/steps.js';
import {parseDocumentSteps} from '../../source/shared/yaml-steps.js';

const options = {prettyErrors: false, uniqueKeys: false, strict: true, logLevel: 'error'} as const;

/** What a parsed document is: its text written back, its data, its errors and warnings with their positions, and the line starts counted. */
function shape(parse: (text: string, lineCounter: LineCounter) => Document.Parsed, text: string) {
	const lineCounter = new LineCounter();
	const document = parse(text, lineCounter);
	const problems = (list: typeof document.errors) => list.map((entry) => ({code: entry.code, pos: entry.pos, message: entry.message}));
	let data: unknown;
	try {
		data = document.toJS({maxAliasCount: 100});
	} catch (error) {
		data = `throws: ${(error as Error).message}`;
	}
	return {text: document.errors.length === 0 ? document.toString() : '', data, errors: problems(document.errors), warnings: problems(document.warnings), lines: lineCounter.lineStarts};
}

// The yaml library's own parseDocument is the reference: the steps must give the same document.
const cases = [
	{name: 'the demo interlock plan (comments, flow maps)', text: readFileSync('docs/examples/interlock/bench3-interlock-plan.yaml', 'utf8')},
	{name: 'the shipped policy (block scalars, lists)', text: readFileSync('rules/default.yaml', 'utf8')},
	{name: 'anchors and aliases', text: 'a: &x {b: 1}\nc: *x\nd: [*x, *x]\n'},
	{name: 'a syntax error', text: 'a: [1, 2\nb: 3\n'},
	{name: 'a duplicate key (kept, uniqueKeys is off)', text: 'a: 1\na: 2\n'},
	{name: 'two documents', text: 'a: 1\n---\nb: 2\n'},
	{name: 'a tab in indentation', text: 'a:\n\tb: 1\n'},
	{name: 'CR LF line ends and a comment on the last line', text: 'a: 1\r\nb: two # note\r\n# end'},
	{name: 'a lone scalar', text: 'just text'},
	{name: 'a plan of 3,000 devices (more than one step of tokens)', text: `devices:\n${Array.from({length: 3000}, (_, index) => `  - {id: d${index}, contact_resistance: 1 mohm}\n`).join('')}`},
];

describe('parseDocumentSteps', () => {
	it.each(cases)('gives what parseDocument gives: $name', ({text}) => {
		const reference = shape((source, lineCounter) => parseDocument(source, {...options, lineCounter}), text);
		const stepped = shape((source, lineCounter) => finish(parseDocumentSteps(source, {...options, lineCounter})), text);
		expect(stepped).toEqual(reference);
	});

	// The planner parses a plan for editing with the library's defaults (comments kept, no line counter).
	it.each(cases.slice(0, 3))('with the default options too: $name', ({text}) => {
		expect(finish(parseDocumentSteps(text, {})).toString()).toBe(parseDocument(text).toString());
		expect(finish(parseDocumentSteps(text, {})).toJS()).toEqual(parseDocument(text).toJS());
	});

	it('yields between parts of a large file, so a caller can let other work in', () => {
		const text = cases.at(-1)!.text;
		const steps = parseDocumentSteps(text, options);
		let yielded = 0;
		while (!steps.next().done) yielded += 1;
		// Each line `  - {id: d0, contact_resistance: 1 mohm}` is at least 12 lexical tokens (indent, -, space, {, 2 × (key, :, space, value), comma, }, line end, less the spaces the lexer joins):
		// 3,000 lines are at least 36,000 tokens, so at least 8 steps of 4,096, and one more before composing.
		expect(yielded).toBeGreaterThanOrEqual(9);
	});
});
