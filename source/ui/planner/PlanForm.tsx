import {Box} from 'ink';
import {Text} from '../Text.js';
import type {PlanEditing} from '../../interlock/plan/plan-edit.js';
import {choicesOf, planFieldHint, shownValue, type PlanField} from './plan-fields.js';
import {FindingLine} from './PlanList.js';
import {formFields, formList, formValue, itemId, runValue, type Form} from './planner-state.js';
import {runSummary} from './wire-run-entry.js';
import {WireRunForm} from './WireRunForm.js';
import {discardQuestion} from '../discard-question.js';
import {Prose} from '../Prose.js';

function title(editing: PlanEditing, form: Form): string {
	const list = formList(form.target);
	if (form.target.kind === 'add') return list === 'devices' ? 'New device (added at the end of the wiring order)' : 'New access point';
	const {index} = form.target.ref;
	const id = itemId(editing, form.target.ref);
	return list === 'devices' ? `Device ${index + 1} of ${editing.plan.devices.length} in wiring order: ${id}` : `Access point ${index + 1} of ${editing.plan.access_points.length}: ${id}`;
}

function EditedValue({field, form, value}: {field: PlanField; form: Form; value: unknown}) {
	if (field.kind === 'run') return <Text>{shownValue(field, value)}</Text>;
	if (field.kind !== 'choice') return <Text>{form.buffer}▌</Text>;
	const options = choicesOf(field, value);
	if (form.choice < 0) return <Text>‹ choose with ← → ›</Text>;
	return (
		<Text>
			‹ <Text bold>{options[form.choice] ?? ''}</Text> › <Text dimColor>{form.choice + 1} of {options.length}</Text>
		</Text>
	);
}

/** The form of one access point or device: its fields, the one in focus being typed or chosen, and the findings about it. */
export function PlanForm({editing, form, rows}: {editing: PlanEditing; form: Form; rows: number}) {
	const fields = formFields(editing, form.target);
	const adding = form.target.kind === 'add';
	const id = form.target.kind === 'edit' ? itemId(editing, form.target.ref) : undefined;
	const subject = formList(form.target) === 'devices' ? 'device' : 'access_point';
	const own = editing.analysis.findings.filter((found) => found.subject.kind === subject && 'id' in found.subject && found.subject.id === id);
	const shownFindings = own.slice(0, 3);
	const room = Math.max(3, rows - 9 - shownFindings.length - (form.message ? 2 : 0) - (adding ? 1 : 0));
	const start = Math.max(0, Math.min(form.focus - Math.floor(room / 2), fields.length - room));
	const focused = fields[form.focus];
	if (form.run) return <WireRunForm device={id ?? 'the new device'} run={form.run} />;
	return (
		<Box flexDirection="column">
			<Text bold wrap="truncate">
				{title(editing, form)}
			</Text>
			<Box marginTop={1} flexDirection="column">
				{start > 0 ? <Text dimColor>  ↑ {start} more</Text> : null}
				{fields.slice(start, start + room).map((field, offset) => {
					const index = start + offset;
					const value = field.kind === 'run' ? runSummary(runValue(editing, form.target)) : formValue(editing, form.target, field);
					const chosen = index === form.focus;
					return (
						<Box key={field.path.join('.')} flexDirection="column">
							<Text wrap="truncate">
								{chosen ? '› ' : '  '}
								{field.label.padEnd(26)}
								{chosen ? <EditedValue field={field} form={form} value={value} /> : shownValue(field, value)}
							</Text>
							{chosen && form.message ? <Prose color="red" text={form.message} lead="  ✗ " hang="    " /> : null}
						</Box>
					);
				})}
				{start + room < fields.length ? <Text dimColor>  ↓ {fields.length - start - room} more</Text> : null}
				{adding ? (
					<Text bold={form.focus === fields.length}>
						{form.focus === fields.length ? '› ' : '  '}[ Add to the plan ]
					</Text>
				) : null}
				{adding && form.focus === fields.length && form.message ? <Prose color="red" text={form.message} lead="  ✗ " hang="    " /> : null}
			</Box>
			{form.asking ? (
				<Text bold wrap="wrap">
					{discardQuestion(adding ? `the new ${formList(form.target) === 'devices' ? 'device' : 'access point'}` : (focused?.label.toLowerCase() ?? 'this item'))}
				</Text>
			) : (
				<Text dimColor wrap="truncate">
					{focused ? planFieldHint(focused) : 'Enter adds it; the plan is checked as a whole first'}
				</Text>
			)}
			<Box marginTop={1} flexDirection="column">
				{adding ? (
					<Text bold>
						Plan findings: {editing.analysis.stops} stop · {editing.analysis.advises} advise (this item is counted once added)
					</Text>
				) : (
					<Text bold>
						Findings for {id}: {own.filter((found) => found.severity === 'stop').length} stop · {own.filter((found) => found.severity === 'advise').length} advise (plan: {editing.analysis.stops} stop)
					</Text>
				)}
				{shownFindings.map((found, index) => (
					<FindingLine key={index} found={found} subject={false} />
				))}
			</Box>
		</Box>
	);
}
