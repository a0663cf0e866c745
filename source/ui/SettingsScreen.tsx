import {Box, type Key} from 'ink';
import {Text} from './Text.js';
import {useKeystrokes, type Arrival} from './use-keystrokes.js';
import {useRefState} from './use-ref-state.js';
import type {Settings} from '../services/settings.js';
import {typeInto} from './text-buffer.js';
import {wrap} from '../shared/wrap.js';
import {discardAnswer, discardQuestion} from './discard-question.js';

const fields: Array<{key: keyof Settings; label: string}> = [
	{key: 'operator', label: 'Operator name'},
	{key: 'role', label: 'Role'},
	{key: 'recordsFolder', label: 'Records folder'},
	{key: 'rulesFile', label: 'Rule file (empty: the shipped policy)'},
];

/** What a field's check says of a value: the value to save (a path made absolute), or why it cannot be saved. */
export type SettingCheck = (typed: string) => {ok: true; value: string} | {ok: false; problems: string[]};

/** Edits the settings; each field is checked (where it has a check) and saved when Enter is pressed on it. */
export function SettingsScreen({initial, path, onSave, onBack, onHelp, active = true, check = {}}: {initial: Settings; path: string; onSave(settings: Settings): void; onBack(): void; /** `?` alone on an empty field: the keys, then the caution in full. */ onHelp?(): void; /** False while the help covers the screen. @default true */ active?: boolean; /** Checks by field: a value that fails is not saved, and its problems are shown under the fields. */ check?: Partial<Record<keyof Settings, SettingCheck>>}) {
	// Kept in a ref: a burst of keys is handled before React draws the next frame.
	const state = useRefState(() => ({values: initial, stored: initial, focus: 0, saved: undefined as string | undefined, problems: [] as string[], asking: false}));
	const set = state.patch;
	const setFocus = (focus: number) => set({focus});
	useKeystrokes(handleKey, {isActive: active});
	function handleKey(input: string, key: Key, arrival: Arrival) {
		const {values, focus, stored} = state.current;
		if (key.ctrl) return;
		if (state.current.asking) return discardAnswer(input, arrival) === 'discard' ? onBack() : set({asking: false});
		// Esc never drops a change silently: a value typed and not saved is asked about first.
		if (key.escape) return fields.some((field) => (values[field.key] ?? '') !== (stored[field.key] ?? '')) ? set({asking: true}) : onBack();
		if (key.upArrow) return set({focus: Math.max(0, focus - 1), problems: []});
		if (key.downArrow) return set({focus: Math.min(fields.length - 1, focus + 1), problems: []});
		const field = fields[focus]!;
		if (input === '?' && arrival.alone && onHelp && (values[field.key] ?? '') === '') return onHelp();
		const change = typeInto(values[field.key] ?? '', input, key);
		const next = {...values, [field.key]: change.text};
		if (!change.submit) return set({values: next});
		const checked = check[field.key]?.(change.text) ?? {ok: true, value: change.text.trim()};
		// A value that fails its check is kept in the field to be corrected, and nothing is saved.
		if (!checked.ok) return set({values: next, saved: undefined, problems: checked.problems});
		onSave({[field.key]: checked.value});
		set({values: {...values, [field.key]: checked.value}, stored: {...stored, [field.key]: checked.value}, saved: `${field.label} saved.`, problems: [], focus: Math.min(fields.length - 1, focus + 1)});
	}
	const {values, focus, saved, problems, asking, stored} = state.current;
	const changed = fields.find((field) => (values[field.key] ?? '') !== (stored[field.key] ?? ''));
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
			{asking && changed ? <Text bold wrap="wrap">{discardQuestion(changed.label.replace(/ \(.*\)$/, '').toLowerCase())}</Text> : null}
			{problems.length > 0 ? <Text color="red">✗ Not saved; fix this and press Enter again, or Esc to leave it as it was:</Text> : null}
			{problems.slice(0, 4).map((problem, index) => (
				<Text key={index} color="red" lines>
					{wrap(problem, 78, '  ').join('\n')}
				</Text>
			))}
		</Box>
	);
}
