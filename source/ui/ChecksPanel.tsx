import {Box, Text} from 'ink';
import {checkFigures} from '../commands/check-text.js';
import type {CheckResult} from '../rules/evaluation.js';
import type {ShownDerived} from '../rules/shown-derived.js';
import {stripControl} from '../text.js';
import {verdictStyle} from './verdict-style.js';

/**
 * The checks of the current step, as the core evaluated them: verdict, figures, what is missing;
 * above them, one line for each derived value the step shows (a converted or worst-case figure).
 */
export function ChecksPanel({checks, rows, derived = []}: {checks: CheckResult[]; rows: number; derived?: ShownDerived[]}) {
	if (checks.length === 0 && derived.length === 0) return <Text dimColor>No checks in this step; its confirmations are listed above.</Text>;
	const shown = checks.slice(0, Math.max(1, Math.floor(rows / 2)));
	return (
		<Box flexDirection="column">
			{derived.map(({entry, text}) => (
				<Text key={entry.id} dimColor wrap="truncate">
					{`= ${stripControl(text)}`.padEnd(10)} {stripControl(entry.label)}
				</Text>
			))}
			{shown.map((check) => {
				const style = verdictStyle[check.verdict];
				const detail = checkFigures(check) ?? (check.needs?.length ? `needs ${check.needs.join(', ')}` : check.error ?? '');
				return (
					<Box key={check.id} flexDirection="column">
						<Text wrap="truncate">
							<Text color={style.color}>{style.label.padEnd(10)}</Text>
							{stripControl(check.title)}
						</Text>
						{detail ? (
							<Text dimColor wrap="truncate">
								{'          '}
								{stripControl(detail)}
							</Text>
						) : null}
					</Box>
				);
			})}
			{checks.length > shown.length ? <Text dimColor>          … {checks.length - shown.length} more in the summary</Text> : null}
		</Box>
	);
}
