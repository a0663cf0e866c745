import {mkdirSync, mkdtempSync, statSync, writeFileSync} from 'node:fs';
import {tmpdir} from 'node:os';
import {dirname, join} from 'node:path';
import {describe, expect, it} from 'vitest';
import {loadPlanDraft, planDraftPath, removePlanDraft, savePlanDraft} from '../../../source/services/drafts/plan-draft-store.js';

const plan = '/lab/bench3/plan.yaml';
const base = 'format: 1\nname: bench 3\n';
const edited = 'format: 1\nname: bench 3, edited\n';

describe('the planner draft of a plan file', () => {
	it('is saved owner-only and read back as current while the file still has the text it started from', () => {
		const home = mkdtempSync(join(tmpdir(), 'prelase-plan-draft-'));
		savePlanDraft(home, plan, base, edited, new Date('2026-12-01T10:00:00Z'));
		const path = planDraftPath(home, plan);
		if (process.platform !== 'win32') expect(statSync(path).mode & 0o777).toBe(0o600);
		expect(loadPlanDraft(home, plan, base)).toEqual({state: 'current', path, draft: {file: plan, baseSha256: expect.stringMatching(/^[0-9a-f]{64}$/) as string, text: edited, savedAt: '2026-12-01T10:00:00.000Z'}});
	});

	it.each([
		{name: 'the file changed since: stale, kept', fileText: `${base}# a hand edit\n`, expected: 'stale'},
		{name: 'the file as it was: current', fileText: base, expected: 'current'},
	])('$name', ({fileText, expected}) => {
		const home = mkdtempSync(join(tmpdir(), 'prelase-plan-draft-'));
		savePlanDraft(home, plan, base, edited);
		expect(loadPlanDraft(home, plan, fileText)?.state).toBe(expected);
	});

	it('is one per plan file, and removed once saved or discarded', () => {
		const home = mkdtempSync(join(tmpdir(), 'prelase-plan-draft-'));
		const other = '/lab/bench5/plan.yaml';
		savePlanDraft(home, plan, base, edited);
		savePlanDraft(home, other, base, 'format: 1\nname: bench 5\n');
		expect(planDraftPath(home, plan)).not.toBe(planDraftPath(home, other));
		removePlanDraft(home, plan);
		expect(loadPlanDraft(home, plan, base)).toBeUndefined();
		expect(loadPlanDraft(home, other, base)?.draft.text).toBe('format: 1\nname: bench 5\n');
	});

	it.each([
		{name: 'not JSON', content: '{"file": '},
		{name: 'another shape', content: JSON.stringify({file: plan, text: edited})},
		{name: 'the draft of another file under this name', content: JSON.stringify({file: '/elsewhere.yaml', baseSha256: 'a'.repeat(64), text: edited, savedAt: 'x'})},
	])('a draft file that is $name is ignored, not trusted', ({content}) => {
		const home = mkdtempSync(join(tmpdir(), 'prelase-plan-draft-'));
		const path = planDraftPath(home, plan);
		mkdirSync(dirname(path), {recursive: true});
		writeFileSync(path, content);
		expect(loadPlanDraft(home, plan, base)).toBeUndefined();
	});
});
