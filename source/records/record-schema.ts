// Named imports (not the z namespace) let the bundler leave out the parts of zod not used.
import {array, boolean, enum as oneOf, literal, number, object, record, string, union} from 'zod';
import type {z} from 'zod';
import {lazySchema, once} from '../shared/lazy-schema.js';
import {isRecordedCornerText} from './record-corner.js';

/** Every record schema, built on first use: most runs of prelase read no record. */
const schemas = once(() => {
	const text = string();
	const shown = object({si: number(), unit: string(), text: string()}).strict();
	/** A value as a record shows it: the SI number and the text shown (records before the lean body also state the SI unit). */
	const figure = object({si: number(), unit: string().optional(), text: string()}).strict();
	/** An input as records made before the lean body keep it: as entered, and what it was read as. */
	const recordedInput = object({entered: string(), si: number().optional(), unit: string().optional(), text: string().optional(), option: string().optional(), value: union([boolean(), string()]).optional()}).strict();
	const sha256Hex = text.regex(/^[0-9a-f]{64}$/);
	const person = object({name: text.min(1), role: text}).strict();
	/**
	 * The previous record the same key wrote to the same records folder: its file name and the SHA-256
	 * of its exact bytes; null in a key's first record there. Missing in records made before the chain.
	 */
	const chainLinkSchema = object({file: text.min(1), sha256: sha256Hex}).strict().nullable();

	/**
	 * Who signed, when, for what, with the key that made it. A version 1 signature states its
	 * meaning; a version 2 signature states its purpose, the SHA-256 of each signature before it
	 * (endorses) and how many signatures the record was signed to carry (count). The integrity
	 * check requires the fields of the record's version.
	 */
	const signatureSchema = object({
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

	const confirmationStatus = oneOf(['yes', 'no', 'not_applicable', 'unanswered', 'skip', 'open']);
	const confirmationEntry = object({
			id: text,
			step: text.optional(),
			statement: text.optional(),
			status: confirmationStatus,
			note: text.optional(),
			needs: array(text).optional(),
		})
		.strict();

	/**
	 * The signed content of a bench-check record. A record states what was entered, what was
	 * computed and concluded, and the SHA-256 of the rule text it was judged under; the words that
	 * come from that text (check titles, explanations, bases, steps, confirmation statements, the
	 * caution) are read from the stored text (records/record-words.ts), so a record made since the
	 * lean body carries none of them. Records made before carry them, and still read.
	 */
	const recordBodySchema = object({
			kind: literal('bench-check'),
			tool: object({name: literal('prelase'), version: text}).strict(),
			createdAt: text,
			operator: object({name: text.min(1), role: text}).strict(),
			setup: object({name: text.nullable(), fingerprint: text.regex(/^sha256:[0-9a-f]{64}$/), identifying: array(text).optional()}).strict(),
			previous: chainLinkSchema.optional(),
			amends: object({record: text, bodySha256: text.regex(/^[0-9a-f]{64}$/), reason: text.min(1)}).strict().optional(),
			/** The rule text is stored once in the records folder under its SHA-256 (rules/<sha256>.yaml); records made before that embed it as `text`. */
			rules: object({name: text, file: text, sha256: text.regex(/^[0-9a-f]{64}$/), text: text.optional()}).strict(),
			outcome: oneOf(['clear_to_energize', 'do_not_energize', 'incomplete']),
			/** The outcome in words (records made before the lean body). */
			outcomeText: text.optional(),
			counts: record(text, number()),
			missingInputs: array(text),
			/** Each input as entered (records made before the lean body also state what it was read as). Read it with inputEntry(). */
			inputs: record(text, union([text, recordedInput])),
			/** Each derived value: its SI number (records since the lean body; the dimension is the rule text's), or as shown, or open, or not computable. */
			derived: record(text, union([number(), figure, object({open: array(text)}).strict(), object({error: text}).strict()])),
			checks: array(
				object({
						id: text,
						step: text.optional(),
						title: text.optional(),
						severity: oneOf(['stop', 'advise']).optional(),
						verdict: oneOf(['pass', 'fail', 'advise', 'open', 'skip']),
						relation: oneOf(['at_most', 'at_least']).optional(),
						value: figure.optional(),
						limit: figure.optional(),
						/** The margin as shown (records since the lean body), or with its SI number and fraction of the limit (before). */
						margin: union([text, object({si: number(), unit: string(), text: string(), fraction: number().nullable()}).strict()]).optional(),
						needs: array(text).optional(),
						message: text.optional(),
						error: text.optional(),
						reason: text.optional(),
						/** Where in the ranges entered the check was judged, as one line (records/record-corner.ts; records since ranges; absent when no range's end mattered to it). */
						corner: text.refine(isRecordedCornerText, {message: 'not a corner line (such as "supply_nominal low")'}).optional(),
						explanation: text.optional(),
						basis: text.optional(),
					})
					.strict(),
			),
			/**
			 * Each confirmation's answer: since the lean body a map from id to the answer (or to
			 * {status, note, needs}); before, a list with each statement. Read it with confirmationList().
			 */
			confirmations: union([array(confirmationEntry), record(text, union([confirmationStatus, confirmationEntry.omit({id: true, step: true, statement: true})]))]),
			interlockTest: object({
					status: oneOf(['current', 'overdue', 'failed', 'stricter-policy', 'other-location', 'untested', 'unreadable']),
					plan: object({file: text, sha256: sha256Hex.nullable()}).strict(),
					record: object({file: text, bodySha256: sha256Hex, testedOn: text, outcome: oneOf(['passed', 'failed']), dueBy: text}).strict().nullable(),
					text,
				})
				.strict()
				.optional(),
			caution: text.optional(),
			deferral: text.optional(),
			/** What would flip each verdict: check → input → the SI value(s) of its flip points (records signed with the what-if analysis). */
			sensitivity: record(text, record(text, array(number()))).optional(),
		})
		.strict();


	/** The signed content of an interlock functional test record. */
	const interlockTestBodySchema = object({
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

	/** A record file of either kind: the body and the signatures over it. */
	const recordFile = <Body extends typeof recordBodySchema | typeof interlockTestBodySchema>(body: Body) =>
		object({
			format: literal('prelase-record'),
			version: union([literal(1), literal(2)]),
			body,
			signatures: array(signatureSchema).min(1, 'a record needs at least one signature'),
		}).strict();
	const interlockTestRecordSchema = recordFile(interlockTestBodySchema);
	const recordSchema = recordFile(recordBodySchema);
	return {chainLinkSchema, signatureSchema, recordBodySchema, interlockTestBodySchema, interlockTestRecordSchema, recordSchema, recordedInput, confirmationEntry};
});

export const chainLinkSchema = lazySchema(() => schemas().chainLinkSchema);
export const signatureSchema = lazySchema(() => schemas().signatureSchema);
export const recordBodySchema = lazySchema(() => schemas().recordBodySchema);
export const interlockTestBodySchema = lazySchema(() => schemas().interlockTestBodySchema);
export const interlockTestRecordSchema = lazySchema(() => schemas().interlockTestRecordSchema);
export const recordSchema = lazySchema(() => schemas().recordSchema);
type Built = ReturnType<typeof schemas>;

export type RecordBody = z.infer<typeof recordBodySchema>;
/** An input of a record as an object: as entered, and (in records made before the lean body) what it was read as. */
export type RecordedInput = z.infer<Built['recordedInput']>;

/** A derived value of a record as an object: a bare SI number (whose dimension the rules did not give) reads as that number. */
export function derivedEntry(value: RecordBody['derived'][string]): Exclude<RecordBody['derived'][string], number> {
	return typeof value === 'number' ? {si: value, text: String(value)} : value;
}

/** A confirmation of a record with its id, whichever way the record keeps the answers. */
export type RecordConfirmation = z.infer<Built['confirmationEntry']>;

/** A record's confirmations as a list in the record's order, whichever way the record keeps them. */
export function confirmationList(body: Pick<RecordBody, 'confirmations'>): RecordConfirmation[] {
	if (Array.isArray(body.confirmations)) return body.confirmations;
	return Object.entries(body.confirmations).map(([id, answer]) => (typeof answer === 'string' ? {id, status: answer} : {id, ...answer}));
}

/** An input of a record as an object, whichever way the record keeps it (undefined when the record has no such input). */
export function inputEntry(value: RecordBody['inputs'][string] | undefined): RecordedInput | undefined {
	return typeof value === 'string' ? {entered: value} : value;
}
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
