import type {YamlSource} from '../../shared/yaml-source.js';

const linesOf = new WeakMap<YamlSource, string[]>();
const isWordCharacter = (character: string | undefined) => character !== undefined && /\w/.test(character);

/** The index of `name` in `line` from `from`, standing as a whole word (not inside a longer name), or -1. */
function wholeWordAt(line: string, name: string, from: number): number {
	for (let index = line.indexOf(name, from); index >= 0; index = line.indexOf(name, index + 1)) {
		if (!isWordCharacter(line[index - 1]) && !isWordCharacter(line[index + name.length])) return index;
	}
	return -1;
}

/**
 * Where a name sits inside a formula field: the field's position, moved to the name's own
 * line and column when the name can be found in the field's text. Found by plain search, not a
 * pattern built from the name: a name can be any text the file holds, however long.
 */
export function locateInField(source: YamlSource, path: ReadonlyArray<string | number>, name: string | undefined, fieldText: string) {
	const start = source.locate(path);
	if (!name) return start;
	let lines = linesOf.get(source);
	if (!lines) {
		lines = source.text.split('\n');
		linesOf.set(source, lines);
	}
	const span = fieldText.split('\n').length + 1;
	for (let offset = 0; offset <= span; offset += 1) {
		const line = lines[start.line - 1 + offset];
		if (line === undefined) break;
		const index = wholeWordAt(line, name, offset === 0 ? start.column - 1 : 0);
		if (index >= 0) return {line: start.line + offset, column: index + 1};
	}
	return start;
}
