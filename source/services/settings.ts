import Conf from 'conf';
import envPaths from 'env-paths';
import {existsSync, readFileSync} from 'node:fs';
import {dirname, join} from 'node:path';
// Named imports (not the z namespace) let the bundler leave out the parts of zod not used.
import {object, string} from 'zod';
import {UsageError} from '../cli/usage-error.js';

/** What prelase remembers between runs. */
export type Settings = {
	/** Operator's name, prefilled when signing. */
	operator?: string;
	/** Operator's role, prefilled when signing. */
	role?: string;
	/** Folder records are written to. */
	recordsFolder?: string;
	/** Rule file in force (site policy); the shipped policy when absent. */
	rulesFile?: string;
	/** The interlock plan last opened in the planner, offered the next time. */
	planFile?: string;
};

const settingsSchema = object({operator: string().optional(), role: string().optional(), recordsFolder: string().optional(), rulesFile: string().optional(), planFile: string().optional()})
	.strip();

/** Where the settings file is: the same place conf uses (PRELASE_HOME, else the platform's config folder). */
export function settingsFile(env: NodeJS.ProcessEnv = process.env): string {
	const home = env['PRELASE_HOME'];
	return join(home ?? envPaths('prelase', {suffix: ''}).config, 'config.json');
}

/**
 * Reads the settings without opening the store: the non-interactive check needs only the rule
 * file in force, and start-up time is a feature. Writing always goes through openSettings.
 */
export function readSettings(env: NodeJS.ProcessEnv = process.env): Settings {
	const path = settingsFile(env);
	if (!existsSync(path)) return {};
	let data: unknown;
	try {
		data = JSON.parse(readFileSync(path, 'utf8'));
	} catch (error) {
		throw new UsageError(`the settings file ${path} cannot be read (${(error as Error).message}); fix or remove it`);
	}
	const parsed = settingsSchema.safeParse(data);
	if (!parsed.success) throw new UsageError(`the settings file ${path} is not valid: ${parsed.error.issues[0]?.message ?? 'unknown problem'}; fix or remove it`);
	return parsed.data as Settings;
}

/** The settings store and the folder it lives in (keys live beside it). */
export type SettingsStore = {folder: string; path: string; read(): Settings; write(changes: Settings): void};

/**
 * Opens the settings (conf, owner-only file). PRELASE_HOME overrides the folder, for tests and
 * for keeping a bench's settings on removable media; otherwise the platform's config folder.
 */
export function openSettings(env: NodeJS.ProcessEnv = process.env): SettingsStore {
	const home = env['PRELASE_HOME'];
	const path = settingsFile(env);
	// The conf store is built only when something is written: reading is a plain file read.
	let store: Conf<Settings> | undefined;
	const open = (): Conf<Settings> => {
		if (store) return store;
		try {
			store = new Conf<Settings>({projectName: 'prelase', projectSuffix: '', configFileMode: 0o600, clearInvalidConfig: false, ...(home ? {cwd: home} : {})});
		} catch (error) {
			throw new UsageError(`the settings file cannot be read (${(error as Error).message}); fix or remove it`);
		}
		return store;
	};
	return {
		folder: dirname(path),
		path,
		read: () => readSettings(env),
		write(changes) {
			const target = open();
			for (const [key, value] of Object.entries(changes)) if (value !== undefined) target.set(key, value);
		},
	};
}
