import {existsSync, mkdirSync, mkdtempSync, rmSync, writeFileSync} from 'node:fs';
import {tmpdir} from 'node:os';
import {join, resolve} from 'node:path';
import {afterAll, beforeAll, describe, expect, it, vi} from 'vitest';
import {operatorKey, ownFingerprint, readTrusted} from '../../source/records/key-files.js';
import {fingerprint, rawPublicKey} from '../../source/records/key-material.js';
import {caseFolder, runIn} from '../helpers/run-cli.js';

// The race of two first signatures is made on demand: existsSync says "no key yet" once more
// after the other process has written it, as it does when two processes check at once.
vi.mock('node:fs', async (importOriginal) => {
	const fs = await importOriginal<typeof import('node:fs')>();
	return {...fs, existsSync: vi.fn(fs.existsSync)};
});

const example = resolve('docs/examples/bench3-808nm-clear.yaml');
let root: string;
beforeAll(() => {
	root = mkdtempSync(join(tmpdir(), 'prelase-key-faults-'));
});
afterAll(() => rmSync(root, {recursive: true, force: true}));

describe('the signing key made by two processes at once', () => {
	it('the one that finds the key made a moment before uses it (no EEXIST crash), and both sign with one key', () => {
		const home = caseFolder(root);
		const first = operatorKey(home, true, 'Ada Quill');
		expect(first.ok && first.value.created).toBe(true);
		vi.mocked(existsSync).mockImplementationOnce(() => false);
		const second = operatorKey(home, true, 'Ada Quill');
		expect(second.ok).toBe(true);
		if (!first.ok || !second.ok) return;
		expect(second.value.created).toBe(false);
		expect(fingerprint(rawPublicKey(second.value.privateKey))).toBe(fingerprint(rawPublicKey(first.value.privateKey)));
	});
});

describe('a damaged key folder is a message, never an internal error', () => {
	it('an empty operator.key (its writing cut off) does not stop the audit, which needs no private key; signing says what to do', async () => {
		const home = caseFolder(root);
		const records = join(home, 'records');
		expect((await runIn(home, ['check', '--answers', example, '--sign', 'Ada Quill', '--records', records])).code).toBe(0);
		writeFileSync(join(home, 'keys', 'operator.key'), '', {mode: 0o600});
		const audit = await runIn(home, ['audit', records]);
		expect(audit.stderr).not.toContain('internal error');
		// The operator's own signature is still known by the public key file beside the key.
		expect(audit.code).toBe(0);
		const sign = await runIn(home, ['check', '--answers', example, '--sign', 'Ada Quill', '--records', records]);
		expect(sign.code).toBe(2);
		expect(sign.stderr).toContain(`the key file ${join(home, 'keys', 'operator.key')} is empty`);
	});

	it('an empty operator.key and no operator.pub: the own key is unknown, not a crash', () => {
		const home = caseFolder(root);
		mkdirSync(join(home, 'keys'), {recursive: true});
		writeFileSync(join(home, 'keys', 'operator.key'), '', {mode: 0o600});
		expect(ownFingerprint(home)).toBeUndefined();
	});

	// A trust list cut short by a full disk, written by another program, or replaced by something else.
	it.each([
		['truncated', '[\n  {\n    "name": "Bo Re', 'is damaged (it ends part-way, as a write cut short leaves it)'],
		['empty', '', 'is damaged (it ends part-way, as a write cut short leaves it)'],
		['not JSON', 'trusted keys: none\n', 'is damaged (it is not JSON)'],
		['wrong shape', '{"name": "Bo Reyes"}\n', 'is not valid'],
	])('a %s trusted.json is a clear error naming the file (exit 2) in audit and keys list', async (_what, text, says) => {
		const home = caseFolder(root);
		const records = join(home, 'records');
		expect((await runIn(home, ['check', '--answers', example, '--sign', 'Ada Quill', '--records', records])).code).toBe(0);
		const path = join(home, 'keys', 'trusted.json');
		writeFileSync(path, text);
		expect(() => readTrusted(home)).toThrow(path);
		for (const argv of [['audit', records], ['keys', 'list']]) {
			const run = await runIn(home, argv);
			expect(run.code).toBe(2);
			expect(run.stderr).toContain(`the trusted keys file ${path} ${says}`);
			expect(run.stderr).not.toContain('internal error');
		}
	});
});
