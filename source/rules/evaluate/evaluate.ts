import {fillPlaceholders} from '../../shared/problems.js';
import {isQuantity} from '../../quantities/engine.js';
import {asDeclared} from '../../quantities/dimension-value.js';
import {alignTemperatures, isTemperature} from '../../quantities/temperature-kind.js';
import {MissingValueError} from '../../quantities/expression-evaluate.js';
import type {Answers} from './answers.js';
import type {CompiledCheck, CompiledRules} from '../compile/compiled-rules.js';
import type {CheckResult, ConfirmationResult, DerivedResult, Evaluation, Outcome} from './evaluation.js';
import type {CompiledFormula} from '../compile/formula.js';
import {toFormulaValue} from '../compile/sample-values.js';
import {classifyError} from '../compile/scope.js';
import {inferDimension, shownSi, toShown} from './shown-value.js';
import {newScope} from '../compile/scope.js';
import {atWorstCorners} from './worst-corner.js';
import {withDerivedSpans} from './derived-span.js';

const tolerance = 1e-12;

/** A formula's result: its value, the inputs it still needs, or why it could not be computed. */
export type Computed = {ok: true; value: unknown} | {ok: false; needs: string[]} | {ok: false; error: string; needs?: undefined};

/**
 * Evaluates formulas over a scope. A formula is evaluated even when some of its names have no
 * value: `a and b` with a false needs no b. Only when evaluation reaches a missing name is the
 * result open, and then it lists every missing input the formula could need.
 */
export function makeCompute(scope: Map<string, unknown>, missing: ReadonlyMap<string, string[]>): (formula: CompiledFormula) => Computed {
	return (formula) => {
		try {
			return {ok: true, value: formula.evaluate(scope)};
		} catch (error) {
			if (error instanceof MissingValueError) {
				const needs = [...new Set([...formula.names].flatMap((name) => missing.get(name) ?? []))];
				// No input is missing: the name is a derived value that could not be computed.
				return needs.length > 0 ? {ok: false, needs} : {ok: false, error: `"${error.missingName}" could not be computed`};
			}
			return {ok: false, error: classifyError(error).detail};
		}
	};
}

/**
 * Evaluates rules against answers: derived values, then each check's verdict and margin,
 * each confirmation's status, and the outcome. Pure: the same inputs give the same result.
 */
