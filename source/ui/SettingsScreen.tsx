import {Box, Text, useInput, type Key} from 'ink';
import {useState} from 'react';
import type {Settings} from '../settings.js';
import {eachLine, typeInto} from './text-buffer.js';

const fields: Array<{key: keyof Settings; label: string}> = [
	{key: 'operator', label: 'Operator name'},
	{key: 'role', label: 'Role'},
	{key: 'recordsFolder', label: 'Records folder'},
	{key: 'rulesFile', label: 'Rule file (empty: the shipped policy)'},
];

/** Edits the settings; each field is saved when Enter is pressed on it. */
export function SettingsScreen({initial, path, onSave, onBack}: {initial: Settings; path: string; onSave(settings: Settings): void; onBack(): void}) {
	const [values, setValues] = useState<Settings>(initial);
	const [focus, setFocus] = useState(0);
	const [saved, setSaved] = useState<string | undefined>();
	useInput((chunk, chunkKey) => eachLine(chunk, chunkKey, handleKey));
	function handleKey(input: string, key: Key) {
		if (key.ctrl) return;
		if (key.escape) return onBack();
		if (key.upArrow) return setFocus(Math.max(0, focus - 1));
		if (key.downArrow) return setFocus(Math.min(fields.length - 1, focus + 1));
		const field = fields[focus]!;
		const change = typeInto(values[field.key] ?? '', input, key);
		const next = {...values, [field.key]: change.text};
		setValues(next);
		if (change.submit) {
			onSave({[field.key]: change.text.trim()});
			setSaved(`${field.label} saved.`);
			setFocus(Math.min(fields.length - 1, focus + 1));
		}
	}
	return (
		<Box flexDirection="column">
			<Text bold>Settings</Text>
			<Text dimColor>{path}</Text>
			<Box marginTop={1} flexDirection="column">
				{fields.map((field, index) => (
					<Text key={field.key} wrap="truncate">
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
