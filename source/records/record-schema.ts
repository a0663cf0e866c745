// Named imports (not the z namespace) let the bundler leave out the parts of zod not used.
import {array, boolean, enum as oneOf, literal, number, object, record, string, union} from 'zod';
import type {z} from 'zod';

const text = string();
const shown = object({si: number(), unit: string(), text: string()}).strict();
const sha256Hex = text.regex(/^[0-9a-f]{64}$/);
const person = object({name: text.min(1), role: text}).strict();
/**
 * The previous record the same key wrote to the same records folder: its file name and the SHA-256
 * of its exact bytes; null in a key's first record there. Missing in records made before the chain.
 */
export const chainLinkSchema = object({file: text.min(1), sha256: sha256Hex}).strict().nullable();

/**
 * Who signed, when, for what, with the key that made it. A version 1 signature states its
 * meaning; a version 2 signature states its purpose, the SHA-256 of each signature before it
 * (endorses) and how many signatures the record was signed to carry (count). The integrity
 * check requires the fields of the record's version.
 */
export const signatureSchema = object({
		signer: object({name: text.min(1), role: text}).strict(),
		meaning: oneOf(['performed', 'verified', 'approved']).optional(),
		purpose: oneOf(['operator', 'witness', 'approval']).optional(),
		endorses: array(sha256Hex).optional(),
		count: number().int().positive().optional(),
		signedAt: text,
		algorithm: literal('Ed25519'),
		publicKey: text.regex(/^[A-Za-z0-9+/]{43}=$/, 'a base64 Ed25519 public key'),
		fingerprint: text.regex(/^sha256:[0-9a-f]{64}$/),
		value: text.regex(/^[A-Za-z0-9+/]{86}==$/, 'a base64 Ed25519 signature'),
	})
	.strict();

/** The signed content of a bench-check record. */
export const recordBodySchema = object({
		kind: literal('bench-check'),
		tool: object({name: literal('prelase'), version: text}).strict(),
		createdAt: text,
		operator: object({name: text.min(1), role: text}).strict(),
		setup: object({name: text.nullable(), fingerprint: text.regex(/^sha256:[0-9a-f]{64}$/), identifying: array(text)}).strict(),
		previous: chainLinkSchema.optional(),
		amends: object({record: text, bodySha256: text.regex(/^[0-9a-f]{64}$/), reason: text.min(1)}).strict().optional(),
		/** The rule text is stored once in the records folder under its SHA-256 (rules/<sha256>.yaml); records made before that embed it as `text`. */
		rules: object({name: text, file: text, sha256: text.regex(/^[0-9a-f]{64}$/), text: text.optional()}).strict(),
		outcome: oneOf(['clear_to_energize', 'do_not_energize', 'incomplete']),
		outcomeText: text,
		counts: record(text, number()),
		missingInputs: array(text),
		inputs: record(text, object({entered: text, si: number().optional(), unit: text.optional(), text: text.optional(), option: text.optional(), value: union([boolean(), text]).optional()}).strict()),
		derived: record(text, union([shown, object({open: array(text)}).strict(), object({error: text}).strict()])),
		checks: array(
			object({
					id: text,
					step: text,
					title: text,
					severity: oneOf(['stop', 'advise']),
					verdict: oneOf(['pass', 'fail', 'advise', 'open', 'skip']),
					relation: oneOf(['at_most', 'at_least']).optional(),
					value: shown.optional(),
					limit: shown.optional(),
					margin: shown.extend({fraction: number().nullable()}).strict().optional(),
					needs: array(text).optional(),
					message: text.optional(),
					error: text.optional(),
					reason: text.optional(),
					explanation: text,
					basis: text,
				})
				.strict(),
		),
		confirmations: array(
			object({
					id: text,
					step: text,
					statement: text,
					status: oneOf(['yes', 'no', 'not_applicable', 'unanswered', 'skip', 'open']),
					note: text.optional(),
					needs: array(text).optional(),
				})
				.strict(),
		),
		interlockTest: object({
				status: oneOf(['current', 'overdue', 'failed', 'stricter-policy', 'other-location', 'untested', 'unreadable']),
				plan: object({file: text, sha256: sha256Hex.nullable()}).strict(),
				record: object({file: text, bodySha256: sha256Hex, testedOn: text, outcome: oneOf(['passed', 'failed']), dueBy: text}).strict().nullable(),
				text,
			})
			.strict()
			.optional(),
		caution: text,
		deferral: text,
	})
	.strict();


/** The signed content of an interlock functional test record. */
export const interlockTestBodySchema = object({
		kind: literal('interlock-test'),
		tool: object({name: literal('prelase'), version: text}).strict(),
		createdAt: text,
		previous: chainLinkSchema.optional(),
		testedOn: text.regex(/^\d{4}-\d{2}-\d{2}$/),
		tester: person,
		/** The witness as named in the results; `signed: false` when they did not sign (named, not signed). Missing in records made before. */
		witness: person.extend({signed: boolean().optional()}).optional(),
		/** The plan's location (room and bench): the test answers only a bench check there. Missing in records made before tests carried it. */
		location: text.optional(),
		plan: object({name: text, file: text, sha256: sha256Hex, text}).strict(),
		policy: object({
				rules: object({name: text, file: text, sha256: sha256Hex}).strict(),
				maxResponseTime: shown,
				resistanceMargin: shown,
				testInterval: shown,
				longestBypass: shown,
			})
			.strict(),
		planFindings: object({stops: number().int().min(0), advises: number().int().min(0), codes: array(text)}).strict(),
		outcome: oneOf(['passed', 'failed']),
		outcomeText: text,
		steps: array(
			object({
					number: number().int().positive(),
					subject: text,
					action: text,
					expect: text,
					result: oneOf(['pass', 'fail', 'not_applicable']),
					stoppedIn: shown.optional(),
					note: text.optional(),
				})
				.strict(),
		),
		caution: text,
		deferral: text,
	})
	.strict();

/** An interlock test record file: the body and the signatures over it. */
export const interlockTestRecordSchema = object({
		format: literal('prelase-record'),
		version: union([literal(1), literal(2)]),
		body: interlockTestBodySchema,
		signatures: array(signatureSchema).min(1, 'a record needs at least one signature'),
	})
	.strict();

/** A record file: the body and the signatures over it. */
export const recordSchema = object({
		format: literal('prelase-record'),
		version: union([literal(1), literal(2)]),
		body: recordBodySchema,
		signatures: array(signatureSchema).min(1, 'a record needs at least one signature'),
	})
	.strict();

export type RecordBody = z.infer<typeof recordBodySchema>;
export type Signature = z.infer<typeof signatureSchema>;
export type BenchRecord = z.infer<typeof recordSchema>;
export type InterlockTestBody = z.infer<typeof interlockTestBodySchema>;
/** A record's link to the previous record of its key in its folder (null: the first). */
export type ChainLink = z.infer<typeof chainLinkSchema>;
export type InterlockTestRecord = z.infer<typeof interlockTestRecordSchema>;
/** Any record prelase writes. */
export type AnyRecord = BenchRecord | InterlockTestRecord;
/** The body of any record prelase writes. */
export type AnyBody = AnyRecord['body'];

/** The schema for a record's data, chosen by the kind its body states (a bench check unless it says otherwise). */
export function schemaForRecord(data: unknown): typeof recordSchema | typeof interlockTestRecordSchema {
	const body = data && typeof data === 'object' ? (data as {body?: unknown}).body : undefined;
	const kind = body && typeof body === 'object' ? (body as {kind?: unknown}).kind : undefined;
	return kind === 'interlock-test' ? interlockTestRecordSchema : recordSchema;
}
