import {closeSync, fstatSync, openSync} from 'node:fs';
import {readToCap} from './read-to-cap.js';
import {isAlias, isMap, isPair, isScalar, isSeq, LineCounter, parseDocument, visit, type Document} from 'yaml';
import {problem, warning, type Problem} from './problems.js';
import {failure, success, type Result} from './result.js';
import {finish, type Steps} from './steps.js';
import {parseDocumentSteps} from './yaml-steps.js';

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
	/** Keys written twice, when the caller asked to go on past them (the later value is the one read). */
	duplicateKeys?: Problem[];
};

/**
 * The largest YAML file prelase reads (a rule file, answers, a plan, test results): 1 MiB. The
 * shipped policy resolves to under 100 kB; a file far larger is a mistake or an attack, and
 * refusing it up front keeps every later step's time and memory bounded.
 */
export const maxYamlFileBytes = 1024 * 1024;

/**
 * Reads a file as text, refusing what is not a regular file (a device, a pipe, a folder), files
 * over `maxBytes`, and empty and binary files, each with a problem naming the file. The size is
 * checked on the open file, and at most `maxBytes + 1` bytes are ever read, so a file that grows
 * while it is read cannot make prelase read without end.
 */
export function readTextFile(file: string, expected: string, maxBytes = maxYamlFileBytes): Result<string, Problem> {
	let bytes: Buffer;
	let descriptor: number | undefined;
	try {
		descriptor = openSync(file, 'r');
		const stat = fstatSync(descriptor);
		if (!stat.isFile()) return failure([problem('file-not-regular', {expected}, {file})]);
		if (stat.size > maxBytes) return failure([problem('file-too-large', {size: stat.size, max: maxBytes, expected}, {file})]);
		// Read to the end in chunks, stopping past the limit: a file that grows while it is read is still bounded.
		const read = readToCap(descriptor, maxBytes, stat.size);
		if (!read.ok) return failure([problem('file-too-large', {size: read.length, max: maxBytes, expected}, {file})]);
		bytes = read.bytes;
	} catch (error) {
		const reason = (error as NodeJS.ErrnoException).code === 'ENOENT' ? 'no such file' : String((error as Error).message);
		return failure([problem('file-unreadable', {reason}, {file})]);
	} finally {
		if (descriptor !== undefined) closeSync(descriptor);
	}
	if (bytes.includes(0)) return failure([problem('file-binary', {expected}, {file})]);
	const text = bytes.toString('utf8');
	if (text.trim() === '') return failure([problem('file-empty', {expected}, {file})]);
	return success(text);
}

/** Parses YAML text, reporting syntax errors and duplicate keys with file:line:column. */
export function parseYamlSource(text: string, file: string, expected: string, options: YamlReadOptions = {}): Result<YamlSource, Problem> {
	return finish(parseYamlSourceSteps(text, file, expected, options));
}

/** How YAML text is read. */
export type YamlReadOptions = {/** Go on past keys written twice, listing them in `duplicateKeys`, so that later checks can still run. */ readDuplicates?: boolean};

