import type {AuditCode} from '../records/findings.js';

/** Something the audit could not check, and why (it is not a finding). */
export type NotChecked = {item: 'record-age' | 'interlock-test'; code: AuditCode};

/** What the audit cannot check on any bench-check record: the rule files hold no validity period for records. */
export const notChecked: readonly NotChecked[] = [{item: 'record-age', code: 'audit-not-checked-age'}];
