import {sha256Hex} from '../../shared/sha256.js';
// Named imports (not the z namespace) let the bundler leave out the parts of zod not used.
import {object, string} from 'zod';
import {fileDraftStore, type FoundDraft} from './draft-kind.js';
import {lazySchema} from '../../shared/lazy-schema.js';

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

const planDraftSchema = lazySchema(() =>
	object({file: string(), baseSha256: string().regex(/^[0-9a-f]{64}$/), text: string(), savedAt: string()}).strict(),
);

const planDrafts = fileDraftStore({prefix: 'plan', schema: planDraftSchema, madeFrom: (draft) => draft.baseSha256});

/** Where the draft of a plan file lives: one per plan, beside the bench-check draft. */
export function planDraftPath(settingsFolder: string, file: string): string {
	return planDrafts.path(settingsFolder, file);
}

/** Saves the unsaved edits of a plan, atomically. */
export function savePlanDraft(settingsFolder: string, file: string, baseText: string, text: string, now = new Date()): void {
	planDrafts.save(settingsFolder, file, {file, baseSha256: sha256Hex(baseText), text, savedAt: now.toISOString()});
}

/**
 * The draft of a plan file and whether it still applies: `current` when it was made from the
 * text the file has now; `stale` when the file changed since (the draft is kept, not applied).
 */
export function loadPlanDraft(settingsFolder: string, file: string, fileText: string): FoundDraft<PlanDraft> | undefined {
	return planDrafts.find(settingsFolder, file, fileText);
}

/** Removes the draft of a plan once its edits are saved or discarded. */
export function removePlanDraft(settingsFolder: string, file: string): void {
	planDrafts.remove(settingsFolder, file);
}
