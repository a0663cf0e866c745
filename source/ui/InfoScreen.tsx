import {Box, Text} from 'ink';
import {useKeystrokes} from './use-keystrokes.js';
import {stripControl} from '../shared/text.js';

/** A page of lines (rules in force, audit results, messages); Esc or Enter goes back. */
export function InfoScreen({title, lines, onBack}: {title: string; lines: string[]; onBack(): void}) {
	useKeystrokes((_input, key) => {
		if (key.escape || key.return) onBack();
	});
	return (
		<Box flexDirection="column">
			<Text bold>{title}</Text>
			<Box marginTop={1} flexDirection="column">
				{lines.map((line, index) => (
					<Text key={index} wrap="wrap">
						{stripControl(line)}
					</Text>
				))}
			</Box>
			<Box marginTop={1}>
				<Text dimColor>Enter or Esc: back</Text>
			</Box>
		</Box>
	);
}
