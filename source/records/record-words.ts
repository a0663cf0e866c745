import {deferral} from '../shared/deferral.js';
import type {CompiledRules} from '../rules/compile/compiled-rules.js';
import {confirmationList, type RecordBody, type RecordConfirmation} from './record-schema.js';
import {parseInputEntry} from '../rules/evaluate/input-entry.js';
import {dimensions, type Dimension} from '../quantities/dimensions.js';
import {formatQuantity} from '../quantities/format.js';

type RecordCheck = RecordBody['checks'][number];

const lookupsByRules = new WeakMap<CompiledRules, {checks: ReadonlyMap<string, CompiledRules['checks'][number]>; dimensions: ReadonlyMap<string, Dimension>; identifying: readonly string[]}>();

/** The rules' checks and derived values by id, and the inputs that identify a setup: made once per rules. */
function lookups(rules: CompiledRules) {
	let known = lookupsByRules.get(rules);
	if (!known) {
		known = {
			checks: new Map([...rules.checks, ...rules.switchedOff].map((compiled) => [compiled.check.id, compiled])),
			dimensions: new Map(rules.derived.map(({derived}) => [derived.id, derived.dimension])),
			identifying: [...rules.inputs.values()].filter(({input}) => input.identifies).map(({input}) => input.id),
		};
		lookupsByRules.set(rules, known);
	}
	return known;
}

/** What an audit reads of a record's rule text without putting its words back into each record: a confirmation's statement, a check's title, the identifying inputs. */
export type RuleWords = {statement(id: string): string | undefined; title(id: string): string | undefined; identifying: readonly string[]};

/** The words of these rules, looked up by id (made once per rules). */
export function ruleWords(rules: CompiledRules): RuleWords {
	const {checks, identifying} = lookups(rules);
	return {statement: (id) => rules.confirmations.get(id)?.confirmation.statement, title: (id) => checks.get(id)?.check.title, identifying};
}

/**
 * A record body with the words that come from its rule text put back: each check's step,
 * title, severity, relation, explanation and basis, each confirmation's step and statement,
 * the identifying inputs, the caution and the deferral. A record states only what was entered, computed
 * and concluded, and names its rule text by SHA-256; the words are the text's, so they are
 * read from it. What the record itself states is never replaced. With no rules (the text could
 * not be had) the body is returned as it is, and printers fall back to ids.
 */
export function withRuleWords(body: RecordBody, rules: CompiledRules | null): RecordBody {
	if (!rules) return body;
	const {checks, identifying} = lookups(rules);
	return {
		...body,
		setup: body.setup.identifying ? body.setup : {...body.setup, identifying: [...identifying]},
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
		caution: body.caution ?? rules.rules.caution,
		deferral: body.deferral ?? deferral,
	};
}

/**
 * A record body with its values as a printed record shows them (records since the lean body
 * keep inputs as entered and derived values as SI numbers): each input read again under its
 * rules (the value in SI with its unit and the text shown, the option chosen, or the yes/no or
 * text given; an entry the rules refuse stays as entered), and each derived value with its
 * text in its dimension. With no rules the body is returned as it is.
 */
export function withValuesShown(body: RecordBody, rules: CompiledRules | null): RecordBody {
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
	const derivedDimensions = lookups(rules).dimensions;
	const derived = Object.fromEntries(
		Object.entries(body.derived).map(([id, entry]) => {
			const dimension = typeof entry === 'number' ? derivedDimensions.get(id) : undefined;
			return [id, typeof entry === 'number' && dimension ? {si: entry, text: formatQuantity(entry, dimension)} : entry];
		}),
	);
	return {...body, inputs, derived};
}
