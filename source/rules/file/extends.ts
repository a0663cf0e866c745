import {dirname, resolve} from 'node:path';
import {displayPath} from '../../shared/display-path.js';
import {problem, type Problem} from '../../shared/problems.js';
import type {YamlSource} from '../../shared/yaml-source.js';
import {didYouMean} from '../../shared/did-you-mean.js';
import {PlaceBook, type Place, type Provenance, type SeverityChange} from './provenance.js';
import {resolvedRuleText, type ChainEntry} from './resolved-text.js';
import {readRuleSource, shippedRulesPath} from './rule-source.js';
import {policyKindText, policyValueText, ruleFileSchema, type RuleFile} from './schema.js';
import {schemaProblems} from './schema-problems.js';
import {siteFileSchema, type SiteFile} from './site-schema.js';

type Path = ReadonlyArray<string | number>;

/** A part of the merged rules (by path) and where it was written. */
type Mapped = {merged: Path; place: Place};

/** A chain of rule files resolved into one set of rules, remembering where each part came from. */
export type ResolvedRules = {
	rules: RuleFile;
	chain: ChainEntry[];
	map: Mapped[];
	book: PlaceBook;
	previousPolicy: Map<string, {value: string | number; file: string}>;
	severityChanges: Map<string, SeverityChange>;
	provenance(): Provenance;
};

/** The base a rule file names with `extends`, or undefined for a file with no base. */
export function extendsBase(data: unknown): unknown {
	return data && typeof data === 'object' && !Array.isArray(data) && 'extends' in data ? (data as {extends: unknown}).extends : undefined;
}

/**
 * Resolves a rule file and the chain of files it extends into one set of rules. Site files
 * may change policy values (the value only; the dimension stays), change a check's severity
 * with a reason, switch a check off with a reason, and add policy values, tables, steps,
 * inputs and confirmations to existing steps, derived values and checks. Problems are
 * located in the file where they arise; a cycle is reported where it closes.
 */
export function resolveRules(source: YamlSource, sha256 = '', visiting: readonly string[] = []): {value?: ResolvedRules; problems: Problem[]; warnings: Problem[]} {
	if (extendsBase(source.data) === undefined) return resolveWholeFile(source, sha256);
	const site = siteFileSchema.safeParse(source.data);
	if (!site.success) return {problems: schemaProblems(site.error.issues, source), warnings: []};
	const at = (path: Path, code: Parameters<typeof problem>[0], data: Problem['data']) => problem(code, data, {file: source.file, ...keyLocation(source, path), field: path.join('.')});

	const named = site.data.extends;
	const baseFile = named === 'shipped' ? shippedRulesPath() : resolve(dirname(source.file), named);
	const here = resolve(source.file);
	const trail = [...visiting, here];
	if (trail.includes(baseFile)) {
		return {problems: [at(['extends'], 'extends-cycle', {chain: [...trail, baseFile].map((file) => displayPath(file)).join(' → ')})], warnings: []};
	}
	const read = readRuleSource(displayPath(baseFile));
	if (!read.ok) {
		const missing = read.errors.find((found) => found.code === 'file-unreadable');
		if (missing) return {problems: [at(['extends'], 'extends-missing', {base: named, file: displayPath(baseFile), reason: String(missing.data['reason'])})], warnings: []};
		return {problems: [...read.errors, at(['extends'], 'extends-base-invalid', {base: named, count: read.errors.length})], warnings: []};
	}
	const base = resolveRules(read.value.source, read.value.sha256, trail);
	const twice = read.value.source.duplicateKeys ?? [];
	if (!base.value || base.problems.length > 0 || twice.length > 0) {
		return {problems: [...twice, ...base.problems, at(['extends'], 'extends-base-invalid', {base: named, count: twice.length + base.problems.length})], warnings: base.warnings};
	}
	const merged = mergeSite(base.value, site.data, source, sha256, at);
	return {value: merged.value, problems: merged.problems, warnings: [...read.warnings, ...base.warnings]};
}

function resolveWholeFile(source: YamlSource, sha256: string): {value?: ResolvedRules; problems: Problem[]; warnings: Problem[]} {
	const validated = ruleFileSchema.safeParse(source.data);
	if (!validated.success) return {problems: schemaProblems(validated.error.issues, source), warnings: []};
	const rules = validated.data;
	const book = new PlaceBook();
	book.addWholeFile(rules, source);
	const map: Mapped[] = [];
	const place = (merged: Path) => map.push({merged, place: {source, path: merged}});
	for (const key of ['format', 'name', 'caution']) place([key]);
	for (const id of Object.keys(rules.policy)) place(['policy', id]);
	for (const id of Object.keys(rules.tables)) place(['tables', id]);
	for (const section of ['steps', 'derived', 'checks'] as const) rules[section].forEach((_entry, index) => place([section, index]));
	const chain = [{file: source.file, name: rules.name, sha256}];
	return {value: resolved(rules, chain, map, book, new Map(), new Map()), problems: [], warnings: []};
}

