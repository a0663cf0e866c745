import {Box, Text} from 'ink';
import SelectInput from 'ink-select-input';
import {deferral} from '../shared/deferral.js';
import {stripControl} from '../shared/text.js';

/** What the home screen can lead to. */
export type HomeChoice = {action: 'start'} | {action: 'resume'} | {action: 'setup'; name: string} | {action: 'audit'} | {action: 'planner'} | {action: 'rules'} | {action: 'settings'} | {action: 'quit'};

/** The home screen: start, resume or audit, the rules in force and settings; the caution always shown. */
export function HomeScreen(props: {rulesName: string; rulesFile: string; rulesSha256: string; caution: string; draft?: {setup: string; savedAt: string}; setups: string[]; onChoose(choice: HomeChoice): void}) {
	const items: Array<{key: string; label: string; value: HomeChoice}> = [{key: 'start', label: props.draft ? 'Start a new bench check (replaces the draft)' : 'Start a bench check', value: {action: 'start'}}];
	if (props.draft) items.unshift({key: 'resume', label: `Resume the draft: ${stripControl(props.draft.setup || 'unnamed setup')} (saved ${props.draft.savedAt.slice(0, 16).replace('T', ' ')})`, value: {action: 'resume'}});
	for (const name of props.setups) items.push({key: `setup-${name}`, label: `Start from the saved setup ${stripControl(name)}`, value: {action: 'setup', name}});
	items.push(
		{key: 'audit', label: 'Audit the records folder', value: {action: 'audit'}},
		{key: 'rules', label: 'Rules in force', value: {action: 'rules'}},
		{key: 'settings', label: 'Settings (operator, role, records folder, rule file)', value: {action: 'settings'}},
		{key: 'planner', label: 'Interlock planner (open a plan file)', value: {action: 'planner'}},
		{key: 'quit', label: 'Quit', value: {action: 'quit'}},
	);
	return (
		<Box flexDirection="column">
			<Text>
				Rules: <Text bold>{stripControl(props.rulesName)}</Text>
			</Text>
			<Text dimColor>
				{'       '}
				{stripControl(props.rulesFile)} · sha256 {props.rulesSha256.slice(0, 16)}
			</Text>
			<Box marginY={1} flexDirection="column">
				<SelectInput items={items} onSelect={(item) => props.onChoose(item.value)} />
			</Box>
			<Text bold>Caution</Text>
			<Text wrap="wrap">{stripControl(props.caution)}</Text>
			<Text dimColor wrap="wrap">
				{deferral}
			</Text>
		</Box>
	);
}
