import {spawnSync} from 'node:child_process';
import {createHash} from 'node:crypto';
import {mkdtempSync, readdirSync, readFileSync, rmSync, writeFileSync} from 'node:fs';
import {tmpdir} from 'node:os';
import {join, resolve} from 'node:path';
import {afterEach, describe, expect, it} from 'vitest';

// The launcher of dist/prelase.js compiles the program with V8's code cache (scripts/launcher.cjs).
// The cache may only ever change how fast the program starts, never what it does.
const bundle = resolve('dist/prelase.js');
const clearDemo = resolve('docs/examples/bench3-808nm-clear.yaml');
const folders: string[] = [];

function cacheFolder(): string {
	const folder = mkdtempSync(join(tmpdir(), 'prelase-code-cache-'));
	folders.push(folder);
	return folder;
}

afterEach(() => {
	for (const folder of folders.splice(0)) rmSync(folder, {recursive: true, force: true});
});

function run(cache: string, args: string[] = ['check', '--answers', clearDemo, '--json']) {
	const env: NodeJS.ProcessEnv = {...process.env, PRELASE_CODE_CACHE: cache};
	for (const name of ['CI', 'CONTINUOUS_INTEGRATION', 'FORCE_COLOR', 'NO_COLOR']) delete env[name];
	return spawnSync(process.execPath, [bundle, ...args], {env, encoding: 'utf8'});
}

function cacheFiles(folder: string): string[] {
	return readdirSync(folder).filter((name) => name.endsWith('.bin'));
}

/** The cache's first line (what wrote it, the SHA-256 of the rest) and whether that SHA-256 holds. */
function cacheHead(file: string): {commands: string[]; sha256: string; holds: boolean} {
	const bytes = readFileSync(file);
	const line = bytes.indexOf(10);
	const head = JSON.parse(bytes.subarray(0, line).toString('latin1')) as {commands: string[]; sha256: string};
	return {...head, holds: createHash('sha256').update(bytes.subarray(line + 1)).digest('hex') === head.sha256};
}

describe('the launcher and its code cache', () => {
	const plain = run('off');

	it('without a cache, the check runs and writes nothing', () => {
		expect(plain.status).toBe(0);
		expect(plain.stderr).toBe('');
		expect(JSON.parse(plain.stdout).outcome).toBe('clear_to_energize');
	});

	it('writes the cache on the first run of a command, and a run with it gives the same output', () => {
		const folder = cacheFolder();
		const first = run(folder);
		expect([first.status, first.stdout, first.stderr]).toEqual([0, plain.stdout, '']);
		const [file] = cacheFiles(folder);
		expect(file).toMatch(/^code-[0-9a-f]{16}-v\d+\.\d+\.\d+-\w+\.bin$/);
		expect(cacheHead(join(folder, file!))).toMatchObject({commands: ['check'], holds: true});
		const second = run(folder);
		expect([second.status, second.stdout, second.stderr]).toEqual([0, plain.stdout, '']);
		// Another command adds what it compiled; the same command does not write again.
		expect(run(folder, ['calc', '--help']).status).toBe(0);
		expect(cacheHead(join(folder, file!)).commands).toEqual(['check', 'calc']);
		expect(run(folder).status).toBe(0);
		expect(cacheHead(join(folder, file!)).commands).toEqual(['check', 'calc']);
	});

	it.each([
		['a damaged byte in the data', (bytes: Buffer) => Buffer.concat([bytes.subarray(0, bytes.length - 100), Buffer.from([bytes[bytes.length - 100]! ^ 0xff]), bytes.subarray(bytes.length - 99)])],
		['a file cut short', (bytes: Buffer) => bytes.subarray(0, Math.floor(bytes.length / 2))],
		['a head that is not JSON', (bytes: Buffer) => Buffer.concat([Buffer.from('not json\n'), bytes])],
		['an empty file', () => Buffer.alloc(0)],
		// The SHA-256 holds, but the data is not V8's: V8 refuses it and compiles the text.
		['data that is not a code cache, with a SHA-256 that holds', () => {
			const data = Buffer.alloc(4096, 7);
			return Buffer.concat([Buffer.from(`${JSON.stringify({sha256: createHash('sha256').update(data).digest('hex'), commands: ['check']})}\n`), data]);
		}],
	])('%s: the same output, and a sound cache written again', (_label, damage) => {
		const folder = cacheFolder();
		expect(run(folder).status).toBe(0);
		const file = join(folder, cacheFiles(folder)[0]!);
		writeFileSync(file, damage(readFileSync(file)));
		const damaged = run(folder);
		expect([damaged.status, damaged.stdout, damaged.stderr]).toEqual([0, plain.stdout, '']);
		expect(cacheHead(file)).toMatchObject({commands: ['check'], holds: true});
	});

	it('a cache folder that cannot be made is no error: the program runs without a cache', () => {
		const parent = cacheFolder();
		const blocked = join(parent, 'a-file');
		writeFileSync(blocked, 'not a folder');
		const result = run(join(blocked, 'cache'));
		expect([result.status, result.stdout, result.stderr]).toEqual([0, plain.stdout, '']);
		expect(readdirSync(parent)).toEqual(['a-file']);
	});

	it('PRELASE_CODE_CACHE=off writes nothing, and the default folder follows XDG_CACHE_HOME', () => {
		const xdg = cacheFolder();
		const env: NodeJS.ProcessEnv = {...process.env, XDG_CACHE_HOME: xdg, PRELASE_CODE_CACHE: 'off'};
		expect(spawnSync(process.execPath, [bundle, '--version'], {env, encoding: 'utf8'}).status).toBe(0);
		expect(readdirSync(xdg)).toEqual([]);
		delete env['PRELASE_CODE_CACHE'];
		expect(spawnSync(process.execPath, [bundle, '--version'], {env, encoding: 'utf8'}).status).toBe(0);
		expect(cacheFiles(join(xdg, 'prelase'))).toHaveLength(1);
	});
});
