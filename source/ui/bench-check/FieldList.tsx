import {Box} from 'ink';
import {Text} from '../Text.js';
import {answeredByRecord, type Field, type Session} from './session.js';
import {fieldHint} from './field-hint.js';
import {strayShown} from '../answer-key.js';
import {confirmationStyle} from '../verdict-style.js';
import {Prose} from '../Prose.js';

/** Props of the list of a step's fields. */
export type FieldListProps = {
	session: Session;
	fields: Field[];
	focus: number;
	/** Text being typed in the focused field. */
	buffer: string;
	/** The option highlighted in a focused choice. */
	choice: number;
	/** Why the last entry was refused, shown under the focused field. */
	message?: string;
	/** True while a note for a confirmation is being typed. */
	noteMode: boolean;
	/** Text typed on a question answered by single keys, held and shown as not taken. @default '' */
	stray?: string;
	/** How many rows the list may use. */
	rows: number;
	width: number;
};

function currentValue(session: Session, field: Field): string {
	if (field.kind === 'confirmation') {
		const status = session.evaluation.confirmations.find(({id}) => id === field.id)?.status ?? 'unanswered';
		// The note in force: the operator's, or the interlock test record's when that answers it.
		const note = session.answers.confirmations.get(field.id)?.note;
		return `${confirmationStyle[status].label}${note ? ` (${note})` : ''}`;
	}
	const entry = session.entries[field.id];
	if (entry === undefined) return '—';
	if (field.input.kind === 'choice') return field.input.options[entry] ?? entry;
	return entry;
}

function truncate(text: string, width: number): string {
	return text.length <= width ? text : `${text.slice(0, Math.max(1, width - 1))}…`;
}

/** The fields of one step: the focused one open for editing, the others one line each. */
export function FieldList({session, fields, focus, buffer, choice, message, noteMode, stray = '', rows, width}: FieldListProps) {
	// Label, hint, value, and the message (which may wrap) or a spare line.
	const focusedHeight = 3 + (message ? Math.ceil((message.length + 4) / Math.max(20, width)) : 1);
	const room = Math.max(1, rows - focusedHeight);
	const start = Math.max(0, Math.min(focus - Math.floor(room / 2), fields.length - room - 1));
	const visible = fields.slice(start, start + room + 1);
	const valueWidth = Math.max(12, Math.floor(width * 0.35));
	const labelWidth = Math.max(10, width - valueWidth - 4);
	return (
		<Box flexDirection="column">
			{start > 0 ? <Text dimColor>  ↑ {start} more</Text> : null}
			{visible.map((field, offset) => {
				const index = start + offset;
				const label = field.kind === 'input' ? field.input.label : field.confirmation.statement;
				if (index !== focus) {
					return (
						<Text key={field.id} wrap="truncate">
							{'  '}
							{truncate(label, labelWidth).padEnd(labelWidth)} {currentValue(session, field)}
						</Text>
					);
				}
				return (
					<Box key={field.id} flexDirection="column">
						<Text bold wrap="wrap">
							› {label}
						</Text>
						<Text dimColor wrap="truncate">
							{'  '}
							{noteMode ? 'note (required for not applicable) · Enter save · Esc cancel' : fieldHint(session.rules, field, answeredByRecord(session, field.id))}
						</Text>
						<FocusedValue session={session} field={field} buffer={buffer} choice={choice} noteMode={noteMode} stray={stray} />
						{message ? (
							// Indented as a block, so that a message that wraps stays under the field.
							<Box paddingLeft={2}>
								{/* Wrapped by words before Ink sees it: a line Ink breaks itself at a space starts with that space. */}
								<Prose color="red" text={message} lead="✗ " hang="  " margin={2} />
							</Box>
						) : null}
					</Box>
				);
			})}
			{start + room + 1 < fields.length ? <Text dimColor>  ↓ {fields.length - start - room - 1} more</Text> : null}
		</Box>
	);
}

function FocusedValue({session, field, buffer, choice, noteMode, stray}: {session: Session; field: Field; buffer: string; choice: number; noteMode: boolean; stray: string}) {
	if (noteMode) return <Text>  {buffer}▌</Text>;
	if (field.kind === 'confirmation' || field.input.kind === 'yes_no') {
		return (
			<Text wrap="truncate">
				{'  '}
				{currentValue(session, field)}
				{strayShown(stray)}
			</Text>
		);
	}
	if (field.input.kind === 'choice') {
		const options = Object.entries(field.input.options);
		return (
			<Text wrap="wrap">
				{'  '}
				{options.map(([id, text], index) => (
					<Text key={id} inverse={index === choice}>
						{index === choice ? `[${text}]` : ` ${text} `}{' '}
					</Text>
				))}
			</Text>
		);
	}
	return <Text>  {buffer}▌</Text>;
}
