import {Box} from 'ink';
import {Text} from './Text.js';
import {useKeystrokes} from './use-keystrokes.js';
import {useState} from 'react';
import {outcomeStyle} from './verdict-style.js';
import {commitNote} from '../render/record-commit-text.js';
import type {Problem} from '../shared/problems.js';

/** After signing: where the record is, and saving the inputs as a named setup. */
export function DoneScreen(props: {path: string; fingerprint: string; outcome: keyof typeof outcomeStyle; setup: string; /** In a records repository: the record's commit, or why it was not committed. */ commit?: string | Problem; onSaveSetup(): string; onHome(): void}) {
	const [saved, setSaved] = useState<string | undefined>();
	useKeystrokes((input, key) => {
		if (input === 's' && !saved) setSaved(props.onSaveSetup());
		else if (key.return || key.escape) props.onHome();
	});
	const outcome = outcomeStyle[props.outcome];
	return (
		<Box flexDirection="column">
			<Text bold color="green">
				✓ Signed record written
			</Text>
			<Text wrap="wrap">{props.path}</Text>
			<Text>Key {props.fingerprint}</Text>
			{props.commit === undefined ? null : (
				<Text wrap="wrap" {...(typeof props.commit === 'string' ? {} : {color: 'red'})}>
					{commitNote(props).trimEnd()}
				</Text>
			)}
			<Text>
				Outcome: <Text color={outcome.color}>{outcome.label}</Text>
			</Text>
			<Box marginTop={1} flexDirection="column">
				{saved ? <Text color="green">✓ Setup saved: {saved}</Text> : <Text>s: save these inputs as the setup “{props.setup || 'unnamed'}” for the next check</Text>}
				<Text>Enter: home</Text>
			</Box>
		</Box>
	);
}
