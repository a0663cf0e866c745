import {statSync} from 'node:fs';
import {replaceFileAtomically} from '../../shared/atomic-file.js';
import {describeProblem} from '../../shared/problems.js';
import {planEditingText, savedEditing, type PlanEditing} from './plan-edit.js';

/**
 * Writes a plan file atomically: a temporary file in the same folder, synced, then renamed
 * over the plan, so a crash leaves the old plan or the new one, never half of either. The
 * file keeps its permissions.
 */
export function writePlanFile(file: string, text: string): void {
	let mode = 0o644;
	try {
		mode = statSync(file).mode & 0o777;
	} catch {
		// A plan saved for the first time gets the usual mode.
	}
	replaceFileAtomically(file, text, mode);
}

/** Saves a plan being edited and reopens it from the text written, so nothing is left unsaved; the message says why not. */
export function savePlanEditing(editing: PlanEditing): {ok: true; editing: PlanEditing} | {ok: false; message: string} {
	const text = planEditingText(editing);
	try {
		writePlanFile(editing.file, text);
	} catch (error) {
		return {ok: false, message: (error as Error).message};
	}
	const saved = savedEditing(editing, text);
	return saved.ok ? {ok: true, editing: saved.value} : {ok: false, message: `written, but it does not load again: ${saved.errors.map(describeProblem).join('; ')}`};
}
