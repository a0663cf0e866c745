import {Box} from 'ink';
import {Text} from './Text.js';
import {useState} from 'react';
import {useKeystrokes} from './use-keystrokes.js';

/** Cuts a line into pieces of at most `width` columns, keeping its spaces (tables and indents stay aligned). */
function fold(line: string, width: number): string[] {
	const characters = [...line];
	if (characters.length <= width) return [line];
	const pieces: string[] = [];
	for (let start = 0; start < characters.length; start += width) pieces.push(characters.slice(start, start + width).join(''));
	return pieces;
}

/** A page of lines (rules in force, audit results, messages) that scrolls within `rows`; Esc or Enter goes back. */
export function InfoScreen({title, lines, rows = 20, width = 80, onBack}: {title: string; lines: string[]; /** Rows the page may use, title included. @default 20 */ rows?: number; /** @default 80 */ width?: number; onBack(): void}) {
	const [offset, setOffset] = useState(0);
	const shown = lines.flatMap((line) => fold(line, Math.max(20, width)));
	// Title, a blank line, and a line each for the scroll marks above and below.
	const room = Math.max(3, rows - 4);
	const maxOffset = Math.max(0, shown.length - room);
	const at = Math.min(offset, maxOffset);
	useKeystrokes((_input, key) => {
		if (key.escape || key.return) onBack();
		else if (key.upArrow) setOffset(Math.max(0, at - 1));
		else if (key.downArrow) setOffset(Math.min(maxOffset, at + 1));
		else if (key.pageDown) setOffset(Math.min(maxOffset, at + room));
		else if (key.pageUp) setOffset(Math.max(0, at - room));
	});
	return (
		<Box flexDirection="column">
			<Text bold wrap="truncate">
				{title}
			</Text>
			<Box marginTop={1} flexDirection="column">
				{at > 0 ? <Text dimColor>↑ {at} more</Text> : null}
				{shown.slice(at, at + room).map((line, index) => (
					<Text key={at + index} wrap="truncate">
						{line === '' ? ' ' : line}
					</Text>
				))}
				{at < maxOffset ? <Text dimColor>↓ {maxOffset - at} more</Text> : null}
			</Box>
		</Box>
	);
}
