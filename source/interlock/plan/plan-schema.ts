// Named imports (not the z namespace) let the bundler drop the parts of zod prelase does not use.
import {array, boolean, custom, literal, number, object, string, enum as oneOf, NEVER} from 'zod';
import type {z} from 'zod';
import {lazySchema, once} from '../../shared/lazy-schema.js';
import {dimensions, type Dimension} from '../../quantities/dimensions.js';
import {parseQuantity} from '../../quantities/parse-quantity.js';
import {fieldExample} from '../../quantities/field-example.js';
import {describeProblem, problem} from '../../shared/problems.js';
import type {InterlockPolicy} from './policy.js';
import {singleLinePattern} from '../../shared/one-line.js';

/**
 * A value with its unit (`50 mohm`, `2 ms`), read into the coherent SI unit of its
 * dimension; a wrong unit or a value below the allowed floor is a schema issue at its line.
 */
export function quantityOf(dimension: Dimension, floor: 'positive' | 'not negative' | 'any' = 'not negative') {
	const info = {noun: dimensions[dimension].noun, example: fieldExample({dimension, ...(floor === 'any' ? {} : {range: {min: 0, max: Infinity, aboveMin: floor === 'positive'}})})};
	const text = custom<string | number>((value) => typeof value === 'string' || typeof value === 'number', `expected ${info.noun} with its unit, for example "${info.example}"`);
	return text.transform((value, context) => {
		const parsed = parseQuantity(String(value), dimension);
		if (!parsed.ok) {
			const data = {label: 'this field', noun: info.noun, example: info.example, hint: '', ...parsed.problem} as Record<string, string>;
			context.issues.push({code: 'custom', message: describeProblem(problem(parsed.problem.code, data)), input: value});
			return NEVER;
		}
		const si = parsed.value.si;
		if ((floor === 'positive' && !(si > 0)) || (floor === 'not negative' && si < 0)) {
			context.issues.push({code: 'custom', message: `"${String(value)}" must be ${floor === 'positive' ? 'greater than zero' : 'zero or more'}`, input: value});
			return NEVER;
		}
		return si;
	}).meta({description: `${info.noun} with its unit, for example "${info.example}"`, examples: [info.example]});
}

/** The kinds of device an interlock loop may hold. */
export const deviceKinds = ['door_switch', 'lid_switch', 'key_switch', 'emergency_stop', 'remote_connector', 'fibre_presence', 'thermal_ok', 'flow_switch', 'bypass_key'] as const;

