import chalk, {type ChalkInstance} from 'chalk';
import {ownControl} from './terminal-text.js';

/** Colours for text output; every colour is paired with a word or symbol, never used alone. */
export type Paint = {
	pass(text: string): string;
	fail(text: string): string;
	advise(text: string): string;
	open(text: string): string;
	dim(text: string): string;
	bold(text: string): string;
};

/** Paint that adds nothing: for files, pipes, tests and NO_COLOR. */
export const plain: Paint = {pass: (t) => t, fail: (t) => t, advise: (t) => t, open: (t) => t, dim: (t) => t, bold: (t) => t};

/** Paint for a terminal, or plain when colour is off (NO_COLOR, not a terminal). */
export function paintFor(stream: NodeJS.WriteStream, env: NodeJS.ProcessEnv = process.env): Paint {
	if (env['NO_COLOR'] !== undefined && env['NO_COLOR'] !== '') return plain;
	if (!stream.isTTY && env['FORCE_COLOR'] === undefined) return plain;
	const c: ChalkInstance = chalk;
	return {pass: own(c.green), fail: own(c.red.bold), advise: own(c.yellow), open: own(c.cyan), dim: own(c.dim), bold: own(c.bold)};
}

/** A chalk style whose sequences travel as prelase's own (terminal-text.ts), so the terminal boundary keeps them. */
function own(style: (text: string) => string): (text: string) => string {
	const [start = '', end = ''] = style('\u0000').split('\u0000');
	const [open, close] = [ownControl(start), ownControl(end)];
	// As chalk does: text that closes the style inside reopens it, so nested colours stay.
	return (text) => (start === '' ? text : `${open}${text.replaceAll(close, close + open)}${close}`);
}