/** The same, in steps (parseDocumentSteps), then one step for the checks and the data. */
export function* parseYamlSourceSteps(text: string, file: string, expected: string, options: YamlReadOptions = {}): Steps<Result<YamlSource, Problem>> {
	if (text.trim() === '') return failure([problem('file-empty', {expected}, {file})]);
	const lineCounter = new LineCounter();
	const document = yield* parseDocumentSteps(text, {lineCounter, prettyErrors: false, uniqueKeys: false, strict: true, logLevel: 'error'});
	yield;
	const at = (offset: number) => {
		const position = lineCounter.linePos(offset);
		return {line: position.line, column: position.col};
	};
	if (document.errors.length > 0) {
		return failure(
			document.errors.map((error) => problem('yaml-syntax', {detail: error.message.split('\n')[0] ?? error.code}, {file, ...at(error.pos[0])})),
		);
	}
	const duplicates = duplicateKeys(document).map(({key, path, offset}) => problem('yaml-duplicate-key', {key}, {file, ...at(offset), field: path.join('.')}));
	if (duplicates.length > 0 && !options.readDuplicates) return failure(duplicates);
	if (!isMap(document.contents)) {
		const received = document.contents === null ? 'nothing' : isScalar(document.contents) ? `the single value ${JSON.stringify(document.contents.toJSON())}` : 'a list';
		return failure([problem('yaml-not-mapping', {received}, {file, line: 1, column: 1})]);
	}
	const warnings: Problem[] = document.warnings.map((entry) => warning('yaml-syntax', {detail: entry.message.split('\n')[0] ?? entry.code}, {file, ...at(entry.pos[0])}));
	let offsets: Map<string, number> | undefined;
	const offsetOf = (path: ReadonlyArray<string | number>) => {
		offsets ??= nodeOffsets(document);
		for (let length = path.length; length >= 0; length -= 1) {
			const offset = offsets.get(pathKey(path.slice(0, length)));
			if (offset !== undefined) return offset;
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
				const offset = offsetOf(path);
				return offset === undefined ? {line: 1, column: 1} : at(offset);
			},
			trailingComment(path) {
				const node = document.getIn(path, true);
				return isScalar(node) && node.comment ? node.comment : undefined;
			},
			...(duplicates.length > 0 ? {duplicateKeys: duplicates} : {}),
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

type Path = Array<string | number>;

/** A path as one map key: each part tagged with its type, as the YAML document's getIn tells 1 from "1". */
function pathKey(path: ReadonlyArray<string | number>): string {
	return path.map((part) => `${typeof part === 'number' ? 'n' : 's'}${String(part)}`).join('\u0000');
}

/** A scalar key as a path part (its value), or undefined for a key that is not a scalar. */
function keyPart(key: unknown): string | number | undefined {
	if (!isScalar(key)) return undefined;
	return typeof key.value === 'number' ? key.value : String(key.value);
}

/** Walks every map and list of a document once, depth first, without recursion (a deep file cannot overflow the stack). */
function walk(document: Document.Parsed, visitNode: (node: unknown, path: Path) => void): void {
	const stack: Array<{node: unknown; path: Path}> = [{node: document.contents, path: []}];
	while (stack.length > 0) {
		const {node, path} = stack.pop()!;
		visitNode(node, path);
		if (isMap(node)) {
			for (let index = node.items.length - 1; index >= 0; index -= 1) {
				const pair = node.items[index];
				const part = isPair(pair) ? keyPart(pair.key) : undefined;
				if (pair && part !== undefined) stack.push({node: pair.value, path: [...path, part]});
			}
		} else if (isSeq(node)) {
			for (let index = node.items.length - 1; index >= 0; index -= 1) stack.push({node: node.items[index], path: [...path, index]});
		}
	}
}

/**
 * Keys written twice in one mapping, in file order, found in one pass with a set per mapping
 * (the YAML library's own check compares every pair: quadratic in the number of keys). Keys
 * compare as the library compares them: 1 and "1" differ.
 */
function duplicateKeys(document: Document.Parsed): Array<{key: string; path: Path; offset: number}> {
	const found: Array<{key: string; path: Path; offset: number}> = [];
	walk(document, (node, path) => {
		if (!isMap(node)) return;
		const seen = new Set<string>();
		for (const pair of node.items) {
			const part = isPair(pair) ? keyPart(pair.key) : undefined;
			if (part === undefined) continue;
			const tagged = `${typeof part}:${String(part)}`;
			if (seen.has(tagged)) found.push({key: String(part), path: [...path, part], offset: (pair.key as {range?: [number, number, number]}).range?.[0] ?? 0});
			else seen.add(tagged);
		}
	});
	return found.sort((a, b) => a.offset - b.offset);
}

/** Where each value of a document starts, by path: built once, so locating is not a search per call. */
function nodeOffsets(document: Document.Parsed): Map<string, number> {
	const offsets = new Map<string, number>();
	walk(document, (node, path) => {
		const range = (node as {range?: [number, number, number]} | null)?.range;
		if (range) offsets.set(pathKey(path), range[0]);
		// A list item is also found by its index written as text, as getIn finds it.
		const last = path.at(-1);
		if (range && typeof last === 'number') offsets.set(pathKey([...path.slice(0, -1), String(last)]), range[0]);
	});
	return offsets;
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
