import type {RecordBody} from '../records/record-schema.js';
import type {Outcome} from '../rules/evaluate/evaluation.js';

/** The facts of a record an auditor reads first. */
export type RecordSummary = {
	createdAt: string;
	tool: RecordBody['tool'];
	operator: RecordBody['operator'];
	setup: {name: string | null; fingerprint: string};
	outcome: Outcome;
	rules: {name: string; file: string; sha256: string};
	/** The interlock test record the check's confirmations were answered from, if it named a plan. */
	interlockTest: NonNullable<RecordBody['interlockTest']> | null;
	/** Confirmations answered no or not applicable, with their notes: what an auditor reads closely. */
	exceptions: Array<{id: string; statement: string; status: string; note?: string}>;
};
