import {Box} from 'ink';
import {Text} from '../Text.js';
import {deferral} from '../../shared/deferral.js';
import {displayPath} from '../../shared/display-path.js';
import {interlockTestCaution} from '../../interlock/functional-test/test-record.js';
import {strayShown} from '../answer-key.js';
import {entryCounts, entryOutcome, peopleFields, signRow, type StepEntry, type TestEntry} from './test-entry.js';
import {commitNote} from '../../render/record-commit-text.js';

const markStyle: Record<NonNullable<StepEntry['result']>, {label: string; color: string}> = {
	pass: {label: '✓ pass', color: 'green'},
	fail: {label: '✗ FAIL', color: 'red'},
	not_applicable: {label: '– n/a', color: 'gray'},
};

const outcomeStyle = {passed: {label: 'PASSED', color: 'green'}, failed: {label: 'FAILED', color: 'red'}} as const;

/** The key line of the test in progress: its keys change with what is in focus. */
export function testKeyLine(entry: TestEntry): string {
	if (entry.recorded) return 'Enter back to the planner';
	if (entry.leaving) return 'd discard the entries and leave · Esc stay';
	if (entry.row === signRow(entry)) return 'Enter sign and write the record · ↑ back · Esc leave · ? help';
	if (entry.row >= entry.steps.length) return 'type · Enter next · ↑ ↓ move · Esc leave';
	if (entry.part !== 'result') return 'type · Enter next · ← back to the result · ↑ ↓ step · Esc leave';
	return 'p pass · f fail · a n/a · Enter next · ↑ ↓ step · PgDn sign-off · ? help';
}

/** What the head says of a plan with stop findings. */
const stopLine = (stops: number) => `✗ The plan has ${stops} stop finding${stops === 1 ? '' : 's'}: this test will be recorded as FAILED whatever the steps show.`;

const signNote = "The tester signs with this machine's operator key; with a key file, the witness signs too.";

/** The head of the test: the plan as tested, and its stop findings in plain sight (with any, the test fails). */
function Head({entry}: {entry: TestEntry}) {
	const {tested, sheet, stops} = entry;
	return (
		<Box flexDirection="column">
			<Text bold wrap="truncate">
				Record a test: {tested.plan.name}
			</Text>
			<Text dimColor wrap="truncate">
				{displayPath(tested.file)} as saved · limit {sheet.limit} · test every {sheet.interval}
			</Text>
			{stops > 0 ? (
				<Text bold color="red" wrap="wrap">
					{stopLine(stops)}
				</Text>
			) : (
				<Text wrap="truncate">Plan findings: 0 stop</Text>
			)}
		</Box>
	);
}

/** One line of the step list: number, subject, result, stop time and note. */
function StepLine({entry, index}: {entry: TestEntry; index: number}) {
	const step = entry.sheet.steps[index]!;
	const given = entry.steps[index]!;
	const chosen = entry.row === index;
	const style = given.result ? markStyle[given.result] : undefined;
	const extra = [given.stoppedIn.trim(), given.note.trim()].filter(Boolean).join(' · ');
	return (
		<Text wrap="truncate" inverse={chosen}>
			{chosen ? '› ' : '  '}
			{String(step.number).padStart(2)} {step.subject.padEnd(34)} <Text {...(style ? {color: style.color} : {})}>{(style?.label ?? '·').padEnd(7)}</Text> {extra}
		</Text>
	);
}

/** A label beside text that wraps under itself, not under the label. */
function Labelled({label, text}: {label: string; text: string}) {
	return (
		<Box>
			<Box width={8} flexShrink={0}>
				<Text>{label}</Text>
			</Box>
			<Text wrap="wrap" lines>{text}</Text>
		</Box>
	);
}

/** The step in focus in full: what to do, what must be seen, and its parts. */
function StepDetail({entry}: {entry: TestEntry}) {
	const step = entry.sheet.steps[entry.row]!;
	const given = entry.steps[entry.row]!;
	const cursor = (part: TestEntry['part']) => (entry.part === part ? '▌' : '');
	const focus = (part: TestEntry['part']) => (entry.part === part ? '› ' : '  ');
	return (
		<Box flexDirection="column" marginTop={1}>
			<Text bold wrap="truncate">
				Step {step.number} of {entry.steps.length}: {step.subject}
			</Text>
			<Labelled label="Do" text={step.action} />
			<Labelled label="Expect" text={step.expect} />
			<Text wrap="truncate">
				{focus('result')}Result      {given.result ? markStyle[given.result].label : '(p pass · f fail · a n/a)'}
				{entry.part === 'result' ? strayShown(entry.stray ?? '') : ''}
			</Text>
			<Text wrap="truncate">
				{focus('time')}Stopped in  {given.stoppedIn}
				{cursor('time')}
				{entry.part === 'time' && !given.stoppedIn ? <Text dimColor> optional, with its unit: 9 ms</Text> : null}
			</Text>
			<Text wrap="truncate">
				{focus('note')}Note        {given.note}
				{cursor('note')}
				{entry.part === 'note' && !given.note ? <Text dimColor> {given.result === 'not_applicable' ? 'needed: why, and who accepted it' : 'optional'}</Text> : null}
			</Text>
		</Box>
	);
}

