import {readFileSync} from 'node:fs';
import {isAlias, isMap, isPair, isScalar, isSeq, LineCounter, parseDocument, visit, type Document} from 'yaml';
import {problem, warning, type Problem} from './problems.js';
import {failure, success, type Result} from './result.js';

/** A parsed YAML file that can tell where each value came from. */
export type YamlSource = {
	file: string;
	text: string;
	data: unknown;
	document: Document.Parsed;
	/** Line and column (1-based) of the value at a path, or of its nearest parent that exists. */
	locate(path: ReadonlyArray<string | number>): {line: number; column: number};
	/** The comment written after the value at a path on the same line, if any. */
	trailingComment(path: ReadonlyArray<string | number>): string | undefined;
	/** True for the shipped policy embedded at build time: its sample-value lint passed in the tests. */
	prelinted?: boolean;
};

/** Reads a file as text, refusing empty and binary files with a problem naming the file. */
export function readTextFile(file: string, expected: string): Result<string, Problem> {
	let bytes: Buffer;
	try {
		bytes = readFileSync(file);
	} catch (error) {
		const reason = (error as NodeJS.ErrnoException).code === 'ENOENT' ? 'no such file' : String((error as Error).message);
		return failure([problem('file-unreadable', {reason}, {file})]);
	}
	if (bytes.includes(0)) return failure([problem('file-binary', {expected}, {file})]);
	const text = bytes.toString('utf8');
	if (text.trim() === '') return failure([problem('file-empty', {expected}, {file})]);
	return success(text);
}

/** Parses YAML text, reporting syntax errors and duplicate keys with file:line:column. */
export function parseYamlSource(text: string, file: string, expected: string): Result<YamlSource, Problem> {
	if (text.trim() === '') return failure([problem('file-empty', {expected}, {file})]);
	const lineCounter = new LineCounter();
	const document = parseDocument(text, {lineCounter, prettyErrors: false, uniqueKeys: true, strict: true, logLevel: 'error'});
	const at = (offset: number) => {
		const position = lineCounter.linePos(offset);
		return {line: position.line, column: position.col};
	};
	if (document.errors.length > 0) {
		return failure(
			document.errors.map((error) => {
				const where = {file, ...at(error.pos[0])};
				if (error.code === 'DUPLICATE_KEY') {
					const found = pairAt(document, error.pos[0]);
					const key = found?.key ?? /^\s*(?:"([^"]*)"|'([^']*)'|([^:\n]*))/.exec(text.slice(error.pos[0]))?.slice(1).find((part) => part !== undefined) ?? '';
					return problem('yaml-duplicate-key', {key: key.trim()}, found ? {...where, field: found.path.join('.')} : where);
				}
				return problem('yaml-syntax', {detail: error.message.split('\n')[0] ?? error.code}, where);
			}),
		);
	}
	if (!isMap(document.contents)) {
		const received = document.contents === null ? 'nothing' : isScalar(document.contents) ? `the single value ${JSON.stringify(document.contents.toJSON())}` : 'a list';
		return failure([problem('yaml-not-mapping', {received}, {file, line: 1, column: 1})]);
	}
	const warnings: Problem[] = document.warnings.map((entry) => warning('yaml-syntax', {detail: entry.message.split('\n')[0] ?? entry.code}, {file, ...at(entry.pos[0])}));
	const nodeAt = (path: ReadonlyArray<string | number>) => {
		for (let length = path.length; length >= 0; length -= 1) {
			const node = document.getIn(path.slice(0, length), true) as {range?: [number, number, number]} | undefined;
			if (node && typeof node === 'object' && node.range) return node;
		}
		return undefined;
	};
	let data: unknown;
	try {
		data = document.toJS({maxAliasCount: 100});
	} catch (error) {
		return failure([aliasProblem(document, error, file, at)]);
	}
	return success(
		{
			file,
			text,
			data,
			document,
			locate(path) {
				const node = nodeAt(path);
				return node?.range ? at(node.range[0]) : {line: 1, column: 1};
			},
			trailingComment(path) {
				const node = document.getIn(path, true);
				return isScalar(node) && node.comment ? node.comment : undefined;
			},
		},
		warnings,
	);
}

/**
 * A source whose data is already known (the shipped policy, parsed when prelase was built):
 * the YAML is parsed only if something asks where a value is. Trailing comments are not
 * looked for; the shipped policy is tested to have none after a formula.
 */
export function preparsedYamlSource(text: string, file: string, data: unknown): YamlSource {
	let parsed: YamlSource | undefined;
	const full = () => {
		if (!parsed) {
			const result = parseYamlSource(text, file, 'a prelase rule file (YAML)');
			if (!result.ok) throw new Error('the pre-parsed rule file no longer parses');
			parsed = result.value;
		}
		return parsed;
	};
	return {
		file,
		text,
		data,
		get document() {
			return full().document;
		},
		locate: (path) => full().locate(path),
		trailingComment: () => undefined,
		prelinted: true,
	};
}

/** The key and path of the mapping entry whose key starts at an offset (for duplicate keys). */
function pairAt(document: Document.Parsed, offset: number): {key: string; path: Array<string | number>} | undefined {
	const search = (node: unknown, path: Array<string | number>): {key: string; path: Array<string | number>} | undefined => {
		if (isMap(node)) {
			for (const pair of node.items) {
				if (!isPair(pair)) continue;
				const key = isScalar(pair.key) ? String(pair.key.value) : '';
				const range = isScalar(pair.key) ? pair.key.range : undefined;
				if (range && range[0] <= offset && offset < Math.max(range[1], range[0] + 1)) return {key, path: [...path, key]};
				const inner = search(pair.value, [...path, key]);
				if (inner) return inner;
			}
		} else if (isSeq(node)) {
			for (const [index, item] of node.items.entries()) {
				const inner = search(item, [...path, index]);
				if (inner) return inner;
			}
		}
		return undefined;
	};
	return search(document.contents, []);
}

/** A problem for an alias that cannot be expanded: an anchor never set, or too many expansions. */
function aliasProblem(document: Document.Parsed, error: unknown, file: string, at: (offset: number) => {line: number; column: number}): Problem {
	let dangling: {source: string; offset: number} | undefined;
	visit(document, {
		Alias(_key, node) {
			if (!dangling && isAlias(node) && node.resolve(document) === undefined) dangling = {source: node.source, offset: node.range?.[0] ?? 0};
		},
	});
	if (dangling) return problem('yaml-alias-missing', {name: dangling.source}, {file, ...at(dangling.offset)});
	const detail = error instanceof Error ? error.message : String(error);
	if (/alias count/i.test(detail)) return problem('yaml-alias-excess', {max: 100}, {file, line: 1, column: 1});
	return problem('yaml-syntax', {detail}, {file, line: 1, column: 1});
}
