import {sha256Hex} from '../shared/sha256.js';
import type {Answers} from '../rules/evaluate/answers.js';
import type {CompiledRules} from '../rules/compile/compiled-rules.js';
import type {Evaluation} from '../rules/evaluate/evaluation.js';
import {evaluationToJson} from '../rules/evaluate/evaluation-json.js';
import {canonicalBytes} from './canonical.js';
import {recordBodySchema, type AnyBody, type RecordBody} from './record-schema.js';
import {isoWithOffset} from '../shared/iso-time.js';
import {displayPath} from '../shared/display-path.js';
import type {WhatIf} from '../rules/evaluate/what-if.js';
import {recordedCornerText} from './record-corner.js';
import {sensitivityBody} from './sensitivity-body.js';

/** A correction: the record it corrects (file name and body hash) and why. */
export type Amendment = {record: string; bodySha256: string; reason: string};

/**
 * The fingerprint of a setup: SHA-256 over the canonical form of the inputs the rules mark
 * as identifying (diode, driver, supply, wiring, location), so an audit can tell when a later
 * record is for a changed setup.
 */
export function setupFingerprint(rules: CompiledRules, answers: Answers): {fingerprint: string; identifying: string[]} {
	const identifying = [...rules.inputs.values()].filter(({input}) => input.identifies).map(({input}) => input.id);
	const values: Record<string, unknown> = {};
	for (const id of identifying) {
		const answer = answers.inputs.get(id);
		values[id] = !answer ? null : answer.kind === 'quantity' ? answer.si : answer.kind === 'choice' ? answer.option : answer.value;
	}
	return {fingerprint: `sha256:${sha256Hex(canonicalBytes(values))}`, identifying};
}

/** SHA-256 (hex) of the canonical form of a record body: how amendments and audits name a body. */
export function bodySha256(body: AnyBody): string {
	return sha256Hex(canonicalBytes(body));
}

/** Builds the body of a bench-check record, validated as plain data before anyone signs it. */
export function buildRecordBody(input: {rules: CompiledRules; answers: Answers; evaluation: Evaluation; operator: {name: string; role: string}; amends?: Amendment; /** The interlock test record the confirmations were answered from (the link's own shape). */ interlockTest?: NonNullable<RecordBody['interlockTest']> | null; now?: Date; /** The what-if analysis, kept as the record's sensitivity section when given. */ whatIf?: WhatIf}): RecordBody {
	const {rules, answers, evaluation, operator, amends} = input;
	const {tool, rules: _rulesSummary, setup, outcomeText: _outcomeText, caution: _caution, deferral: _deferral, inputs, derived, checks, confirmations, ...evaluated} = evaluationToJson(rules, answers, evaluation);
	const body = {
		kind: 'bench-check' as const,
		tool,
		createdAt: isoWithOffset(input.now ?? new Date()),
		operator,
		setup: {name: setup, fingerprint: setupFingerprint(rules, answers).fingerprint},
		...(amends ? {amends} : {}),
		// The text itself is stored once in the records folder under its SHA-256 (records/rule-texts.ts).
		rules: {name: rules.rules.name, file: displayPath(rules.file), sha256: rules.sha256},
		...evaluated,
		// What was entered, computed and concluded; the words of the rule text (titles, statements,
		// bases, the caution) are read from the stored text (records/record-words.ts); a margin's
		// number and fraction follow from the value and the limit.
		inputs: Object.fromEntries(Object.entries(inputs).map(([id, entry]) => [id, entry.entered])),
		derived: Object.fromEntries(Object.entries(derived).map(([id, entry]) => [id, 'si' in entry ? entry.si : entry])),
		checks: checks.map(({step: _step, title: _title, severity: _severity, relation: _relation, explanation: _explanation, basis: _basis, value, limit, margin, corner, ...check}) => ({
			...check,
			// Lean: one line (records/record-corner.ts); an end's number follows from the range entered.
			...optionalCorner(corner),
			...(value ? {value: figure(value)} : {}),
			...(limit ? {limit: figure(limit)} : {}),
			...(margin ? {margin: margin.text} : {}),
		})),
		confirmations: Object.fromEntries(confirmations.map(({id, step: _step, statement: _statement, status, ...more}) => [id, Object.keys(more).length === 0 ? status : {status, ...more}])),
		...(input.interlockTest ? {interlockTest: input.interlockTest} : {}),
		...(input.whatIf ? {sensitivity: sensitivityBody(input.whatIf)} : {}),
	};
	return recordBodySchema.parse(JSON.parse(JSON.stringify(body)));
}

/** A value as a record keeps it: the SI number and the text shown (the unit is the check's, in the rule text). */
function figure(value: {si: number; text: string}): {si: number; text: string} {
	return {si: value.si, text: value.text};
}

/** A check's corner as a record keeps it, when one of its ranges' ends mattered. */
function optionalCorner(corner: Parameters<typeof recordedCornerText>[0] | undefined): {corner?: string} {
	const line = corner && recordedCornerText(corner);
	return line === undefined ? {} : {corner: line};
}
