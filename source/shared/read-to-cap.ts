import {readSync} from 'node:fs';

/**
 * Reads an open file to its end, stopping as soon as more than `maxBytes` have come: a file
 * larger than its cap (or one that grows while it is read) is never read whole. Gives the
 * bytes, or how many were read when the cap was passed.
 *
 * `sizeHint` (the size fstat gave) lets a regular file be read into one buffer of its own size
 * plus one byte: the spare byte shows the end (a read of 0) without a second buffer, and a file
 * that grew since goes on in 64 kB chunks. An audit reads thousands of files this way without
 * allocating and copying chunks for each.
 */
export function readToCap(descriptor: number, maxBytes: number, sizeHint = 0): {ok: true; bytes: Buffer} | {ok: false; length: number} {
	const first = Buffer.allocUnsafe(Math.min(Math.max(sizeHint, 0) + 1, maxBytes + 1, 64 * 1024 * 1024));
	let length = 0;
	while (length < first.length) {
		const read = readSync(descriptor, first, length, first.length - length, null);
		if (read === 0) return {ok: true, bytes: first.subarray(0, length)};
		length += read;
	}
	if (length > maxBytes) return {ok: false, length};
	const chunks: Buffer[] = [first];
	for (;;) {
		const chunk = Buffer.allocUnsafe(Math.min(64 * 1024, maxBytes + 1 - length));
		const read = readSync(descriptor, chunk, 0, chunk.length, null);
		if (read === 0) break;
		chunks.push(chunk.subarray(0, read));
		length += read;
		if (length > maxBytes) return {ok: false, length};
	}
	return {ok: true, bytes: Buffer.concat(chunks, length)};
}
