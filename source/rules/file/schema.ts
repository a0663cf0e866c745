// Named imports (not the z namespace) let the bundler drop the parts of zod prelase does not use.
import {array, boolean, discriminatedUnion, literal, number, object, preprocess, record, string, tuple, union, enum as oneOf} from 'zod';
import type {z} from 'zod';
import {lazySchema, once} from '../../shared/lazy-schema.js';
import {dimensionNames} from '../../quantities/dimensions.js';
import {singleLinePattern} from '../../shared/one-line.js';

/** Every rule-file schema, built on first use: a check under the shipped policy reads it already checked. */
const schemas = once(() => {
	const identifier = string()
		.regex(/^[a-z][a-z0-9_]*$/, 'an id is lower case letters, digits and underscores, starting with a letter (e.g. current_limit)');

	const formula = string().trim().min(1, 'a formula cannot be empty');
	const quantityText = union([string(), number()]);
	const words = string().trim().min(1, 'this text cannot be empty');
	/** A name, title, label or role: one line, since a line break would print as a line of its own. */
	const line = words.regex(singleLinePattern, 'this is one line of text but holds a line break; write it on one line');

	/**
	 * A site-tunable constant with its meaning and basis: a quantity with its unit and dimension,
	 * or (with `options_of`) a list of options of a choice input, such as the laser classes a
	 * requirement applies to; formulas test it with `one_of(choice, list)`.
	 */
	const policyValueSchema = object({
			value: union([quantityText, array(identifier)]).describe('The value with its unit, e.g. "10 %" or "3 s"; or, with options_of, a list of options, e.g. [class_3b, class_4]'),
			dimension: oneOf(dimensionNames).optional().describe('The dimension of a quantity value (not with options_of)'),
			options_of: identifier.optional().describe('The choice input whose options the value lists (not with dimension)'),
			meaning: words,
			basis: words,
		})
		.strict()
		.superRefine((entry, context) => {
			const list = Array.isArray(entry.value);
			if (entry.options_of !== undefined && entry.dimension !== undefined) context.addIssue({code: 'custom', message: 'a policy value has either dimension (a quantity) or options_of (a list of options of a choice), not both'});
			else if (entry.options_of === undefined && entry.dimension === undefined) context.addIssue({code: 'custom', message: 'a policy value needs dimension (a quantity) or options_of (a list of options of a choice)'});
			else if (list !== (entry.options_of !== undefined)) context.addIssue({code: 'custom', message: list ? 'a list of options needs options_of: the choice input it lists options of' : 'with options_of the value is a list of options, e.g. [class_3b, class_4]'});
		});

	const inputCommon = {
		id: identifier,
		label: line,
		help: string().optional().describe('One line shown under the input'),
		when: formula.optional().describe('The input is asked only when this holds'),
		identifies: boolean().optional().describe('Part of what identifies the setup (diode, driver, supply, wiring, location)'),
		optional: boolean().optional().describe('May be left blank without making the check incomplete'),
	};

	/** A number with a unit, in a sane range. */
	const quantityInputSchema = object({
			...inputCommon,
			kind: literal('quantity'),
			dimension: oneOf(dimensionNames),
			range: tuple([quantityText, quantityText]).describe('[lowest, highest] accepted entry, with units'),
			default: quantityText.optional(),
			range_entry: oneOf(['allowed', 'refused']).optional().describe('Whether the operator may enter a range (1.6 V .. 2.0 V, 1.8 V ± 0.2 V); default allowed'),
			default_tolerance: quantityText.optional().describe('Policy: a single value entered is read as this much each way (5 % of it, or an amount such as 0.1 V; a difference in K for a temperature)'),
			tolerance_input_was: identifier.optional().describe('An input of older rules that held this input\'s tolerance (supply_tolerance): an answers file that still gives it is read as this input\'s range'),
		})
		.strict();

	/** One option out of a listed set. */
	const choiceInputSchema = object({
			...inputCommon,
			kind: literal('choice'),
			options: record(identifier, line).refine((options) => Object.keys(options).length >= 2, 'a choice needs at least two options'),
			default: identifier.optional(),
		})
		.strict();

	/** A yes or no fact about the setup (not a confirmation of a precaution). */
	const yesNoInputSchema = object({...inputCommon, kind: literal('yes_no'), default: boolean().optional()})
		.strict();

	/** Short free text, such as a serial number or a procedure revision. */
	const textInputSchema = object({...inputCommon, kind: literal('text'), max_length: number().int().positive().max(2000).default(200)})
		.strict();

	/** An input of a step. */
	const inputSchema = preprocess(
		(raw) => (raw && typeof raw === 'object' && !Array.isArray(raw) && !('kind' in raw) ? {...raw, kind: 'quantity'} : raw),
		discriminatedUnion('kind', [quantityInputSchema, choiceInputSchema, yesNoInputSchema, textInputSchema]),
	);

	/** A statement the operator answers yes, no or not applicable. */
	const confirmationSchema = object({
			id: identifier,
			statement: words,
			when: formula.optional(),
			not_applicable: oneOf(['allowed', 'forbidden']).default('allowed'),
			answered_by: oneOf(['operator', 'interlock_test'])
				.default('operator')
				.describe('interlock_test: when the input interlock_plan names a plan, answered from its latest trusted interlock test record'),
			basis: words,
		})
		.strict();

	/** A screen's worth of the bench check. */
	const stepSchema = object({
			id: identifier,
			title: line,
			summary: string().optional(),
			inputs: array(inputSchema).default([]),
			confirmations: array(confirmationSchema).default([]),
		})
		.strict();

	/** A value computed from inputs, policy values and other derived values. */
	const derivedSchema = object({
			id: identifier,
			label: line,
			dimension: oneOf(dimensionNames),
			step: identifier.optional().describe('Show this value with the inputs of this step (a converted or worst-case figure the operator should see)'),
			formula,
		})
		.strict();

	/** Which options of one choice go with each option of another. */
	const tableSchema = object({
			label: words,
			key: identifier,
			value: identifier,
			rows: record(identifier, array(identifier)),
			basis: words,
		})
		.strict();

	/** A condition that must hold before energizing, with its severity, margin and basis. */
	const checkSchema = object({
			id: identifier,
			step: identifier,
			title: line,
			when: formula.optional(),
			skip_reason: words.optional().describe('Why the check is skipped when its `when` does not hold; shown with the skip'),
			value: formula.optional().describe('The quantity being checked'),
			at_most: formula.optional().describe('The limit the value must not exceed'),
			at_least: formula.optional().describe('The limit the value must reach'),
			holds: formula.optional().describe('A true/false condition, for checks that are not a comparison with a limit'),
			dimension: oneOf(dimensionNames).optional().describe('How value, limit and margin are shown (inferred when absent)'),
			severity: oneOf(['stop', 'advise']),
			explanation: words.describe('One line: why this check exists'),
			message: string().optional().describe('Shown when the check does not hold; {{value}}, {{limit}}, {{margin}} and names are filled in'),
			basis: words,
			switched_off: words.optional().describe('Why this check is switched off: it is kept for the record but not evaluated (set by a site file\'s switched_off)'),
		})
		.strict()
		.superRefine((check, context) => {
			const limits = Number(check.at_most !== undefined) + Number(check.at_least !== undefined);
			if (check.holds !== undefined && (check.value !== undefined || limits > 0)) {
				context.addIssue({code: 'custom', message: 'a check has either holds, or value with at_most or at_least, not both'});
			} else if (check.holds === undefined && (check.value === undefined || limits !== 1)) {
				context.addIssue({code: 'custom', message: 'a check needs holds, or value with exactly one of at_most and at_least'});
			}
		});

	const roleName = string().trim().min(1, 'a role cannot be empty').regex(singleLinePattern, 'a role is one line of text but holds a line break; write it on one line');

	/**
	 * What the site asks of signatures: the roles that carry authority (they count only when the
	 * auditor's trust list grants them), when a countersignature by a granted role is required,
	 * whether an interlock functional test needs a signed witness, and the purposes each kind of
	 * record needs.
	 */
	const signingSchema = object({
			authority_roles: array(roleName).optional().describe('Roles that carry authority; default [laser safety officer, supervisor]. Compared case-insensitively after trimming'),
			countersign: object({
					roles: array(roleName).min(1).describe('A countersignature by a key granted one of these roles'),
					laser_classes: array(identifier).default([]).describe('… is required for a bench check of these laser classes (options of laser_class)'),
					switched_off_checks: boolean().default(false).describe('… and for any bench check made under rules with a switched-off check'),
				})
				.strict()
				.optional(),
			signed_witness_for_interlock_tests: boolean().optional().describe('An interlock functional test needs a witness signature by a trusted key'),
			purposes: object({
					bench_check: array(oneOf(['operator', 'witness', 'approval'])).optional(),
					interlock_test: array(oneOf(['operator', 'witness', 'approval'])).optional(),
				})
				.strict()
				.optional()
				.describe('The purposes each kind of record needs among its signatures'),
		})
		.strict();

	/** The whole rule file. */
	const ruleFileSchema = object({
			format: literal(1).describe('Rule file format version'),
			name: line,
			caution: words.describe('Shown at the start of every check, on the summary and in every record'),
			policy: record(identifier, policyValueSchema).default({}),
			tables: record(identifier, tableSchema).default({}),
			steps: array(stepSchema).min(1, 'a rule file needs at least one step'),
			derived: array(derivedSchema).default([]),
			checks: array(checkSchema).default([]),
			signing: signingSchema.optional().describe('What the site asks of signatures (see docs/records.md)'),
		})
		.strict();
	return {policyValueSchema, quantityInputSchema, choiceInputSchema, yesNoInputSchema, textInputSchema, inputSchema, confirmationSchema, stepSchema, derivedSchema, tableSchema, checkSchema, signingSchema, ruleFileSchema};
});