function resolved(rules: RuleFile, chain: ChainEntry[], map: Mapped[], book: PlaceBook, previousPolicy: ResolvedRules['previousPolicy'], severityChanges: ResolvedRules['severityChanges']): ResolvedRules {
	return {rules, chain, map, book, previousPolicy, severityChanges, provenance: () => book.provenance(chain.map((entry) => entry.file), previousPolicy, severityChanges)};
}

type At = (path: Path, code: Parameters<typeof problem>[0], data: Problem['data']) => Problem;

function mergeSite(base: ResolvedRules, site: SiteFile, source: YamlSource, sha256: string, at: At): {value: ResolvedRules; problems: Problem[]} {
	const rules = structuredClone(base.rules);
	const {book} = base;
	const problems: Problem[] = [];
	// Unmapped paths (new parts, the top level) belong to the site file; the base's parts keep their places.
	const map: Mapped[] = [{merged: [], place: {source, path: []}}, ...base.map.filter((entry) => entry.merged.length > 0)];
	const mapTo = (merged: Path, path: Path) => map.push({merged, place: {source, path}});
	const previousPolicy = new Map(base.previousPolicy);
	const severityChanges = new Map(base.severityChanges);

	for (const key of ['name', 'caution'] as const) {
		if (site[key] === undefined) continue;
		rules[key] = site[key];
		mapTo([key], [key]);
		book.set(key, source, [key]);
	}
	if (site.signing !== undefined) {
		rules.signing = site.signing;
		mapTo(['signing'], ['signing']);
	}

	for (const [id, change] of Object.entries(site.policy_changed)) {
		const entry = rules.policy[id];
		if (!entry) {
			problems.push(at(['policy_changed', id], 'extends-unknown-policy', {id, hint: didYouMean(id, Object.keys(rules.policy))}));
			continue;
		}
		if (change.dimension !== undefined && change.dimension !== entry.dimension) {
			problems.push(at(['policy_changed', id, 'dimension'], 'extends-dimension-change', {id, dimension: policyKindText(entry), given: change.dimension}));
			continue;
		}
		if (Array.isArray(change.value) !== Array.isArray(entry.value)) {
			problems.push(at(['policy_changed', id, 'value'], 'extends-dimension-change', {id, dimension: policyKindText(entry), given: Array.isArray(change.value) ? 'a list of options' : 'a single value'}));
			continue;
		}
		previousPolicy.set(id, {value: policyValueText(entry.value), file: book.fileOf(`policy.${id}.value`) ?? ''});
		entry.value = change.value;
		mapTo(['policy', id, 'value'], ['policy_changed', id, 'value']);
		book.set(`policy.${id}.value`, source, ['policy_changed', id, 'value']);
		if (change.basis !== undefined) {
			entry.basis = change.basis;
			mapTo(['policy', id, 'basis'], ['policy_changed', id, 'basis']);
		}
	}

	const checkIndex = new Map(rules.checks.map((check, index) => [check.id, index]));
	const findCheck = (section: string, id: string): number | undefined => {
		const index = checkIndex.get(id);
		if (index === undefined) problems.push(at([section, id], 'extends-unknown-check', {id, section, hint: didYouMean(id, checkIndex.keys())}));
		return index;
	};
	for (const [id, change] of Object.entries(site.checks_changed)) {
		const index = findCheck('checks_changed', id);
		if (index === undefined) continue;
		const check = rules.checks[index]!;
		severityChanges.set(id, {from: check.severity, to: change.severity, reason: change.reason});
		check.severity = change.severity;
		mapTo(['checks', index, 'severity'], ['checks_changed', id, 'severity']);
		book.set(`check.${id}.severity`, source, ['checks_changed', id, 'severity']);
	}
	for (const [id, reason] of Object.entries(site.switched_off)) {
		const index = findCheck('switched_off', id);
		if (index === undefined) continue;
		if (typeof reason !== 'string' || reason.trim() === '') {
			problems.push(at(['switched_off', id], 'extends-switch-off-reason', {id}));
			continue;
		}
		rules.checks[index]!.switched_off = reason.trim();
		mapTo(['checks', index, 'switched_off'], ['switched_off', id]);
		book.set(`check.${id}.switched_off`, source, ['switched_off', id]);
	}

	// Inputs and confirmations added to a base step land in the middle of the names, so their ids are checked here, where the site wrote them.
	const taken = new Map<string, string>();
	const claim = (key: string, what: string) => taken.set(key.slice(key.indexOf('.') + 1), `${what} in ${displayPath(book.fileOf(key) ?? source.file)}`);
	for (const id of Object.keys(rules.policy)) claim(`policy.${id}`, 'a policy value');
	for (const id of Object.keys(rules.tables)) claim(`table.${id}`, 'a table');
	for (const step of rules.steps) {
		for (const input of step.inputs) claim(`input.${input.id}`, 'an input');
		for (const confirmation of step.confirmations) claim(`confirmation.${confirmation.id}`, 'a confirmation');
	}
	for (const derived of rules.derived) claim(`derived.${derived.id}`, 'a derived value');
	for (const [stepId, addition] of Object.entries(site.add_to_steps)) {
		const stepIndex = rules.steps.findIndex((step) => step.id === stepId);
		if (stepIndex < 0) {
			problems.push(at(['add_to_steps', stepId], 'extends-unknown-step', {id: stepId, hint: didYouMean(stepId, rules.steps.map((step) => step.id))}));
			continue;
		}
		const step = rules.steps[stepIndex]!;
		for (const section of ['inputs', 'confirmations'] as const) {
			addition[section].forEach((entry, index) => {
				const path = ['add_to_steps', stepId, section, index];
				const first = taken.get(entry.id);
				if (first) {
					problems.push(at([...path, 'id'], 'duplicate-id', {id: entry.id, first}));
					return;
				}
				taken.set(entry.id, `an entry of add_to_steps in ${displayPath(source.file)}`);
				const list = step[section] as Array<typeof entry>;
				mapTo(['steps', stepIndex, section, list.push(entry) - 1], path);
				book.set(`${section === 'inputs' ? 'input' : 'confirmation'}.${entry.id}`, source, path);
			});
		}
	}

	for (const [id, value] of Object.entries(site.add_policy)) {
		rules.policy[id] = value;
		mapTo(['policy', id], ['add_policy', id]);
		book.set(`policy.${id}`, source, ['add_policy', id]);
		book.set(`policy.${id}.value`, source, ['add_policy', id, 'value']);
	}
	for (const [id, table] of Object.entries(site.add_tables)) {
		rules.tables[id] = table;
		mapTo(['tables', id], ['add_tables', id]);
		book.set(`table.${id}`, source, ['add_tables', id]);
	}
	site.add_steps.forEach((step, index) => {
		mapTo(['steps', rules.steps.push(step) - 1], ['add_steps', index]);
		book.addStep(step, source, ['add_steps', index]);
	});
	site.add_derived.forEach((derived, index) => {
		mapTo(['derived', rules.derived.push(derived) - 1], ['add_derived', index]);
		book.set(`derived.${derived.id}`, source, ['add_derived', index]);
	});
	site.add_checks.forEach((check, index) => {
		mapTo(['checks', rules.checks.push(check) - 1], ['add_checks', index]);
		book.set(`check.${check.id}`, source, ['add_checks', index]);
	});

	const chain = [{file: source.file, name: rules.name, sha256}, ...base.chain];
	return {value: resolved(rules, chain, map, book, previousPolicy, severityChanges), problems};
}

