import {Box, Text, type Key} from 'ink';
import {useKeystrokes} from './use-keystrokes.js';
import {useRefState} from './use-ref-state.js';
import type {Settings} from '../services/settings.js';
import {typeInto} from './text-buffer.js';

const fields: Array<{key: keyof Settings; label: string}> = [
	{key: 'operator', label: 'Operator name'},
	{key: 'role', label: 'Role'},
	{key: 'recordsFolder', label: 'Records folder'},
	{key: 'rulesFile', label: 'Rule file (empty: the shipped policy)'},
];

/** Edits the settings; each field is saved when Enter is pressed on it. */
export function SettingsScreen({initial, path, onSave, onBack}: {initial: Settings; path: string; onSave(settings: Settings): void; onBack(): void}) {
	// Kept in a ref: a burst of keys is handled before React draws the next frame.
	const state = useRefState(() => ({values: initial, focus: 0, saved: undefined as string | undefined}));
	const set = state.patch;
	const setFocus = (focus: number) => set({focus});
	useKeystrokes(handleKey);
	function handleKey(input: string, key: Key) {
		const {values, focus} = state.current;
		if (key.ctrl) return;
		if (key.escape) return onBack();
		if (key.upArrow) return setFocus(Math.max(0, focus - 1));
		if (key.downArrow) return setFocus(Math.min(fields.length - 1, focus + 1));
		const field = fields[focus]!;
		const change = typeInto(values[field.key] ?? '', input, key);
		const next = {...values, [field.key]: change.text};
		if (!change.submit) return set({values: next});
		onSave({[field.key]: change.text.trim()});
		set({values: next, saved: `${field.label} saved.`, focus: Math.min(fields.length - 1, focus + 1)});
	}
	const {values, focus, saved} = state.current;
	return (
		<Box flexDirection="column">
			<Text bold>Settings</Text>
			<Text dimColor>{path}</Text>
			<Box marginTop={1} flexDirection="column">
				{fields.map((field, index) => (
					// The field being typed in wraps, so the end of a long value and the cursor stay in sight.
					<Text key={field.key} wrap={index === focus ? 'wrap' : 'truncate'}>
						{index === focus ? '› ' : '  '}
						{field.label.padEnd(40)} {values[field.key] ?? ''}
						{index === focus ? '▌' : ''}
					</Text>
				))}
			</Box>
			{saved ? <Text color="green">✓ {saved}</Text> : null}
			<Text dimColor>Enter saves the field · ↑ ↓ move · Esc back</Text>
		</Box>
	);
}
