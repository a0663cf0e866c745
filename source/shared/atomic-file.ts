import {randomBytes} from 'node:crypto';
import {closeSync, fstatSync, fsyncSync, linkSync, openSync, renameSync, rmSync, unlinkSync, writeSync} from 'node:fs';
import {basename, dirname, join} from 'node:path';
import {asWriteError, FileWriteError} from './file-write-error.js';
import {removeStaleTemporaries} from './stale-temporaries.js';


/** Writes every byte of `data` to an open file, or throws: a write that returns fewer bytes is continued, one that returns none fails. */
function writeAll(handle: number, data: Buffer, path: string): void {
	let done = 0;
	while (done < data.length) {
		const written = writeSync(handle, data, done, data.length - done);
		if (written <= 0) throw new FileWriteError(path, 'ESHORT', `only ${done} of ${data.length} bytes could be written`);
		done += written;
	}
}

/**
 * Writes text to a new temporary file in the folder of `path` (so a rename or link to `path`
 * stays on one file system), synced to disk; returns the temporary file's path. Every byte is
 * written (a short write is continued) and the size on disk is checked after the sync; the
 * name is `.NAME.PID-12HEX.tmp` (stale ones are removed here, see stale-temporaries). When
 * anything fails the temporary file is removed and a FileWriteError naming `path` is thrown.
 */
export function writeSyncedTemporary(path: string, text: string, mode: number): string {
	// Each write first clears what killed writes left in its folder (drafts/, the records folder, keys/...).
	removeStaleTemporaries(dirname(path));
	const temporary = join(dirname(path), `.${basename(path)}.${process.pid}-${randomBytes(6).toString('hex')}.tmp`);
	const data = Buffer.from(text, 'utf8');
	let handle: number;
	try {
		handle = openSync(temporary, 'wx', mode);
	} catch (error) {
		throw asWriteError(path, error);
	}
	try {
		writeAll(handle, data, path);
		fsyncSync(handle);
		const size = fstatSync(handle).size;
		if (size !== data.length) throw new FileWriteError(path, 'ESHORT', `the file holds ${size} of the ${data.length} bytes written`);
	} catch (error) {
		closeSync(handle);
		rmSync(temporary, {force: true});
		throw asWriteError(path, error);
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
		throw asWriteError(path, error);
	}
	fsyncFolder(dirname(path));
}

/**
 * Creates a file with text, wholly or not at all, and never over another: a synced temporary
 * file linked to `path`. Returns false (and writes nothing) when `path` already exists, as
 * when another process created it a moment before.
 */
export function createFileAtomically(path: string, text: string, mode: number): boolean {
	const temporary = writeSyncedTemporary(path, text, mode);
	try {
		linkSync(temporary, path);
		fsyncFolder(dirname(path));
		return true;
	} catch (error) {
		if ((error as NodeJS.ErrnoException).code === 'EEXIST') return false;
		throw asWriteError(path, error);
	} finally {
		unlinkSync(temporary);
	}
}
