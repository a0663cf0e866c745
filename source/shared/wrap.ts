/** Wraps text to a width, indenting every line; long words are kept whole. */
export function wrap(text: string, width: number, indent = ''): string[] {
	const room = Math.max(20, width - indent.length);
	const lines: string[] = [];
	for (const paragraph of text.split('\n')) {
		let line = '';
		// A word longer than the line (a pasted hash, a hostile note) is cut into line-sized pieces.
		const words = keepValuesWhole(paragraph.split(/\s+/).filter(Boolean)).flatMap((word) => (word.length <= room ? [word] : word.match(new RegExp(`.{1,${room}}`, 'gu')) ?? [word]));
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

const number = /^\(?[-+\u2212]?\d[\d.,]*(?:e[-+]?\d+)?$/;
const unit = /^(?:[a-zA-Z\u00B5\u03BC\u00B0\u2126\u03A9%\/^\d\u221A\u00B2\u00B3\u207B\u00B9]{1,8})[.,;:)]?$/;

/** A number and the unit after it ("3 A", "2.62 W", "125 mW") stay on one line. */
function keepValuesWhole(words: string[]): string[] {
	const kept: string[] = [];
	for (let index = 0; index < words.length; index += 1) {
		const word = words[index]!;
		const next = words[index + 1];
		if (next !== undefined && number.test(word) && unit.test(next) && /[^\d.,;:)]/.test(next)) {
			kept.push(`${word} ${next}`);
			index += 1;
		} else kept.push(word);
	}
	return kept;
}

/** A definition-list row: the term padded to a column, the description wrapped under itself. */
export function definitionRow(term: string, description: string, termWidth: number, width: number, indent = '  '): string[] {
	const hanging = indent + ' '.repeat(termWidth + 2);
	const lines = wrap(description, width, hanging);
	lines[0] = `${indent}${term.padEnd(termWidth)}  ${lines[0]!.trimStart()}`;
	return lines;
}
