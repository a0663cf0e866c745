import {readFileSync} from 'node:fs';
import {resolve} from 'node:path';
import {describe, expect, it} from 'vitest';
import {main} from '../../source/cli/dispatch.js';
import {loadRulesFromText} from '../../source/rules/load.js';
import {fakeIo} from '../helpers/fake-io.js';
import {evaluateDocument, readDemo, shippedRules} from './bench-answers.js';

// A derived value may name a step: the check's text output and the step's screen then show it
// with that step, so the operator sees a converted or worst-case figure where it is used.
const minimal = (step: string) => `format: 1
name: derived step
caution: Test rules.
steps:
  - id: only
    title: Only step
    inputs:
      - id: typed
        label: A typed current
        dimension: current
        range: [0 A, 10 A]
derived:
  - id: doubled
    label: Twice the typed current
    dimension: current
    step: ${step}
    formula: typed * 2
`;

describe('a derived value shown with a step', () => {
	it('is refused when its step does not exist, at the line of the step', () => {
		const loaded = loadRulesFromText(minimal('nowhere'), 'derived.yaml');
		expect(loaded.ok).toBe(false);
		if (!loaded.ok) expect(loaded.errors.map(({code, line, data}) => ({code, line, step: data['step']}))).toEqual([{code: 'missing-step', line: 16, step: 'nowhere'}]);
	});

	it('carries its step into the evaluation', () => {
		const evaluation = evaluateDocument(shippedRules(), readDemo('bench3-808nm-clear.yaml'));
		const shown = evaluation.derived.filter((entry) => entry.step === 'people').map(({id}) => id);
		expect(shown).toEqual(['beam1_assessed_power', 'beam1_divergence_1e', 'beam2_divergence_1e', 'beam3_divergence_1e']);
	});

	it('is printed with its step in the text output', () => {
		const io = fakeIo();
		main(['check', '--answers', resolve('docs/examples/bench3-808nm-clear.yaml')], io);
		const text = io.stdout.text;
		const people = text.slice(text.indexOf('8. People around the bench'), text.indexOf('9. ESD'));
		expect(people).toContain('Beam 1 power the people checks use');
		// 1 mrad at the 1/e² points / √2 = 0.7071 mrad at 1/e (Gaussian beam, hand arithmetic)
		expect(people).toMatch(/converted from the typed figure[\s\S]*?= 707 µrad/);
		// max(2 W typed, 1.74 W at the limit, coldest) = 2 W
		expect(people).toMatch(/people checks use[\s\S]*?= 2 W/);
		// a derived value with no step is not printed
		expect(text).not.toContain('Supply at its low tolerance');
		// beam 3 is not asked in the demo: its open conversion is not printed either
		expect(people).not.toContain('Beam 3 1/e');
		expect(readFileSync(resolve('docs/examples/bench3-808nm-clear.yaml'), 'utf8')).toContain('beam2_divergence_convention: one_over_e_squared');
	});
});
