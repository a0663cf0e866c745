import type {RecordBody} from '../records/record-schema.js';
import {markupText as h, marginChartSvg, tornadoSvg} from './chart-svg.js';
import {marginRows} from './margin-chart.js';
import {sensitivityView} from './report-sensitivity.js';

/** The margin chart section of a record's HTML report: every check with a number, closest to failing first. */
export function marginChartSection(body: RecordBody): string {
	const rows = marginRows(body.checks.map((check) => ({id: check.id, title: check.title, verdict: check.verdict, relation: check.relation, value: check.value, limit: check.limit})));
	if (rows.length === 0) return '';
	return `<section class="charts"><h2>Margins</h2><p>Each check with a number: its value against its limit (the vertical line), closest to failing first. ✓ holds, ✗ fails, ! advises (both drawn open with a dashed outline).</p><figure>${marginChartSvg(rows)}</figure></section>`;
}

/**
 * The what-if section of a record signed with it: the closest calls, a tornado chart of them and
 * of each failing check, and every flip point in words. Empty for a record without a sensitivity section.
 */
export function sensitivitySection(body: RecordBody): string {
	const view = sensitivityView(body);
	if (!view) return '';
	const charted = new Set([...view.closest.map((call) => call.check), ...view.flips.filter((entry) => entry.verdict !== 'pass').map((entry) => entry.check)]);
	const titles = new Set(view.flips.filter((entry) => charted.has(entry.check)).map((entry) => `${entry.verdict}: ${entry.title}`));
	const out = ['<section class="sensitivity"><h2>What would flip each verdict</h2>', '<p>Each input moved on its own, everything else as recorded, within its allowed range; figures rounded toward the passing side. A flip point is arithmetic on the rule file, not a safe operating limit.</p>'];
	if (view.closest.length > 0) out.push(`<ol class="closest">${view.closest.map((call) => `<li>${h(call.title)}: ${h(call.words)}</li>`).join('')}</ol>`);
	const rows = view.tornado.filter((row) => titles.has(row.group));
	if (rows.length > 0) out.push(`<figure>${tornadoSvg(rows)}</figure>`);
	out.push('<table class="flips"><caption>Every flip point</caption><tbody>');
	for (const entry of view.flips) out.push(`<tr><td>${h(entry.verdict)}: ${h(entry.title)}<br><code>${h(entry.check)}</code></td><td>${entry.words.map((words) => h(words)).join('<br>')}</td></tr>`);
	out.push('</tbody></table></section>');
	return out.join('');
}
