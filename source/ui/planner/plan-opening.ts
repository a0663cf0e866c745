import {statSync} from 'node:fs';
import {resolve} from 'node:path';
import {openPlanForEditingSteps, planEditingFromTextSteps, type PlanEditing} from '../../interlock/plan/plan-edit.js';
import type {CompiledRules} from '../../rules/compile/compiled-rules.js';
import {loadPlanDraft} from '../../services/drafts/plan-draft-store.js';
import type {SettingsStore} from '../../services/settings.js';
import {formatProblem} from '../../shared/problems.js';
import {finish, type Steps} from '../../shared/steps.js';
import {restoreDraft, type DraftNotice} from '../draft-restore.js';
import {refusedWrite} from '../refused-write.js';

/** A plan opened for the planner: its editing state (and what became of a draft), or why it did not open. */
export type OpenedPlan = {editing?: PlanEditing; problems?: string[]; notice?: DraftNotice};

/**
 * A plan file larger than this is opened a step at a time after the first frame (see
 * runInSlices), so a signal is honoured while it is read; a smaller one, a few tens of
 * milliseconds of work, is opened at once. 128 kB is about 450 devices.
 */
export const openInStepsAbove = 128 * 1024;

/** True when the file is large enough to open in steps (a file that cannot be read is opened at once, to say why). */
export function opensInSteps(path: string): boolean {
	try {
		return statSync(resolve(path)).size > openInStepsAbove;
	} catch {
		return false;
	}
}

/** Opens a plan at once. */
export function openPlan(path: string, rules: CompiledRules, settings: SettingsStore): OpenedPlan {
	return finish(openPlanSteps(path, rules, settings));
}

/**
 * Opens a plan in steps: reads and checks it, remembers it in the settings, and brings back edits
 * left unsaved by an earlier session (a crash, Ctrl-C) if the file has not changed since.
 */
export function* openPlanSteps(path: string, rules: CompiledRules, settings: SettingsStore): Steps<OpenedPlan> {
	const file = resolve(path);
	const opened = yield* openPlanForEditingSteps(file, rules);
	if (!opened.ok) return {problems: opened.errors.map(formatProblem)};
	// Remembering the plan is a convenience: a refused write is not a reason to refuse opening it.
	refusedWrite(() => settings.write({planFile: file}));
	const editing = opened.value;
	const found = loadPlanDraft(settings.folder, editing.file, editing.original);
	const fromDraft = found?.state === 'current' ? yield* planEditingFromTextSteps(found.draft.text, editing.file, editing.policy) : undefined;
	const {value, notice} = restoreDraft(found, editing, (draft, when) => {
		if (draft.state === 'stale' || !fromDraft) return {refused: `Unsaved edits from ${when} were not restored: the file changed since. They are kept in ${draft.path}`};
		if (!fromDraft.ok) return {refused: `Unsaved edits from ${when} no longer load and were not restored; they are kept in ${draft.path}`};
		return {restored: {...fromDraft.value, original: editing.original, dirty: true}, text: `Unsaved edits from ${when} restored: s saves them, Esc then d discards them`};
	});
	return notice ? {editing: value, notice} : {editing: value};
}
