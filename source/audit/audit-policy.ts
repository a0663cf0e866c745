import type {CompiledRules} from '../rules/compile/compiled-rules.js';
import {outcomeWords, type Evaluation, type Outcome, type Verdict} from '../rules/evaluate/evaluation.js';
import type {RecordAnswers, RefusedInput} from './audit-answers.js';
import {finding, type Finding} from '../records/findings.js';
import {confirmationList, type RecordBody} from '../records/record-schema.js';

/** A check whose verdict would differ under the current rules (null: the check is not in that rule file). */
export type PolicyChange = {
	id: string;
	title: string;
	recorded: Verdict | null;
	current: Verdict | null;
	/** The current value and limit, as text, when the current rules evaluate them. */
	value?: string;
	limit?: string;
	relation?: 'at_most' | 'at_least';
};

/** What would change if the record's setup were checked again under the site's current rules. */
export type PolicyReport = {
	rules: {name: string; file: string; sha256: string};
	/** The record was made under exactly these rules (same SHA-256). */
	sameRules: boolean;
	outcome: {recorded: Outcome; current: Outcome};
	checks: PolicyChange[];
	/** Inputs the current rules ask for that the record does not give. */
	inputsNeeded: string[];
	/** The record's inputs that the current rules refuse as entered (a tighter range, say). */
	inputsRefused: RefusedInput[];
	/** The record's inputs that the current rules no longer have. */
	inputsNotUsed: string[];
	/** Confirmations in the current rules that the record does not have. */
	confirmationsAdded: Array<{id: string; statement: string; status: string}>;
};

/**
 * Compares a record's recorded verdicts and outcome with an evaluation of its inputs under
 * the current rules, and says what would change. A changed outcome or verdict is a finding.
 */
export function policyReport(body: RecordBody, current: CompiledRules, read: RecordAnswers, evaluation: Evaluation): {report: PolicyReport; findings: Finding[]} {
	const recorded = new Map(body.checks.map((check) => [check.id, check]));
	const checks: PolicyChange[] = [];
	for (const check of evaluation.checks) {
		const held = recorded.get(check.id)?.verdict ?? null;
		recorded.delete(check.id);
		if (held === check.verdict || (held === null && check.verdict === 'skip')) continue;
		checks.push({
			id: check.id,
			title: check.title,
			recorded: held,
			current: check.verdict,
			...(check.value ? {value: check.value.text} : {}),
			...(check.limit ? {limit: check.limit.text} : {}),
			...(check.relation ? {relation: check.relation} : {}),
		});
	}
	for (const [id, check] of recorded) if (check.verdict !== 'skip') checks.push({id, title: check.title ?? id, recorded: check.verdict, current: null});

	const answeredIds = new Set(confirmationList(body).map((entry) => entry.id));
	const report: PolicyReport = {
		rules: {name: current.rules.name, file: current.file, sha256: current.sha256},
		sameRules: current.sha256 === body.rules.sha256,
		outcome: {recorded: body.outcome, current: evaluation.outcome},
		checks,
		inputsNeeded: [...evaluation.missingInputs],
		inputsRefused: read.refusedInputs,
		inputsNotUsed: read.unknownInputs,
		confirmationsAdded: evaluation.confirmations.filter((entry) => !answeredIds.has(entry.id)).map((entry) => ({id: entry.id, statement: entry.statement, status: entry.status})),
	};
	const data = {rules: current.file, recorded: outcomeWords[body.outcome], current: outcomeWords[evaluation.outcome], count: checks.length};
	const findings: Finding[] = [];
	if (evaluation.outcome !== body.outcome) findings.push(finding('policy', 'audit-policy-outcome', data));
	else if (checks.length > 0) findings.push(finding('policy', 'audit-policy-verdicts', data));
	return {report, findings};
}
