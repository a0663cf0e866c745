import {linkSync, mkdirSync, unlinkSync} from 'node:fs';
import {join} from 'node:path';
import {fsyncFolder, writeSyncedTemporary} from '../shared/atomic-file.js';
import {asWriteError} from '../shared/file-write-error.js';
import type {AnyRecord} from './record-schema.js';
import {bodySha256} from './build-body.js';
import {recordJson} from './record-json.js';

/** A short, file-name-safe form of a setup name. */
function slug(text: string | null): string {
	const cleaned = (text ?? 'setup')
		.normalize('NFKD')
		.replaceAll(/[^A-Za-z0-9]+/g, '-')
		.replaceAll(/^-+|-+$/g, '')
		.toLowerCase()
		.slice(0, 40)
		.replace(/-+$/, '');
	return cleaned || 'setup';
}

/** The file name of a record: date, time, setup and a short hash of its body. */
export function recordFileName(record: AnyRecord): string {
	const stamp = record.body.createdAt.slice(0, 19).replaceAll(':', '').replace('T', '-');
	const what = record.body.kind === 'interlock-test' ? `interlock-test-${slug(record.body.plan.name)}` : slug(record.body.setup.name);
	return `${stamp}-${what}-${bodySha256(record.body).slice(0, 8)}.json`;
}

/**
 * Writes a record so that it is either wholly there or not at all, and never replaces
 * another: a temporary file in the same folder is written and synced, then linked to the
 * final name (which fails if the name is taken), then removed; the folder is synced.
 * Returns the path written.
 */
export function writeRecord(folder: string, record: AnyRecord): string {
	try {
		mkdirSync(folder, {recursive: true});
	} catch (error) {
		throw asWriteError(folder, error);
	}
	const data = recordJson(record);
	const temporary = writeSyncedTemporary(join(folder, 'record'), data, 0o644);
	try {
		const base = recordFileName(record).replace(/\.json$/, '');
		for (let attempt = 0; attempt < 100; attempt += 1) {
			const path = join(folder, attempt === 0 ? `${base}.json` : `${base}-${attempt + 1}.json`);
			try {
				linkSync(temporary, path);
				fsyncFolder(folder);
				return path;
			} catch (error) {
				if ((error as NodeJS.ErrnoException).code !== 'EEXIST') throw asWriteError(path, error);
			}
		}
		throw new Error(`no free record name in ${folder} after 100 tries`);
	} finally {
		unlinkSync(temporary);
	}
}
