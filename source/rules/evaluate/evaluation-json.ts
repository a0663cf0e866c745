import {version} from '../../shared/version.js';
import {deferral} from '../../shared/deferral.js';
import {dimensions} from '../../quantities/dimensions.js';
import type {Answers} from './answers.js';
import type {CompiledRules} from '../compile/compiled-rules.js';
import {outcomeWords, type Evaluation, type Shown, type Verdict} from './evaluation.js';
import {shownSi} from './shown-value.js';
import {countVerdicts} from './verdict-words.js';
import {cornerToJson} from './corner-json.js';

/** A value in the JSON output: SI number, its SI unit, and the text a person reads. */
export type JsonValue = {si: number; unit: string; text: string};

function json(value: Shown): JsonValue {
	return {si: value.si, unit: dimensions[value.dimension].si, text: value.text};
}

/**
 * The evaluation as plain JSON data, the shape `prelase check --json` prints and records
 * build on. Values carry SI numbers with their unit and the text shown to people. Checks a
 * site file switched off are not evaluated; `rules.switchedOff` lists them with their reasons
 * (a record keeps them in its embedded rule text).
 */
export function evaluationToJson(rules: CompiledRules, answers: Answers, evaluation: Evaluation) {
	const counts = countVerdicts(evaluation.checks);
	const inputs: Record<string, {entered: string} & Partial<JsonValue> & {option?: string; value?: boolean | string; range?: {low: JsonValue; high: JsonValue}}> = {};
	for (const [id, answer] of answers.inputs) {
		if (answer.kind === 'quantity') inputs[id] = {entered: answer.entered, ...json(shownSi(answer.si, answer.dimension)), ...(answer.range ? {range: {low: json(shownSi(answer.range.low, answer.dimension)), high: json(shownSi(answer.range.high, answer.dimension))}} : {})};
		else if (answer.kind === 'choice') inputs[id] = {entered: answer.entered, option: answer.option};
		else inputs[id] = {entered: answer.entered, value: answer.value};
	}
	return {
		tool: {name: 'prelase', version},
		rules: {
			name: rules.rules.name,
			file: rules.file,
			sha256: rules.sha256,
			// Listed only when there are some, so the shape for the shipped policy stays as it was.
			...(rules.switchedOff.length > 0 ? {switchedOff: rules.switchedOff.map(({check}) => ({id: check.id, title: check.title, reason: check.switched_off ?? ''}))} : {}),
		},
		setup: answers.setup ?? null,
		outcome: evaluation.outcome,
		outcomeText: outcomeWords[evaluation.outcome],
		counts,
		missingInputs: evaluation.missingInputs,
		inputs,
		derived: Object.fromEntries(
			evaluation.derived.map((entry) => [entry.id, entry.status === 'value' ? {...json(entry.value), ...(entry.span ? {span: {low: json(entry.span.low), high: json(entry.span.high)}} : {})} : entry.status === 'open' ? {open: entry.needs} : {error: entry.error}]),
		),
		checks: evaluation.checks.map((check) => ({
			id: check.id,
			step: check.step,
			title: check.title,
			severity: check.severity,
			verdict: check.verdict,
			...(check.relation ? {relation: check.relation} : {}),
			...(check.value ? {value: json(check.value)} : {}),
			...(check.limit ? {limit: json(check.limit)} : {}),
			...(check.margin ? {margin: {...json(check.margin), fraction: check.margin.fraction}} : {}),
			...(check.needs ? {needs: check.needs} : {}),
			...(check.message ? {message: check.message} : {}),
			...(check.error ? {error: check.error} : {}),
			...(check.reason ? {reason: check.reason} : {}),
			...(check.corner ? {corner: cornerToJson(check.corner)} : {}),
			explanation: check.explanation,
			basis: check.basis,
		})),
		confirmations: evaluation.confirmations.map((entry) => ({
			id: entry.id,
			step: entry.step,
			statement: entry.statement,
			status: entry.status,
			...(entry.note ? {note: entry.note} : {}),
			...(entry.needs ? {needs: entry.needs} : {}),
		})),
		caution: rules.rules.caution,
		deferral,
	};
}
