import {accessPointSchema, deviceKinds, deviceSchema, type Plan} from '../../interlock/plan/plan-schema.js';
import type {PlanList} from '../../interlock/plan/plan-edit.js';
import {dimensions, type Dimension} from '../../quantities/dimensions.js';
import {fieldExample} from '../../quantities/field-example.js';

/** One field of the planner's form: where it is in the item, and how it is typed or chosen. */
export type PlanField = {
	path: readonly string[];
	label: string;
	kind: 'text' | 'quantity' | 'number' | 'choice' | 'run';
	/** For a choice: the values written to the file, in order. */
	options?: readonly string[];
	/** The field may be left out of the file (an empty entry, or "(none)", removes it). */
	optional?: boolean;
	/** Shown when the field is not in the file: the value the schema takes instead. */
	fallback?: string;
	dimension?: Dimension;
	/** Emptied, this field removes the map it belongs to (a wire run's length: the whole run). */
	removes?: readonly string[];
};

/** The choice that leaves an optional field out. */
export const noneOption = '(none)';
const yesNo = ['yes', 'no'] as const;

const quantity = (path: string[], label: string, dimension: Dimension, optional = false): PlanField => ({path, label, kind: 'quantity', dimension, ...(optional ? {optional} : {})});

/** The fields of a device, in the order of the plan file; `bypasses` offers the other devices. */
export function deviceFields(plan: Plan, current?: string): PlanField[] {
	const others = plan.devices.map((device) => device.id).filter((id) => id !== current);
	return [
		{path: ['id'], label: 'Id', kind: 'text'},
		{path: ['kind'], label: 'Kind', kind: 'choice', options: deviceKinds},
		{path: ['description'], label: 'Description', kind: 'text'},
		{path: ['contact'], label: 'Contact', kind: 'choice', options: deviceSchema.shape.contact.options},
		{path: ['wiring'], label: 'Wiring', kind: 'choice', options: deviceSchema.shape.wiring.unwrap().options, optional: true, fallback: 'series'},
		quantity(['contact_resistance'], 'Contact resistance', 'resistance'),
		quantity(['rated_current'], 'Rated current', 'current'),
		quantity(['rated_voltage'], 'Rated voltage', 'voltage'),
		{path: ['positive_opening'], label: 'Positive opening', kind: 'choice', options: yesNo},
		quantity(['opening_time'], 'Opening time', 'time'),
		{path: ['shorting_plug'], label: 'Shorting plug', kind: 'choice', options: yesNo, optional: true, fallback: 'no'},
		{path: ['bypasses'], label: 'Bypasses (bypass key)', kind: 'choice', options: [noneOption, ...others], optional: true},
		{path: ['bypass', 'owner'], label: 'Bypass owner', kind: 'text', optional: true},
		{path: ['bypass', 'reason'], label: 'Bypass reason', kind: 'text', optional: true},
		quantity(['bypass', 'time_limit'], 'Bypass time limit', 'time', true),
		// The run is entered as a whole in its own small form: a size alone or a length alone is not a run.
		{path: ['wire_to_next'], label: 'Wire run to next device', kind: 'run', optional: true},
	];
}

/** The fields of an access point; `device` offers the devices of the loop. */
export function accessPointFields(plan: Plan): PlanField[] {
	return [
		{path: ['id'], label: 'Id', kind: 'text'},
		{path: ['description'], label: 'Description', kind: 'text'},
		{path: ['beam_reachable'], label: 'Beam reachable', kind: 'choice', options: yesNo},
		{path: ['secured_by'], label: 'Secured by', kind: 'choice', options: accessPointSchema.shape.secured_by.options},
		{path: ['device'], label: 'Device', kind: 'choice', options: [noneOption, ...plan.devices.map((device) => device.id)], optional: true},
	];
}

/** The fields of an item of a list. */
export function fieldsOf(list: PlanList, plan: Plan, current?: string): PlanField[] {
	return list === 'devices' ? deviceFields(plan, current) : accessPointFields(plan);
}

/** A value as the form shows it: booleans as yes / no, an absent optional field as its fallback or empty. */
export function shownValue(field: PlanField, value: unknown): string {
	if (value === undefined || value === null) return field.kind === 'choice' && field.optional && !field.fallback ? noneOption : (field.fallback ?? '');
	if (typeof value === 'boolean') return value ? 'yes' : 'no';
	return String(value);
}

/** The choices of a choice field, with a value the file holds that is not among them (an id not in the loop) kept. */
export function choicesOf(field: PlanField, value: unknown): readonly string[] {
	const options = field.options ?? [];
	const shown = shownValue(field, value);
	return shown && !options.includes(shown) ? [...options, shown] : options;
}

/** What an entry writes to the file: undefined removes an optional field; yes / no become booleans; a plain number stays a number. */
export function typedValue(field: PlanField, entry: string): unknown {
	const text = entry.trim();
	if (field.optional && (text === '' || text === noneOption)) return undefined;
	if (field.kind === 'choice' && field.options?.[0] === 'yes') return text === 'yes';
	if (field.kind === 'number' && /^-?\d+$/.test(text)) return Number(text);
	return text;
}

/** One line saying what a field expects. */
export function planFieldHint(field: PlanField): string {
	const optional = field.removes ? ` · empty removes the whole ${field.removes.join('.')}` : field.optional ? ' · empty leaves it out' : '';
	if (field.kind === 'quantity' && field.dimension) return `${dimensions[field.dimension].noun} with its unit, e.g. ${fieldExample({dimension: field.dimension})}${optional}`;
	if (field.kind === 'choice') return `← → choose · Enter apply${field.options?.[0] === 'yes' ? ' · y n' : ''}`;
	if (field.kind === 'number') return `a whole number${optional}`;
	if (field.kind === 'run') return 'Enter opens the wire run: its size and length together';
	return field.path[0] === 'id' ? 'lower case letters, digits and _, starting with a letter' : `text${optional}`;
}
