import {z} from 'zod';

const text = z.string();
const shown = z.object({si: z.number(), unit: z.string(), text: z.string()}).strict();

/** Who signed, when, what the signature means, with the key that made it. */
export const signatureSchema = z
	.object({
		signer: z.object({name: text.min(1), role: text}).strict(),
		meaning: z.enum(['performed', 'verified', 'approved']),
		signedAt: text,
		algorithm: z.literal('Ed25519'),
		publicKey: text.regex(/^[A-Za-z0-9+/]{43}=$/, 'a base64 Ed25519 public key'),
		fingerprint: text.regex(/^sha256:[0-9a-f]{64}$/),
		value: text.regex(/^[A-Za-z0-9+/]{86}==$/, 'a base64 Ed25519 signature'),
	})
	.strict();

/** The signed content of a bench-check record. */
export const recordBodySchema = z
	.object({
		kind: z.literal('bench-check'),
		tool: z.object({name: z.literal('prelase'), version: text}).strict(),
		createdAt: text,
		operator: z.object({name: text.min(1), role: text}).strict(),
		setup: z.object({name: text.nullable(), fingerprint: text.regex(/^sha256:[0-9a-f]{64}$/), identifying: z.array(text)}).strict(),
		amends: z.object({record: text, bodySha256: text.regex(/^[0-9a-f]{64}$/), reason: text.min(1)}).strict().optional(),
		rules: z.object({name: text, file: text, sha256: text.regex(/^[0-9a-f]{64}$/), text}).strict(),
		outcome: z.enum(['clear_to_energize', 'do_not_energize', 'incomplete']),
		outcomeText: text,
		counts: z.record(text, z.number()),
		missingInputs: z.array(text),
		inputs: z.record(text, z.object({entered: text, si: z.number().optional(), unit: text.optional(), text: text.optional(), option: text.optional(), value: z.union([z.boolean(), text]).optional()}).strict()),
		derived: z.record(text, z.union([shown, z.object({open: z.array(text)}).strict(), z.object({error: text}).strict()])),
		checks: z.array(
			z
				.object({
					id: text,
					step: text,
					title: text,
					severity: z.enum(['stop', 'advise']),
					verdict: z.enum(['pass', 'fail', 'advise', 'open', 'skip']),
					relation: z.enum(['at_most', 'at_least']).optional(),
					value: shown.optional(),
					limit: shown.optional(),
					margin: shown.extend({fraction: z.number().nullable()}).strict().optional(),
					needs: z.array(text).optional(),
					message: text.optional(),
					error: text.optional(),
					explanation: text,
					basis: text,
				})
				.strict(),
		),
		confirmations: z.array(
			z
				.object({
					id: text,
					step: text,
					statement: text,
					status: z.enum(['yes', 'no', 'not_applicable', 'unanswered', 'skip', 'open']),
					note: text.optional(),
					needs: z.array(text).optional(),
				})
				.strict(),
		),
		caution: text,
		deferral: text,
	})
	.strict();

/** A record file: the body and the signatures over it. */
export const recordSchema = z
	.object({
		format: z.literal('prelase-record'),
		version: z.literal(1),
		body: recordBodySchema,
		signatures: z.array(signatureSchema).min(1, 'a record needs at least one signature'),
	})
	.strict();

export type RecordBody = z.infer<typeof recordBodySchema>;
export type Signature = z.infer<typeof signatureSchema>;
export type BenchRecord = z.infer<typeof recordSchema>;
