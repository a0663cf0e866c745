import {linkSync, mkdirSync, unlinkSync} from 'node:fs';
import {readRecordFile} from '../shared/record-file-read.js';
import {dirname, join} from 'node:path';
import {fsyncFolder, replaceFileAtomically, writeSyncedTemporary} from '../shared/atomic-file.js';
import {sha256Hex} from '../shared/sha256.js';
import {asWriteError} from '../shared/file-write-error.js';

/**
 * Rule texts stored once, by content: `<records folder>/rules/<sha256>.yaml`. A record names
 * its rule text by SHA-256 (covered by its signature) instead of carrying the whole text. The
 * files end in `.yaml`, so the audit, which takes only `.json` files as records, never takes
 * one for a record, and the store names records `*.json` in the folder itself.
 */
export const ruleTextsFolder = 'rules';

/** Where the rule text of this SHA-256 lives in a records folder. */
export function ruleTextPath(folder: string, sha256: string): string {
	return join(folder, ruleTextsFolder, `${sha256}.yaml`);
}

/** What reading a stored rule text found: the text, no file, or a file whose text has another hash. */
export type StoredRuleText = {status: 'ok'; path: string; text: string} | {status: 'missing'} | {status: 'mismatch'; path: string; actual: string} | {status: 'unreadable'; path: string; reason: string};

/** Reads a stored rule text and checks it against the hash in its name. */
export function readRuleText(path: string, sha256: string): StoredRuleText {
	// Read as a record file is: a regular file of at most 1 MiB, never a link, pipe or device in the records folder.
	const read = readRecordFile(path);
	if (!read.ok && 'unreadable' in read) return read.unreadable === 'ENOENT' || read.unreadable === 'ENOTDIR' ? {status: 'missing'} : {status: 'unreadable', path, reason: read.unreadable};
	if (!read.ok) return {status: 'unreadable', path, reason: `not a rule text file: ${read.notRecordFile}`};
	const text = read.bytes.toString('utf8');
	const actual = sha256Hex(text);
	return actual === sha256 ? {status: 'ok', path, text} : {status: 'mismatch', path, actual};
}

/**
 * Stores a rule text in the records folder under its SHA-256, before any record names it, so
 * that a record never names a text that is not there. A text already stored with the right
 * hash is left alone; a file under that name whose text does not match (damaged or altered)
 * is replaced by the text itself, atomically. Returns the SHA-256.
 */
export function storeRuleText(folder: string, text: string): string {
	const sha256 = sha256Hex(text);
	const path = ruleTextPath(folder, sha256);
	const found = readRuleText(path, sha256);
	if (found.status === 'ok') return sha256;
	try {
		mkdirSync(dirname(path), {recursive: true});
	} catch (error) {
		throw asWriteError(dirname(path), error);
	}
	if (found.status !== 'missing') {
		replaceFileAtomically(path, text, 0o644);
		return sha256;
	}
	const temporary = writeSyncedTemporary(path, text, 0o644);
	try {
		linkSync(temporary, path);
		fsyncFolder(dirname(path));
	} catch (error) {
		// Another writer stored the same text first: it is the same text, by its name.
		if ((error as NodeJS.ErrnoException).code !== 'EEXIST') throw asWriteError(path, error);
	} finally {
		unlinkSync(temporary);
	}
	return sha256;
}

/**
 * The folders where a record's rule text may be stored: the record's own folder and each
 * folder above it (a records folder may sort its records into sub-folders, by month say).
 */
export function ruleTextFolders(recordPath: string): string[] {
	const folders: string[] = [];
	let folder = dirname(recordPath);
	for (;;) {
		folders.push(folder);
		const parent = dirname(folder);
		if (parent === folder) return folders;
		folder = parent;
	}
}

/** Finds the stored rule text a record names, nearest folder first; `missing` when none of them holds it. */
export function findRuleText(recordPath: string, sha256: string): StoredRuleText {
	for (const folder of ruleTextFolders(recordPath)) {
		const found = readRuleText(ruleTextPath(folder, sha256), sha256);
		if (found.status !== 'missing') return found;
	}
	return {status: 'missing'};
}
