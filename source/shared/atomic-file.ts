import {randomBytes} from 'node:crypto';
import {closeSync, fsyncSync, openSync, renameSync, rmSync, writeSync} from 'node:fs';
import {basename, dirname, join} from 'node:path';

/**
 * Writes text to a new temporary file in the folder of `path` (so a rename or link to `path`
 * stays on one file system), synced to disk; returns the temporary file's path. The file is
 * removed again if writing fails.
 */
export function writeSyncedTemporary(path: string, text: string, mode: number): string {
	const temporary = join(dirname(path), `.${basename(path)}.${process.pid}-${randomBytes(6).toString('hex')}.tmp`);
	const handle = openSync(temporary, 'wx', mode);
	try {
		writeSync(handle, text);
		fsyncSync(handle);
	} catch (error) {
		closeSync(handle);
		rmSync(temporary, {force: true});
		throw error;
	}
	closeSync(handle);
	return temporary;
}

/** Syncs a folder, so a file just renamed or linked into it is there after a power cut. */
export function fsyncFolder(folder: string): void {
	try {
		const handle = openSync(folder, 'r');
		try {
			fsyncSync(handle);
		} finally {
			closeSync(handle);
		}
	} catch {
		// Some file systems cannot fsync a folder; the file itself is already synced.
	}
}

/** Replaces a file with text so that a crash leaves the old text or the new, never part of either. */
export function replaceFileAtomically(path: string, text: string, mode: number): void {
	const temporary = writeSyncedTemporary(path, text, mode);
	try {
		renameSync(temporary, path);
	} catch (error) {
		rmSync(temporary, {force: true});
		throw error;
	}
	fsyncFolder(dirname(path));
}
