import {array, literal, number, object, record, string, union, unknown, enum as oneOf} from 'zod';
import type {z} from 'zod';
import {builtSchema, lazySchema, once} from '../../shared/lazy-schema.js';
import {dimensionNames} from '../../quantities/dimensions.js';
import {singleLinePattern} from '../../shared/one-line.js';
import {checkSchema, confirmationSchema, derivedSchema, inputSchema, policyValueSchema, signingSchema, stepSchema, tableSchema} from './schema.js';

/** Every site-file schema, built on first use: most runs read no site rule file. */
const schemas = once(() => {
	// The rule-file schemas themselves (not their stand-ins), so the JSON Schema sees each part as the same object.
	const base = {inputSchema: builtSchema(inputSchema), confirmationSchema: builtSchema(confirmationSchema), policyValueSchema: builtSchema(policyValueSchema), tableSchema: builtSchema(tableSchema), stepSchema: builtSchema(stepSchema), derivedSchema: builtSchema(derivedSchema), checkSchema: builtSchema(checkSchema), signingSchema: builtSchema(signingSchema)};
	const identifier = string().regex(/^[a-z][a-z0-9_]*$/, 'an id is lower case letters, digits and underscores, starting with a letter (e.g. current_limit)');
	const words = string().trim().min(1, 'this text cannot be empty');

	/** A new value for a policy value the base has: the value, and optionally a new basis. The dimension stays. */
	const policyChangeSchema = object({
			value: union([string(), number(), array(identifier)]).describe('The new value with its unit, e.g. "20 %"; or a new list of options, e.g. [class_3r, class_3b, class_4]'),
			dimension: oneOf(dimensionNames).optional().describe('May be given, but must be the base\'s dimension'),
			basis: words.optional().describe('Why the site uses this value (keeps the base\'s basis when absent)'),
		})
		.strict();

	/** A change to a check the base has: its severity, and why. */
	const checkChangeSchema = object({
			severity: oneOf(['stop', 'advise']),
			reason: words.describe('Why the site changes this check'),
		})
		.strict();

	/** Inputs and confirmations added to a step the base has. */
	const stepAdditionSchema = object({
			inputs: array(base.inputSchema).default([]),
			confirmations: array(base.confirmationSchema).default([]),
		})
		.strict();

	/**
	 * A site rule file: names its base (`shipped` or a path relative to itself) and says only
	 * what differs. Each section is explicit about what it does, so a misspelt id is an error
	 * rather than a silent addition.
	 */
	const siteFileSchema = object({
			format: literal(1).describe('Rule file format version'),
			extends: words.describe('The base: "shipped" for the shipped policy, or a path relative to this file'),
			name: words.regex(singleLinePattern, 'this is one line of text but holds a line break; write it on one line').optional().describe('Shown on every screen and record (the base\'s name when absent)'),
			caution: words.optional().describe('Shown at the start of every check (the base\'s caution when absent)'),
			policy_changed: record(identifier, policyChangeSchema).default({}),
			checks_changed: record(identifier, checkChangeSchema).default({}),
			// Reasons are checked by the resolver, so a missing one gets its own message and line.
			switched_off: record(identifier, unknown()).default({}),
			add_policy: record(identifier, base.policyValueSchema).default({}),
			add_tables: record(identifier, base.tableSchema).default({}),
			add_steps: array(base.stepSchema).default([]),
			add_to_steps: record(identifier, stepAdditionSchema).default({}),
			add_derived: array(base.derivedSchema).default([]),
			add_checks: array(base.checkSchema).default([]),
			signing: base.signingSchema.optional().describe('What the site asks of signatures; replaces the base\'s signing section'),
		})
		.strict();
	return {policyChangeSchema, checkChangeSchema, stepAdditionSchema, siteFileSchema};
});

export const policyChangeSchema = lazySchema(() => schemas().policyChangeSchema);
export const checkChangeSchema = lazySchema(() => schemas().checkChangeSchema);
export const stepAdditionSchema = lazySchema(() => schemas().stepAdditionSchema);
export const siteFileSchema = lazySchema(() => schemas().siteFileSchema);

/** A site rule file as written, after validation. */
export type SiteFile = z.infer<typeof siteFileSchema>;
