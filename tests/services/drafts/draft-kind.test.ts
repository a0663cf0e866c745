import {existsSync, mkdtempSync, readFileSync, statSync, writeFileSync} from 'node:fs';
import {tmpdir} from 'node:os';
import {join} from 'node:path';
import {describe, expect, it} from 'vitest';
import {object, string} from 'zod';
import {draftStore, fileDraftStore} from '../../../source/services/drafts/draft-kind.js';
import {sha256Hex} from '../../../source/shared/sha256.js';

const home = () => mkdtempSync(join(tmpdir(), 'prelase-draft-kind-'));
const noteSchema = object({note: string(), savedAt: string()}).strict();
const notes = draftStore({fileName: (key: string) => `note-${key}.json`, schema: noteSchema});

describe('a draft store made for one kind of draft', () => {
	it('saves owner-only under drafts/ by the kind\'s file name and reads back what it saved', () => {
		const folder = home();
		notes.save(folder, 'a', {note: 'first', savedAt: '2026-12-01T10:00:00.000Z'});
		expect(notes.path(folder, 'a')).toBe(join(folder, 'drafts', 'note-a.json'));
		if (process.platform !== 'win32') expect(statSync(notes.path(folder, 'a')).mode & 0o777).toBe(0o600);
		expect(notes.load(folder, 'a')).toEqual({note: 'first', savedAt: '2026-12-01T10:00:00.000Z'});
		expect(notes.load(folder, 'b')).toBeUndefined();
	});

	it.each([
		{name: 'not JSON', content: '{"note": '},
		{name: 'of another shape', content: JSON.stringify({note: 3, savedAt: 'x'})},
		{name: 'with an unknown key', content: JSON.stringify({note: 'n', savedAt: 'x', extra: true})},
	])('ignores a file that is $name', ({content}) => {
		const folder = home();
		notes.save(folder, 'a', {note: 'n', savedAt: 'x'});
		writeFileSync(notes.path(folder, 'a'), content);
		expect(notes.load(folder, 'a')).toBeUndefined();
	});

	it('removes a draft, and removing one that is not there is no error', () => {
		const folder = home();
		notes.save(folder, 'a', {note: 'n', savedAt: 'x'});
		notes.remove(folder, 'a');
		expect(existsSync(notes.path(folder, 'a'))).toBe(false);
		expect(() => notes.remove(folder, 'a')).not.toThrow();
	});
});

const editSchema = object({file: string(), textSha256: string(), edit: string(), savedAt: string()}).strict();
const edits = fileDraftStore({prefix: 'edit', schema: editSchema, madeFrom: (draft) => draft.textSha256});

describe('a draft store of a file\'s edits, bound to the text they were made from', () => {
	it('names the draft after a hash of the file\'s path: one per file', () => {
		// The first 16 hex digits of the path's SHA-256, as the plan and test drafts are named.
		expect(edits.path('/h', '/lab/plan.yaml')).toBe(join('/h', 'drafts', `edit-${sha256Hex('/lab/plan.yaml').slice(0, 16)}.json`));
		expect(edits.path('/h', '/lab/plan.yaml')).not.toBe(edits.path('/h', '/lab/other.yaml'));
	});

	it.each([
		{name: 'the text it was made from: current', text: 'v1', state: 'current'},
		{name: 'a text changed since: stale', text: 'v2', state: 'stale'},
	])('is found against $name', ({text, state}) => {
		const folder = home();
		const draft = {file: '/lab/plan.yaml', textSha256: sha256Hex('v1'), edit: 'e', savedAt: '2026-12-01T10:00:00.000Z'};
		edits.save(folder, draft.file, draft);
		expect(edits.find(folder, draft.file, text)).toEqual({state, draft, path: edits.path(folder, draft.file)});
	});

	it('ignores the draft of another file under its name', () => {
		const folder = home();
		edits.save(folder, '/lab/plan.yaml', {file: '/elsewhere.yaml', textSha256: sha256Hex('v1'), edit: 'e', savedAt: 'x'});
		expect(edits.find(folder, '/lab/plan.yaml', 'v1')).toBeUndefined();
	});

	it('sets a draft aside under a name that says when it was saved (digits of savedAt only)', () => {
		const folder = home();
		const draft = {file: '/lab/plan.yaml', textSha256: sha256Hex('v1'), edit: 'e', savedAt: '2026-12-01T10:00:00.000Z'};
		edits.save(folder, draft.file, draft);
		const aside = edits.setAside(folder, draft.file, draft);
		// '2026-12-01T10:00:00.000Z' without '-', ':' and '.' is '20261201T100000000Z'.
		expect(aside).toBe(edits.path(folder, draft.file).replace(/\.json$/, '.20261201T100000000Z.json'));
		expect(JSON.parse(readFileSync(aside, 'utf8'))).toEqual(draft);
		expect(edits.find(folder, draft.file, 'v1')).toBeUndefined();
	});
});
