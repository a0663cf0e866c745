import {parseTolerance} from '../../quantities/range-entry.js';
import {sha256Hex} from '../../shared/sha256.js';
import {formulaFunctions} from '../../calculations/formula-functions.js';
import {describeProblem, problem, warning, type Problem} from '../../shared/problems.js';
import {mathFunctions} from '../../quantities/engine.js';
import {parseQuantity} from '../../quantities/parse-quantity.js';
import type {Dimension} from '../../quantities/dimensions.js';
import {failure, success, type Result} from '../../shared/result.js';
import type {YamlSource} from '../../shared/yaml-source.js';
import {dimensionWords} from '../../quantities/dimensions.js';
import {collectNames} from './collect-names.js';
import type {CompiledCheck, CompiledConfirmation, CompiledDerived, CompiledInput, CompiledRules, SiValue} from './compiled-rules.js';
import {compileFormula, type CompiledFormula} from './formula.js';
import {lintWithSamples} from './lint-samples.js';
import {locateInField} from './locate.js';
import {didYouMean} from '../../shared/did-you-mean.js';
import type {NameTable} from './names.js';
import {wholeFileProvenance, type Place, type Provenance} from '../file/provenance.js';
import type {RuleFile} from '../file/schema.js';

type Path = Array<string | number>;

/** Functions a rule formula may call: the math functions and every registered calculation. */
export const formulaFunctionNames: ReadonlySet<string> = new Set([...mathFunctions, ...formulaFunctions.keys(), 'one_of']);

/**
 * Compiles validated rules: parses policy values, ranges and defaults, compiles every
 * formula once, orders derived values, then lints with sample values. Reports every
 * problem found, each with file:line:column.
 */