export function evaluate(rules: CompiledRules, answers: Answers): Evaluation {
	const scope = newScope(rules.optionLists);
	const missing = new Map<string, string[]>();
	for (const [id, value] of rules.policy) scope.set(id, toFormulaValue(value));

	const compute = makeCompute(scope, missing);

	// Inputs: an input whose condition is false is not asked; one whose condition is open waits on it.
	for (const [id, answer] of answers.inputs) {
		if (!rules.inputs.has(id)) continue;
		scope.set(id, answer.kind === 'quantity' ? toFormulaValue(answer) : answer.kind === 'choice' ? answer.option : answer.value);
	}
	for (const id of rules.inputs.keys()) if (!answers.inputs.has(id)) missing.set(id, [id]);
	const missingInputs: string[] = [];
	const askedInputs: string[] = [];
	for (const [id, compiled] of rules.inputs) {
		const condition = compiled.when ? compute(compiled.when) : {ok: true as const, value: true};
		if (condition.ok && condition.value === true) {
			askedInputs.push(id);
			if (!answers.inputs.has(id) && !compiled.input.optional) missingInputs.push(id);
			continue;
		}
		scope.delete(id);
		missing.set(id, !condition.ok && condition.needs ? [...new Set([...condition.needs, id])] : [id]);
	}

	for (const [id, table] of rules.tables) {
		const key = scope.get(table.key);
		const value = scope.get(table.value);
		if (typeof key === 'string' && typeof value === 'string') scope.set(id, (table.rows[key] ?? []).includes(value));
		else missing.set(id, [table.key, table.value].filter((name) => !scope.has(name)));
	}

	const derived: DerivedResult[] = [];
	for (const {derived: entry, formula} of rules.derived) {
		const result = compute(formula);
		if (result.ok && isFiniteResult(result.value)) {
			const value = asDeclared(result.value, entry.dimension);
			scope.set(entry.id, value);
			derived.push({...shownWith(entry), status: 'value', value: toShown(value, entry.dimension)});
		} else if (!result.ok && result.needs) {
			missing.set(entry.id, result.needs);
			derived.push({...shownWith(entry), status: 'open', needs: result.needs});
		} else {
			const error = result.ok ? 'the result is not a finite number' : result.error;
			missing.set(entry.id, []);
			derived.push({...shownWith(entry), status: 'error', error});
		}
	}
	const failedDerived = new Map(derived.filter((entry) => entry.status === 'error').map((entry) => [entry.id, entry.status === 'error' ? entry.error : '']));

	const middle = rules.checks.map((compiled) => judge(compiled, compute, scope, failedDerived));
	const corners = {scope, missing, failedDerived, judge, makeCompute};
	const checks = atWorstCorners(rules, answers, middle, corners);
	const derivedShown = withDerivedSpans(rules, answers, derived, corners);
	const confirmations = rules.rules.steps.flatMap((step) =>
		step.confirmations.map((confirmation): ConfirmationResult => {
			const base = {id: confirmation.id, step: step.id, statement: confirmation.statement, basis: confirmation.basis};
			const when = rules.confirmations.get(confirmation.id)?.when;
			if (when) {
				const condition = compute(when);
				if (!condition.ok) return {...base, status: 'open', needs: condition.needs ?? []};
				if (condition.value === false) return {...base, status: 'skip'};
			}
			const answer = answers.confirmations.get(confirmation.id);
			if (!answer) return {...base, status: 'unanswered'};
			return {...base, status: answer.answer, ...(answer.note ? {note: answer.note} : {})};
		}),
	);
	return {outcome: decideOutcome(checks, confirmations, missingInputs), checks, confirmations, derived: derivedShown, missingInputs, askedInputs};
}

/**
 * Clear only when no stop check fails or is open, every required input that is asked has an
 * answer, and every confirmation that applies is yes (or a justified not applicable).
 */
export function decideOutcome(checks: readonly CheckResult[], confirmations: readonly ConfirmationResult[], missingInputs: readonly string[] = []): Outcome {
	const stops = checks.filter((check) => check.severity === 'stop');
	if (stops.some((check) => check.verdict === 'fail') || confirmations.some((entry) => entry.status === 'no')) return 'do_not_energize';
	if (missingInputs.length > 0 || stops.some((check) => check.verdict === 'open') || confirmations.some((entry) => entry.status === 'unanswered' || entry.status === 'open')) return 'incomplete';
	return 'clear_to_energize';
}

/** A derived value's id and label, and the step it is shown with when it names one. */
function shownWith(entry: {id: string; label: string; step?: string | undefined}): {id: string; label: string; step?: string} {
	return entry.step === undefined ? {id: entry.id, label: entry.label} : {id: entry.id, label: entry.label, step: entry.step};
}

function isFiniteResult(value: unknown): boolean {
	if (typeof value === 'number') return Number.isFinite(value);
	if (typeof value === 'boolean' || typeof value === 'string') return true;
	if (isQuantity(value)) return Number.isFinite(value.value);
	return false;
}

