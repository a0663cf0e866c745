import {existsSync, mkdirSync, readFileSync, renameSync, rmSync} from 'node:fs';
import {dirname, join} from 'node:path';
import {replaceFileAtomically} from '../../shared/atomic-file.js';
import {asWriteError} from '../../shared/file-write-error.js';
import {sha256Hex} from '../../shared/sha256.js';
import type {ZodType} from 'zod';

/** One kind of draft: the name of its file in the drafts folder for a key, and its shape. */
export type DraftKind<T, K> = {fileName(key: K): string; schema: ZodType<T>};

/** Where the drafts of one kind are kept, in a settings folder, by key. */
export type DraftStore<T, K> = {
	path(settingsFolder: string, key: K): string;
	/**
	 * Saves a draft so that a crash, a closed terminal or kill -9 loses at most the field being
	 * edited: an owner-only temporary file, synced, then renamed over the draft.
	 */
	save(settingsFolder: string, key: K, draft: T): void;
	/** The draft checked against its shape: undefined when missing, not JSON or of another shape (never trusted). */
	load(settingsFolder: string, key: K): T | undefined;
	/** Removes the draft once it has served; no error when there is none. */
	remove(settingsFolder: string, key: K): void;
};

/** The draft store of one kind. */
export function draftStore<T, K>(kind: DraftKind<T, K>): DraftStore<T, K> {
	const path = (settingsFolder: string, key: K) => join(settingsFolder, 'drafts', kind.fileName(key));
	return {
		path,
		save(settingsFolder, key, draft) {
			const file = path(settingsFolder, key);
			try {
				mkdirSync(dirname(file), {recursive: true, mode: 0o700});
			} catch (error) {
				throw asWriteError(dirname(file), error);
			}
			replaceFileAtomically(file, JSON.stringify(draft), 0o600);
		},
		load(settingsFolder, key) {
			const file = path(settingsFolder, key);
			if (!existsSync(file)) return undefined;
			try {
				const parsed = kind.schema.safeParse(JSON.parse(readFileSync(file, 'utf8')));
				return parsed.success ? parsed.data : undefined;
			} catch {
				return undefined;
			}
		},
		remove: (settingsFolder, key) => rmSync(path(settingsFolder, key), {force: true}),
	};
}

/** A draft of edits to a file, found with whether it still applies: `current` when made from the text the file has now, `stale` when the file changed since. */
export type FoundDraft<T> = {state: 'current' | 'stale'; draft: T; path: string};

/** The drafts of edits to files (a plan's edits, a test's entries), one per file, each bound to the text it was made from. */
export type FileDraftStore<T> = DraftStore<T, string> & {
	/** The draft of a file and whether it applies to the file's text; a draft naming another file is ignored. */
	find(settingsFolder: string, file: string, text: string): FoundDraft<T> | undefined;
	/** Moves a draft out of the way of a new one, to a name that says when it was saved; returns where it now is. */
	setAside(settingsFolder: string, file: string, draft: T): string;
};

/**
 * The draft store of edits to files: a draft is named `PREFIX-` and the first 16 hex digits of
 * the SHA-256 of the file's path; `madeFrom` gives the SHA-256 of the text the draft was made from.
 */
export function fileDraftStore<T extends {file: string; savedAt: string}>(kind: {prefix: string; schema: ZodType<T>; madeFrom(draft: T): string}): FileDraftStore<T> {
	const store = draftStore<T, string>({fileName: (file) => `${kind.prefix}-${sha256Hex(file).slice(0, 16)}.json`, schema: kind.schema});
	return {
		...store,
		find(settingsFolder, file, text) {
			const draft = store.load(settingsFolder, file);
			if (draft?.file !== file) return undefined;
			return {state: kind.madeFrom(draft) === sha256Hex(text) ? 'current' : 'stale', draft, path: store.path(settingsFolder, file)};
		},
		setAside(settingsFolder, file, draft) {
			const aside = store.path(settingsFolder, file).replace(/\.json$/, `.${draft.savedAt.replaceAll(/[-:.]/g, '')}.json`);
			renameSync(store.path(settingsFolder, file), aside);
			return aside;
		},
	};
}
