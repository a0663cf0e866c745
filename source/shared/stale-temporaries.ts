import {lstatSync, readdirSync, rmSync} from 'node:fs';
import {join} from 'node:path';

/** Our temporary files: `.NAME.PID-12HEX.tmp`, written beside the file they become (see atomic-file). */
export const temporaryPattern = /^\..+\.\d+-[0-9a-f]{12}\.tmp$/;

/** A temporary this old is left by a process that was killed: our writes take well under a second. */
export const staleTemporaryAge = 10 * 60_000;

/**
 * Removes the temporary files of our own naming older than ten minutes from a folder (left
 * by a process killed between writing and renaming). Only plain files of that exact pattern
 * are touched; anything else, and a folder that cannot be read, is left as it is.
 */
export function removeStaleTemporaries(folder: string, now = Date.now()): void {
	let names: string[];
	try {
		names = readdirSync(folder);
	} catch {
		return;
	}
	for (const name of names) {
		if (!temporaryPattern.test(name)) continue;
		try {
			const stat = lstatSync(join(folder, name));
			if (stat.isFile() && now - stat.mtimeMs > staleTemporaryAge) rmSync(join(folder, name), {force: true});
		} catch {
			// Removed by another process meanwhile, or not ours to remove: leave it.
		}
	}
}
