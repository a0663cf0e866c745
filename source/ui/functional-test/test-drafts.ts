import {loadTestDraft, removeTestDraft, saveTestDraft, setTestDraftAside} from '../../services/drafts/test-draft-store.js';
import {restoreDraft} from '../draft-restore.js';
import {refusedWrite} from '../refused-write.js';
import {resumeTestEntry, type TestEntry} from './test-entry.js';

/** Where the planner keeps the entries of a test in progress, so that a crash or Ctrl-C loses none. */
export type TestDrafts = {
	/** A new test as it starts: given the entries of an earlier one of the same plan text, with a notice saying so, or why not. */
	start(entry: TestEntry): TestEntry;
	/** Saves the entries; returns why the machine refused it (disk full, read-only folder), so the screen says so and goes on. */
	save(entry: TestEntry): string | undefined;
	clear(file: string): void;
};

/** The test drafts of a settings folder. */
export function testDraftsIn(settingsFolder: string): TestDrafts {
	return {
		start(entry) {
			const {file, text} = entry.tested;
			const {value, notice} = restoreDraft(loadTestDraft(settingsFolder, file, text), entry, (found, when) => {
				if (found.state === 'current' && found.draft.steps.length === entry.steps.length) {
					return {restored: resumeTestEntry(entry, found.draft), text: `Test entries from ${when} restored; carry on from the first step without a result`};
				}
				let kept: string;
				try {
					kept = `they are kept in ${setTestDraftAside(settingsFolder, file, found.draft)}`;
				} catch (error) {
					kept = `they could not be set aside (${(error as Error).message}) and are replaced by this test's entries`;
				}
				return {refused: `Test entries from ${when} were not restored: the plan changed since, and a test is of the plan as wired; ${kept}`};
			});
			return notice ? {...value, notice} : value;
		},
		save: (entry) => refusedWrite(() => saveTestDraft(settingsFolder, entry.tested.file, entry.tested.text, {steps: entry.steps, people: entry.people})),
		clear: (file) => removeTestDraft(settingsFolder, file),
	};
}

/** Keeps the draft in step with a key's change to the test: saved after each change to the entries, removed once signed or left; returns why a save was refused. */
export function followTestEntry(drafts: TestDrafts, before: TestEntry, after: TestEntry | undefined): string | undefined {
	if (!after || after.recorded) {
		if (!before.recorded) drafts.clear(before.tested.file);
	} else if (after.steps !== before.steps || after.people !== before.people) return drafts.save(after);
	return undefined;
}
