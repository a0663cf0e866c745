import {dimensions, dimensionNames, type Dimension} from '../quantities/dimensions.js';
import {formatQuantity} from '../quantities/format.js';
import {safeText, type FlipPoint} from '../rules/evaluate/what-if.js';
import {inputEntry, type RecordBody} from '../records/record-schema.js';
import type {TornadoRow} from './chart-svg.js';
import {flipWords} from './what-if-text.js';

/** What a report shows of a record's sensitivity section: the closest calls, each flip in words, and the tornado rows. */
export type SensitivityView = {
	closest: Array<{check: string; title: string; words: string; fraction: number}>;
	flips: Array<{check: string; title: string; verdict: string; words: string[]}>;
	tornado: TornadoRow[];
};

/** The dimension an input was entered in, from its SI unit and what was typed (kelvin typed as degrees is a temperature). */
function dimensionOf(unit: string | undefined, entered: string): Dimension {
	if (unit === 'K') return /deg|\u00B0/.test(entered) ? 'temperature' : 'temperature_difference';
	if (!unit) return /%\s*$/.test(entered) ? 'ratio' : 'number';
	return dimensionNames.find((name) => dimensions[name].si === unit) ?? 'number';
}

/**
 * A record's flip points as a report shows them (the record keeps the SI values; the way each
 * moves, the verdict it turns to and the fraction follow from the input's value and the check's
 * verdict). Undefined when the record has no sensitivity section.
 */
export function sensitivityView(body: RecordBody): SensitivityView | undefined {
	if (!body.sensitivity) return undefined;
	const view: SensitivityView = {closest: [], flips: [], tornado: []};
	const nearest: SensitivityView['closest'] = [];
	for (const check of body.checks) {
		const inputs: Record<string, number[]> | undefined = body.sensitivity[check.id];
		if (!inputs || (check.verdict !== 'pass' && check.verdict !== 'fail' && check.verdict !== 'advise')) continue;
		const title = check.title ?? check.id;
		const becomes = check.verdict === 'pass' ? 'fail' : 'pass';
		const points: FlipPoint[] = [];
		for (const [input, values] of Object.entries(inputs) as Array<[string, number[]]>) {
			const entry = inputEntry(body.inputs[input]);
			if (entry?.si === undefined) continue;
			const now = entry.si;
			const dimension = dimensionOf(entry.unit, entry.entered);
			const row: TornadoRow = {group: `${check.verdict}: ${title}`, input};
			for (const at of values as number[]) {
				const direction = at > now ? 'up' : 'down';
				// The failing side: beyond the flip for a pass, back toward the value entered for a fail.
				const towardFail = (becomes === 'fail') === (direction === 'up') ? 1 : -1;
				const shown = safeText(at, at + towardFail * Math.max(Math.abs(at), 1e-30) * 1e-9, dimension);
				const fraction = now === 0 ? null : Math.abs(at - now) / Math.abs(now);
				const changeDimension = dimension === 'temperature' ? 'temperature_difference' : dimension;
				const change = Math.abs(shown.si - now);
				points.push({input, dimension, direction, becomes, now: {si: now, dimension, text: formatQuantity(now, dimension)}, at: {si: at, dimension, text: shown.text}, beyond: at, change: {si: change, dimension: changeDimension, text: formatQuantity(change, changeDimension)}, fraction, method: 'bisection'});
				row[direction] = fraction;
			}
			view.tornado.push(row);
		}
		view.flips.push({check: check.id, title, verdict: check.verdict, words: points.map(flipWords)});
		const closest = points.filter((point) => point.fraction !== null).sort((a, b) => a.fraction! - b.fraction!)[0];
		if (check.verdict === 'pass' && closest) nearest.push({check: check.id, title, words: flipWords(closest), fraction: closest.fraction!});
	}
	view.closest = nearest.sort((a, b) => a.fraction - b.fraction).slice(0, 3);
	return view;
}
