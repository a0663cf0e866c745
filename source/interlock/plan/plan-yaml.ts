import {isCollection, isScalar, visit, type Document} from 'yaml';
import {finish, type Steps} from '../../shared/steps.js';
import {parseDocumentSteps} from '../../shared/yaml-steps.js';

/** How an edited plan is written: no folding of long lines, flow maps as `{awg: 22, length: 3 m}`. */
const writeOptions = {lineWidth: 0, flowCollectionPadding: false} as const;

/**
 * Parses a plan for editing, keeping its comments. A comment written after `devices:` on the
 * key's own line is kept there (the parser would otherwise print it on the next line).
 */
export function planDocument(text: string): Document.Parsed {
	return finish(planDocumentSteps(text));
}

/** The same, in steps (the parse is long for a plan near the size limit). */
export function* planDocumentSteps(text: string): Steps<Document.Parsed> {
	const document = yield* parseDocumentSteps(text, {});
	visit(document, {
		Pair(_, pair) {
			const {key, value} = pair;
			if (!isScalar(key) || !isCollection(value) || !value.commentBefore || !key.range || !value.range) return;
			const between = text.slice(key.range[1], value.range[0]);
			const hash = between.indexOf('#');
			if (hash >= 0 && !between.slice(0, hash).includes('\n')) {
				key.comment = value.commentBefore;
				value.commentBefore = undefined;
			}
		},
	});
	return document;
}

/**
 * The document as text. Lines the edit did not change keep the spacing they had before their
 * comment in the original text, so a save changes only what was edited.
 */
export function planDocumentText(document: Document, original: string): string {
	const collapse = (line: string) => line.replace(/\s+(#[^#]*)$/, ' $1');
	const kept = new Map<string, string>();
	for (const line of original.split('\n')) if (line.includes('#')) kept.set(collapse(line), line);
	return document
		.toString(writeOptions)
		.split('\n')
		.map((line) => (line.includes('#') ? (kept.get(line) ?? line) : line))
		.join('\n');
}
