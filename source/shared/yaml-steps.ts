import {Composer, Lexer, Parser, YAMLParseError, type Document, type DocumentOptions, type ParseOptions, type SchemaOptions} from 'yaml';
import type {Steps} from './steps.js';

/** Lexical tokens read between two steps: a few milliseconds of work. */
const lexemesPerStep = 4096;

/**
 * The yaml library's parseDocument, in steps: it reads the text a few thousand tokens at a time,
 * then builds the document (one step). The same lexer, parser and composer, fed the same tokens
 * in the same order, so the document is the one parseDocument gives. A file near the size limit
 * takes most of a second to parse; in steps a caller can let a signal in meanwhile. Errors are
 * left as they are (`prettyErrors` is not applied).
 */
export function* parseDocumentSteps(source: string, options: ParseOptions & DocumentOptions & SchemaOptions): Steps<Document.Parsed> {
	const parser = new Parser(options.lineCounter?.addNewLine);
	// As Parser.parse does before its first token.
	options.lineCounter?.addNewLine(0);
	const tokens = [];
	let read = 0;
	for (const lexeme of new Lexer().lex(source, false)) {
		for (const token of parser.next(lexeme)) tokens.push(token);
		read += 1;
		if (read % lexemesPerStep === 0) yield;
	}
	for (const token of parser.end()) tokens.push(token);
	yield;
	const composer = new Composer(options);
	let document: Document.Parsed | undefined;
	for (const composed of composer.compose(tokens, true, source.length)) {
		if (!document) document = composed;
		else {
			// As parseDocument does: one document is expected.
			if (document.options.logLevel !== 'silent') document.errors.push(new YAMLParseError(composed.range.slice(0, 2) as [number, number], 'MULTIPLE_DOCS', 'Source contains multiple documents; please use YAML.parseAllDocuments()'));
			break;
		}
	}
	return document!;
}
