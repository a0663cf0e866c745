import type {CodedMessage} from '../../shared/problems.js';

/** What a finding concerns: a device, an access point, the input, or the loop as a whole. */
export type FindingSubject = {kind: 'device' | 'access_point'; id: string} | {kind: 'input' | 'loop'};

/** A weak spot of an interlock plan. `stop` must be resolved before emission; `advise` is a warning. */
export type Finding = CodedMessage & {
	severity: 'stop' | 'advise';
	subject: FindingSubject;
};

/** Makes a finding. */
export function finding(code: Finding['code'], severity: Finding['severity'], subject: FindingSubject, data: Finding['data'] = {}): Finding {
	return {code, severity, subject, data};
}

/** The subject as a person reads it: `device lid_switch`, `access point rear_panel`, `input`, `loop`. */
export function subjectText(subject: FindingSubject): string {
	if (subject.kind === 'device') return `device ${subject.id}`;
	if (subject.kind === 'access_point') return `access point ${subject.id}`;
	return subject.kind;
}
