import {Box, Text, useInput} from 'ink';

/** Keys of each screen, as the help overlay lists them. */
export const screenKeys: Record<string, Array<[string, string]>> = {
	home: [
		['↑ ↓', 'choose'],
		['Enter', 'open'],
		['Ctrl-C', 'quit'],
	],
	step: [
		['type', 'enter a value with its unit (250 mA, 25 degC, 5 %)'],
		['Enter', 'accept the value and go to the next field'],
		['↑ ↓', 'previous / next field (accepts what you typed)'],
		['← →', 'choose an option'],
		['y n a', 'yes / no / not applicable (a note is needed)'],
		['Tab', 'add a note to a confirmation'],
		['PgDn PgUp', 'next / previous step'],
		['Esc', 'back'],
		['?', 'this help'],
		['Ctrl-C', 'quit (your answers are kept as a draft)'],
	],
	summary: [
		['↑ ↓ PgUp PgDn', 'scroll'],
		['Enter', 'go to sign-off'],
		['Esc', 'back to the steps'],
	],
	signoff: [
		['type', 'fill a field'],
		['↑ ↓', 'move between fields'],
		['Enter', 'next field; on the button, sign and write the record'],
		['Esc', 'back to the summary'],
	],
	done: [
		['s', 'save these inputs as a named setup'],
		['Enter', 'back to the home screen'],
	],
};

/** Lists the keys of the current screen; any key closes it. */
export function HelpOverlay({screen, onClose}: {screen: string; onClose(): void}) {
	useInput(() => onClose());
	return (
		<Box flexDirection="column" borderStyle="single" paddingX={1}>
			<Text bold>Keys</Text>
			{(screenKeys[screen] ?? screenKeys['home']!).map(([keys, meaning]) => (
				<Text key={keys} wrap="wrap">
					{keys.padEnd(14)} {meaning}
				</Text>
			))}
			<Text dimColor>Any key closes this help.</Text>
		</Box>
	);
}
