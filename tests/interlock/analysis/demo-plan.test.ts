import {describe, expect, it} from 'vitest';
import {deferral} from '../../../source/shared/deferral.js';
import {analysePlan, planVerdict} from '../../../source/interlock/analysis/analyse.js';
import {testSheet} from '../../../source/interlock/functional-test/test-sheet.js';
import {testSheetMarkdown} from '../../../source/render/test-sheet-markdown.js';

import {loadPlanUnderShippedPolicy as demo} from '../plan-fixture.js';

describe('the demo plan', () => {
	it('analyses with no finding and its loop figures', () => {
		const analysis = analysePlan(demo());
		expect(analysis.findings).toEqual([]);
		// hand arithmetic: contacts 80 + 100 + 20 + 50 + 200 + 30 mΩ = 480 mΩ (the bypass key's 50 mΩ is not in series)
		expect(analysis.resistance.contacts).toBeCloseTo(0.48, 12);
		// hand arithmetic: 100 Ω less 25 % = 75 Ω
		expect(analysis.allowedResistance).toBeCloseTo(75, 12);
		// hand arithmetic: 0.5 mm² at 30 °C, 2 × 12 m twice: 48 m × (1/58 Ω·mm²/m) × (1 + 0.00393 × 10) / 0.5 mm² = 1.7204 Ω
		const mm2 = analysis.resistance.parts.filter((part) => part.from === 'estop_bench' || part.from === 'door_switch').filter((part) => part.what === 'wire');
		expect(mm2.reduce((total, part) => total + part.ohms, 0)).toBeCloseTo(1.7204, 3);
		expect(analysis.current).toBeCloseTo(0.01, 12);
		// hand arithmetic: the flow switch 15 ms + 1 ms + 0.5 ms = 16.5 ms, the slowest
		expect(analysis.slowest).toEqual({device: 'chiller_flow', opening: 0.015, total: expect.closeTo(0.0165, 12) as number});
		expect(planVerdict(analysis)).toBe('No stop findings, 0 advise findings: wire the loop, then prove it with the functional test sheet.');
	});

	it('has one test step per device (each emergency stop and key switch once), then wire break, power interruption and bypass time-out', () => {
		const sheet = testSheet(demo());
		expect(sheet.limit).toBe('20 ms');
		expect(sheet.steps.map((step) => step.subject)).toEqual([
			'lid_switch',
			'fibre_sense',
			'estop_bench',
			'door_switch',
			'chiller_flow',
			'key_switch',
			'loop wire break',
			'power interruption',
			'bypass time-out: alignment_bypass',
		]);
		expect(sheet.steps.map((step) => step.number)).toEqual([1, 2, 3, 4, 5, 6, 7, 8, 9]);
		expect(sheet.steps[0]).toMatchObject({action: 'With emission on, open lid_switch (FH-LS2 tongue switch on the enclosure lid), then close it again.', expect: 'Emission stops within 20 ms. After closing, emission stays off until the reset is pressed.'});
		expect(sheet.steps[4]!.action).toContain('stop the coolant flow through chiller_flow');
		expect(sheet.steps[2]!.action).toContain("press estop_bench (FH-ES1 mushroom emergency stop on the bench front) from the operator's position");
		expect(sheet.steps[5]!.action).toContain('turn key_switch (FH-KS3 key switch on the driver shelf, key held by the bench owner) to off and remove the key');
		expect(sheet.steps[8]!.action).toContain('wait 4 h');
	});

	it('prints the sheet with blanks for result, initials and date on every step', () => {
		const markdown = testSheetMarkdown(testSheet(demo()));
		const rows = markdown.split('\n').filter((line) => /^\| \d+ \|/.test(line));
		expect(rows).toHaveLength(9);
		for (const row of rows) expect(row.endsWith('|  |  |  |')).toBe(true);
		expect(markdown).toContain('| # | Concerns | Do | Expect | Result (pass / fail) | Initials | Date |');
		expect(markdown).toContain('every 180 days');
		expect(markdown).toContain(deferral);
		expect(markdown.replace(deferral, '')).not.toMatch(/\bsafe\b/);
	});
});
