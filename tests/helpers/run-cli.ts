import {mkdirSync, writeFileSync} from 'node:fs';
import {join} from 'node:path';
import {main} from '../../source/cli/dispatch.js';
import {fakeIo} from './fake-io.js';

/** What a command said and its exit status. */
export type CliRun = {code: number; stdout: string; stderr: string};

/** Runs the program in-process with `env` as its whole environment; waits when the command answers later. */
export async function runCli(argv: string[], env: NodeJS.ProcessEnv = {}): Promise<CliRun> {
	const io = fakeIo(env);
	const code = await main(argv, io);
	return {code, stdout: io.stdout.text, stderr: io.stderr.text};
}

/** Runs a command that answers at once (no terminal, no signing); fails the test if it answers later. */
export function runCliNow(argv: string[], env: NodeJS.ProcessEnv = {}): CliRun {
	const io = fakeIo(env);
	const code = main(argv, io);
	if (typeof code !== 'number') throw new Error(`prelase ${argv.join(' ')} did not answer at once`);
	return {code, stdout: io.stdout.text, stderr: io.stderr.text};
}

/** Runs the program in-process with its settings, keys and records folder under `home` (PRELASE_HOME). */
export async function runIn(home: string, argv: string[]): Promise<CliRun> {
	return runCli(argv, {PRELASE_HOME: home});
}

/** Joins the wrapped continuation lines of text output, so assertions need not know the width; JSON is left as it is. */
export function unwrap(text: string): string {
	return text.startsWith('{') ? text : text.replaceAll(/\n {17,}/g, ' ');
}

let cases = 0;

/** A new folder of its own below `parent` for one test case (case-1, case-2, ..., or NAME-1, NAME-2, ...). */
export function caseFolder(parent: string, name = 'case'): string {
	cases += 1;
	const dir = join(parent, `${name}-${cases}`);
	mkdirSync(dir, {recursive: true});
	return dir;
}

/** Writes `content` (text, or data as the record store writes it) as `name` in a new case folder; returns its path. */
export function writeCaseFile(parent: string, content: string | object, name = 'record.json'): string {
	const path = join(caseFolder(parent), name);
	writeFileSync(path, typeof content === 'string' ? content : `${JSON.stringify(content, null, 2)}\n`);
	return path;
}
