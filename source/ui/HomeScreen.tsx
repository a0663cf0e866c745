import {Box} from 'ink';
import {Text} from './Text.js';
import {Menu} from './Menu.js';
import {Prose} from './Prose.js';
import {deferral} from '../shared/deferral.js';

/** What the home screen can lead to. */
export type HomeChoice = {action: 'shipped'} | {action: 'start'} | {action: 'resume'} | {action: 'setup'; name: string} | {action: 'audit'} | {action: 'planner'} | {action: 'rules'} | {action: 'settings'} | {action: 'quit'};

/** The home screen: start, resume or audit, the rules in force and settings; the caution always shown. */
export function HomeScreen(props: {/** The rule file named in the settings does not load: no check is offered until it is fixed or the shipped policy is chosen. */ broken?: {file: string; settingsPath: string; problems: string[]}; rulesName: string; rulesFile: string; rulesSha256: string; caution: string; draft?: {setup: string; savedAt: string}; setups: string[]; /** The item chosen last time: the menu opens on it. */ last?: string; onChoose(choice: HomeChoice, key: string): void}) {
	const items: Array<{key: string; label: string; value: HomeChoice}> = [{key: 'start', label: props.draft ? 'Start a new bench check (replaces the draft)' : 'Start a bench check', value: {action: 'start'}}];
	if (props.draft) items.unshift({key: 'resume', label: `Resume the draft: ${props.draft.setup || 'unnamed setup'} (saved ${props.draft.savedAt.slice(0, 16).replace('T', ' ')})`, value: {action: 'resume'}});
	for (const name of props.setups) items.push({key: `setup-${name}`, label: `Start from the saved setup ${name}`, value: {action: 'setup', name}});
	if (props.broken) {
		items.splice(0, items.length, {key: 'fix', label: 'Settings: fix or clear the rule file', value: {action: 'settings'}}, {key: 'shipped', label: 'Use the shipped policy for this session', value: {action: 'shipped'}});
	}
	items.push(
		{key: 'audit', label: 'Audit the records folder', value: {action: 'audit'}},
		...(props.broken ? [] : [{key: 'rules', label: 'Rules in force', value: {action: 'rules'} as HomeChoice}]),
		...(props.broken ? [] : [{key: 'settings', label: 'Settings (operator, role, records folder, rule file)', value: {action: 'settings'} as HomeChoice}]),
		{key: 'planner', label: 'Interlock planner (open a plan file)', value: {action: 'planner'}},
		{key: 'quit', label: 'Quit', value: {action: 'quit'}},
	);
	return (
		<Box flexDirection="column">
			{props.broken ? (
				<BrokenRules {...props.broken} />
			) : (
				<>
					<Text>
						Rules: <Text bold>{props.rulesName}</Text>
					</Text>
					<Text dimColor>
						{'       '}
						{props.rulesFile} · sha256 {props.rulesSha256.slice(0, 16)}
					</Text>
				</>
			)}
			<Box marginY={1} flexDirection="column">
				{/* A new menu (the rule file fixed or the shipped policy chosen) starts at its first item. */}
				<Menu key={props.broken ? 'broken' : 'rules'} items={items} {...(props.last ? {initial: props.last} : {})} onSelect={(item) => props.onChoose(item.value, item.key)} />
			</Box>
			<Text bold>Caution</Text>
			<Prose text={props.caution} lines />
			<Prose dimColor text={deferral} />
		</Box>
	);
}

/** Which setting names the rule file that does not load, its first problems, and where the settings live. */
function BrokenRules({file, settingsPath, problems}: {file: string; settingsPath: string; problems: string[]}) {
	return (
		<Box flexDirection="column">
			<Text color="red" wrap="wrap">
				✗ No check can start: the rule file in the setting “Rule file” does not load ({file}).
			</Text>
			{problems.slice(0, 2).map((problem, index) => (
				<Text key={index} wrap="truncate">
					{'  '}
					{problem}
				</Text>
			))}
			{problems.length > 2 ? <Text dimColor>{`  … ${problems.length - 2} more (prelase rules validate shows them all)`}</Text> : null}
			<Text dimColor wrap="truncate">
				{'  '}Settings live in {settingsPath}
			</Text>
		</Box>
	);
}
