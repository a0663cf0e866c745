import {existsSync, mkdirSync, readdirSync, readFileSync} from 'node:fs';
import {join} from 'node:path';
import {replaceFileAtomically} from '../../shared/atomic-file.js';
import {asWriteError} from '../../shared/file-write-error.js';
// Named imports (not the z namespace) let the bundler leave out the parts of zod not used.
import {object, record, string} from 'zod';
import {lazySchema} from '../../shared/lazy-schema.js';

/** A named bench setup: the inputs of a finished check, to prefill the next one. */
export type SavedSetup = {name: string; entries: Record<string, string>; savedAt: string};

const setupSchema = lazySchema(() =>
	object({name: string(), entries: record(string(), string()), savedAt: string()}).strict(),
);

function fileName(name: string): string {
	return `${name.normalize('NFKD').replaceAll(/[^A-Za-z0-9]+/g, '-').replaceAll(/^-+|-+$/g, '').toLowerCase() || 'setup'}.json`;
}

function folderOf(settingsFolder: string): string {
	return join(settingsFolder, 'setups');
}

/** Saves (or replaces) a named setup. */
export function saveSetup(settingsFolder: string, setup: SavedSetup): string {
	const folder = folderOf(settingsFolder);
	try {
		mkdirSync(folder, {recursive: true});
	} catch (error) {
		throw asWriteError(folder, error);
	}
	const path = join(folder, fileName(setup.name));
	replaceFileAtomically(path, `${JSON.stringify(setup, null, 2)}\n`, 0o644);
	return path;
}

/** A saved setup by name, or undefined. */
export function loadSetup(settingsFolder: string, name: string): SavedSetup | undefined {
	const path = join(folderOf(settingsFolder), fileName(name));
	if (!existsSync(path)) return undefined;
	const parsed = setupSchema.safeParse(JSON.parse(readFileSync(path, 'utf8')));
	return parsed.success ? parsed.data : undefined;
}

/** The names of every saved setup. */
export function listSetups(settingsFolder: string): string[] {
	const folder = folderOf(settingsFolder);
	if (!existsSync(folder)) return [];
	return readdirSync(folder)
		.filter((file) => file.endsWith('.json'))
		.map((file) => {
			try {
				return setupSchema.parse(JSON.parse(readFileSync(join(folder, file), 'utf8'))).name;
			} catch {
				return undefined;
			}
		})
		.filter((name): name is string => name !== undefined);
}
