import {readFileSync} from 'node:fs';
import fc from 'fast-check';
import {describe, expect, it} from 'vitest';
import {analysePlan} from '../../../source/interlock/analysis/analyse.js';
import {loadPlanFromText} from '../../../source/interlock/plan/load-plan.js';
import {testPolicy} from '../plan-fixture.js';

const demo = readFileSync('docs/examples/interlock/bench3-interlock-plan.yaml', 'utf8');

describe('the plan loader on mutated files', () => {
	it('never throws: a cut, spliced or garbled plan is refused with located problems, or loads and analyses', () => {
		const mutated = fc.tuple(fc.nat(demo.length), fc.nat(40), fc.string({maxLength: 12})).map(([start, cut, insert]) => demo.slice(0, start) + insert + demo.slice(start + cut));
		fc.assert(
			fc.property(mutated, (text) => {
				const result = loadPlanFromText(text, 'plan.yaml');
				if (result.ok) return analysePlan({...result.value, policy: testPolicy()}).findings.every((entry) => entry.severity === 'stop' || entry.severity === 'advise');
				return result.errors.length > 0 && result.errors.every((found) => found.file === 'plan.yaml');
			}),
			{numRuns: 300},
		);
	});

	it('refuses an unquoted value that is not a quantity, with its line', () => {
		const result = loadPlanFromText(demo.replace('loop_voltage: 12 V', 'loop_voltage: twelve'), 'plan.yaml');
		expect(result.ok).toBe(false);
		if (!result.ok) expect(result.errors.map((found) => [found.field, found.line])).toEqual([['input.loop_voltage', demo.slice(0, demo.indexOf('loop_voltage')).split('\n').length]]);
	});
});
