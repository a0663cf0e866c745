import {randomBytes} from 'node:crypto';
import {stripControl} from './text.js';

/**
 * A control sequence prelase writes itself (a colour, clearing a progress line) travels inside
 * text as a marker that names a key made fresh for each run. No file, argument or answer can know
 * the key, so no text from outside can pass for one of prelase's own sequences.
 */
const key = randomBytes(12).toString('hex');
const opening = `\uE000${key}:`;
const closing = '\uE001';
const marker = new RegExp(`${opening}([0-9a-f]*)${closing}`, 'g');

/** A control sequence of prelase's own, which `terminalText` writes as it is. */
export function ownControl(sequence: string): string {
	return `${opening}${Buffer.from(sequence, 'utf8').toString('hex')}${closing}`;
}

/**
 * Text as it may reach a terminal or a file: every control and bidirectional character removed
 * (tabs and line feeds stay), except prelase's own sequences made by `ownControl`. Every command
 * writes through this (cli/terminal-io.ts), so a renderer cannot forget it.
 */
export function terminalText(text: string): string {
	let out = '';
	let last = 0;
	for (const found of text.matchAll(marker)) {
		out += stripControl(text.slice(last, found.index)) + Buffer.from(found[1]!, 'hex').toString('utf8');
		last = found.index + found[0].length;
	}
	return out + stripControl(text.slice(last));
}
