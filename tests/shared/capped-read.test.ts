import {execFileSync} from 'node:child_process';
import {chmodSync, mkdirSync, mkdtempSync, rmSync, symlinkSync, writeFileSync} from 'node:fs';
import {tmpdir} from 'node:os';
import {join} from 'node:path';
import {afterAll, describe, expect, it} from 'vitest';
import {keyFolder, namedKeyFromFile, operatorKey, ownFingerprint, readTrusted} from '../../source/records/key-files.js';
import {loadSettings} from '../../source/services/settings.js';
import {ProblemError} from '../../source/shared/problem-error.js';

// The settings, the operator's key and the trust list are read only as regular files of at
// most 1 MiB (1,048,576 bytes): a link to /dev/zero, a pipe or a 2 MiB file in their place is a
// message naming the file, read without waiting and without growing.

const top = mkdtempSync(join(tmpdir(), 'prelase-capped-'));
afterAll(() => rmSync(top, {recursive: true, force: true}));

type Kind = 'a link to /dev/zero' | 'a named pipe' | 'a 2 MiB file';
const kinds: Kind[] = ['a link to /dev/zero', 'a named pipe', 'a 2 MiB file'];
let made = 0;

/** A settings folder whose file at `relative` is of the kind given; returns the folder. */
function home(relative: string, kind: Kind, padding: (size: number) => string): string {
	made += 1;
	const folder = join(top, `home-${made}`);
	mkdirSync(keyFolder(folder), {recursive: true});
	const path = join(folder, relative);
	if (kind === 'a link to /dev/zero') symlinkSync('/dev/zero', path);
	else if (kind === 'a named pipe') execFileSync('mkfifo', ['-m', '600', path]);
	else writeFileSync(path, padding(2 * 1024 * 1024), {mode: 0o600});
	if (kind === 'a 2 MiB file') chmodSync(path, 0o600);
	return folder;
}

/** Valid content padded with spaces to `size`, so that only its size is wrong. */
const padded = (content: string) => (size: number) => `${content}${' '.repeat(size - content.length)}`;

describe.each(kinds)('%s in place of a file prelase keeps', (kind) => {
	it('the trust list is a damaged-file message naming it', {timeout: 20_000}, () => {
		const folder = home('keys/trusted.json', kind, padded('[]'));
		let thrown: unknown;
		try {
			readTrusted(folder);
		} catch (error) {
			thrown = error;
		}
		expect(thrown).toBeInstanceOf(ProblemError);
		expect((thrown as ProblemError).problem).toMatchObject({code: 'key-trusted-damaged', data: {path: join(folder, 'keys', 'trusted.json'), detail: expect.stringMatching(/character device|named pipe|2097152 bytes/)}});
	});

	it('the settings file is an unreadable-settings message naming it', {timeout: 20_000}, () => {
		const folder = home('config.json', kind, padded('{}'));
		expect(loadSettings({PRELASE_HOME: folder})).toMatchObject({ok: false, errors: [{code: 'settings-unreadable', data: {path: join(folder, 'config.json'), detail: expect.stringMatching(/character device|named pipe|2097152 bytes/)}}]});
	});

	it('the operator key is refused with a message naming it, and the audit\'s own-key look-up gives none', {timeout: 20_000}, () => {
		const folder = home('keys/operator.key', kind, padded(''));
		const path = join(keyFolder(folder), 'operator.key');
		expect(operatorKey(folder, false)).toMatchObject({ok: false, errors: [{data: {path}}]});
		expect(namedKeyFromFile(path)).toMatchObject({ok: false, errors: [{data: {path}}]});
		expect(ownFingerprint(folder)).toBeUndefined();
	});
});
