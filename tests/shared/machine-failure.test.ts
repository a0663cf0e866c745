import {describe, expect, it} from 'vitest';
import {FileWriteError} from '../../source/shared/file-write-error.js';
import {machineFailure} from '../../source/shared/machine-failure.js';

/** An error shaped as node:fs gives it (code, syscall, path), errno names from POSIX <errno.h>. */
function fsError(code: string, syscall: string, path: string): NodeJS.ErrnoException {
	return Object.assign(new Error(`${code}: ${syscall} '${path}'`), {code, syscall, path});
}

describe('machineFailure: the machine refusing a file operation is a message, anything else is not', () => {
	it.each([
		[fsError('EFBIG', 'write', '/r/x.json'), 'could not write to /r/x.json: the file size limit was reached (ulimit -f), EFBIG'],
		[fsError('ENOSPC', 'write', '/r/x.json'), 'could not write to /r/x.json: the disk is full, ENOSPC'],
		[fsError('EROFS', 'open', '/r/.x.tmp'), 'could not open /r/.x.tmp: the file system is read-only, EROFS'],
		[fsError('EACCES', 'scandir', '/r/sub'), 'could not list the folder /r/sub: permission denied, EACCES'],
		[fsError('EACCES', 'mkdir', '/r'), 'could not make the folder /r: permission denied, EACCES'],
	])('%s', (error, start) => {
		expect(machineFailure(error)).toMatch(new RegExp(`^${start.replaceAll(/[().]/g, '\\$&')}; check the folder's permissions`));
	});

	it('a FileWriteError names the file it was to write and says the previous file is unchanged', () => {
		expect(machineFailure(new FileWriteError('/r/trusted.json', 'ESHORT', 'only 0 of 120 bytes could be written'))).toBe('could not write /r/trusted.json: only 0 of 120 bytes could be written; nothing was written there and the file there before (if any) is unchanged');
	});

	it.each([[new TypeError('x is undefined')], [fsError('ENOENT', 'open', '/r/x')], ['a string'], [undefined]])('%s is not the machine (a bug stays a bug, exit 70)', (error) => {
		expect(machineFailure(error)).toBeUndefined();
	});
});
