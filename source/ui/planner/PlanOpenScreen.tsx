import {Box, type Key} from 'ink';
import {Text} from '../Text.js';
import {useRefState} from '../use-ref-state.js';
import {typeInto} from '../text-buffer.js';
import {useKeystrokes} from '../use-keystrokes.js';

/** Props of the question which plan file to open. */
export type PlanOpenScreenProps = {
	/** The path shown at first: the last plan opened, or empty. */
	initial: string;
	/** Problems from a failed attempt to open (a path given on the command line). */
	problems?: string[];
	/** Opens the plan; returns the problems when it cannot be opened. */
	onOpen(path: string): string[] | undefined;
	onBack(): void;
	onHelp(): void;
	/** @default true */
	active?: boolean;
};

/** Asks for the interlock plan file to open in the planner. */
export function PlanOpenScreen({initial, problems = [], onOpen, onBack, onHelp, active = true}: PlanOpenScreenProps) {
	const state = useRefState(() => ({path: initial, problems}));
	useKeystrokes(handleKey, {isActive: active});
	function handleKey(input: string, key: Key) {
		if (key.ctrl) return;
		if (key.escape) return onBack();
		if (input === '?' && state.current.path === '') return onHelp();
		const change = typeInto(state.current.path, input, key);
		state.current = {...state.current, path: change.text};
		if (change.submit) {
			const path = change.text.trim();
			state.current = {...state.current, problems: path ? (onOpen(path) ?? []) : ['Type the path of a plan file first.']};
		}
		state.redraw();
	}
	return (
		<Box flexDirection="column">
			<Text bold>Interlock planner</Text>
			<Text wrap="wrap">Lists a plan's access points and devices, edits them and shows the findings as they change.</Text>
			<Box marginTop={1}>
				<Text wrap="wrap">
					› Plan file {state.current.path}▌
				</Text>
			</Box>
			{state.current.problems.map((line, index) => (
				<Text key={index} color="red" wrap="wrap">
					✗ {line}
				</Text>
			))}
			<Box marginTop={1}>
				<Text dimColor wrap="wrap">
					A relative path starts from the folder prelase was started in.
				</Text>
			</Box>
		</Box>
	);
}