/** Every plan schema, built on first use: most runs of prelase read no plan. */
const schemas = once(() => {
	const identifier = string().regex(/^[a-z][a-z0-9_]*$/, 'an id is lower case letters, digits and underscores, starting with a letter (e.g. lid_switch)');
	const words = string().trim().min(1, 'this text cannot be empty');
	/** A name, description, owner or location: one line, since a line break would print as a line of its own. */
	const line = words.regex(singleLinePattern, 'this is one line of text but holds a line break; write it on one line');

	/** A copper wire run: AWG gauge or cross-section, cable length and how many of its conductors carry the loop. */
	const wireRunSchema = object({
			awg: number().int().min(-3).max(40).optional().describe('Copper gauge (AWG); give this or cross_section'),
			cross_section: quantityOf('area', 'positive').optional().describe('Copper cross-section, e.g. "0.5 mm^2"'),
			length: quantityOf('length', 'positive').describe('Cable length of the run'),
			conductors: number().int().min(1).max(8).default(2).describe('Conductors of the run that carry the loop current, each the full length (default 2: out and back)'),
		})
		.strict()
		.superRefine((run, context) => {
			if ((run.awg === undefined) === (run.cross_section === undefined)) context.addIssue({code: 'custom', message: 'give the copper size as either awg or cross_section (not both, not neither)'});
		});

	/** Owner, reason and time limit of a bypass; each is checked by the analysis, so each may be missing here. */
	const bypassSchema = object({
			owner: line.optional(),
			reason: words.optional(),
			time_limit: quantityOf('time', 'positive').optional(),
		})
		.strict();

	/** One device of the loop, in wiring order. */
	const deviceSchema = object({
			id: identifier,
			kind: oneOf(deviceKinds),
			description: line,
			contact: oneOf(['normally_closed', 'normally_open']),
			wiring: oneOf(['series', 'parallel']).default('series'),
			contact_resistance: quantityOf('resistance'),
			rated_current: quantityOf('current', 'positive'),
			rated_voltage: quantityOf('voltage', 'positive'),
			positive_opening: boolean(),
			opening_time: quantityOf('time').describe('From actuation until the contact is open'),
			shorting_plug: boolean().default(false).describe('The connector is closed by a shorting plug or jumper instead of a remote device'),
			bypasses: identifier.optional().describe('For a bypass key: the device it shorts out'),
			bypass: bypassSchema.optional(),
			wire_to_next: wireRunSchema.optional().describe('The run from this device to the next (the last: back to the input)'),
		})
		.strict();

	/** A way into the beam enclosure or the room. */
	const accessPointSchema = object({
			id: identifier,
			description: line,
			beam_reachable: boolean(),
			secured_by: oneOf(['interlock', 'tool', 'none']),
			device: identifier.optional().describe('The device that interlocks it'),
		})
		.strict();

	/** The driver's (or shutter controller's) interlock input. */
	const interlockInputSchema = object({
			description: line,
			loop_voltage: quantityOf('voltage', 'positive'),
			sense_current: quantityOf('current', 'positive').optional(),
			source_resistance: quantityOf('resistance', 'positive').optional(),
			closed_below: quantityOf('resistance', 'positive').describe('The largest loop resistance the input still reads as closed'),
			response_time: quantityOf('time'),
			disable_time: quantityOf('time').describe("The driver's disable and fall time after the input opens"),
			latches: boolean().describe('The input stays off after opening until a manual reset'),
			wire_to_first: wireRunSchema.optional(),
		})
		.strict()
		.superRefine((input, context) => {
			if (input.sense_current === undefined && input.source_resistance === undefined) context.addIssue({code: 'custom', message: 'give sense_current or source_resistance, so the loop current can be worked out'});
		});

	/** An interlock plan file. */
	const planSchema = object({
			format: literal(1),
			name: line,
			location: line.optional().describe('Room and bench of the loop, as the bench check gives its location; a test of this plan answers only a check at this location'),
			laser_class: oneOf(['class_1', 'class_1m', 'class_2', 'class_2m', 'class_3r', 'class_3b', 'class_4']),
			wire_temperature: quantityOf('temperature', 'positive'),
			input: interlockInputSchema,
			access_points: array(accessPointSchema),
			devices: array(deviceSchema).min(1, 'the loop needs at least one device'),
		})
		.strict();
	return {wireRunSchema, deviceSchema, accessPointSchema, interlockInputSchema, planSchema};
});

export const wireRunSchema = lazySchema(() => schemas().wireRunSchema);
export const deviceSchema = lazySchema(() => schemas().deviceSchema);
export const accessPointSchema = lazySchema(() => schemas().accessPointSchema);
export const interlockInputSchema = lazySchema(() => schemas().interlockInputSchema);
export const planSchema = lazySchema(() => schemas().planSchema);

/** A validated plan file, every quantity in SI. */
export type PlanFile = z.output<typeof planSchema>;
/** A plan file with the interlock policy of the rule file in force: what the analysis works on. */
export type Plan = PlanFile & {policy: InterlockPolicy};
/** One device of a validated plan. */
export type Device = Plan['devices'][number];
/** One access point of a validated plan. */
export type AccessPoint = Plan['access_points'][number];
/** One wire run of a validated plan. */
export type WireRun = z.output<typeof wireRunSchema>;
