import type {CompiledRules} from '../rules/compile/compiled-rules.js';
import {evaluate} from '../rules/evaluate/evaluate.js';
import {evaluationKey} from '../rules/evaluate/evaluation-key.js';
import type {Evaluation} from '../rules/evaluate/evaluation.js';
import type {Finding} from '../records/findings.js';
import type {RecordBody} from '../records/record-schema.js';
import {answersFromRecord, type RecordAnswers} from './audit-answers.js';
import {conclusionFindings, conclusionParts, identityFindings} from './audit-consistency.js';
import {policyReport, type PolicyReport} from './audit-policy.js';
import {sensitivityFindings} from './audit-sensitivity.js';
import type {RecordRules} from './audit-rule-texts.js';

/** What auditContents finds about one authentic bench-check record. */
export type ContentsAudit = {consistency: {reevaluated: boolean; consistent: boolean; rulesSha256: string | null}; policy: PolicyReport; findings: Finding[]; switchedOff: number};

/** The part of a record's audit that follows from an evaluation and the record's conclusions alone. */
type Compared = {conclusions: Finding[]; policy: {report: PolicyReport; findings: Finding[]}};

/** Entries kept in each bounded memo; the oldest is dropped first. */
const kept = 512;

/**
 * The audit's memory of work already done, for records that repeat it: records of one setup
 * with the same numbers under the same rules are evaluated once (evaluate is pure), and records
 * that hold the same conclusions under the same evaluations are compared with them once (the
 * comparisons are pure in the evaluations and the parts of the body they read). Bounded.
 */
export class ContentsMemo {
	readonly #evaluations = new Map<string, Evaluation>();
	readonly #compared = new Map<string, Compared>();
	readonly #ids = new WeakMap<Evaluation, number>();
	#nextId = 0;

	/** The evaluation of these answers under these rules, made once per evaluation key. */
	evaluation(rules: CompiledRules, answers: RecordAnswers['answers']): Evaluation {
		const key = evaluationKey(rules, answers);
		let evaluation = this.#evaluations.get(key);
		if (!evaluation) {
			evaluation = evaluate(rules, answers);
			remember(this.#evaluations, key, evaluation);
		}
		return evaluation;
	}

	/**
	 * The comparisons of a body with its own evaluation (undefined: its rule text was not had) and
	 * the current one. `members`: the canonical text of each of the body's members, when
	 * integrity checking made them (the body's parts need not be written again for the key).
	 */
	compared(body: RecordBody, members: ReadonlyMap<string, string> | undefined, own: Evaluation | undefined, current: {rules: CompiledRules; read: RecordAnswers; evaluation: Evaluation}): Compared {
		// Every input of the two comparisons: the evaluations (by identity), the body's parts they read, and what the current rules made of its inputs. JSON text has no line break.
		const texts = members && conclusionMembers.map((name) => members.get(name));
		const parts = texts?.every((text) => text !== undefined) ? texts.join('\n') : JSON.stringify(conclusionParts(body));
		const key = `${own ? this.#id(own) : '-'} ${this.#id(current.evaluation)}\n${parts}\n${JSON.stringify([body.rules.sha256, current.read.refusedInputs, current.read.unknownInputs])}`;
		let compared = this.#compared.get(key);
		if (!compared) {
			compared = {conclusions: own ? conclusionFindings(body, own) : [], policy: policyReport(body, current.rules, current.read, current.evaluation)};
			remember(this.#compared, key, compared);
		}
		return compared;
	}

	#id(evaluation: Evaluation): number {
		let id = this.#ids.get(evaluation);
		if (id === undefined) this.#ids.set(evaluation, (id = this.#nextId++));
		return id;
	}
}

/** The body's members whose values conclusionParts gives, by name (both the same parts; a test holds them equal). */
export const conclusionMembers = ['derived', 'checks', 'counts', 'confirmations', 'missingInputs', 'outcome'];

function remember<T>(memo: Map<string, T>, key: string, value: T): void {
	if (memo.size >= kept) memo.delete(memo.keys().next().value!);
	memo.set(key, value);
}

/**
 * Audits one authentic bench-check record's contents: consistency under its own rules (its
 * inputs re-read, re-evaluated, every conclusion compared), and what the current rules would
 * change. The findings are new arrays; the finding objects and the policy report may be shared
 * with other records (they are never changed once made).
 */
export function auditContents(body: RecordBody, members: ReadonlyMap<string, string> | undefined, own: RecordRules, current: CompiledRules, memo: ContentsMemo): ContentsAudit {
	const findings: Finding[] = [...own.findings];
	let judged: {rules: CompiledRules; read: RecordAnswers; evaluation: Evaluation} | undefined;
	if (own.rules) {
		const read = answersFromRecord(own.rules, body);
		judged = {rules: own.rules, read, evaluation: memo.evaluation(own.rules, read.answers)};
		findings.push(...identityFindings(body, own.rules, read));
	}
	// The same rule text and the same answers give the same evaluation: evaluate is pure.
	const read = judged && judged.rules === current ? judged.read : answersFromRecord(current, body);
	const evaluation = judged && judged.rules === current ? judged.evaluation : memo.evaluation(current, read.answers);
	const compared = memo.compared(body, members, judged?.evaluation, {rules: current, read, evaluation});
	findings.push(...compared.conclusions);
	// A record signed with its flip points: worked out again from its own numbers (nothing to do for a record without them).
	if (judged) findings.push(...sensitivityFindings(body, judged.rules, judged.read.answers, judged.evaluation));
	const consistency = {reevaluated: judged !== undefined, consistent: findings.length === 0, rulesSha256: own.sha256};
	return {consistency, policy: compared.policy.report, findings: [...findings, ...compared.policy.findings], switchedOff: judged?.rules.switchedOff.length ?? 0};
}
