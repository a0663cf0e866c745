import chalk, {type ChalkInstance} from 'chalk';

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
	return {pass: c.green, fail: (t) => c.red.bold(t), advise: c.yellow, open: c.cyan, dim: c.dim, bold: c.bold};
}
