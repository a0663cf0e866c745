import {spawn, spawnSync} from 'node:child_process';
import {linkSync, mkdtempSync, readdirSync, rmSync} from 'node:fs';
import {tmpdir} from 'node:os';
import {join, resolve} from 'node:path';
import {afterAll, beforeAll, describe, expect, it} from 'vitest';

// The commands install no signal handler, so the default action of SIGTERM ends them at once
// (POSIX: a process ended by a signal reports it; a shell shows 128 + 15 = 143). This guards
// against a handler (a progress bar, a library) that would wait for synchronous work to end.
const bundle = resolve('dist/prelase.js');
let home: string;
let records: string;

beforeAll(() => {
	home = mkdtempSync(join(tmpdir(), 'prelase-signals-'));
	records = join(home, 'records');
	const signed = spawnSync(process.execPath, [bundle, 'check', '--answers', 'docs/examples/bench3-808nm-clear.yaml', '--sign', 'Ada Quill', '--records', records], {env: {PATH: process.env['PATH'], PRELASE_HOME: home}, encoding: 'utf8'});
	expect(signed.status, signed.stderr).toBe(0);
	const [record] = readdirSync(records).filter((file) => file.endsWith('.json'));
	// 1,500 names for one record: several seconds of synchronous audit work (about 5 ms a record, measured).
	for (let copy = 0; copy < 1500; copy += 1) linkSync(join(records, record!), join(records, `copy-${copy}.json`));
});
afterAll(() => rmSync(home, {recursive: true, force: true}));

describe('signals', () => {
	it('audit of 1,500 records ends within 1.5 s of a SIGTERM sent 0.5 s after it started', {timeout: 30_000}, async () => {
		const child = spawn(process.execPath, [bundle, 'audit', records], {env: {PATH: process.env['PATH'], PRELASE_HOME: home}, stdio: 'ignore'});
		const ended = new Promise<{signal: NodeJS.Signals | null; at: number}>((done) => child.once('exit', (_code, signal) => done({signal, at: Date.now()})));
		await new Promise((done) => setTimeout(done, 500));
		const sent = Date.now();
		child.kill('SIGTERM');
		const {signal, at} = await ended;
		expect(signal).toBe('SIGTERM');
		expect(at - sent).toBeLessThan(1500);
	});
});
