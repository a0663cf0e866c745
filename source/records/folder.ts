import {dirname, join} from 'node:path';
import {readSettings, settingsFile} from '../settings.js';

/** The records folder: the one asked for, else the settings', else `records` beside the settings file. */
export function recordsFolder(env: NodeJS.ProcessEnv, asked?: string): string {
	return asked ?? readSettings(env).recordsFolder ?? join(dirname(settingsFile(env)), 'records');
}
