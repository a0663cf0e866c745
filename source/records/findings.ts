import {messages, type ProblemCode} from '../shared/messages.js';
import {fillPlaceholders} from '../shared/problems.js';

/**
 * What part of the audit a finding comes from. `integrity` findings make a record
 * untrustworthy (exit 3); every other kind leaves it authentic, with findings (exit 1).
 */
export type FindingKind = 'integrity' | 'trust' | 'consistency' | 'policy' | 'history';

/** Code of an audit finding; its words live in messages.ts. */
export type AuditCode = Extract<ProblemCode, `audit-${string}`>;

/** One thing the audit found about a record, with the values that fill its message. */
export type Finding = {kind: FindingKind; code: AuditCode; data: Record<string, string | number>};

/** Makes a finding. */
export function finding(kind: FindingKind, code: AuditCode, data: Finding['data'] = {}): Finding {
	return {kind, code, data};
}

/** A finding in words (not yet stripped of control characters: the face does that). */
export function describeFinding(found: Pick<Finding, 'code' | 'data'>): string {
	return fillPlaceholders(messages[found.code], found.data);
}
