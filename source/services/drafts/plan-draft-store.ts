import {sha256Hex} from '../../shared/sha256.js';
import {rmSync} from 'node:fs';
import {join} from 'node:path';
// Named imports (not the z namespace) let the bundler leave out the parts of zod not used.
import {object, string} from 'zod';
import {readDraftFile, writeDraftFile} from './draft-store.js';

/** Unsaved planner edits of one plan file, kept so that a crash or Ctrl-C loses none of them. */
export type PlanDraft = {
	/** The plan file, as an absolute path. */
	file: string;
	/** SHA-256 of the file's text the edits started from: a draft applies only to that text. */
	baseSha256: string;
	/** The plan as it would be saved. */
	text: string;
	savedAt: string;
};

const planDraftSchema = object({file: string(), baseSha256: string().regex(/^[0-9a-f]{64}$/), text: string(), savedAt: string()}).strict();


/** Where the draft of a plan file lives: one per plan, beside the bench-check draft. */
export function planDraftPath(settingsFolder: string, file: string): string {
	return join(settingsFolder, 'drafts', `plan-${sha256Hex(file).slice(0, 16)}.json`);
}

/** Saves the unsaved edits of a plan, atomically. */
export function savePlanDraft(settingsFolder: string, file: string, baseText: string, text: string, now = new Date()): void {
	const draft: PlanDraft = {file, baseSha256: sha256Hex(baseText), text, savedAt: now.toISOString()};
	writeDraftFile(planDraftPath(settingsFolder, file), JSON.stringify(draft));
}

/**
 * The draft of a plan file and whether it still applies: `current` when it was made from the
 * text the file has now; `stale` when the file changed since (the draft is kept, not applied).
 */
export function loadPlanDraft(settingsFolder: string, file: string, fileText: string): {state: 'current' | 'stale'; draft: PlanDraft; path: string} | undefined {
	const path = planDraftPath(settingsFolder, file);
	const draft = readDraftFile(path, planDraftSchema);
	if (draft?.file !== file) return undefined;
	return {state: draft.baseSha256 === sha256Hex(fileText) ? 'current' : 'stale', draft, path};
}

/** Removes the draft of a plan once its edits are saved or discarded. */
export function removePlanDraft(settingsFolder: string, file: string): void {
	rmSync(planDraftPath(settingsFolder, file), {force: true});
}
