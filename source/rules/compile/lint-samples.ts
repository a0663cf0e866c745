import {dimensions} from '../../quantities/dimensions.js';
import {asDeclared} from '../../quantities/dimension-value.js';
import {alignTemperatures, isTemperature} from '../../quantities/temperature-kind.js';
import {isQuantity} from '../../quantities/engine.js';
import {hasDimension} from '../../quantities/parse-quantity.js';
import {problem, type Problem} from '../../shared/problems.js';
import {CalculationInputError} from '../../calculations/calculation.js';
import type {CompiledRules} from './compiled-rules.js';
import type {CompiledFormula} from './formula.js';
import {sampleWithin, toFormulaValue} from './sample-values.js';
import {classifyError, newScope} from './scope.js';
import {describeValue} from '../../quantities/describe-value.js';
import {EvaluationError} from '../../quantities/evaluation-error.js';

type Where = (path: Array<string | number>, name?: string, text?: string) => Pick<Problem, 'file' | 'line' | 'column' | 'field'>;

/**
 * Evaluates every formula with sample inputs (defaults, or values inside each range) to find
 * dimension mismatches, non-boolean conditions and checks comparing unlike quantities.
 * Branches of a ? b : c and operands of and/or are evaluated on their own too.
 */
export function lintWithSamples(rules: CompiledRules, where: Where): Problem[] {
	const problems: Problem[] = [];
	const scope = sampleScope(rules, 0.5);
	// Other samples inside the ranges, tried only when a formula is not finite at the first:
	// a division that is zero at one sample is not an error; one that is zero at all of them is.
	let others: Array<Map<string, unknown>> | undefined;
	const otherScopes = () => (others ??= [0.2, 0.85].map((fraction) => withDerived(rules, sampleScope(rules, fraction))));

	// A derived value that failed is reported once; formulas using it are not reported again.
	const failed = new Set<string>();
	const attempt = (formula: CompiledFormula, at: Map<string, unknown>): {ok: true; value: unknown; results: unknown[]} | {ok: false; error: unknown} => {
		const results: unknown[] = [];
		try {
			for (const part of formula.parts) results.push(part.evaluate(at));
			return {ok: true, value: formula.evaluate(at), results};
		} catch (error) {
			return {ok: false, error};
		}
	};
	const notFinite = (tried: ReturnType<typeof attempt>) => (tried.ok ? !isFiniteValue(tried.value) : tried.error instanceof EvaluationError && tried.error.code === 'not-finite');
	const run = (formula: CompiledFormula, path: Array<string | number>): {ok: true; value: unknown} | {ok: false; outsideValidity?: boolean} => {
		if ([...formula.names].some((name) => failed.has(name))) return {ok: false};
		let tried = attempt(formula, scope);
		if (notFinite(tried)) {
			const finite = otherScopes()
				.map((other) => attempt(formula, other))
				.find((other) => !notFinite(other) && !(!other.ok && other.error instanceof CalculationInputError));
			if (!finite) {
				const detail = tried.ok ? `it gives ${describeNumber(tried.value)} at every sample value inside the input ranges` : `${classifyError(tried.error).detail}, at every sample value inside the input ranges`;
				problems.push(problem('formula-not-finite', {detail}, where(path, undefined, formula.text)));
				return {ok: false};
			}
			tried = finite;
		}
		if (!tried.ok) {
			// A sample value outside a calculation's validity says nothing about the formula.
			if (tried.error instanceof CalculationInputError) return {ok: false, outsideValidity: true};
			const {code, detail} = classifyError(tried.error);
			const part = formula.parts.find((candidate) => {
				try {
					candidate.evaluate(scope);
					return false;
				} catch {
					return true;
				}
			});
			problems.push(problem(code, {detail: part ? `${detail} (in ${part.text})` : detail}, where(path, undefined, formula.text)));
			return {ok: false};
		}
		const {results} = tried;
		formula.parts.forEach((part, index) => {
			if (part.pairedWith === undefined) return;
			const [a, b] = [results[index], results[part.pairedWith]];
			const pointAndStep = isTemperature(a) && isTemperature(b) && a.kind !== undefined && b.kind !== undefined && a.kind !== b.kind;
			const same = (isQuantity(a) && isQuantity(b) && a.equalBase(b) && !pointAndStep) || (typeof a === typeof b && !isQuantity(a) && !isQuantity(b));
			if (!same) problems.push(problem('dimension-mismatch', {detail: `the two branches of a ? b : c differ: ${describeValue(a)} and ${describeValue(b)}`}, where(path, undefined, formula.text)));
		});
		return {ok: true, value: tried.value};
	};
	const mustBeBoolean = (formula: CompiledFormula | undefined, path: Array<string | number>, what: string) => {
		if (!formula) return;
		const result = run(formula, path);
		if (result.ok && typeof result.value !== 'boolean') problems.push(problem('not-boolean', {what, received: describeValue(result.value)}, where(path, undefined, formula.text)));
	};

	for (const {derived, formula} of rules.derived) {
		const path = ['derived', rules.rules.derived.indexOf(derived), 'formula'];
		const result = run(formula, path);
		if (!result.ok && result.outsideValidity) {
			// (The other sample scopes compute their own derived values.)
			// Lint what uses it with a stand-in of the declared dimension.
			scope.set(derived.id, toFormulaValue({si: 1, dimension: derived.dimension}));
			continue;
		}
		if (!result.ok) {
			failed.add(derived.id);
			continue;
		}
		const info = dimensions[derived.dimension];
		const fits = hasDimension(result.value, derived.dimension);
		if (!fits) failed.add(derived.id);
		if (!fits) problems.push(problem('wrong-dimension', {what: `derived value "${derived.id}"`, expected: info.noun, received: describeValue(result.value)}, where(path, undefined, formula.text)));
		else scope.set(derived.id, asDeclared(result.value, derived.dimension));
	}
	const stepIndex = new Map(rules.rules.steps.map((step, index) => [step.id, index]));
	for (const {input, step, when} of rules.inputs.values()) {
		const index = rules.rules.steps[stepIndex.get(step.id)!]!.inputs.indexOf(input);
		mustBeBoolean(when, ['steps', stepIndex.get(step.id)!, 'inputs', index, 'when'], 'condition (when)');
	}
	for (const {confirmation, step, when} of rules.confirmations.values()) {
		const index = step.confirmations.indexOf(confirmation);
		mustBeBoolean(when, ['steps', stepIndex.get(step.id)!, 'confirmations', index, 'when'], 'condition (when)');
	}
	rules.checks.forEach((compiled) => {
		const {check} = compiled;
		// Its place in the file, not in the list linted (a switched-off check, or one left out, is not in that list).
		const index = rules.rules.checks.indexOf(check);
		mustBeBoolean(compiled.when, ['checks', index, 'when'], 'condition (when)');
		mustBeBoolean(compiled.holds, ['checks', index, 'holds'], 'condition (holds)');
		if (!compiled.value || !compiled.limit || !compiled.relation) return;
		const value = run(compiled.value, ['checks', index, 'value']);
		const limit = run(compiled.limit, ['checks', index, compiled.relation]);
		if (!value.ok || !limit.ok) return;
		const comparable = (isQuantity(value.value) && isQuantity(limit.value) && value.value.equalBase(limit.value)) || (typeof value.value === 'number' && typeof limit.value === 'number');
		if (!comparable) {
			problems.push(problem('compare-mismatch', {value: describeValue(value.value), limit: describeValue(limit.value)}, where(['checks', index, compiled.relation], undefined, check.at_most ?? check.at_least)));
			return;
		}
		if (isTemperature(value.value) && isTemperature(limit.value)) {
			try {
				alignTemperatures(value.value, limit.value, 'the value and the limit are');
			} catch (error) {
				problems.push(problem('temperature-kind-mismatch', {detail: classifyError(error).detail}, where(['checks', index, compiled.relation], undefined, check.at_most ?? check.at_least)));
				return;
			}
		}
		if (check.dimension) {
			const info = dimensions[check.dimension];
			const fits = hasDimension(value.value, check.dimension);
			if (!fits) problems.push(problem('wrong-dimension', {what: `value of check "${check.id}"`, expected: info.noun, received: describeValue(value.value)}, where(['checks', index, 'dimension'])));
		}
	});
	return problems;
}

