import {formatQuantity} from '../quantities/format.js';

/** What a margin chart needs of a check: from an evaluation or from a record. */
export type ChartableCheck = {id: string; title?: string | undefined; verdict: string; relation?: 'at_most' | 'at_least' | undefined; value?: {si: number; text: string} | undefined; limit?: {si: number; text: string} | undefined};

/** One bar: the check's value as a fraction of its limit, and how far it is from failing. */
export type MarginRow = {id: string; title: string; verdict: string; relation: 'at_most' | 'at_least'; valueText: string; limitText: string; ratio: number; margin: number};

/**
 * The checks with a number, as bars: value over limit (the limit sits at 1) and the margin as a
 * fraction of the limit (negative when failing), closest to failing first. A check whose limit is
 * not positive, or whose value is negative, has no ratio to draw and is left out.
 */
export function marginRows(checks: readonly ChartableCheck[]): MarginRow[] {
	const rows: MarginRow[] = [];
	for (const check of checks) {
		const {value, limit, relation} = check;
		if (!value || !limit || !relation || !(limit.si > 0) || value.si < 0 || !['pass', 'fail', 'advise'].includes(check.verdict)) continue;
		const margin = (relation === 'at_most' ? limit.si - value.si : value.si - limit.si) / limit.si;
		rows.push({id: check.id, title: check.title ?? check.id, verdict: check.verdict, relation, valueText: value.text, limitText: limit.text, ratio: value.si / limit.si, margin});
	}
	return rows.sort((a, b) => a.margin - b.margin);
}

/** A verdict as a mark that reads without colour. */
export function verdictMark(verdict: string): string {
	return verdict === 'pass' ? '✓' : verdict === 'fail' ? '✗' : '!';
}

/** Cells from zero to the limit, and past it (to 1.5 times the limit). */
const toLimit = 20;
const pastLimit = 10;

/** One bar in block characters: filled up to the value, the limit a │, » when the value is beyond 1.5 times the limit. */
export function marginBar(ratio: number): string {
	const filled = Math.round(Math.min(ratio, 1.5) * toLimit);
	const cells = Array.from({length: toLimit + pastLimit}, (_, index) => (index < filled ? '█' : ' '));
	const left = cells.slice(0, toLimit).join('');
	const right = cells.slice(toLimit).join('');
	return `${left}│${ratio > 1.5 ? `${right.slice(0, -1)}»` : right}`;
}

/**
 * The margin chart in block characters: one line per check, closest to failing first, with the
 * verdict as a mark and the figures in words (never colour alone). Fits 80 columns.
 */
export function marginChartLines(rows: readonly MarginRow[], width = 80): string[] {
	const nameWidth = Math.max(10, Math.min(24, width - 2 - toLimit - pastLimit - 1 - 12 - 3));
	const lines = [`  ${''.padEnd(nameWidth)} 0${' '.repeat(toLimit - 6)}limit│`];
	for (const row of rows) {
		const name = row.id.length > nameWidth ? `${row.id.slice(0, nameWidth - 1)}…` : row.id.padEnd(nameWidth);
		lines.push(`${verdictMark(row.verdict)} ${name} ${marginBar(row.ratio)} ${marginWords(row.margin)}`);
	}
	return lines;
}

/** The margin as words: "13 % left", "8 % over". */
export function marginWords(margin: number): string {
	return margin >= 0 ? `${formatQuantity(margin, 'ratio')} left` : `${formatQuantity(-margin, 'ratio')} over`;
}
