import {closeSync, constants, fstatSync, lstatSync, openSync, type Stats} from 'node:fs';
import {readToCap} from './read-to-cap.js';

/**
 * The largest record file prelase reads: 8 MiB. A record is about 9 kB; records made before
 * the lean body were up to about 80 kB. But a record may embed one rule or plan text, and such
 * a file may be up to 1 MiB, which JSON escaping can make up to six times longer: 8 MiB is above
 * anything prelase itself can write, so no genuine record is ever refused, while a device or a
 * file that grows is still read no further than that.
 */
export const maxRecordFileBytes = 8 * 1024 * 1024;

/** Why a path is not read as a record file: a few words for a person, naming what it is. */
export type NotRecordFile = {ok: false; notRecordFile: string} | {ok: false; unreadable: string};

/** The bytes of a regular file, or why it is not one, is too large, or cannot be read. */
export type RecordFileRead = {ok: true; bytes: Buffer} | NotRecordFile;

/** What a file that is not a regular file is, in words. */
export function fileKind(stat: Stats): string {
	if (stat.isDirectory()) return 'a folder';
	if (stat.isSymbolicLink()) return 'a symbolic link';
	if (stat.isFIFO()) return 'a named pipe (FIFO)';
	if (stat.isSocket()) return 'a socket';
	if (stat.isCharacterDevice()) return 'a character device';
	if (stat.isBlockDevice()) return 'a block device';
	return 'not a regular file';
}

/**
 * Reads a record file: only a regular file (a symbolic link is not followed: a record is
 * written as a regular file, and a link can point anywhere, be repointed between two audits, or
 * show one record twice), of at most `maxBytes`. A named pipe is opened without waiting for a
 * writer, and never more than `maxBytes + 1` bytes are read, so a file that grows while it is
 * read, or a device, cannot make the reader wait or grow without end.
 */
export function readRecordFile(path: string, maxBytes = maxRecordFileBytes): RecordFileRead {
	let descriptor: number | undefined;
	try {
		const link = lstatSync(path);
		if (link.isSymbolicLink()) return {ok: false, notRecordFile: 'a symbolic link (a record is a regular file; the audit does not follow links)'};
		// A folder the audit lists is one it could not list: opening it says why (EACCES).
		if (link.isDirectory()) closeSync(openSync(path, 'r'));
		if (!link.isFile()) return {ok: false, notRecordFile: fileKind(link)};
		// O_NOFOLLOW and O_NONBLOCK: the path may have been swapped for a link or a pipe since the lstat.
		descriptor = openSync(path, constants.O_RDONLY | constants.O_NOFOLLOW | constants.O_NONBLOCK);
		const stat = fstatSync(descriptor);
		if (!stat.isFile()) return {ok: false, notRecordFile: fileKind(stat)};
		if (stat.size > maxBytes) return {ok: false, notRecordFile: tooLarge(stat.size, maxBytes)};
		const read = readToCap(descriptor, maxBytes, stat.size);
		return read.ok ? {ok: true, bytes: read.bytes} : {ok: false, notRecordFile: tooLarge(read.length, maxBytes)};
	} catch (error) {
		const code = (error as NodeJS.ErrnoException).code;
		if (code === 'ELOOP') return {ok: false, notRecordFile: 'a symbolic link (a record is a regular file; the audit does not follow links)'};
		return {ok: false, unreadable: code ?? (error as Error).message};
	} finally {
		if (descriptor !== undefined) closeSync(descriptor);
	}
}

function tooLarge(size: number, max: number): string {
	return `${size} bytes, above the ${max} bytes a record file may have`;
}
