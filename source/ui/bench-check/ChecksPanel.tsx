import {Box} from 'ink';
import {Text} from '../Text.js';
import {checkFigures} from '../../render/check-text.js';
import type {CheckResult} from '../../rules/evaluate/evaluation.js';
import type {ShownDerived} from '../../rules/evaluate/shown-derived.js';
import {wrap} from '../../shared/wrap.js';
import {verdictStyle} from '../verdict-style.js';
import {cornerWords} from '../../rules/evaluate/worst-corner.js';

const indent = '          ';

/** The detail lines of a check, wrapped in full (an error or reason is never cut mid-sentence). */
export function checkDetailLines(check: CheckResult, width: number): string[] {
	const detail = checkFigures(check) ?? (check.needs?.length ? `needs ${check.needs.join(', ')}` : check.error ?? check.reason ?? '');
	const lines = detail ? wrap(detail, width, indent) : [];
	if (check.corner) lines.push(...wrap(cornerWords(check.corner), width, indent));
	return lines;
}

/** The line of a derived value: its figure and label, cut to one line or wrapped whole under the label. */
export function derivedLines({entry, text}: ShownDerived, width: number, full: boolean): string[] {
	const figure = `= ${text}`.padEnd(10);
	if (!full) return [`${figure} ${entry.label}`];
	const pieces = wrap(entry.label, width, ' '.repeat(11));
	pieces[0] = `${figure} ${pieces[0]!.trimStart()}`;
	return pieces;
}

/**
 * The checks of the current step, as the core evaluated them: verdict, figures, what is missing;
 * above them, one line for each derived value the step shows (a converted or worst-case figure).
 * As many checks as fit in `rows` are shown whole; the rest are counted and left to the summary.
 */
export function ChecksPanel({checks, rows, width = 80, derived = [], full = false, from = 0}: {checks: CheckResult[]; rows: number; width?: number; derived?: ShownDerived[]; /** Derived values' labels wrapped whole rather than cut, and the checks not shown reached with ↓ rather than left to the summary. @default false */ full?: boolean; /** The first check shown (the ones before it scrolled away). @default 0 */ from?: number}) {
	if (checks.length === 0 && derived.length === 0) return <Text dimColor>No checks in this step; its confirmations are listed above.</Text>;
	const shown: Array<{check: CheckResult; title: string[]; detail: string[]}> = [];
	let used = 0;
	for (const check of checks.slice(from)) {
		const title = wrap(check.title, width, indent).map((line, index) => (index === 0 ? line.trimStart() : line));
		const detail = checkDetailLines(check, width);
		if (shown.length > 0 && used + title.length + detail.length > rows) break;
		shown.push({check, title, detail});
		used += title.length + detail.length;
	}
	return (
		<Box flexDirection="column">
			{derived.map(({entry, text}) => (
				<Text key={entry.id} dimColor wrap="truncate" lines>
					{derivedLines({entry, text}, width, full).join('\n')}
				</Text>
			))}
			{shown.map(({check, title, detail}) => {
				const style = verdictStyle[check.verdict];
				return (
					<Box key={check.id} flexDirection="column">
						<Text>
							<Text color={style.color}>{style.label.padEnd(10)}</Text>
							{title[0]}
						</Text>
						{title.slice(1).map((line, index) => (
							<Text key={`title-${index}`}>{line}</Text>
						))}
						{detail.map((line, index) => (
							<Text key={index} dimColor>
								{line}
							</Text>
						))}
					</Box>
				);
			})}
			{checks.length - from > shown.length ? <Text dimColor>{indent}… {checks.length - from - shown.length} more {full ? '(↓ shows them)' : 'in the summary'}</Text> : null}
		</Box>
	);
}
