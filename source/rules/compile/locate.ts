import type {YamlSource} from '../../shared/yaml-source.js';

/**
 * Where a name sits inside a formula field: the field's position, moved to the name's own
 * line and column when the name can be found in the field's text.
 */
export function locateInField(source: YamlSource, path: ReadonlyArray<string | number>, name: string | undefined, fieldText: string) {
	const start = source.locate(path);
	if (!name) return start;
	const lines = source.text.split('\n');
	const span = fieldText.split('\n').length + 1;
	const pattern = new RegExp(`(^|[^\\w])(${name.replaceAll(/[.*+?^${}()|[\]\\]/g, '\\$&')})(?![\\w])`);
	for (let offset = 0; offset <= span; offset += 1) {
		const line = lines[start.line - 1 + offset];
		if (line === undefined) break;
		const from = offset === 0 ? start.column - 1 : 0;
		const match = pattern.exec(line.slice(from));
		if (match) return {line: start.line + offset, column: from + match.index + match[1]!.length + 1};
	}
	return start;
}
