import {mkdtempSync, readFileSync, rmSync, writeFileSync} from 'node:fs';
import {tmpdir} from 'node:os';
import {join, resolve} from 'node:path';
import {afterAll, beforeAll, describe, expect, it} from 'vitest';
import {generateKeyPair} from '../../source/records/key-material.js';
import type {BenchRecord} from '../../source/records/record-schema.js';
import {runIn} from '../helpers/run-cli.js';

const clearDemo = resolve('docs/examples/bench3-808nm-clear.yaml');
let folder: string;
let home: string;
let secondKey: string;

beforeAll(async () => {
	folder = mkdtempSync(join(tmpdir(), 'prelase-cosign-'));
	home = join(folder, 'home');
	secondKey = join(folder, 'second.key');
	writeFileSync(secondKey, `Name: Tomas Reyes\n${String(generateKeyPair().privateKey.export({format: 'pem', type: 'pkcs8'}))}`, {mode: 0o600});
	expect((await runIn(home, ['keys', '--name', 'Dana Whitlow'])).code).toBe(0);
});
afterAll(() => rmSync(folder, {recursive: true, force: true}));

describe('check --sign with a second signer', () => {
	it('signs twice: the operator, then the second signer as witness, with their own key', async () => {
		const {code, stdout} = await runIn(home, ['check', '--answers', clearDemo, '--sign', 'Dana Whitlow', '--cosign', 'Tomas Reyes', '--cosign-role', 'deputy laser safety officer', '--cosign-key', secondKey, '--records', join(folder, 'records')]);
		expect(code).toBe(0);
		const record = JSON.parse(readFileSync(/Record written: (.+)/.exec(stdout)![1]!, 'utf8')) as BenchRecord;
		expect(record.signatures.map((signature) => [signature.signer.name, signature.purpose])).toEqual([
			['Dana Whitlow', 'operator'],
			['Tomas Reyes', 'witness'],
		]);
		expect(record.signatures[0]!.fingerprint).not.toBe(record.signatures[1]!.fingerprint);
	});

	it('refuses the operator\'s own key as the second signer\'s: exit 2, nothing written', async () => {
		const records = join(folder, 'refused');
		const {code, stderr} = await runIn(home, ['check', '--answers', clearDemo, '--sign', 'Dana Whitlow', '--cosign', 'Dana Whitlow', '--cosign-key', join(home, 'keys', 'operator.key'), '--records', records]);
		expect(code).toBe(2);
		expect(stderr).toContain('--cosign-key is your own key; the second signer signs with a key of their own');
		expect(() => readFileSync(records)).toThrow();
	});
});
