import {sha256Hex} from '../../shared/sha256.js';
// Named imports (not the z namespace) let the bundler leave out the parts of zod not used.
import {array, enum as oneOf, object, string} from 'zod';
import {fileDraftStore, type FoundDraft} from './draft-kind.js';
import {lazySchema} from '../../shared/lazy-schema.js';

/** One step as entered on screen: the result (once marked), the stop time and note as typed. */
export type TestDraftStep = {result?: 'pass' | 'fail' | 'not_applicable'; stoppedIn: string; note: string};

/** The tester, the witness and the date as typed. */
export type TestDraftPeople = {name: string; role: string; witnessName: string; witnessRole: string; witnessKey: string; date: string};

/** The entries of a functional test in progress, kept so that a crash or Ctrl-C loses none of them. */
export type TestDraft = {
	/** The plan file, as an absolute path. */
	file: string;
	/** SHA-256 of the plan's text as tested: the entries apply only to that text. */
	planSha256: string;
	steps: TestDraftStep[];
	people: TestDraftPeople;
	savedAt: string;
};

const testDraftSchema = lazySchema(() =>
	object({
	file: string(),
	planSha256: string().regex(/^[0-9a-f]{64}$/),
	steps: array(object({result: oneOf(['pass', 'fail', 'not_applicable']).optional(), stoppedIn: string(), note: string()}).strict()),
	people: object({name: string(), role: string(), witnessName: string(), witnessRole: string(), witnessKey: string(), date: string()}).strict(),
	savedAt: string().datetime(),
}).strict(),
);

const testDrafts = fileDraftStore({prefix: 'test', schema: testDraftSchema, madeFrom: (draft) => draft.planSha256});

/** Where the test draft of a plan file lives: one per plan, beside the planner's draft. */
export function testDraftPath(settingsFolder: string, file: string): string {
	return testDrafts.path(settingsFolder, file);
}

/** Saves the entries of a test of a plan's text, atomically and owner-only. */
export function saveTestDraft(settingsFolder: string, file: string, planText: string, entries: {steps: TestDraftStep[]; people: TestDraftPeople}, now = new Date()): void {
	testDrafts.save(settingsFolder, file, {file, planSha256: sha256Hex(planText), steps: entries.steps, people: entries.people, savedAt: now.toISOString()});
}

/**
 * The test draft of a plan file and whether it still applies: `current` when it was entered
 * against the text the file has now; `stale` when the plan changed since. A draft that does not
 * read as one is ignored.
 */
export function loadTestDraft(settingsFolder: string, file: string, planText: string): FoundDraft<TestDraft> | undefined {
	return testDrafts.find(settingsFolder, file, planText);
}

/**
 * Moves a draft that no longer applies out of the way of a new test, to a name that says when
 * it was saved; returns where it now is.
 */
export function setTestDraftAside(settingsFolder: string, file: string, draft: TestDraft): string {
	return testDrafts.setAside(settingsFolder, file, draft);
}

/** Removes the test draft of a plan once its test is signed or discarded. */
export function removeTestDraft(settingsFolder: string, file: string): void {
	testDrafts.remove(settingsFolder, file);
}
