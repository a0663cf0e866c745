import {displayPath} from '../../shared/display-path.js';
import type {CompiledRules} from '../compile/compiled-rules.js';
import type {SeverityChange} from '../file/provenance.js';
import {policyKindText, policyValueText, type Check, type Input} from '../file/schema.js';

/** Where a part was written, as a person reads it. */
export type ShowOrigin = {file: string; line: number};

/** A check as `rules show` lists it: its condition in one line, severity, basis and origin. */
export type ShowCheck = {
	id: string;
	title: string;
	step: string;
	severity: 'stop' | 'advise';
	/** `value ≤ limit`, `value ≥ limit`, or the `holds` condition. */
	condition: string;
	when?: string;
	explanation: string;
	basis: string;
	from: ShowOrigin | null;
	severityChange?: SeverityChange & {at: ShowOrigin | null};
};

/** The effective rules, step by step, with where each part came from. */
export type RulesShow = {
	name: string;
	file: string;
	sha256: string;
	/** The loaded file first, then each base. */
	chain: string[];
	caution: string;
	policy: Array<{id: string; value: string; dimension: string; meaning: string; basis: string; from: ShowOrigin | null; previous?: {value: string; file: string}}>;
	tables: Array<{id: string; label: string; key: string; value: string; rows: Record<string, string[]>; basis: string; from: ShowOrigin | null}>;
	steps: Array<{
		id: string;
		title: string;
		from: ShowOrigin | null;
		inputs: Array<{id: string; label: string; kind: Input['kind']; detail: string; when?: string; from: ShowOrigin | null}>;
		confirmations: Array<{id: string; statement: string; when?: string; notApplicable: 'allowed' | 'forbidden'; basis: string; from: ShowOrigin | null}>;
		checks: ShowCheck[];
	}>;
	derived: Array<{id: string; label: string; dimension: string; formula: string; from: ShowOrigin | null}>;
	switchedOff: Array<ShowCheck & {reason: string; switchedOffAt: ShowOrigin | null}>;
};

const oneLine = (text: string) => text.replaceAll(/\s+/g, ' ').trim();

/** A check's condition in one line. */
export function checkCondition(check: Check): string {
	if (check.holds !== undefined) return oneLine(check.holds);
	const relation = check.at_most === undefined ? '≥' : '≤';
	return `${oneLine(check.value ?? '')} ${relation} ${oneLine(check.at_most ?? check.at_least ?? '')}`;
}

function inputDetail(input: Input): string {
	if (input.kind === 'quantity') return `${input.dimension}, ${input.range[0]} to ${input.range[1]}${input.default === undefined ? '' : `, default ${input.default}`}`;
	if (input.kind === 'choice') return `choice: ${Object.keys(input.options).join(', ')}`;
	if (input.kind === 'yes_no') return 'yes or no';
	return 'text';
}

/** The effective rules of a compiled rule file, ready to print or to give as JSON. */
export function showRules(rules: CompiledRules): RulesShow {
	const {provenance} = rules;
	const from = (key: string): ShowOrigin | null => {
		const origin = provenance.where(key);
		return origin ? {file: displayPath(origin.file), line: origin.line} : null;
	};
	const showCheck = (check: Check): ShowCheck => {
		const change = provenance.severityChanges.get(check.id);
		return {
			id: check.id,
			title: check.title,
			step: check.step,
			severity: check.severity,
			condition: checkCondition(check),
			...(check.when === undefined ? {} : {when: oneLine(check.when)}),
			explanation: oneLine(check.explanation),
			basis: oneLine(check.basis),
			from: from(`check.${check.id}`),
			...(change ? {severityChange: {...change, at: from(`check.${check.id}.severity`)}} : {}),
		};
	};
	const evaluated = rules.checks.map(({check}) => check);
	return {
		name: rules.rules.name,
		file: displayPath(rules.file),
		sha256: rules.sha256,
		chain: provenance.chain.map((file) => displayPath(file)),
		caution: oneLine(rules.rules.caution),
		policy: Object.entries(rules.rules.policy).map(([id, entry]) => {
			const previous = provenance.previousPolicy.get(id);
			return {
				id,
				value: policyValueText(entry.value),
				dimension: policyKindText(entry),
				meaning: oneLine(entry.meaning),
				basis: oneLine(entry.basis),
				from: from(`policy.${id}.value`),
				...(previous ? {previous: {value: String(previous.value), file: displayPath(previous.file)}} : {}),
			};
		}),
		tables: [...rules.tables].map(([id, table]) => ({id, label: table.label, key: table.key, value: table.value, rows: table.rows, basis: oneLine(table.basis), from: from(`table.${id}`)})),
		steps: rules.rules.steps.map((step) => ({
			id: step.id,
			title: step.title,
			from: from(`step.${step.id}`),
			inputs: step.inputs.map((input) => ({id: input.id, label: input.label, kind: input.kind, detail: inputDetail(input), ...(input.when === undefined ? {} : {when: oneLine(input.when)}), from: from(`input.${input.id}`)})),
			confirmations: step.confirmations.map((entry) => ({
				id: entry.id,
				statement: oneLine(entry.statement),
				...(entry.when === undefined ? {} : {when: oneLine(entry.when)}),
				notApplicable: entry.not_applicable,
				basis: oneLine(entry.basis),
				from: from(`confirmation.${entry.id}`),
			})),
			checks: evaluated.filter((check) => check.step === step.id).map(showCheck),
		})),
		derived: rules.rules.derived.map((entry) => ({id: entry.id, label: entry.label, dimension: entry.dimension, formula: oneLine(entry.formula), from: from(`derived.${entry.id}`)})),
		switchedOff: rules.switchedOff.map(({check}) => ({...showCheck(check), reason: check.switched_off ?? '', switchedOffAt: from(`check.${check.id}.switched_off`)})),
	};
}