/** One check's verdict, value, limit and margin over a scope (exported for the worst-corner search). */
export function judge(compiled: CompiledCheck, compute: (formula: CompiledFormula) => Computed, scope: Map<string, unknown>, failedDerived: Map<string, string>): CheckResult {
	const {check} = compiled;
	const base: CheckResult = {id: check.id, step: check.step, title: check.title, severity: check.severity, explanation: check.explanation, basis: check.basis, verdict: 'open'};
	const notHeld = check.severity === 'stop' ? 'fail' : 'advise';
	const broken = (formula: CompiledFormula) => [...formula.names].map((name) => failedDerived.get(name)).find((error) => error !== undefined);
	const failWith = (error: string): CheckResult => ({...base, verdict: notHeld, error});

	if (compiled.when) {
		const condition = compute(compiled.when);
		// A condition that cannot be decided (a non-finite operand, a failed value) fails the check: it is never skipped.
		if (!condition.ok) return condition.needs ? {...base, verdict: 'open', needs: condition.needs} : failWith(`its condition (when) cannot be decided: ${condition.error}`);
		if (condition.value !== true) return {...base, verdict: 'skip', ...(check.skip_reason ? {reason: check.skip_reason} : {})};
	}
	const formulas = [compiled.holds, compiled.value, compiled.limit].filter((formula): formula is CompiledFormula => formula !== undefined);
	const results = formulas.map((formula) => ({formula, result: compute(formula)}));
	const needs = [...new Set(results.flatMap(({result}) => (!result.ok && result.needs ? result.needs : [])))];
	for (const {formula} of results) {
		const error = broken(formula);
		if (error !== undefined) return failWith(`a value it uses could not be computed: ${error}`);
	}
	if (needs.length > 0) return {...base, verdict: 'open', needs};
	for (const {result} of results) if (!result.ok && !result.needs) return failWith(result.error);

	const fill = (extra: Record<string, string>) => (check.message ? fillPlaceholders(check.message, {...placeholderValues(scope, check.message), ...extra}) : undefined);
	if (compiled.holds) {
		const held = (results[0]!.result as {value: unknown}).value;
		if (held === true) return {...base, verdict: 'pass'};
		if (held !== false) return failWith('the condition did not give true or false');
		const message = fill({});
		return {...base, verdict: notHeld, ...(message ? {message} : {})};
	}
	let [valueRaw, limitRaw] = results.map(({result}) => (result as {value: unknown}).value);
	if (isTemperature(valueRaw) && isTemperature(limitRaw)) {
		try {
			[valueRaw, limitRaw] = alignTemperatures(valueRaw, limitRaw, 'the value and the limit are');
		} catch (error) {
			return failWith(classifyError(error).detail);
		}
	}
	const dimension = inferDimension(valueRaw, check.dimension, limitRaw);
	if (!dimension || !isFiniteResult(valueRaw) || !isFiniteResult(limitRaw)) return failWith('the value or the limit is not a finite number');
	const value = toShown(valueRaw, dimension);
	const limit = toShown(limitRaw, dimension);
	const marginSi = compiled.relation === 'at_most' ? limit.si - value.si : value.si - limit.si;
	const marginDimension = dimension === 'temperature' ? 'temperature_difference' : dimension;
	const margin = {...shownSi(marginSi, marginDimension), fraction: limit.si === 0 ? null : marginSi / Math.abs(limit.si)};
	const holds = marginSi >= -tolerance * Math.max(Math.abs(value.si), Math.abs(limit.si));
	const shown = {value, limit, margin, relation: compiled.relation!};
	if (holds) return {...base, verdict: 'pass', ...shown};
	const message = fill({value: value.text, limit: limit.text, margin: margin.text});
	return {...base, verdict: notHeld, ...shown, ...(message ? {message} : {})};
}

/** The text of each name a message's placeholders use (only those: formatting every value is slow). */
function placeholderValues(scope: Map<string, unknown>, message: string): Record<string, string> {
	const values: Record<string, string> = {};
	for (const match of message.matchAll(/\{\{\s*([a-zA-Z_]\w*)\s*\}\}/g)) {
		const name = match[1]!;
		if (!scope.has(name)) continue;
		const value = scope.get(name);
		if (typeof value === 'function') continue;
		const dimension = inferDimension(value);
		values[name] = dimension && (typeof value === 'number' || isQuantity(value)) ? toShown(value, dimension).text : String(value);
	}
	return values;
}
