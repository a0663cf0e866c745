import type {CompiledCheck, CompiledRules} from '../compile/compiled-rules.js';
import {policyKindText, policyValueText, type Check} from '../file/schema.js';

/** A part named by id, with the words a person reads. */
export type Named = {id: string; title: string};

/** A policy value whose value differs: as written in each file, with its dimension. */
export type PolicyValueChange = {id: string; dimension: string; from: string; to: string; fromSi: number; toSi: number};

/** One field of a check that differs. */
export type FieldChange = {field: 'severity' | 'step' | 'when' | 'value' | 'at_most' | 'at_least' | 'holds' | 'dimension'; from: string | null; to: string | null};

/**
 * What differs between two rule files in meaning (not in text): policy values, checks added,
 * removed, switched off or on, or whose formulas or severity changed, and inputs,
 * confirmations, derived values, tables and steps added or removed.
 */
export type RulesDiff = {
	from: {name: string; file: string; sha256: string};
	to: {name: string; file: string; sha256: string};
	equal: boolean;
	name: {from: string; to: string} | null;
	cautionChanged: boolean;
	policy: {changed: PolicyValueChange[]; added: Array<{id: string; dimension: string; value: string}>; removed: Array<{id: string; dimension: string; value: string}>};
	checks: {
		added: Array<Named & {severity: string; step: string}>;
		removed: Array<Named & {severity: string}>;
		switchedOff: Array<Named & {reason: string}>;
		switchedOn: Named[];
		changed: Array<Named & {changes: FieldChange[]}>;
	};
	inputs: {added: Array<Named & {step: string}>; removed: Array<Named & {step: string}>};
	confirmations: {added: Array<Named & {step: string}>; removed: Array<Named & {step: string}>};
	derived: {added: Named[]; removed: Named[]; changed: Array<Named & {from: string; to: string}>};
	tables: {added: string[]; removed: string[]; changed: string[]};
	steps: {added: Named[]; removed: Named[]};
};

const formulaFields = ['when', 'value', 'at_most', 'at_least', 'holds'] as const;

/** Formulas compare without regard to spacing or line breaks. */
function normal(text: string | undefined): string | null {
	return text === undefined ? null : text.replaceAll(/\s+/g, ' ').trim();
}

function checkChanges(a: Check, b: Check): FieldChange[] {
	const changes: FieldChange[] = [];
	if (a.severity !== b.severity) changes.push({field: 'severity', from: a.severity, to: b.severity});
	if (a.step !== b.step) changes.push({field: 'step', from: a.step, to: b.step});
	for (const field of formulaFields) {
		const from = normal(a[field]);
		const to = normal(b[field]);
		if (from !== to) changes.push({field, from, to});
	}
	if ((a.dimension ?? null) !== (b.dimension ?? null)) changes.push({field: 'dimension', from: a.dimension ?? null, to: b.dimension ?? null});
	return changes;
}

function byId(list: readonly CompiledCheck[]): Map<string, Check> {
	return new Map(list.map(({check}) => [check.id, check]));
}

function inputsOf(rules: CompiledRules) {
	return new Map([...rules.inputs].map(([id, {input, step}]) => [id, {id, title: input.label, step: step.id}]));
}

function confirmationsOf(rules: CompiledRules) {
	return new Map([...rules.confirmations].map(([id, {confirmation, step}]) => [id, {id, title: confirmation.statement, step: step.id}]));
}

function addedRemoved<T>(a: ReadonlyMap<string, T>, b: ReadonlyMap<string, T>): {added: T[]; removed: T[]} {
	return {added: [...b].filter(([id]) => !a.has(id)).map(([, value]) => value), removed: [...a].filter(([id]) => !b.has(id)).map(([, value]) => value)};
}