/**
 * A YAML source for the merged rules: its text is the resolved rule file, and every path is
 * located in the file where that part was written (`locate` also says which file).
 */
export function mergedSource(resolvedRules: ResolvedRules, site: YamlSource): YamlSource & {origin(path: Path): Place} {
	const origin = (path: Path): Place => {
		let best: Mapped | undefined;
		for (const entry of resolvedRules.map) {
			if (entry.merged.length > path.length || (best && entry.merged.length < best.merged.length)) continue;
			if (entry.merged.every((part, index) => part === path[index])) best = entry;
		}
		const found = best ?? {merged: [], place: {source: site, path: []}};
		return {source: found.place.source, path: [...found.place.path, ...path.slice(found.merged.length)]};
	};
	return {
		file: site.file,
		text: resolvedRuleText(resolvedRules.rules, resolvedRules.chain),
		data: resolvedRules.rules,
		get document() {
			return site.document;
		},
		origin,
		locate(path) {
			const at = origin(path);
			// Carries the file too: callers spread this after `file: source.file`, so problems name the right file.
			const position: {line: number; column: number} = {...at.source.locate(at.path), file: at.source.file} as {line: number; column: number};
			return position;
		},
		trailingComment(path) {
			const at = origin(path);
			return at.source.trailingComment(at.path);
		},
	};
}

/** The position of the key at the end of a path (where a person reads the entry), else of its value. */
function keyLocation(source: YamlSource, path: Path): {line: number; column: number} {
	const parent = source.document.getIn(path.slice(0, -1), true) as {items?: Array<{key?: {value?: unknown; range?: [number, number, number]}}>} | undefined;
	const key = parent?.items?.find((pair) => pair.key?.value === path.at(-1))?.key;
	if (!key?.range) return source.locate(path);
	const before = source.text.slice(0, key.range[0]).split('\n');
	return {line: before.length, column: before.at(-1)!.length + 1};
}
