import {mkdirSync, readdirSync, readFileSync} from 'node:fs';
import {basename, join} from 'node:path';
import {literal, object, string} from 'zod';
import {replaceFileAtomically} from '../shared/atomic-file.js';
import {sha256Hex} from '../shared/sha256.js';
import {readRecordFile} from '../shared/record-file-read.js';
import {chainLinkSchema, type ChainLink} from './record-schema.js';
import {lazySchema} from '../shared/lazy-schema.js';

/** The dot-folder beside the records that remembers each key's latest record (the audit's folder walk leaves dot-folders out). */
export const chainFolderName = '.prelase-chain';

const headSchema = lazySchema(() => object({format: literal('prelase-chain-head'), version: literal(1), key: string(), head: chainLinkSchema.unwrap()}).strict());

/** The file that remembers the latest record of one key in a records folder (one file per key, so keys never race each other). */
export function headFile(folder: string, key: string): string {
	return join(folder, chainFolderName, `${key.replace(/^sha256:/, '')}.json`);
}

/** The latest record of a key as its head file remembers it; undefined when there is no such file or it cannot be read. */
export function readHead(folder: string, key: string): NonNullable<ChainLink> | undefined {
	try {
		// Read as a record file is: a regular file of bounded size, never a link, pipe or device.
		const read = readRecordFile(headFile(folder, key), 64 * 1024);
		if (!read.ok) return undefined;
		const parsed = headSchema.safeParse(JSON.parse(read.bytes.toString('utf8')));
		return parsed.success && parsed.data.key === key ? parsed.data.head : undefined;
	} catch {
		return undefined;
	}
}

/** What the scan keeps of a record of the key: its link, what it names, and when it was made. */
type Scanned = {link: NonNullable<ChainLink>; previous: string | null; time: number};

/**
 * The latest record of a key found by reading the folder: of the records whose first signature
 * is by the key, the ones no other of them names as previous (the heads), and of those the
 * latest by the instant it was made (then by file name). Records made before the chain count
 * too, so the first chained record names the last one before it.
 */
export function scanHead(folder: string, key: string): ChainLink {
	let names: string[];
	try {
		names = readdirSync(folder).filter((name) => name.endsWith('.json') && !name.startsWith('.')).sort();
	} catch {
		return null;
	}
	const found: Scanned[] = [];
	for (const file of names) {
		// Only regular files of a record's size: a link, pipe or device named *.json is not a record of the key.
		const read = readRecordFile(join(folder, file));
		if (!read.ok) continue;
		const bytes = read.bytes;
		const text = bytes.toString('utf8');
		// Most files of a folder shared by several keys are not this key's: skip them unparsed.
		if (!text.includes(key)) continue;
		const data = parse(text);
		if (data?.signatures?.[0]?.fingerprint !== key) continue;
		const time = Date.parse(String(data.body?.createdAt));
		found.push({link: {file, sha256: sha256Hex(bytes)}, previous: data.body?.previous?.sha256 ?? null, time: Number.isNaN(time) ? Number.NEGATIVE_INFINITY : time});
	}
	const named = new Set(found.map((entry) => entry.previous));
	const heads = found.filter((entry) => !named.has(entry.link.sha256));
	const latest = (heads.length > 0 ? heads : found).sort((a, b) => a.time - b.time || a.link.file.localeCompare(b.link.file)).at(-1);
	return latest?.link ?? null;
}

type RecordShape = {signatures?: Array<{fingerprint?: unknown}>; body?: {createdAt?: unknown; previous?: {sha256?: string} | null}};

function parse(text: string): RecordShape | undefined {
	try {
		return JSON.parse(text) as RecordShape;
	} catch {
		return undefined;
	}
}

/**
 * The link a new record of `key` in `folder` names: the latest record its head file remembers,
 * even when that file has since been removed or changed (so that the removal or change shows in
 * the chain); a scan of the folder when there is no readable head file; null when the key has
 * written nothing there.
 */
export function previousRecord(folder: string, key: string): ChainLink {
	return readHead(folder, key) ?? scanHead(folder, key);
}

/**
 * Remembers the record at `path` (just written in `folder`) as the latest record of `key`: the SHA-256 of its
 * exact bytes, in the key's head file, replaced atomically (a reader sees the old head or the
 * new, never part of either). A head file that cannot be written is left: the next record falls
 * back to a scan.
 */
export function rememberRecord(folder: string, key: string, path: string): void {
	try {
		const link = {file: basename(path), sha256: sha256Hex(readFileSync(path))};
		mkdirSync(join(folder, chainFolderName), {recursive: true});
		replaceFileAtomically(headFile(folder, key), `${JSON.stringify({format: 'prelase-chain-head', version: 1, key, head: link}, null, 2)}\n`, 0o644);
	} catch {
		// The record is written; without its head file the next record finds the link by a scan.
	}
}
