import Conf from 'conf';
import envPaths from 'env-paths';
import {existsSync, readFileSync} from 'node:fs';
import {dirname, join} from 'node:path';
// Named imports (not the z namespace) let the bundler leave out the parts of zod not used.
import {object, string} from 'zod';
import {problem, type Problem} from '../shared/problems.js';
import {ProblemError} from '../shared/problem-error.js';
import {failure, success, type Result} from '../shared/result.js';

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
	const loaded = loadSettings(env);
	if (!loaded.ok) throw new ProblemError(loaded.errors[0]!);
	return loaded.value;
}

/** The settings, or why the settings file cannot be used (for callers that report a Result). */
export function loadSettings(env: NodeJS.ProcessEnv = process.env): Result<Settings, Problem> {
	const path = settingsFile(env);
	if (!existsSync(path)) return success({});
	let data: unknown;
	try {
		data = JSON.parse(readFileSync(path, 'utf8'));
	} catch (error) {
		return failure([problem('settings-unreadable', {path, detail: (error as Error).message})]);
	}
	const parsed = settingsSchema.safeParse(data);
	if (!parsed.success) return failure([problem('settings-invalid', {path, detail: parsed.error.issues[0]?.message ?? 'unknown problem'})]);
	return success(parsed.data as Settings);
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
			throw new ProblemError(problem('settings-store-unreadable', {detail: (error as Error).message}));
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
