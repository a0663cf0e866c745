import {marginWords, verdictMark, type MarginRow} from './margin-chart.js';

const entities: Record<string, string> = {'&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;'};
/** Escapes text for SVG and HTML content and attribute values (the charts are drawn apart from the page writers). */
export const markupText = (text: string) => text.replaceAll(/[&<>"']/g, (found) => entities[found]!);
const x = markupText;

const rowHeight = 16;
const labelWidth = 250;
const barWidth = 260;
const width = 680;

/**
 * The margin chart as inline SVG: one bar per check with a number, its value as a fraction of its
 * limit (a vertical line at the limit, 0 to 1.5 times it), closest to failing first. Each row says
 * its verdict by a mark and its figures in words; a bar that does not hold is drawn open with a dashed outline (it reads in
 * black and white). No external assets, not even a pattern reference.
 */
export function marginChartSvg(rows: readonly MarginRow[]): string {
	const top = 22;
	const height = top + rows.length * rowHeight + 8;
	const scale = barWidth / 1.5;
	const limitX = labelWidth + scale;
	const out = [`<svg class="chart margin-chart" role="img" aria-label="Margin chart: each check's value against its limit, closest to failing first" viewBox="0 0 ${width} ${height}" width="100%" xmlns="http://www.w3.org/2000/svg" font-family="Arial, 'Liberation Sans', 'DejaVu Sans', sans-serif" font-size="10">`];
	out.push(`<text x="${labelWidth}" y="12">0</text><text x="${limitX}" y="12" text-anchor="middle">limit</text><text x="${labelWidth + barWidth}" y="12" text-anchor="end">1.5×</text>`);
	rows.forEach((row, index) => {
		const y = top + index * rowHeight;
		const length = Math.min(row.ratio, 1.5) * scale;
		const failing = row.verdict !== 'pass';
		out.push(
			`<g class="bar verdict-${row.verdict === 'pass' ? 'pass' : row.verdict === 'fail' ? 'fail' : 'advise'}"><title>${x(`${row.title}: ${row.valueText} ${row.relation === 'at_most' ? '≤' : '≥'} ${row.limitText}`)}</title>`,
			`<text x="0" y="${y + 11}">${x(`${verdictMark(row.verdict)} ${row.id.length > 38 ? `${row.id.slice(0, 37)}…` : row.id}`)}</text>`,
			`<rect x="${labelWidth}" y="${y + 2}" width="${length.toFixed(1)}" height="${rowHeight - 5}" fill="${failing ? '#fff' : '#888'}" stroke="#000" stroke-width="${failing ? '1.5" stroke-dasharray="4 2' : '0.5'}"/>`,
			`<text x="${labelWidth + barWidth + 6}" y="${y + 11}">${x(`${row.valueText} ${row.relation === 'at_most' ? '≤' : '≥'} ${row.limitText} · ${marginWords(row.margin)}`)}</text></g>`,
		);
	});
	out.push(`<line x1="${limitX}" y1="${top - 4}" x2="${limitX}" y2="${height - 4}" stroke="#000" stroke-width="1.5"/>`, '</svg>');
	return out.join('');
}

/** One row of a tornado chart: an input and how far (as a fraction of its value) it may fall and rise before the verdict flips. */
export type TornadoRow = {group: string; input: string; down?: number | null | undefined; up?: number | null | undefined};

/**
 * A tornado chart as inline SVG: for each row, a bar to the left of the axis for how far the input
 * may fall and one to the right for how far it may rise before the verdict flips (as a fraction of
 * its current value, to 100 %; a row with no bar on a side has no flip that way). Each side is
 * labelled in words.
 */
export function tornadoSvg(rows: readonly TornadoRow[]): string {
	const top = 22;
	const groups = [...new Set(rows.map((row) => row.group))];
	const height = top + (rows.length + groups.length) * rowHeight + 8;
	const half = 130;
	const axis = labelWidth + half;
	const out = [`<svg class="chart tornado-chart" role="img" aria-label="Tornado chart: how far each input may move before the verdict flips" viewBox="0 0 ${width} ${height}" width="100%" xmlns="http://www.w3.org/2000/svg" font-family="Arial, 'Liberation Sans', 'DejaVu Sans', sans-serif" font-size="10">`];
	out.push(`<text x="${axis - half}" y="12">−100 %</text><text x="${axis}" y="12" text-anchor="middle">now</text><text x="${axis + half}" y="12" text-anchor="end">+100 %</text>`);
	let line = 0;
	for (const group of groups) {
		out.push(`<text x="0" y="${top + line * rowHeight + 11}" font-weight="bold">${x(group.length > 64 ? `${group.slice(0, 63)}…` : group)}</text>`);
		line += 1;
		for (const row of rows.filter((entry) => entry.group === group)) {
			const y = top + line * rowHeight;
			const side = (fraction: number | null | undefined) => (fraction === undefined || fraction === null ? 0 : Math.max(1, Math.min(1, fraction) * half));
			const left = side(row.down);
			const right = side(row.up);
			const words = [row.down === undefined ? 'no flip' : row.down === null ? 'from zero' : `−${percent(row.down)}`, row.up === undefined ? 'no flip' : row.up === null ? 'from zero' : `+${percent(row.up)}`].join(' / ');
			out.push(
				`<text x="12" y="${y + 11}">${x(row.input)}</text>`,
				left > 0 ? `<rect x="${(axis - left).toFixed(1)}" y="${y + 2}" width="${left.toFixed(1)}" height="${rowHeight - 5}" fill="#888" stroke="#000" stroke-width="0.5"/>` : '',
				right > 0 ? `<rect x="${axis}" y="${y + 2}" width="${right.toFixed(1)}" height="${rowHeight - 5}" fill="#888" stroke="#000" stroke-width="0.5"/>` : '',
				`<text x="${axis + half + 6}" y="${y + 11}">${x(words)}</text>`,
			);
			line += 1;
		}
	}
	out.push(`<line x1="${axis}" y1="${top - 4}" x2="${axis}" y2="${height - 4}" stroke="#000" stroke-width="1.5"/>`, '</svg>');
	return out.join('');
}

function percent(fraction: number): string {
	return `${Number((fraction * 100).toPrecision(3))} %`;
}
