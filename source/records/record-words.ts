import {deferral} from '../shared/deferral.js';
import type {CompiledRules} from '../rules/compile/compiled-rules.js';
import {confirmationList, type RecordBody, type RecordConfirmation} from './record-schema.js';
import {parseInputEntry} from '../rules/evaluate/input-entry.js';
import {dimensions} from '../quantities/dimensions.js';
import {formatQuantity} from '../quantities/format.js';

type RecordCheck = RecordBody['checks'][number];

/**
 * A record body with the words that come from its rule text put back: each check's step,
 * title, severity, relation, explanation and basis, each confirmation's step and statement,
 * the identifying inputs, each derived value's text (from its dimension), the caution and
 * the deferral. A record states only what was entered, computed
 * and concluded, and names its rule text by SHA-256; the words are the text's, so they are
 * read from it. What the record itself states is never replaced. With no rules (the text could
 * not be had) the body is returned as it is, and printers fall back to ids.
 */
export function withRuleWords(body: RecordBody, rules: CompiledRules | null): RecordBody {
	if (!rules) return body;
	const checks = new Map([...rules.checks, ...rules.switchedOff].map((compiled) => [compiled.check.id, compiled]));
	const dimensions = new Map(rules.derived.map(({derived}) => [derived.id, derived.dimension]));
	return {
		...body,
		setup: body.setup.identifying ? body.setup : {...body.setup, identifying: [...rules.inputs.values()].filter(({input}) => input.identifies).map(({input}) => input.id)},
		checks: body.checks.map((check): RecordCheck => {
			const compiled = checks.get(check.id);
			if (!compiled) return check;
			const relation = check.relation ?? compiled.relation;
			return {
				...check,
				step: check.step ?? compiled.check.step,
				title: check.title ?? compiled.check.title,
				severity: check.severity ?? compiled.check.severity,
				...(relation && (check.value || check.relation) ? {relation} : {}),
				explanation: check.explanation ?? compiled.check.explanation,
				basis: check.basis ?? compiled.check.basis,
			};
		}),
		confirmations: confirmationList(body).map((entry): RecordConfirmation => {
			const compiled = rules.confirmations.get(entry.id);
			return compiled ? {...entry, step: entry.step ?? compiled.step.id, statement: entry.statement ?? compiled.confirmation.statement} : entry;
		}),
		derived: Object.fromEntries(
			Object.entries(body.derived).map(([id, entry]) => {
				const dimension = typeof entry === 'number' ? dimensions.get(id) : undefined;
				return [id, typeof entry === 'number' && dimension ? {si: entry, text: formatQuantity(entry, dimension)} : entry];
			}),
		),
		caution: body.caution ?? rules.rules.caution,
		deferral: body.deferral ?? deferral,
	};
}

/**
 * A record body with each input that the record keeps as entered (records since the lean body)
 * read again under its rules, as a printed record shows it: the value in SI with its unit and
 * the text shown, the option chosen, or the yes/no or text given. An entry the rules refuse
 * stays as entered. With no rules the body is returned as it is.
 */
export function withInputsRead(body: RecordBody, rules: CompiledRules | null): RecordBody {
	if (!rules) return body;
	const inputs: RecordBody['inputs'] = {};
	for (const [id, value] of Object.entries(body.inputs)) {
		const compiled = rules.inputs.get(id);
		const read = typeof value === 'string' && compiled ? parseInputEntry(compiled, value) : undefined;
		if (!read?.ok) {
			inputs[id] = value;
			continue;
		}
		const answer = read.value;
		inputs[id] =
			answer.kind === 'quantity'
				? {entered: answer.entered, si: answer.si, unit: dimensions[answer.dimension].si, text: formatQuantity(answer.si, answer.dimension)}
				: answer.kind === 'choice'
					? {entered: answer.entered, option: answer.option}
					: {entered: answer.entered, value: answer.value};
	}
	return {...body, inputs};
}