/** Inputs, policy values and tables at sample values: each quantity input at `fraction` of its range (the middle uses its default). */
function sampleScope(rules: CompiledRules, fraction: number): Map<string, unknown> {
	const scope = newScope(rules.optionLists);
	for (const [id, value] of rules.policy) scope.set(id, toFormulaValue(value));
	for (const [id, {input, range, defaultValue}] of rules.inputs) {
		if (input.kind === 'quantity') scope.set(id, toFormulaValue(fraction === 0.5 ? (defaultValue ?? sampleWithin(range, input.dimension)) : sampleWithin(range, input.dimension, fraction)));
		else if (input.kind === 'choice') scope.set(id, input.default ?? Object.keys(input.options)[0]);
		else if (input.kind === 'yes_no') scope.set(id, input.default ?? true);
	}
	for (const id of rules.tables.keys()) scope.set(id, true);
	return scope;
}

/** A sample scope with every derived value that can be computed in it. */
function withDerived(rules: CompiledRules, scope: Map<string, unknown>): Map<string, unknown> {
	for (const {derived, formula} of rules.derived) {
		try {
			scope.set(derived.id, asDeclared(formula.evaluate(scope), derived.dimension));
		} catch {
			// Left out: formulas using it fail at this sample and the first sample's finding stands.
		}
	}
	return scope;
}

function isFiniteValue(value: unknown): boolean {
	if (typeof value === 'number') return Number.isFinite(value);
	if (isQuantity(value)) return Number.isFinite(value.value);
	return true;
}

function describeNumber(value: unknown): string {
	const number = typeof value === 'number' ? value : isQuantity(value) ? value.value : 0;
	return Number.isNaN(number) ? 'not a number' : 'an infinite value';
}
