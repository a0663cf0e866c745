/** Wraps text to a width, indenting every line; long words are kept whole. */
export function wrap(text: string, width: number, indent = ''): string[] {
	const room = Math.max(20, width - indent.length);
	const lines: string[] = [];
	for (const paragraph of text.split('\n')) {
		let line = '';
		// A word longer than the line (a pasted hash, a hostile note) is cut into line-sized pieces.
		const words = paragraph.split(/\s+/).filter(Boolean).flatMap((word) => (word.length <= room ? [word] : word.match(new RegExp(`.{1,${room}}`, 'gu')) ?? [word]));
		for (const word of words) {
			if (line && line.length + 1 + word.length > room) {
				lines.push(indent + line);
				line = word;
			} else line = line ? `${line} ${word}` : word;
		}
		lines.push(indent + line);
	}
	return lines;
}

/** A definition-list row: the term padded to a column, the description wrapped under itself. */
export function definitionRow(term: string, description: string, termWidth: number, width: number, indent = '  '): string[] {
	const hanging = indent + ' '.repeat(termWidth + 2);
	const lines = wrap(description, width, hanging);
	lines[0] = `${indent}${term.padEnd(termWidth)}  ${lines[0]!.trimStart()}`;
	return lines;
}
