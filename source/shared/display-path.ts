import {isAbsolute, relative} from 'node:path';

/** A path as a person wants to read it: relative to the working folder when inside it. */
export function displayPath(path: string, cwd = process.cwd()): string {
	if (!isAbsolute(path)) return path;
	const inside = relative(cwd, path);
	return inside && !inside.startsWith('..') && !isAbsolute(inside) ? inside : path;
}
