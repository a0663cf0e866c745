import {readSync} from 'node:fs';

/**
 * Reads an open file to its end in 64 kB chunks, stopping as soon as more than `maxBytes` have
 * come: a file larger than its cap (or one that grows while it is read) is never read whole.
 * Gives the bytes, or how many were read when the cap was passed.
 */
export function readToCap(descriptor: number, maxBytes: number): {ok: true; bytes: Buffer} | {ok: false; length: number} {
	const chunks: Buffer[] = [];
	let length = 0;
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
