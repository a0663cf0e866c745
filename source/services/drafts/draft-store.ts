// Named imports (not the z namespace) let the bundler leave out the parts of zod not used.
import {enum as oneOf, number, object, record, string} from 'zod';
import {draftStore} from './draft-kind.js';
import {lazySchema} from '../../shared/lazy-schema.js';

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

const draftSchema = lazySchema(() =>
	object({
		rulesFile: string(),
		rulesSha256: string(),
		setup: string(),
		entries: record(string(), string()),
		confirmations: record(string(), object({answer: oneOf(['yes', 'no', 'not_applicable']), note: string().optional()}).strict()),
		step: number().int().min(0),
		savedAt: string(),
	})
	.strict(),
);

const benchDrafts = draftStore<Draft, void>({fileName: () => 'current.json', schema: draftSchema});

/** Where the draft lives: one per settings folder. */
export function draftPath(settingsFolder: string): string {
	return benchDrafts.path(settingsFolder);
}

/** Saves the draft atomically, so that a crash loses at most the field being edited. */
export function saveDraft(settingsFolder: string, draft: Draft): void {
	benchDrafts.save(settingsFolder, undefined, draft);
}

/** The saved draft, or undefined when there is none or it cannot be read. */
export function loadDraft(settingsFolder: string): Draft | undefined {
	return benchDrafts.load(settingsFolder);
}

/** Removes the draft once its check is finished. */
export function removeDraft(settingsFolder: string): void {
	benchDrafts.remove(settingsFolder);
}
