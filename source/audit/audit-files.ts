import {lstatSync, readdirSync, realpathSync, statSync, type Dirent, type Stats} from 'node:fs';
import {join, resolve} from 'node:path';

/** Record files found under the paths given, and the paths that do not exist. */
export type RecordFiles = {files: string[]; missing: string[]};

function skipped(name: string): boolean {
	return name.startsWith('.') || name.endsWith('.tmp');
}

/** In a folder, only `.json` files are taken as records; other files (a README, notes) are left alone. */
function recordName(name: string): boolean {
	return name.endsWith('.json');
}

/**
 * Expands record files and folders into the files to audit: folders recursively, in name
 * order, taking `.json` files and leaving out dotfiles, dot-folders and `*.tmp` (a write in
 * progress). A file named on its own is always audited. Each file is listed once, however it was reached.
 * Inside a folder, symbolic links are not followed: a link named as a record, or to a folder, is
 * listed so that the audit reports it as not a record file (a folder named on its own may be a link).
 */
export function listRecordFiles(paths: readonly string[]): RecordFiles {
	const files: string[] = [];
	const missing: string[] = [];
	const seenFiles = new Set<string>();
	const seenFolders = new Set<string>();
	const add = (path: string) => {
		const key = resolve(path);
		if (seenFiles.has(key)) return;
		seenFiles.add(key);
		files.push(path);
	};
	const walk = (folder: string) => {
		const names = listFolder(folder, seenFolders);
		// A folder that cannot be listed is audited as a file: it is then reported as unreadable, never passed over.
		if (names === 'unreadable') return add(folder);
		for (const entry of names) {
			const name = entry.name;
			const path = join(folder, name);
			// The folder's listing says what each name is (no stat of each file); where it cannot tell, lstat does.
			const stat = entry.isFile() ? entry : entry.isDirectory() ? entry : statOrDenied(path, lstatSync);
			if (stat === 'denied') add(path);
			else if (stat?.isDirectory()) walk(path);
			// A link inside a folder is not followed (it could leave the folder, loop, or show a record twice):
			// one named as a record, or one to a folder (whose records would otherwise be passed over), is
			// audited so that it is reported as not a record file. So are pipes, devices and sockets named as records.
			else if (stat?.isSymbolicLink()) {
				const target = statOrDenied(path);
				if (recordName(name) || target === 'denied' || target?.isDirectory()) add(path);
			} else if (stat && recordName(name)) add(path);
		}
	};
	for (const path of paths) {
		const stat = statOrDenied(path);
		if (stat === 'denied') add(path);
		else if (!stat) missing.push(path);
		else if (stat.isDirectory()) walk(path);
		else add(path);
	}
	return {files, missing};
}

/** The names to look at in a folder (none when it was seen already by another path), or 'unreadable' when it cannot be listed. */
function listFolder(folder: string, seenFolders: Set<string>): Dirent[] | 'unreadable' {
	try {
		const real = realpathSync(folder);
		if (seenFolders.has(real)) return [];
		seenFolders.add(real);
		return readdirSync(folder, {withFileTypes: true})
			.filter((entry) => !skipped(entry.name))
			.sort((a, b) => (a.name < b.name ? -1 : a.name > b.name ? 1 : 0));
	} catch {
		return 'unreadable';
	}
}

/** A path's stat (undefined when nothing is there), or 'denied' when even its stat is refused (a folder without search permission). */
function statOrDenied(path: string, stat: typeof statSync = statSync): Stats | undefined | 'denied' {
	try {
		return stat(path, {throwIfNoEntry: false});
	} catch {
		return 'denied';
	}
}
