import {Box} from 'ink';
import {Text} from '../Text.js';
import {runFields, type RunForm} from './wire-run-entry.js';
import {discardQuestion} from '../discard-question.js';
import {Prose} from '../Prose.js';

/** The small form of a device's wire run to the next device: size and length (and conductors), applied together. */
export function WireRunForm({device, run}: {device: string; run: RunForm}) {
	const focused = runFields[run.focus];
	return (
		<Box flexDirection="column">
			<Text bold wrap="truncate">
				Wire run from {device} to the next device
			</Text>
			<Box marginTop={1} flexDirection="column">
				{runFields.map((field, index) => (
					<Box key={field.key} flexDirection="column">
						<Text wrap="truncate">
							{index === run.focus ? '› ' : '  '}
							{field.label.padEnd(30)}
							{run.entries[field.key]}
							{index === run.focus ? '▌' : ''}
						</Text>
						{index === run.focus && run.message ? <Prose color="red" text={run.message} lead="  ✗ " hang="    " /> : null}
					</Box>
				))}
				<Text bold={run.focus === runFields.length}>{run.focus === runFields.length ? '› ' : '  '}[ Apply the wire run ]</Text>
				{run.focus === runFields.length && run.message ? <Prose color="red" text={run.message} lead="  ✗ " hang="    " /> : null}
			</Box>
			{run.asking ? (
				<Text bold wrap="wrap">
					{discardQuestion('the wire run')}
				</Text>
			) : (
				<Text dimColor wrap="truncate">
					{focused ? focused.hint : 'Enter applies size and length together; all empty removes the run'}
				</Text>
			)}
		</Box>
	);
}
