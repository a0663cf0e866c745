/** Line breaks of every kind: CR LF, CR, LF, VT, FF, NEL, and the Unicode line and paragraph separators. */
const lineBreak = /\r\n|[\n\r\v\f\u0085\u2028\u2029]/g;

/** Text with no line break of any kind: what a single-line field (name, title, label, role, serial) holds. */
export const singleLinePattern = /^[^\n\r\v\f\u0085\u2028\u2029]*$/;

/** True when text holds a line break of any kind (so it is not one line). */
export function hasLineBreak(text: string): boolean {
	return !singleLinePattern.test(text);
}

/**
 * A single-line field (a name, a role, an id, a serial) as one line: each line break shown as ⏎,
 * so text from a file cannot start a line of its own, and runs of other white space folded to one
 * space. Text longer than `max` is cut with an ellipsis.
 */
export function oneLine(text: string, max = Number.POSITIVE_INFINITY): string {
	const line = text.replaceAll(lineBreak, ' ⏎ ').replaceAll(/\s+/g, ' ').trim();
	return line.length > max ? `${line.slice(0, max - 1)}…` : line;
}

/** Each line break of any kind shown as ⏎ between spaces; nothing else changes (a screen's single-line field, spacing kept). */
export function showLineBreaks(text: string): string {
	return text.replaceAll(lineBreak, ' ⏎ ');
}
