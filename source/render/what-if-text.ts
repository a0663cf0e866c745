import {deferral} from '../shared/deferral.js';
import {formatQuantity} from '../quantities/format.js';
import type {FlipPoint, WhatIf} from '../rules/evaluate/what-if.js';
import {wrap} from '../shared/wrap.js';
import {marginChartLines, marginRows, type ChartableCheck} from './margin-chart.js';

/** One flip point in words: "fails if ambient_max > 58 °C (now 35 °C)", "passes if current_limit ≤ 2.25 A (now 2.4 A)". */
export function flipWords(flip: FlipPoint): string {
	const sign = flip.becomes === 'fail' ? (flip.direction === 'up' ? '>' : '<') : flip.direction === 'up' ? '≥' : '≤';
	return `${flip.becomes === 'fail' ? 'fails' : 'passes'} if ${flip.input} ${sign} ${flip.at.text} (now ${flip.now.text})`;
}

/** A change that clears a fail, in words: "lower current_limit by 150 mA to ≤ 2.25 A". */
export function fixWords(flip: FlipPoint): string {
	return flip.direction === 'up' ? `raise ${flip.input} by ${flip.change.text} to ≥ ${flip.at.text}` : `lower ${flip.input} by ${flip.change.text} to ≤ ${flip.at.text}`;
}

/** A fraction of the current value as text: "7.46 %"; "from zero" when the current value is zero. */
export function fractionWords(fraction: number | null): string {
	return fraction === null ? 'from zero' : formatQuantity(fraction, 'ratio');
}

/** Half the width of a tornado bar: this many cells stand for a change of 100 % of the current value. */
const halfBar = 10;

/**
 * One tornado row for an input: the bar to the left of the axis is how far the input may fall,
 * the one to the right how far it may rise, before the verdict flips; no bar where no value in range
 * flips it. Drawn in characters only, so it reads without colour.
 */
export function tornadoRow(input: string, flips: readonly FlipPoint[], nameWidth: number): string {
	const down = flips.find((flip) => flip.direction === 'down');
	const up = flips.find((flip) => flip.direction === 'up');
	const left = bar(down?.fraction).padStart(halfBar, down ? ' ' : '·');
	const right = bar(up?.fraction).padEnd(halfBar, up ? ' ' : '·');
	const words = [down ? `−${fractionWords(down.fraction)}` : 'no flip', up ? `+${fractionWords(up.fraction)}` : 'no flip'].join(' / ');
	return `${input.padEnd(nameWidth)} ${left}│${right} ${words}`;
}

function bar(fraction: number | null | undefined): string {
	if (fraction === undefined) return '';
	if (fraction === null) return '?';
	if (fraction === 0) return '';
	const cells = Math.max(1, Math.min(halfBar, Math.round(fraction * halfBar)));
	return fraction > 1 ? `${'█'.repeat(halfBar - 1)}»` : '█'.repeat(cells);
}

/** The tornado chart of the closest calls (and of each failing check): one row per input with a flip. */
export function tornadoLines(result: WhatIf, width: number): string[] {
	const lines: string[] = [];
	const charted = [...result.closest.map((call) => call.check), ...result.fixes.map((fix) => fix.check)];
	const entries = result.checks.filter((entry) => charted.includes(entry.check));
	const inputs = entries.flatMap((entry) => entry.flips.map((flip) => flip.input));
	const nameWidth = Math.min(30, Math.max(10, ...inputs.map((input) => input.length)));
	lines.push(`  One cell is ${100 / halfBar} % of the input's current value; » is beyond 100 %; · no flip that way.`);
	lines.push(`  ${''.padEnd(nameWidth)} ${'fall'.padStart(halfBar)}│${'rise'.padEnd(halfBar)}`);
	for (const entry of entries) {
		lines.push(...hang(`${entry.verdict}: ${entry.title}`, width, '  ', '    '));
		const byInput = new Map<string, FlipPoint[]>();
		for (const flip of entry.flips) byInput.set(flip.input, [...(byInput.get(flip.input) ?? []), flip]);
		for (const [input, flips] of byInput) lines.push(`  ${tornadoRow(input, flips, nameWidth)}`);
	}
	return lines;
}

/** The what-if analysis as text: closest calls, changes that clear each fail, the margin and tornado charts, every flip point. */
export function whatIfLines(result: WhatIf, width: number, checks: readonly ChartableCheck[] = []): string[] {
	const lines: string[] = ['', 'WHAT WOULD FLIP EACH VERDICT', ...wrap('Each input moved on its own, everything else as entered, within the input\'s allowed range; figures rounded toward the passing side. A flip point is arithmetic on the rule file, not a safe operating limit: the laser safety officer and the codes in force decide.', width, '  '), ''];
	lines.push('Closest calls (the smallest change, as a fraction of the current value, that fails a pass)');
	if (result.closest.length === 0) lines.push('  none: no passing check flips inside its inputs\' ranges');
	result.closest.forEach((call, index) => {
		lines.push(...hang(`${index + 1}. ${call.title}`, width, '  ', '     '));
		lines.push(...wrap(`${flipWords(call.flip)} · ${fractionWords(call.flip.fraction)} away`, width, '     '));
	});
	if (result.fixes.length > 0) {
		lines.push('', 'To clear each failing check (one change at a time, the smallest first)');
		for (const fix of result.fixes) {
			lines.push(...hang(`${fix.verdict}: ${fix.title}`, width, '  ', '    '));
			const options = fix.options.slice(0, 3).map(fixWords);
			lines.push(...wrap(options.length > 0 ? options.join(', or ') : 'no single input in its range clears it', width, '     '));
		}
	}
	const margins = marginRows(checks);
	if (margins.length > 0) lines.push('', 'Margins: each value against its limit (│), closest to failing first', ...marginChartLines(margins, width));
	lines.push('', 'How far each input may move before the verdict flips', ...tornadoLines(result, width));
	lines.push('', 'Every flip point (each pass\'s nearest marked, with how far it is as a fraction of the value)');
	const nearest = new Set(result.nearest.map((call) => call.flip));
	for (const entry of result.checks) {
		if (entry.flips.length === 0) continue;
		lines.push(...hang(`${entry.verdict}: ${entry.title}`, width, '  ', '    '));
		for (const flip of entry.flips) lines.push(...wrap(`${flipWords(flip)}${nearest.has(flip) ? ` · nearest, ${fractionWords(flip.fraction)} away` : ''}`, width, '     '));
	}
	lines.push('', ...wrap(deferral, width, '  '));
	return lines;
}

/** Wrapped text whose first line starts with `first` and the rest with `rest`. */
function hang(text: string, width: number, first: string, rest: string): string[] {
	const lines = wrap(text, width, rest);
	lines[0] = first + lines[0]!.slice(rest.length);
	return lines;
}
