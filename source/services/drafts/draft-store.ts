import {existsSync, mkdirSync, readFileSync, rmSync} from 'node:fs';
import {dirname, join} from 'node:path';
import {replaceFileAtomically} from '../../shared/atomic-file.js';
// Named imports (not the z namespace) let the bundler leave out the parts of zod not used.
import {enum as oneOf, number, object, record, string, type ZodType} from 'zod';

/** A check in progress: enough to resume it exactly where it was left. */
export type Draft = {
	rulesFile: string;
	rulesSha256: string;
	setup: string;
	entries: Record<string, string>;
	confirmations: Record<string, {answer: 'yes' | 'no' | 'not_applicable'; note?: string}>;
	step: number;
	savedAt: string;
};

const draftSchema = object({
		rulesFile: string(),
		rulesSha256: string(),
		setup: string(),
		entries: record(string(), string()),
		confirmations: record(string(), object({answer: oneOf(['yes', 'no', 'not_applicable']), note: string().optional()}).strict()),
		step: number().int().min(0),
		savedAt: string(),
	})
	.strict();

/** Where the draft lives: one per settings folder. */
export function draftPath(settingsFolder: string): string {
	return join(settingsFolder, 'drafts', 'current.json');
}

/**
 * Saves the draft so that a crash, a closed terminal or kill -9 loses at most the field being
 * edited: write and sync a temporary file, then rename it over the draft.
 */
export function saveDraft(settingsFolder: string, draft: Draft): void {
	writeDraftFile(draftPath(settingsFolder), JSON.stringify(draft));
}

/** Writes a draft file (owner-only) all at once: a synced temporary file renamed over it. */
export function writeDraftFile(path: string, text: string): void {
	mkdirSync(dirname(path), {recursive: true, mode: 0o700});
	replaceFileAtomically(path, text, 0o600);
}

/** A draft file checked against its shape: undefined when missing, not JSON or of another shape (never trusted). */
export function readDraftFile<T>(path: string, schema: ZodType<T>): T | undefined {
	if (!existsSync(path)) return undefined;
	try {
		const parsed = schema.safeParse(JSON.parse(readFileSync(path, 'utf8')));
		return parsed.success ? parsed.data : undefined;
	} catch {
		return undefined;
	}
}

/** The saved draft, or undefined when there is none or it cannot be read. */
export function loadDraft(settingsFolder: string): Draft | undefined {
	return readDraftFile(draftPath(settingsFolder), draftSchema) as Draft | undefined;
}

/** Removes the draft once its check is finished. */
export function removeDraft(settingsFolder: string): void {
	rmSync(draftPath(settingsFolder), {force: true});
}
