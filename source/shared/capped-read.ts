import {closeSync, constants, fstatSync, openSync} from 'node:fs';
import {readToCap} from './read-to-cap.js';
import {fileKind} from './record-file-read.js';

/** The largest settings, key or trust-list file prelase reads: 1 MiB (they are well under 100 kB; a trust list entry is ~190 bytes). */
export const maxSmallFileBytes = 1024 * 1024;

/** A file that is not a regular file of at most the size allowed; its message says what it is. */
export class FileShapeError extends Error {}

/**
 * Reads a small file prelase keeps (settings, a key, the trust list) as UTF-8 text: a link is
 * followed, but what it leads to must be a regular file of at most `maxBytes`, opened without
 * waiting for a writer and read no further than the cap plus one byte, so a link to a device or
 * a pipe in its place cannot stall prelase or exhaust its memory. Throws a FileShapeError for a
 * file of the wrong kind or size, and the system's error when it cannot be read.
 */
export function readCappedText(path: string, maxBytes = maxSmallFileBytes): string {
	const descriptor = openSync(path, constants.O_RDONLY | constants.O_NONBLOCK);
	try {
		const stat = fstatSync(descriptor);
		if (!stat.isFile()) throw new FileShapeError(`it is ${fileKind(stat)}, not a regular file`);
		if (stat.size > maxBytes) throw new FileShapeError(`it is ${stat.size} bytes, above the ${maxBytes} bytes such a file may have`);
		const read = readToCap(descriptor, maxBytes, stat.size);
		if (!read.ok) throw new FileShapeError(`it is more than ${maxBytes} bytes, the most such a file may have`);
		return read.bytes.toString('utf8');
	} finally {
		closeSync(descriptor);
	}
}
