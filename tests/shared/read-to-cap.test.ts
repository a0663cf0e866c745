import {closeSync, mkdtempSync, openSync, rmSync, writeFileSync} from 'node:fs';
import {tmpdir} from 'node:os';
import {join} from 'node:path';
import {afterAll, describe, expect, it} from 'vitest';
import {readToCap} from '../../source/shared/read-to-cap.js';

const folder = mkdtempSync(join(tmpdir(), 'prelase-read-to-cap-'));
afterAll(() => rmSync(folder, {recursive: true, force: true}));

/** Reads a file of `size` bytes (each byte its position mod 251) with a cap and a size hint. */
function readWith(size: number, cap: number, hint: number | undefined) {
	const path = join(folder, `f-${size}-${cap}-${hint}`);
	const content = Buffer.from(Array.from({length: size}, (_, index) => index % 251));
	writeFileSync(path, content);
	const descriptor = openSync(path, 'r');
	try {
		return {content, read: hint === undefined ? readToCap(descriptor, cap) : readToCap(descriptor, cap, hint)};
	} finally {
		closeSync(descriptor);
	}
}

describe('readToCap: the whole file or how far past the cap, whatever the size hint', () => {
	it.each([
		// size, cap, hint (the size fstat gave; smaller when the file grew since, larger when it shrank)
		[0, 100, 0],
		[0, 100, undefined],
		[9_137, 8 * 1024 * 1024, 9_137],
		[9_137, 8 * 1024 * 1024, 4_000],
		[9_137, 8 * 1024 * 1024, 20_000],
		[9_137, 8 * 1024 * 1024, undefined],
		[200_000, 8 * 1024 * 1024, 1_000],
		[100, 100, 100],
	])('%i bytes, cap %i, hint %s: all of it', (size, cap, hint) => {
		const {content, read} = readWith(size, cap, hint);
		expect(read.ok).toBe(true);
		if (read.ok) expect(read.bytes.equals(content)).toBe(true);
	});

	it.each([
		[101, 100, 101],
		[101, 100, 0],
		[5_000, 100, 5_000],
		[300_000, 70_000, 10],
	])('%i bytes, cap %i, hint %i: refused, having read no more than the cap and one byte', (size, cap, hint) => {
		const {read} = readWith(size, cap, hint);
		expect(read.ok).toBe(false);
		if (!read.ok) {
			expect(read.length).toBeGreaterThan(cap);
			expect(read.length).toBeLessThanOrEqual(cap + 1);
		}
	});
});
