import {existsSync, mkdirSync, mkdtempSync, readFileSync, statSync, writeFileSync} from 'node:fs';
import {tmpdir} from 'node:os';
import {dirname, join} from 'node:path';
import {describe, expect, it} from 'vitest';
import {loadTestDraft, removeTestDraft, saveTestDraft, setTestDraftAside, testDraftPath, type TestDraftPeople, type TestDraftStep} from '../../../source/services/drafts/test-draft-store.js';
import {sha256Hex} from '../../../source/shared/sha256.js';

const plan = '/lab/bench3/plan.yaml';
const planText = 'format: 1\nname: Fenwick Hollow bench 3\n';
const steps: TestDraftStep[] = [
	{result: 'pass', stoppedIn: '9 ms', note: ''},
	{result: 'fail', stoppedIn: '31 ms', note: 'relay slow'},
	{result: 'not_applicable', stoppedIn: '', note: 'no lid, accepted by the LSO'},
	{stoppedIn: '', note: ''},
];
const people: TestDraftPeople = {name: 'Orla Penhaligon', role: 'laser technician', witnessName: 'Tobias Quenby', witnessRole: '', witnessKey: '', date: '2026-12-01'};
const home = () => mkdtempSync(join(tmpdir(), 'prelase-test-draft-'));

describe('the test draft of a plan file', () => {
	it('is saved owner-only with the hash of the plan text and read back as current while the plan is unchanged', () => {
		const folder = home();
		saveTestDraft(folder, plan, planText, {steps, people}, new Date('2026-12-01T10:00:00Z'));
		const path = testDraftPath(folder, plan);
		expect(path).toMatch(/[/\\]drafts[/\\]test-[0-9a-f]{16}\.json$/);
		if (process.platform !== 'win32') expect(statSync(path).mode & 0o777).toBe(0o600);
		// The same hash as the record of the test would carry.
		expect(JSON.parse(readFileSync(path, 'utf8'))).toMatchObject({planSha256: sha256Hex(planText)});
		expect(loadTestDraft(folder, plan, planText)).toEqual({state: 'current', path, draft: {file: plan, planSha256: sha256Hex(planText), steps, people, savedAt: '2026-12-01T10:00:00.000Z'}});
	});

	it('is stale once the plan text changed, and can be set aside out of a new test\'s way', () => {
		const folder = home();
		saveTestDraft(folder, plan, planText, {steps, people}, new Date('2026-12-01T10:00:00Z'));
		const found = loadTestDraft(folder, plan, `${planText}# a device added\n`);
		expect(found?.state).toBe('stale');
		const aside = setTestDraftAside(folder, plan, found!.draft);
		expect(aside).toBe(testDraftPath(folder, plan).replace(/\.json$/, '.20261201T100000000Z.json'));
		expect(existsSync(testDraftPath(folder, plan))).toBe(false);
		expect(JSON.parse(readFileSync(aside, 'utf8'))).toMatchObject({steps, people});
		expect(loadTestDraft(folder, plan, planText)).toBeUndefined();
	});

	it('is one per plan file, and removed once signed or discarded', () => {
		const folder = home();
		const other = '/lab/bench5/plan.yaml';
		saveTestDraft(folder, plan, planText, {steps, people});
		saveTestDraft(folder, other, planText, {steps: steps.slice(0, 1), people});
		expect(testDraftPath(folder, plan)).not.toBe(testDraftPath(folder, other));
		removeTestDraft(folder, plan);
		expect(loadTestDraft(folder, plan, planText)).toBeUndefined();
		expect(loadTestDraft(folder, other, planText)?.draft.steps).toEqual(steps.slice(0, 1));
	});

	const valid = {file: plan, planSha256: sha256Hex(planText), steps, people, savedAt: '2026-12-01T10:00:00.000Z'};
	it.each([
		{name: 'not JSON', content: '{"file": '},
		{name: 'missing the people', content: JSON.stringify({...valid, people: undefined})},
		{name: 'with a result that is not one', content: JSON.stringify({...valid, steps: [{result: 'ok', stoppedIn: '', note: ''}]})},
		{name: 'with an unknown key', content: JSON.stringify({...valid, signed: true})},
		{name: 'with a hash that is not one', content: JSON.stringify({...valid, planSha256: 'abc'})},
		{name: 'with a saved time that is not one', content: JSON.stringify({...valid, savedAt: '../../elsewhere'})},
		{name: 'the draft of another file under this name', content: JSON.stringify({...valid, file: '/elsewhere.yaml'})},
	])('a draft file $name is ignored, not trusted', ({content}) => {
		const folder = home();
		const path = testDraftPath(folder, plan);
		mkdirSync(dirname(path), {recursive: true});
		writeFileSync(path, content);
		expect(loadTestDraft(folder, plan, planText)).toBeUndefined();
		// A well-formed one in the same place is read: the table's cases fail for their own reason.
		writeFileSync(path, JSON.stringify(valid));
		expect(loadTestDraft(folder, plan, planText)?.state).toBe('current');
	});
});
