import {FileWriteError, failureReason, isMachineRefusal} from './file-write-error.js';
import {describeProblem, problem} from './problems.js';

/**
 * The message for a failure of the machine rather than of prelase or its input: a write cut
 * short (disk full, file size limit), a read-only or denied folder. Such a failure exits 74
 * (EX_IOERR of sysexits.h, beside 70 for our own bugs); undefined for anything else.
 */
export function machineFailure(error: unknown): string | undefined {
	if (error instanceof FileWriteError) return error.message;
	if (!isMachineRefusal(error)) return undefined;
	const action = error.syscall === undefined ? 'use' : (actions[error.syscall] ?? error.syscall);
	return describeProblem(problem('file-machine-refused', {action, path: error.path ?? 'a file', reason: failureReason(error)}));
}

const actions: Record<string, string> = {open: 'open', read: 'read', write: 'write to', mkdir: 'make the folder', scandir: 'list the folder', stat: 'look at', lstat: 'look at', rename: 'rename', link: 'create', unlink: 'remove', fsync: 'sync', chmod: 'set the permissions of'};
