import {definitionRow, wrap} from '../shared/wrap.js';

import type {Io} from './io.js';

/** Where a command writes; tests pass their own. */
export type {Io};

/** One option of a command: how it parses and how its help row reads. */
export type OptionSpec =
	| {readonly type: 'boolean'; readonly short?: string; readonly summary: string}
	| {readonly type: 'string'; readonly short?: string; readonly summary: string; readonly value: string; readonly multiple?: boolean};

export type OptionSpecs = Readonly<Record<string, OptionSpec>>;

/**
 * A command, declared once: its name and one-line summary (the main help's command list), its
 * usage line (the main help's usage block), its options (parseArgs, the Options part of its
 * help, did-you-mean), the prose of its help before and after the options, and what runs it.
 */
export type Command = {
	readonly name: string;
	readonly summary: string;
	readonly usage: string;
	readonly options: OptionSpecs;
	readonly help: {readonly intro: string; readonly notes?: string};
	readonly run: (args: string[], io: Io) => number | Promise<number>;
};

/** The option every command takes. */
export const helpOption = {type: 'boolean', short: 'h', summary: 'Show this help'} as const satisfies OptionSpec;

/** parseArgs' options config from a declaration: the type, short letter and multiple, nothing else. */
export function parseOptions<const O extends OptionSpecs>(options: O): {[K in keyof O]: {type: O[K]['type']; short?: string} & (O[K] extends {multiple: true} ? {multiple: true} : unknown)} {
	const config: Record<string, {type: 'string' | 'boolean'; short?: string; multiple?: boolean}> = {};
	for (const [name, spec] of Object.entries(options)) {
		config[name] = {type: spec.type, ...(spec.short === undefined ? {} : {short: spec.short}), ...(spec.type === 'string' && spec.multiple ? {multiple: true} : {})};
	}
	return config as never;
}

/** The term of an option's help row: `-h, --help`, `--rules FILE`. */
export function optionTerm(name: string, spec: OptionSpec): string {
	const long = `--${name}${spec.type === 'string' ? ` ${spec.value}` : ''}`;
	return spec.short === undefined ? long : `-${spec.short}, ${long}`;
}

/** Widest option term kept on the description's line. */
const longestTerm = 21;

/** Width the generated option rows wrap to, as the prose around them. */
const helpWidth = 96;

/** The Options part of a command's help, one row per declared option. */
export function optionsHelp(options: OptionSpecs, width = helpWidth): string {
	const entries = Object.entries(options);
	const termWidth = Math.min(longestTerm, Math.max(...entries.map(([name, spec]) => optionTerm(name, spec).length)));
	const rows = entries.flatMap(([name, spec]) => {
		const term = optionTerm(name, spec);
		const summary = `${spec.summary}${spec.type === 'string' && spec.multiple ? ' (may be given more than once)' : ''}`;
		// A term wider than the column takes a line of its own, so one long value does not push every description right.
		return term.length > termWidth ? [`  ${term}`, ...wrap(summary, width, ' '.repeat(termWidth + 4))] : definitionRow(term, summary, termWidth, width);
	});
	return ['Options:', ...rows].join('\n');
}

/** A command's whole `--help` text: its intro prose, the generated options, its notes. */
export function commandHelp(command: Pick<Command, 'options' | 'help'>): string {
	return [command.help.intro, optionsHelp(command.options), ...(command.help.notes === undefined ? [] : [command.help.notes])].join('\n\n');
}

/**
 * The long spellings of a command's options, for did-you-mean (`--rules`). Short letters are left
 * out: every unknown letter is one edit from each of them, so guessing one would be noise.
 */
export function optionSpellings(options: OptionSpecs): string[] {
	return Object.keys(options).map((name) => `--${name}`);
}
