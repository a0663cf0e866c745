import {Box, type Key} from 'ink';
import {Text} from '../Text.js';
import {useKeystrokes, type Arrival} from '../use-keystrokes.js';
import {signAloneMessage} from '../answer-key.js';
import {useRefState} from '../use-ref-state.js';
import {outcomeWords} from '../../rules/evaluate/evaluation.js';
import type {Session} from './session.js';
import {typeInto} from '../text-buffer.js';

/** What the sign-off form collects. */
export type SignOffForm = {setup: string; name: string; role: string; cosignName: string; cosignRole: string; cosignKey: string};

const fields: Array<{key: keyof SignOffForm; label: string}> = [
	{key: 'setup', label: 'Setup name'},
	{key: 'name', label: 'Your name'},
	{key: 'role', label: 'Your role'},
	{key: 'cosignName', label: 'Second signer (optional): name'},
	{key: 'cosignRole', label: 'Second signer: role'},
	{key: 'cosignKey', label: "Second signer: path to their private key file"},
];

/** The sign-off: who signs, what they are signing, then the signed record is written. */
export function SignOffScreen({session, initial, error, onSign, onBack, onHelp, active = true}: {session: Session; initial: SignOffForm; error?: string; onSign(form: SignOffForm): void; onBack(): void; /** `?` alone on an empty field or the button: the keys, then the caution in full. */ onHelp?(): void; active?: boolean}) {
	// Kept in a ref: a burst of keys is handled before React draws the next frame.
	const state = useRefState(() => ({form: initial, focus: 0, message: undefined as string | undefined}));
	const set = state.patch;
	const setFocus = (focus: number) => set({focus});
	const setMessage = (message: string | undefined) => set({message});
	useKeystrokes(handleKey, {isActive: active});
	function handleKey(input: string, key: Key, arrival: Arrival) {
		const {form, focus} = state.current;
		const onButton = focus === fields.length;
		if (key.ctrl) return;
		if (key.escape) return onBack();
		if (key.upArrow) return setFocus(Math.max(0, focus - 1));
		if (key.downArrow) return setFocus(Math.min(fields.length, focus + 1));
		if (input === '?' && arrival.alone && onHelp && (onButton || form[fields[focus]!.key] === '')) return onHelp();
		if (onButton) {
			if (!key.return) return;
			// Signing is a deliberate act: an Enter of a paste or of keys typed ahead does not sign.
			if (!arrival.alone) return setMessage(signAloneMessage);
			if (!form.name.trim()) return setMessage('Your name is needed to sign.');
			if (form.cosignName.trim() && !form.cosignKey.trim()) return setMessage("A second signer needs their private key file.");
			setMessage(undefined);
			return onSign(form);
		}
		const field = fields[focus]!;
		const change = typeInto(form[field.key], input, key);
		set({form: {...form, [field.key]: change.text}, ...(change.submit ? {focus: focus + 1} : {})});
	}
	const {form, focus, message} = state.current;
	const onButton = focus === fields.length;
	const rulesName = session.rules.rules.name;
	const who = form.name.trim() || '(your name)';
	return (
		<Box flexDirection="column">
			<Text bold>Sign-off</Text>
			<Box flexDirection="column" marginTop={1}>
				{fields.map((field, index) => (
					// The field being typed in wraps, so the end of a long value and the cursor stay in sight.
					<Text key={field.key} wrap={index === focus ? 'wrap' : 'truncate'}>
						{index === focus ? '› ' : '  '}
						{field.label.padEnd(46)} {form[field.key]}
						{index === focus ? '▌' : ''}
					</Text>
				))}
			</Box>
			<Box marginTop={1} flexDirection="column">
				<Text wrap="wrap">
					I, {who}
					{form.role.trim() ? ` (${form.role.trim()})` : ''}, performed this bench check of {form.setup.trim() || 'this setup'} under {rulesName}. Its outcome is{' '}
					{outcomeWords[session.evaluation.outcome]}. The answers are true to the best of my knowledge. This record shows which checks held; it does not say the setup is safe.
				</Text>
			</Box>
			<Box marginTop={1}>
				<Text inverse={onButton} bold>
					{onButton ? '[ Sign and write the record ]' : '  Sign and write the record  '}
				</Text>
			</Box>
			{message || error ? <Text color="red">✗ {message ?? error}</Text> : null}
		</Box>
	);
}
