import {readFileSync} from 'node:fs';

declare const PRELASE_VERSION: string | undefined;

/** The program's version: set at build time; read from package.json when running from source. */
export const version: string =
	typeof PRELASE_VERSION === 'string'
		? PRELASE_VERSION
		: (JSON.parse(readFileSync(new URL('../../package.json', import.meta.url), 'utf8')) as {version: string}).version;

/** Whether this is the bundled program (dist/prelase.js), whose own file can start worker threads; not when running from source (the tests). */
export const isBundled: boolean = typeof PRELASE_VERSION === 'string';
