import {describe, expect, it} from 'vitest';
import {marginChartSection, sensitivitySection} from '../../source/render/report-charts-html.js';
import {sensitivityView} from '../../source/render/report-sensitivity.js';
import {sensitivityMarkdown} from '../../source/render/report-sensitivity-markdown.js';
import {markdownText} from '../../source/render/report-markdown.js';
import {withRuleWords, withValuesShown} from '../../source/records/record-words.js';
import {sampleAnswers, sampleRecord, sampleRules} from '../helpers/sample-record.js';

const rules = sampleRules();
const answers = sampleAnswers(rules);
const shown = (withWhatIf: boolean) => withValuesShown(withRuleWords(sampleRecord({rules, answers, withWhatIf}).body, rules), rules);

describe('the charts of the HTML report', () => {
	it('draws one margin bar per check with a number, closest to failing first, with no external reference', () => {
		const html = marginChartSection(shown(false));
		expect(html).toContain('<svg class="chart margin-chart"');
		const order = [...html.matchAll(/<text x="0" y="\d+">(.) ([a-z0-9_]+)<\/text>/g)].map((match) => `${match[1]} ${match[2]}`);
		// Bench 3: the advice first (short_circuit_dissipation over its rating), then the emission delay at 0 % left (3 s on the 3 s minimum, site policy).
		expect(order[0]).toMatch(/^! /);
		expect(order).toContain('✓ emission_delay_long_enough');
		expect(order.indexOf('✓ emission_delay_long_enough')).toBeLessThan(order.indexOf('✓ limit_below_diode_maximum'));
		expect(html).not.toMatch(/url\(|href=|src=/);
	});

	it('shows the record\'s flip points only when it keeps them, rounded toward the passing side', () => {
		expect(sensitivitySection(shown(false))).toBe('');
		const view = sensitivityView(shown(true))!;
		// Ambient flip 58 °C (hand arithmetic: 125 °C − 100 K·6.7 W/10 W); ceiling 2.25 A = 2.5 A·0.9 (hand arithmetic).
		expect(view.closest.map((call) => call.words)).toContain('fails if ambient_max > 58 °C (now 35 °C)');
		const ceiling = view.flips.find((entry) => entry.check === 'limit_below_diode_maximum')!;
		// 2 A/0.9 = 2.2222 A: the passing side is above it, so it is shown rounded up.
		expect(ceiling.words).toEqual(['fails if diode_max_current < 2.23 A (now 2.5 A)', 'fails if current_limit > 2.25 A (now 2 A)']);
		const html = sensitivitySection(shown(true));
		expect(html).toContain('<svg class="chart tornado-chart"');
		expect(html).toContain('fails if ambient_max &gt; 58 °C (now 35 °C)');
	});

	it('gives the Markdown report the same flip points in words', () => {
		expect(sensitivityMarkdown(shown(false), markdownText)).toEqual([]);
		const lines = sensitivityMarkdown(shown(true), markdownText);
		expect(lines[0]).toBe('## What would flip each verdict');
		// Ambient flip 58 °C (hand arithmetic: 125 °C − 100 K·6.7 W/10 W); > is written as an entity for Markdown (the second closest call of bench 3).
		expect(lines.join('\n')).toContain('2. Worst-case driver dissipation within its derated rating: fails if ambient_max &gt; 58 °C (now 35 °C)');
	});
});
