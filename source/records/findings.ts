import type {ProblemCode} from '../shared/messages.js';
import type {CodedMessage} from '../shared/problems.js';

/**
 * What part of the audit a finding comes from. `integrity` findings make a record
 * untrustworthy (exit 3); every other kind leaves it authentic, with findings (exit 1).
 */
export type FindingKind = 'integrity' | 'trust' | 'consistency' | 'policy' | 'history';

/** Code of an audit finding; its words live in messages.ts. */
export type AuditCode = Extract<ProblemCode, `audit-${string}`>;

/** One thing the audit found about a record: a coded message (worded by describeProblem) and the part of the audit it comes from. */
export type Finding = CodedMessage<AuditCode> & {kind: FindingKind};

/** Makes a finding. */
export function finding(kind: FindingKind, code: AuditCode, data: Finding['data'] = {}): Finding {
	return {kind, code, data};
}
