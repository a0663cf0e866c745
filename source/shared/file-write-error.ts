import {problem} from './problems.js';
import {describeProblem} from './problems.js';

/** The error codes of a file system or machine that refused a write (or a read of our own files), not of a bug. */
const machineCodes = new Set(['EFBIG', 'ENOSPC', 'EDQUOT', 'EACCES', 'EPERM', 'EROFS', 'EIO', 'ENOTDIR', 'EISDIR', 'ELOOP', 'ENAMETOOLONG', 'EMFILE', 'ENFILE', 'EBUSY', 'ETXTBSY', 'ESHORT']);

/** Plain words for the codes above, so the message says what the machine did. */
const reasons: Record<string, string> = {
	EFBIG: 'the file size limit was reached (ulimit -f)',
	ENOSPC: 'the disk is full',
	EDQUOT: 'the disk quota is used up',
	EACCES: 'permission denied',
	EPERM: 'operation not permitted',
	EROFS: 'the file system is read-only',
	EIO: 'an input/output error',
	ENOTDIR: 'a part of the path is not a folder',
	EISDIR: 'it is a folder',
};

/**
 * A file prelase could not write completely: the machine refused (a full disk, a file size
 * limit, a read-only folder, no permission) or the bytes on disk are fewer than were written.
 * Thrown by the atomic writers after they removed their temporary file, so the file that was
 * there before (if any) is unchanged. The command line reports it with exit status 74.
 */
export class FileWriteError extends Error {
	constructor(
		readonly path: string,
		readonly code: string,
		readonly reason: string,
	) {
		super(describeProblem(problem('file-write-failed', {path, reason})));
	}
}

/** Why a write failed, in plain words: the error's code explained, or its own message. */
export function failureReason(error: unknown): string {
	const code = (error as NodeJS.ErrnoException | null)?.code;
	if (code !== undefined && reasons[code]) return `${reasons[code]}, ${code}`;
	return error instanceof Error ? error.message : String(error);
}

/** Whether an error is the machine refusing a file operation (with the code it gave), not a bug. */
export function isMachineRefusal(error: unknown): error is NodeJS.ErrnoException & {code: string} {
	const code = (error as NodeJS.ErrnoException | null)?.code;
	return typeof code === 'string' && machineCodes.has(code);
}

/** The error a failed write of `path` becomes: a FileWriteError naming `path` (not a temporary), or the error itself when it is not the machine's. */
export function asWriteError(path: string, error: unknown): unknown {
	if (error instanceof FileWriteError) return error;
	return isMachineRefusal(error) ? new FileWriteError(path, error.code, failureReason(error)) : error;
}
