import {Box} from 'ink';
import {Text} from '../Text.js';
import {useKeystrokes} from '../use-keystrokes.js';
import {useMemo, useState} from 'react';
import {wrap} from '../../shared/wrap.js';
import {countVerdicts} from '../../rules/evaluate/verdict-words.js';
import type {Session} from './session.js';
import {outcomeStyle} from '../verdict-style.js';
import {outcomeReason, summaryLines, type SummaryLine} from './summary-lines.js';
import {whatIfSummaryLines} from './what-if-lines.js';

/**
 * The outcome and why, on top; then every check and confirmation that is not a plain yes: failures,
 * then what is unanswered or open, then advice, then passes. The key w switches to the pictures
 * and what would flip each verdict (margin chart, closest calls, fixes, tornado chart) and back.
 * The caution is one line of the App.
 */
export function SummaryScreen({session, rows, width = 80, onSign, onBack, onHelp, active = true}: {session: Session; rows: number; width?: number; onSign(): void; onBack(): void; onHelp(): void; active?: boolean}) {
	const [offset, setOffset] = useState(0);
	const [whatIf, setWhatIf] = useState(false);
	const {evaluation} = session;
	// The what-if view is worked out when asked for (a few hundred evaluations), once per evaluation.
	const whatIfView = useMemo(() => (whatIf ? whatIfSummaryLines(session, Math.max(20, width - 1)) : []), [whatIf, session, width]);
	const unwrapped = whatIf ? whatIfView : summaryLines(evaluation, session.interlockTest);
	// Long lines wrap (under their own indent) rather than being cut, so every note and message can be read.
	const wrapped: SummaryLine[] = unwrapped.flatMap((line) => {
		if (line.preformatted) return [line];
		const indent = /^\s*(?:\S+ \S+\s+|\S+\s+)?/.exec(line.text)?.[0].length ?? 0;
		const pieces = wrap(line.text.slice(indent), Math.max(20, width - 1), ' '.repeat(Math.min(indent, 14)));
		pieces[0] = line.text.slice(0, indent) + pieces[0]!.trimStart();
		return pieces.map((text, index) => ({...line, key: `${line.key}-${index}`, text}));
	});
	const reason = wrap(outcomeReason(evaluation), Math.max(20, width - 1), '  ').slice(0, 2);
	// Title, outcome, reason, a blank line, and a line each for the scroll marks above and below.
	const room = Math.max(3, rows - 5 - reason.length);
	const lines = wrapped;
	const maxOffset = Math.max(0, lines.length - room);
	useKeystrokes((input, key) => {
		if (key.upArrow) setOffset(Math.max(0, offset - 1));
		else if (key.downArrow) setOffset(Math.min(maxOffset, offset + 1));
		else if (key.pageDown) setOffset(Math.min(maxOffset, offset + room));
		else if (key.pageUp) setOffset(Math.max(0, offset - room));
		else if (key.return) onSign();
		else if (key.escape) onBack();
		else if (input === '?') onHelp();
		else if (input === 'w') {
			setWhatIf(!whatIf);
			setOffset(0);
		}
	}, {isActive: active});
	const counts = countVerdicts(evaluation.checks);
	const unanswered = evaluation.confirmations.filter((entry) => entry.status === 'unanswered' || entry.status === 'open').length;
	const outcome = outcomeStyle[evaluation.outcome];
	return (
		<Box flexDirection="column">
			<Text bold wrap="truncate">
				Summary: {counts.fail} fail · {unanswered} unanswered · {counts.open} open · {counts.advise} advise · {counts.pass} pass · {counts.skip} skip
			</Text>
			<Text bold>
				Outcome: <Text color={outcome.color}>{outcome.label}</Text>
			</Text>
			{reason.map((line, index) => (
				<Text key={`reason-${index}`} wrap="truncate" color={outcome.color}>
					{line}
				</Text>
			))}
			<Box flexDirection="column" marginTop={1}>
				{offset > 0 ? <Text dimColor>↑ {offset} more</Text> : null}
				{lines.slice(offset, offset + room).map((line) => (
					<Text key={line.key} wrap="truncate" {...(line.color ? {color: line.color} : {})} dimColor={line.dim ?? false}>
						{line.text}
					</Text>
				))}
				{offset < maxOffset ? <Text dimColor>↓ {maxOffset - offset} more</Text> : null}
			</Box>
		</Box>
	);
}