export function compileRules(
	rules: RuleFile,
	source: YamlSource & {origin?(path: Path): Place},
	sha256 = sha256Hex(source.text),
	provenance: Provenance = wholeFileProvenance(rules, source),
): Result<CompiledRules, Problem> {
	const {names, problems} = collectNames(rules, source);
	const warnings: Problem[] = [];
	// Merged rules (a site file and its base) locate each part in the file where it was written.
	const origin = (path: Path): Place => source.origin?.(path) ?? {source, path};
	const where = (path: Path, name?: string, text = '') => {
		const at = origin(path);
		return {file: at.source.file, ...locateInField(at.source, at.path, name, text), field: at.path.join('.')};
	};

	const quantity = (text: string | number, dimension: Dimension) => parseQuantity(String(text), dimension);
	const policy = new Map<string, SiValue>();
	const optionLists = new Map<string, readonly string[]>();
	for (const [id, entry] of Object.entries(rules.policy)) {
		if (Array.isArray(entry.value) || entry.dimension === undefined) {
			const listed = Array.isArray(entry.value) ? entry.value : [];
			const choice = entry.options_of === undefined ? undefined : names.get(entry.options_of);
			if (choice?.kind !== 'choice') {
				const choices = [...names].filter(([, kind]) => kind.kind === 'choice').map(([name]) => name);
				problems.push(problem('policy-options-of', {id, name: entry.options_of ?? '', hint: didYouMean(entry.options_of ?? '', choices)}, where(['policy', id, 'options_of'])));
				continue;
			}
			listed.forEach((option, index) => {
				if (!choice.options.includes(option)) problems.push(problem('policy-option', {id, option, name: entry.options_of!, allowed: choice.options.join(', ')}, where(['policy', id, 'value', index])));
			});
			optionLists.set(id, listed);
			continue;
		}
		const parsed = quantity(entry.value, entry.dimension);
		if (parsed.ok) policy.set(id, {si: parsed.value.si, dimension: entry.dimension});
		else problems.push(problem('policy-value', {id, detail: describeProblem(problem(parsed.problem.code, {...parsed.problem, label: id, hint: '', ...dimensionWords(entry.dimension)}))}, where(['policy', id, 'value'])));
	}

	const formula = (text: string, path: Path): CompiledFormula | undefined => {
		const comment = origin(path).source.trailingComment(origin(path).path);
		if (comment !== undefined) warnings.push(warning('formula-comment', {}, where(path)));
		const compiled = compileFormula(text, names, formulaFunctionNames);
		if (compiled.ok) return compiled.formula;
		for (const found of compiled.problems) problems.push(problem(found.code, found.data, where(path, found.name, text)));
		return undefined;
	};

	const inputs = new Map<string, CompiledInput>();
	const confirmations = new Map<string, CompiledConfirmation>();
	rules.steps.forEach((step, stepIndex) => {
		step.inputs.forEach((input, index) => {
			const path: Path = ['steps', stepIndex, 'inputs', index];
			const compiled: CompiledInput = {input, step};
			if (input.when !== undefined) compiled.when = formula(input.when, [...path, 'when']);
			if (input.kind === 'quantity') {
				const words = {label: input.id, hint: '', ...dimensionWords(input.dimension)};
				const [low, high] = input.range.map((text) => quantity(text, input.dimension));
				if (low && high && low.ok && high.ok) {
					if (low.value.si > high.value.si) problems.push(problem('range-order', {id: input.id, min: String(input.range[0]), max: String(input.range[1])}, where([...path, 'range'])));
					compiled.range = {min: low.value.si, max: high.value.si};
				}
				for (const [position, parsed] of [low, high].entries()) {
					if (parsed && !parsed.ok) problems.push(problem('range-value', {id: input.id, detail: describeProblem(problem(parsed.problem.code, {...parsed.problem, ...words}))}, where([...path, 'range', position])));
				}
				if (input.default !== undefined) {
					const parsed = quantity(input.default, input.dimension);
					if (parsed.ok) compiled.defaultValue = {si: parsed.value.si, dimension: input.dimension};
					else problems.push(problem('default-value', {id: input.id, detail: describeProblem(problem(parsed.problem.code, {...parsed.problem, ...words}))}, where([...path, 'default'])));
				}
				if (input.default_tolerance !== undefined) {
					const tolerance = parseTolerance(String(input.default_tolerance), input.dimension);
					if (tolerance.ok) compiled.tolerance = tolerance.value;
					else problems.push(problem('range-rule-tolerance', {id: input.id, detail: describeProblem(problem(tolerance.problem.code, {...tolerance.problem, ...words}))}, where([...path, 'default_tolerance'])));
				}
			}
			if (input.kind === 'choice' && input.default !== undefined && !Object.hasOwn(input.options, input.default)) {
				problems.push(problem('default-value', {id: input.id, detail: `"${input.default}" is not one of its options (${Object.keys(input.options).join(', ')})`}, where([...path, 'default'])));
			}
			inputs.set(input.id, compiled);
		});
		step.confirmations.forEach((confirmation, index) => {
			const compiled: CompiledConfirmation = {confirmation, step};
			if (confirmation.when !== undefined) compiled.when = formula(confirmation.when, ['steps', stepIndex, 'confirmations', index, 'when']);
			confirmations.set(confirmation.id, compiled);
		});
	});

	for (const [id, table] of Object.entries(rules.tables)) {
		for (const [role, name] of [['key', table.key], ['value', table.value]] as const) {
			const entry = names.get(name);
			if (entry?.kind !== 'choice') {
				problems.push(problem('table-input', {id, name, role}, where(['tables', id, role])));
				continue;
			}
			const listed = role === 'key' ? Object.keys(table.rows) : Object.values(table.rows).flat();
			for (const option of listed) {
				if (!entry.options.includes(option)) problems.push(problem('table-option', {id, option, name, allowed: entry.options.join(', ')}, where(['tables', id, 'rows'], option, option)));
			}
		}
	}

	const derivedList: CompiledDerived[] = [];
	const stepIds = rules.steps.map((step) => step.id);
	rules.derived.forEach((derived, index) => {
		if (derived.step !== undefined && !stepIds.includes(derived.step)) problems.push(problem('missing-step', {step: derived.step, allowed: stepIds.join(', ')}, where(['derived', index, 'step'])));
		const compiled = formula(derived.formula, ['derived', index, 'formula']);
		if (compiled) derivedList.push({derived, formula: compiled});
	});
	const inCycle = new Set<string>();
	const ordered = orderDerived(derivedList, (cycle) => {
		for (const id of cycle) inCycle.add(id);
		const index = rules.derived.findIndex((derived) => derived.id === cycle[0]);
		problems.push(problem('derived-cycle', {path: cycle.join(' → ')}, where(['derived', index, 'formula'])));
	});

	const checks: CompiledCheck[] = [];
	const switchedOff: CompiledCheck[] = [];
	rules.checks.forEach((check, index) => {
		const path: Path = ['checks', index];
		if (!stepIds.includes(check.step)) problems.push(problem('missing-step', {step: check.step, allowed: stepIds.join(', ')}, where([...path, 'step'])));
		const compiled: CompiledCheck = {check};
		if (check.when !== undefined) compiled.when = formula(check.when, [...path, 'when']);
		if (check.holds !== undefined) compiled.holds = formula(check.holds, [...path, 'holds']);
		if (check.value !== undefined) compiled.value = formula(check.value, [...path, 'value']);
		const limitText = check.at_most ?? check.at_least;
		if (limitText !== undefined) {
			compiled.relation = check.at_most === undefined ? 'at_least' : 'at_most';
			compiled.limit = formula(limitText, [...path, compiled.relation]);
		}
		for (const placeholder of placeholdersOf(check.message ?? '')) {
			if (!['value', 'limit', 'margin'].includes(placeholder) && !names.has(placeholder)) problems.push(problem('unknown-placeholder', {placeholder: `{{${placeholder}}}`}, where([...path, 'message'])));
		}
		// A switched-off check is compiled (its formulas must still make sense) but never evaluated.
		(check.switched_off === undefined ? checks : switchedOff).push(compiled);
	});

	const compiled: CompiledRules = {
		file: source.file,
		text: source.text,
		sha256,
		rules,
		names: names as NameTable,
		policy,
		optionLists,
		tables: new Map(Object.entries(rules.tables)),
		inputs,
		confirmations,
		derived: ordered,
		checks,
		switchedOff,
		provenance,
	};
	const lintWhere = (path: Path, name?: string, text?: string) => where(path, name, text);
	// With problems found, the sample-value lint still runs on the formulas that compiled and use no value that failed, so one run reports them all.
	if (problems.length > 0) {
		// Names whose value is not known: a derived value that did not compile or is in a circle, a policy value or an input range that did not parse.
		const failed = new Set([...inCycle, ...rules.derived.map((entry) => entry.id).filter((id) => !derivedList.some((kept) => kept.derived.id === id))]);
		for (const id of Object.keys(rules.policy)) if (!policy.has(id) && !optionLists.has(id)) failed.add(id);
		for (const [id, entry] of inputs) if (entry.input.kind === 'quantity' && entry.range === undefined) failed.add(id);
		return failure([...problems, ...lintGoodParts(compiled, failed, lintWhere)]);
	}
	// The shipped policy embedded at build time is the exact text the tests lint; skip the repeat.
	const lint = source.prelinted ? [] : lintWithSamples(compiled, lintWhere);
	if (lint.length > 0) return failure(lint);
	return success(compiled, warnings);
}

