import envPaths from 'env-paths';
import {existsSync, mkdirSync} from 'node:fs';
import {readCappedText} from '../shared/capped-read.js';
import {dirname, join} from 'node:path';
// Named imports (not the z namespace) let the bundler leave out the parts of zod not used.
import {object, string} from 'zod';
import {problem, type Problem} from '../shared/problems.js';
import {ProblemError} from '../shared/problem-error.js';
import {failure, success, type Result} from '../shared/result.js';
import {replaceFileAtomically} from '../shared/atomic-file.js';
import {asWriteError} from '../shared/file-write-error.js';
import {lazySchema} from '../shared/lazy-schema.js';

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

const settingsSchema = lazySchema(() =>
	object({operator: string().optional(), role: string().optional(), recordsFolder: string().optional(), rulesFile: string().optional(), planFile: string().optional()})
	.strip(),
);

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
		data = JSON.parse(readCappedText(path));
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
 * Opens the settings (an owner-only JSON file). PRELASE_HOME overrides the folder, for tests
 * and for keeping a bench's settings on removable media; otherwise the platform's config
 * folder. A write reads the file, applies the changes and replaces the file atomically with
 * every byte checked (the conf store this replaced wrote its temporary file with one write
 * call and did not check the count, so a full disk left a truncated settings file).
 */
export function openSettings(env: NodeJS.ProcessEnv = process.env): SettingsStore {
	const path = settingsFile(env);
	return {
		folder: dirname(path),
		path,
		read: () => readSettings(env),
		write(changes) {
			const loaded = loadSettings(env);
			if (!loaded.ok) throw new ProblemError(loaded.errors[0]!);
			const next: Record<string, string> = {...loaded.value};
			for (const [key, value] of Object.entries(changes)) if (value !== undefined) next[key] = value;
			try {
				mkdirSync(dirname(path), {recursive: true, mode: 0o700});
			} catch (error) {
				throw asWriteError(dirname(path), error);
			}
			replaceFileAtomically(path, JSON.stringify(next, undefined, '\t'), 0o600);
		},
	};
}
