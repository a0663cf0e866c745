import {readFileSync} from 'node:fs';

declare const PRELASE_VERSION: string | undefined;

/** The program's version: set at build time; read from package.json when running from source. */
export const version: string =
	typeof PRELASE_VERSION === 'string'
		? PRELASE_VERSION
		: (JSON.parse(readFileSync(new URL('../../package.json', import.meta.url), 'utf8')) as {version: string}).version;