/** The lint, on the checks and derived values whose formulas all compiled and name no derived value that failed. */
function lintGoodParts(compiled: CompiledRules, unknown: ReadonlySet<string>, where: Parameters<typeof lintWithSamples>[1]): Problem[] {
	const failed = new Set(unknown);
	const usable = (formulas: Array<CompiledFormula | undefined>, texts: Array<string | undefined>) => formulas.every((formula, index) => (texts[index] === undefined) === (formula === undefined)) && formulas.every((formula) => !formula || ![...formula.names].some((name) => failed.has(name)));
	const good = (entry: CompiledCheck) => usable([entry.when, entry.holds, entry.value, entry.limit], [entry.check.when, entry.check.holds, entry.check.value, entry.check.at_most ?? entry.check.at_least]);
	// In their order of dependence, so that a value built on one left out is left out too.
	const derived = compiled.derived.filter((entry) => {
		const kept = !failed.has(entry.derived.id) && usable([entry.formula], [entry.derived.formula]);
		if (!kept) failed.add(entry.derived.id);
		return kept;
	});
	try {
		return lintWithSamples({...compiled, derived, checks: compiled.checks.filter(good), switchedOff: compiled.switchedOff.filter(good)}, where);
	} catch {
		// Parts left unchecked here are still refused: the rules do not load until every problem reported is fixed.
		return [];
	}
}

function placeholdersOf(message: string): string[] {
	return [...message.matchAll(/\{\{\s*([a-zA-Z_]\w*)\s*\}\}/g)].map((match) => match[1]!);
}

function orderDerived(list: CompiledDerived[], onCycle: (cycle: string[]) => void): CompiledDerived[] {
	const byId = new Map(list.map((entry) => [entry.derived.id, entry]));
	const ordered: CompiledDerived[] = [];
	const state = new Map<string, 'visiting' | 'done'>();
	const visit = (id: string, trail: string[]) => {
		if (state.get(id) === 'done') return;
		if (state.get(id) === 'visiting') {
			onCycle([...trail.slice(trail.indexOf(id)), id]);
			return;
		}
		state.set(id, 'visiting');
		const entry = byId.get(id)!;
		for (const name of entry.formula.names) if (byId.has(name)) visit(name, [...trail, id]);
		state.set(id, 'done');
		ordered.push(entry);
	};
	for (const id of byId.keys()) visit(id, []);
	return ordered;
}