export const policyValueSchema = lazySchema(() => schemas().policyValueSchema);
export const quantityInputSchema = lazySchema(() => schemas().quantityInputSchema);
export const choiceInputSchema = lazySchema(() => schemas().choiceInputSchema);
export const yesNoInputSchema = lazySchema(() => schemas().yesNoInputSchema);
export const textInputSchema = lazySchema(() => schemas().textInputSchema);
export const inputSchema = lazySchema(() => schemas().inputSchema);
export const confirmationSchema = lazySchema(() => schemas().confirmationSchema);
export const stepSchema = lazySchema(() => schemas().stepSchema);
export const derivedSchema = lazySchema(() => schemas().derivedSchema);
export const tableSchema = lazySchema(() => schemas().tableSchema);
export const checkSchema = lazySchema(() => schemas().checkSchema);
export const signingSchema = lazySchema(() => schemas().signingSchema);
export const ruleFileSchema = lazySchema(() => schemas().ruleFileSchema);

/** A rule file as written, after validation. */
export type RuleFile = z.infer<typeof ruleFileSchema>;
export type Step = z.infer<typeof stepSchema>;
export type Input = z.infer<typeof quantityInputSchema> | z.infer<typeof choiceInputSchema> | z.infer<typeof yesNoInputSchema> | z.infer<typeof textInputSchema>;
export type Confirmation = z.infer<typeof confirmationSchema>;
export type Check = z.infer<typeof checkSchema>;
export type Derived = z.infer<typeof derivedSchema>;
export type Table = z.infer<typeof tableSchema>;

/** A policy value as text: "10 %", or "[class_3b, class_4]" for a list of options. */
export function policyValueText(value: string | number | readonly string[]): string {
	return Array.isArray(value) ? `[${value.join(', ')}]` : String(value);
}

/** What kind of value a policy value is: its dimension, or "options of laser_class". */
export function policyKindText(entry: Pick<z.infer<typeof policyValueSchema>, 'dimension' | 'options_of'>): string {
	return entry.options_of !== undefined ? `options of ${entry.options_of}` : (entry.dimension ?? '');
}