/** Compares two compiled rule files by meaning. `equal` is true when nothing that changes a check or what is asked differs. */
export function diffRules(a: CompiledRules, b: CompiledRules): RulesDiff {
	const policy: RulesDiff['policy'] = {changed: [], added: [], removed: []};
	for (const [id, entry] of Object.entries(b.rules.policy)) {
		const old = a.rules.policy[id];
		const toSi = b.policy.get(id)?.si ?? Number.NaN;
		if (!old) policy.added.push({id, dimension: policyKindText(entry), value: policyValueText(entry.value)});
		else if (policyKindText(old) !== policyKindText(entry) || a.policy.get(id)?.si !== b.policy.get(id)?.si || policyValueText(a.optionLists.get(id) ?? []) !== policyValueText(b.optionLists.get(id) ?? [])) {
			policy.changed.push({id, dimension: policyKindText(entry), from: policyValueText(old.value), to: policyValueText(entry.value), fromSi: a.policy.get(id)?.si ?? Number.NaN, toSi});
		}
	}
	for (const [id, entry] of Object.entries(a.rules.policy)) if (!Object.hasOwn(b.rules.policy, id)) policy.removed.push({id, dimension: policyKindText(entry), value: policyValueText(entry.value)});

	const onA = byId(a.checks);
	const offA = byId(a.switchedOff);
	const onB = byId(b.checks);
	const offB = byId(b.switchedOff);
	const checks: RulesDiff['checks'] = {added: [], removed: [], switchedOff: [], switchedOn: [], changed: []};
	for (const [id, check] of [...onB, ...offB]) {
		const old = onA.get(id) ?? offA.get(id);
		if (!old) {
			checks.added.push({id, title: check.title, severity: check.severity, step: check.step});
			continue;
		}
		if (onA.has(id) && offB.has(id)) checks.switchedOff.push({id, title: check.title, reason: check.switched_off ?? ''});
		if (offA.has(id) && onB.has(id)) checks.switchedOn.push({id, title: check.title});
		const changes = checkChanges(old, check);
		if (changes.length > 0) checks.changed.push({id, title: check.title, changes});
	}
	for (const [id, check] of [...onA, ...offA]) if (!onB.has(id) && !offB.has(id)) checks.removed.push({id, title: check.title, severity: check.severity});

	const derivedA = new Map(a.rules.derived.map((entry) => [entry.id, entry]));
	const derivedB = new Map(b.rules.derived.map((entry) => [entry.id, entry]));
	const derived = addedRemoved(new Map([...derivedA].map(([id, entry]) => [id, {id, title: entry.label}])), new Map([...derivedB].map(([id, entry]) => [id, {id, title: entry.label}])));
	const derivedChanged = [...derivedB]
		.filter(([id, entry]) => derivedA.has(id) && normal(derivedA.get(id)!.formula) !== normal(entry.formula))
		.map(([id, entry]) => ({id, title: entry.label, from: normal(derivedA.get(id)!.formula)!, to: normal(entry.formula)!}));

	const tables = {
		added: [...b.tables.keys()].filter((id) => !a.tables.has(id)),
		removed: [...a.tables.keys()].filter((id) => !b.tables.has(id)),
		changed: [...b.tables].filter(([id, table]) => a.tables.has(id) && JSON.stringify(a.tables.get(id)) !== JSON.stringify(table)).map(([id]) => id),
	};
	const steps = addedRemoved(new Map(a.rules.steps.map((step) => [step.id, {id: step.id, title: step.title}])), new Map(b.rules.steps.map((step) => [step.id, {id: step.id, title: step.title}])));

	const diff: Omit<RulesDiff, 'equal'> = {
		from: {name: a.rules.name, file: a.file, sha256: a.sha256},
		to: {name: b.rules.name, file: b.file, sha256: b.sha256},
		name: a.rules.name === b.rules.name ? null : {from: a.rules.name, to: b.rules.name},
		cautionChanged: normal(a.rules.caution) !== normal(b.rules.caution),
		policy,
		checks,
		inputs: addedRemoved(inputsOf(a), inputsOf(b)),
		confirmations: addedRemoved(confirmationsOf(a), confirmationsOf(b)),
		derived: {...derived, changed: derivedChanged},
		tables,
		steps,
	};
	return {...diff, equal: differenceCount(diff) === 0};
}

/** How many differences a diff lists (a check with several changed fields counts once). */
export function differenceCount(diff: Omit<RulesDiff, 'equal'>): number {
	const lists = [
		diff.policy.changed,
		diff.policy.added,
		diff.policy.removed,
		...Object.values(diff.checks),
		diff.inputs.added,
		diff.inputs.removed,
		diff.confirmations.added,
		diff.confirmations.removed,
		diff.derived.added,
		diff.derived.removed,
		diff.derived.changed,
		diff.tables.added,
		diff.tables.removed,
		diff.tables.changed,
		diff.steps.added,
		diff.steps.removed,
	];
	return lists.reduce((sum, list) => sum + list.length, 0) + (diff.name ? 1 : 0) + (diff.cautionChanged ? 1 : 0);
}
