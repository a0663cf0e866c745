import {Box, useInput} from 'ink';
import {Text} from './Text.js';
import {useContext, useState} from 'react';
import {deferral} from '../shared/deferral.js';
import {CautionContext} from './caution-context.js';
import {Prose} from './Prose.js';

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
		['y n a', 'yes / no / not applicable (a note is needed), each key alone'],
		['other text', 'never an answer, nor is a paste: it is shown as not taken'],
		['Backspace', 'clear text typed on a confirmation, then answer'],
		['Tab', 'write a note to an answered confirmation'],
		['PgDn PgUp', 'next / previous step (accepts what you typed)'],
		['last answer', "the step's verdicts stay: ↓ ↑ scroll, Enter goes on"],
		['Esc', 'back (asks first when a value typed or chosen is not entered)'],
		['?', 'this help'],
		['Ctrl-C', 'quit (your answers are kept as a draft)'],
	],
	summary: [
		['↑ ↓ PgUp PgDn', 'scroll'],
		['Enter', 'go to sign-off'],
		['Esc', 'back to the steps'],
		['w', 'what would flip each verdict (and back): closest calls, fixes, tornado chart'],
	],
	signoff: [
		['type', 'fill a field'],
		['↑ ↓', 'move between fields'],
		['Enter', 'next field; on the button, pressed alone, sign and write'],
		['Esc', 'back to the summary'],
	],
	'plan-open': [
		['type', 'the path of an interlock plan file (YAML)'],
		['Enter', 'open it in the planner'],
		['Esc', 'back'],
	],
	planner: [
		['↑ ↓', 'choose an access point or device'],
		['Enter', 'edit it'],
		['a / d', 'add an access point / a device'],
		['x', 'remove it (asks first)'],
		['[ ]', 'move a device earlier / later in the wiring order'],
		['f', 'every finding in full, with the verdict line'],
		['t', 'record a functional test of the plan as saved'],
		['s', 'save the plan file (comments and key order kept)'],
		['Esc', 'back (asks when there are unsaved changes)'],
		['✗ !', 'the item has a stop / advise finding'],
		['N/C N/O', 'normally closed / normally open contact'],
	],
	'plan-form': [
		['type', 'a value with its unit (8 ms, 80 mohm, 0.5 mm^2)'],
		['Enter', 'apply it; the findings follow at once'],
		['↑ ↓ Tab', 'previous / next field (applies what you typed)'],
		['← → space', 'choose an option; y n for yes / no'],
		['empty', 'leaves an optional field out of the file'],
		['Esc', 'back to the list (asks first when a change or a new item is not applied)'],
	],
	'plan-test': [
		['p f a', 'mark the step pass / fail / n/a (each key alone)'],
		['Backspace', 'clear text typed on a result (it marks nothing)'],
		['type', 'the stop time with its unit (9 ms), then a note (n/a needs one)'],
		['Enter', 'take the field and go on; on the sign line, alone, sign'],
		['←', 'back from the note to the time, from the time to the result'],
		['↑ ↓', 'previous / next step or field'],
		['PgDn', 'to the tester, the witness and the date'],
		['Esc', 'leave (asks before the entries are dropped)'],
	],
	settings: [
		['type', 'fill a field'],
		['Enter', 'check and save the field'],
		['↑ ↓', 'move between fields'],
		['Esc', 'back to the home screen'],
	],
	info: [
		['↑ ↓ PgUp PgDn', 'scroll'],
		['Enter Esc', 'back to the home screen'],
	],
	done: [
		['s', 'save these inputs as a named setup'],
		['Enter', 'back to the home screen'],
	],
};

/** Lists the keys of the current screen; `?` again shows the caution in full, any other key closes it. */
export function HelpOverlay({screen, onClose}: {screen: string; onClose(): void}) {
	const caution = useContext(CautionContext);
	const [page, setPage] = useState<'keys' | 'caution'>('keys');
	useInput((input) => (input === '?' && page === 'keys' ? setPage('caution') : onClose()));
	if (page === 'caution')
		return (
			<Box flexDirection="column" borderStyle="single" paddingX={1}>
				<Text bold>Caution</Text>
				{/* Inside the border and padding: four columns fewer. */}
				{caution ? <Prose text={caution} margin={4} lines /> : null}
				<Prose text={deferral} margin={4} />
				<Text dimColor>Any key closes this page.</Text>
			</Box>
		);
	return (
		<Box flexDirection="column" borderStyle="single" paddingX={1}>
			<Text bold>Keys</Text>
			{(screenKeys[screen] ?? screenKeys['home']!).map(([keys, meaning]) => (
				<Text key={keys} wrap="wrap">
					{keys.padEnd(14)} {meaning}
				</Text>
			))}
			<Text dimColor>? again: the caution in full. Any key closes this help.</Text>
		</Box>
	);
}
