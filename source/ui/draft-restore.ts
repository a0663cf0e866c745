import type {FoundDraft} from '../services/drafts/draft-kind.js';
import {isoWithOffset} from '../shared/iso-time.js';

/** The line a screen shows about a draft: plain when it was restored, red when it was not. */
export type DraftNotice = {text: string; error?: boolean};

/** What a kind of draft makes of one found: the value restored and what to say, or why it was not. */
export type DraftRestorer<D, T> = (found: FoundDraft<D>, when: string) => {restored: T; text: string} | {refused: string};

/**
 * The one way a draft left by an earlier session (a crash, Ctrl-C) comes back: none found, the
 * fresh value; found, the kind decides, given when it was saved as the operator's clock shows it
 * (local, to the minute). A draft not restored leaves the fresh value and an error notice.
 */
export function restoreDraft<D extends {savedAt: string}, T>(found: FoundDraft<D> | undefined, fresh: T, restore: DraftRestorer<D, NoInfer<T>>): {value: T; notice?: DraftNotice} {
	if (!found) return {value: fresh};
	const when = isoWithOffset(new Date(found.draft.savedAt)).slice(0, 16).replace('T', ' ');
	const outcome = restore(found, when);
	return 'restored' in outcome ? {value: outcome.restored, notice: {text: outcome.text}} : {value: fresh, notice: {text: outcome.refused, error: true}};
}
