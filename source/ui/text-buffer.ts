/** What a keystroke does to a one-line text buffer. */
export type BufferChange = {text: string; submit: boolean};

/**
 * Applies typed input to a buffer. Text and Enter arriving together (a paste, or a terminal
 * that sends them in one chunk) are split: the text is kept and the Enter submits it.
 */
export function typeInto(text: string, input: string, key: {backspace?: boolean; delete?: boolean; return?: boolean}): BufferChange {
	if (key.return) return {text, submit: true};
	if (key.backspace || key.delete) return {text: text.slice(0, -1), submit: false};
	const line = input.search(/[\r\n]/);
	if (line >= 0) return {text: text + clean(input.slice(0, line)), submit: true};
	return {text: text + clean(input), submit: false};
}

function clean(input: string): string {
	return input.replaceAll(/[\u0000-\u001F\u007F-\u009F]/g, '');
}

/** The parts of a key event a handler looks at. */
export type KeyLike = {return?: boolean; backspace?: boolean; delete?: boolean; [name: string]: unknown};

/**
 * How a key arrived. `alone`: it was the only key of its input event, as a key pressed on its
 * own is. A key of a paste, or of keys typed faster than the terminal is read, is not alone,
 * and never answers a question.
 */
export type Arrival = {alone: boolean};

const alone: Arrival = {alone: true};
const inChunk: Arrival = {alone: false};

/**
 * Calls a key handler once per character of a multi-character chunk: a paste, or keys typed
 * faster than the terminal is read ("SN-0417\rX\ryyy" arrives as one event), become the
 * keys they were: characters, and Enter for each line break, each marked as not alone.
 * `together`: the event came with others in one read, so even a single key is not alone.
 */
export function eachLine<K extends KeyLike>(input: string, key: K, handle: (input: string, key: K, arrival: Arrival) => void, together = false): void {
	if ([...input].length <= 1) {
		handle(input, key, together ? inChunk : alone);
		return;
	}
	const characters = [...input.replaceAll('\r\n', '\r')];
	for (const character of characters) {
		if (character === '\r' || character === '\n') handle('', {...key, return: true}, inChunk);
		else if (character === '\u007F' || character === '\b') handle('', {...key, return: false, backspace: true}, inChunk);
		else handle(character, {...key, return: false}, inChunk);
	}
}
