import {Box, Text} from 'ink';
import {useKeystrokes} from '../use-keystrokes.js';
import {useState} from 'react';
import {checkFigures} from '../../render/check-text.js';
import {deferral} from '../../shared/deferral.js';
import type {CheckResult} from '../../rules/evaluate/evaluation.js';
import {stripControl} from '../../shared/text.js';
import {wrap} from '../../shared/wrap.js';
import {countVerdicts} from '../../rules/evaluate/verdict-words.js';
import type {Session} from './session.js';
import {confirmationStyle, outcomeStyle, verdictStyle} from '../verdict-style.js';

const order = {fail: 0, advise: 1, open: 2, pass: 3, skip: 4} as const;

type Line = {key: string; text: string; color?: string; dim?: boolean; bold?: boolean};

function checkLines(check: CheckResult): Line[] {
	const style = verdictStyle[check.verdict];
	const lines: Line[] = [{key: check.id, text: `${style.label.padEnd(10)}${stripControl(check.title)}`, color: style.color}];
	const figures = checkFigures(check) ?? (check.needs?.length ? `needs ${check.needs.join(', ')}` : check.error);
	if (figures) lines.push({key: `${check.id}-figures`, text: `          ${stripControl(figures)}`, dim: true});
	if (check.message && check.verdict !== 'pass') lines.push({key: `${check.id}-message`, text: `          ${stripControl(check.message)}`});
	return lines;
}

/** Every check, failures first, then advice, open checks and passes; confirmations; the outcome and the caution. */
export function SummaryScreen({session, rows, width = 80, onSign, onBack, onHelp, active = true}: {session: Session; rows: number; width?: number; onSign(): void; onBack(): void; onHelp(): void; active?: boolean}) {
	const [offset, setOffset] = useState(0);
	const {evaluation} = session;
	const sorted = [...evaluation.checks].filter((check) => check.verdict !== 'skip').sort((a, b) => order[a.verdict] - order[b.verdict]);
	const unwrapped: Line[] = sorted.flatMap(checkLines);
	for (const entry of evaluation.confirmations.filter(({status}) => status !== 'yes' && status !== 'skip')) {
		const style = confirmationStyle[entry.status];
		unwrapped.push({key: `c-${entry.id}`, text: `${style.label.padEnd(13)}${stripControl(entry.statement)}${entry.note ? ` (${stripControl(entry.note)})` : ''}`, color: style.color});
	}
	if (session.interlockTest?.status === 'current') unwrapped.push({key: 'interlock', text: `${'Interlock'.padEnd(13)}${stripControl(session.interlockTest.text)}`, color: 'green'});
	if (evaluation.missingInputs.length > 0) unwrapped.push({key: 'missing', text: `Inputs not given: ${evaluation.missingInputs.join(', ')}`, color: 'cyan'});
	// Long lines wrap (under their own indent) rather than being cut, so every note and message can be read.
	const wrapped: Line[] = unwrapped.flatMap((line) => {
		const indent = /^\s*(?:\S+ \S+\s+|\S+\s+)?/.exec(line.text)?.[0].length ?? 0;
		const pieces = wrap(line.text.slice(indent), Math.max(20, width - 1), ' '.repeat(Math.min(indent, 14)));
		pieces[0] = line.text.slice(0, indent) + pieces[0]!.trimStart();
		return pieces.map((text, index) => ({...line, key: `${line.key}-${index}`, text}));
	});
	const room = Math.max(3, rows - 12);
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
	}, {isActive: active});
	const counts = countVerdicts(evaluation.checks);
	const outcome = outcomeStyle[evaluation.outcome];
	return (
		<Box flexDirection="column">
			<Text bold>
				Summary: {counts.fail} fail · {counts.advise} advise · {counts.open} open · {counts.pass} pass · {counts.skip} skip
			</Text>
			<Box flexDirection="column" marginTop={1}>
				{offset > 0 ? <Text dimColor>↑ {offset} more</Text> : null}
				{lines.slice(offset, offset + room).map((line) => (
					<Text key={line.key} wrap="truncate" {...(line.color ? {color: line.color} : {})} dimColor={line.dim ?? false}>
						{line.text}
					</Text>
				))}
				{offset < maxOffset ? <Text dimColor>↓ {maxOffset - offset} more</Text> : null}
			</Box>
			<Box marginTop={1}>
				<Text bold>
					Outcome: <Text color={outcome.color}>{outcome.label}</Text>
				</Text>
			</Box>
			<Text dimColor wrap="wrap">
				{stripControl(session.rules.rules.caution)}
			</Text>
			<Text dimColor wrap="wrap">
				{deferral}
			</Text>
		</Box>
	);
}
