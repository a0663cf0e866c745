import {copyFileSync, mkdtempSync, readFileSync, writeFileSync} from 'node:fs';
import {tmpdir} from 'node:os';
import {join} from 'node:path';
import {describe, expect, it} from 'vitest';
import {planEditingText} from '../../../source/interlock/plan/plan-edit.js';
import {openInStepsAbove, openPlan, openPlanSteps, opensInSteps} from '../../../source/ui/planner/plan-opening.js';
import {runInSlices} from '../../../source/services/run-in-slices.js';
import {openSettings} from '../../../source/services/settings.js';
import {savePlanDraft} from '../../../source/services/drafts/plan-draft-store.js';
import {shippedRules} from '../../helpers/screen-driver.js';
import {demoPlanFile} from '../../interlock/plan-fixture.js';

const folder = mkdtempSync(join(tmpdir(), 'prelase-plan-opening-'));

describe('opening a plan for the planner', () => {
	const big = join(folder, 'big.yaml');
	writeFileSync(big, `${readFileSync(demoPlanFile, 'utf8')}\n${'#'.repeat(openInStepsAbove)}\n`);
	it.each([
		{name: 'the demo plan (about 4 kB) opens at once', path: demoPlanFile, steps: false},
		{name: 'a file over 128 kB opens in steps', path: big, steps: true},
		{name: 'a file that is not there opens at once, to say so', path: join(folder, 'missing.yaml'), steps: false},
	])('$name', ({path, steps}) => {
		expect(opensInSteps(path)).toBe(steps);
	});

	it('in steps gives what it gives at once, a draft restored included', async () => {
		const file = join(folder, 'plan.yaml');
		copyFileSync(demoPlanFile, file);
		const settings = openSettings({PRELASE_HOME: mkdtempSync(join(folder, 'home-'))});
		const original = readFileSync(file, 'utf8');
		savePlanDraft(settings.folder, file, original, original.replace('opening_time: 8 ms', 'opening_time: 9 ms'));
		const atOnce = openPlan(file, shippedRules(), settings);
		const stepwise = await runInSlices(openPlanSteps(file, shippedRules(), settings));
		expect(atOnce.notice?.text).toMatch(/^Unsaved edits from .* restored/);
		expect(stepwise?.notice).toEqual(atOnce.notice);
		expect(planEditingText(stepwise!.editing!)).toBe(planEditingText(atOnce.editing!));
		expect(planEditingText(atOnce.editing!)).toContain('opening_time: 9 ms');
		expect(stepwise!.editing!.analysis).toEqual(atOnce.editing!.analysis);
	});
});