/** The tester, the witness and the date, the summary of the steps, and the sign line. */
function SignOff({entry}: {entry: TestEntry}) {
	const counts = entryCounts(entry);
	const outcome = entryOutcome(entry);
	const onSign = entry.row === signRow(entry);
	return (
		<Box flexDirection="column" marginTop={1}>
			{peopleFields.map((field, offset) => {
				const chosen = entry.row === entry.steps.length + offset;
				return (
					<Text key={field.key} wrap="truncate">
						{chosen ? '› ' : '  '}
						{field.label.padEnd(28)} {entry.people[field.key]}
						{chosen ? '▌' : ''}
					</Text>
				);
			})}
			<Text bold>
				Steps: {counts.pass} pass · {counts.fail} fail · {counts.notApplicable} n/a{counts.open > 0 ? ` · ${counts.open} not yet marked` : ''}
			</Text>
			{outcome ? (
				<Text wrap="wrap">
					If signed now: <Text bold color={outcomeStyle[outcome.outcome].color}>{outcomeStyle[outcome.outcome].label}</Text> — {outcome.text}
				</Text>
			) : null}
			<Text inverse={onSign} bold>
				{onSign ? '[ Sign and write the record ]' : '  Sign and write the record  '}
			</Text>
			<Text dimColor wrap="wrap">
				{signNote}
			</Text>
		</Box>
	);
}

/** After signing: where the record is, its outcome, and the cautions. */
function Recorded({entry}: {entry: TestEntry}) {
	const recorded = entry.recorded!;
	const style = outcomeStyle[recorded.outcome];
	return (
		<Box flexDirection="column">
			<Text bold>
				Interlock test of {entry.tested.plan.name}, {recorded.testedOn}, by {recorded.tester}: <Text color={style.color}>{style.label}</Text>
			</Text>
			<Text wrap="wrap" lines>{recorded.outcomeText}</Text>
			<Text wrap="wrap">Record written: {recorded.path}</Text>
			<Text wrap="wrap">
				Signed with key {recorded.fingerprint}
				{recorded.keyCreated ? ' (a new key, created now; share it with: prelase keys export)' : ''}
			</Text>
			{recorded.commit === undefined ? null : (
				<Text wrap="wrap" {...(typeof recorded.commit === 'string' ? {} : {color: 'red'})}>
					{commitNote(recorded).trimEnd()}
				</Text>
			)}
			<Box marginTop={1} flexDirection="column">
				<Text wrap="wrap">{interlockTestCaution}</Text>
				<Text wrap="wrap">{deferral}</Text>
			</Box>
		</Box>
	);
}

/** Recording a functional test of the plan as saved: the sheet's steps one by one, who tested, then signing. */
export function TestRecordScreen({entry, rows, width}: {entry: TestEntry; rows: number; width: number}) {
	if (entry.recorded) return <Recorded entry={entry} />;
	const onStep = entry.row < entry.steps.length;
	// The step in focus (or the sign-off) and the head take what they need; the step list shows as many lines as fit around the focus.
	const lines = (text: string, indent = 0) => Math.ceil(text.length / Math.max(20, width - indent));
	const step = entry.sheet.steps[Math.min(entry.row, entry.steps.length - 1)]!;
	const outcome = entryOutcome(entry);
	const detail = onStep ? 5 + lines(step.action, 8) + lines(step.expect, 8) : peopleFields.length + 3 + lines(signNote) + (outcome ? lines(`If signed now: FAILED — ${outcome.text}`) : 0);
	const below = (entry.message ? lines(entry.message) + 1 : 0) + (entry.leaving ? 1 : 0) + (entry.notice ? lines(entry.notice.text) : 0);
	const room = Math.max(3, rows - 5 - (entry.stops > 0 ? lines(stopLine(entry.stops)) - 1 : 0) - detail - below);
	const focus = Math.min(entry.row, entry.steps.length - 1);
	const start = Math.max(0, Math.min(focus - Math.floor(room / 2), entry.steps.length - room));
	const shown = entry.steps.slice(start, start + room).map((_, offset) => start + offset);
	return (
		<Box flexDirection="column">
			<Head entry={entry} />
			{entry.notice ? (
				<Text wrap="wrap" {...(entry.notice.error ? {color: 'red'} : {})}>
					{entry.notice.error ? '✗ ' : '✓ '}
					{entry.notice.text}
				</Text>
			) : null}
			<Box marginTop={1} flexDirection="column">
				{shown.map((index) => (
					<StepLine key={index} entry={entry} index={index} />
				))}
				{start + room < entry.steps.length ? <Text dimColor>  ↓ {entry.steps.length - start - room} more</Text> : null}
			</Box>
			{onStep ? <StepDetail entry={entry} /> : <SignOff entry={entry} />}
			{entry.leaving ? (
				<Text bold wrap="wrap">
					Leave without recording? The results entered are not kept.
				</Text>
			) : null}
			{entry.message ? (
				<Text color="red" wrap="wrap">
					✗ {entry.message}
				</Text>
			) : null}
		</Box>
	);
}
