import {dirname, join} from 'node:path';
import {readSettings, settingsFile} from './settings.js';
import {ownFingerprint, readTrusted} from '../records/key-files.js';

/** The records folder: the one asked for, else the settings', else `records` beside the settings file. */
export function recordsFolder(env: NodeJS.ProcessEnv, asked?: string): string {
	return asked ?? readSettings(env).recordsFolder ?? join(dirname(settingsFile(env)), 'records');
}

/** Fingerprints of the keys whose records count as this operator's: their own and the ones they trust. */
export function trustedFingerprints(env: NodeJS.ProcessEnv): Set<string> {
	const folder = dirname(settingsFile(env));
	const own = ownFingerprint(folder);
	return new Set([...(own === undefined ? [] : [own]), ...readTrusted(folder).map((key) => key.fingerprint)]);
}
