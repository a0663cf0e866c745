import {dimensions} from '../quantities/dimensions.js';
import {isQuantity} from '../quantities/engine.js';
import {hasDimension} from '../quantities/parse-quantity.js';
import {problem, type Problem} from '../problems.js';
import {CalculationInputError} from '../calculations/calculation.js';
import type {CompiledRules} from './compiled-rules.js';
import type {CompiledFormula} from './formula.js';
import {sampleWithin, toFormulaValue} from './sample-values.js';
import {classifyError, describeResult, newScope} from './scope.js';

type Where = (path: Array<string | number>, name?: string, text?: string) => Pick<Problem, 'file' | 'line' | 'column' | 'field'>;

/**
 * Evaluates every formula with sample inputs (defaults, or values inside each range) to find
 * dimension mismatches, non-boolean conditions and checks comparing unlike quantities.
 * Branches of a ? b : c and operands of and/or are evaluated on their own too.
 */
export function lintWithSamples(rules: CompiledRules, where: Where): Problem[] {
	const problems: Problem[] = [];
	const scope = newScope(rules.optionLists);
	for (const [id, value] of rules.policy) scope.set(id, toFormulaValue(value));
	for (const [id, {input, range, defaultValue}] of rules.inputs) {
		if (input.kind === 'quantity') scope.set(id, toFormulaValue(defaultValue ?? sampleWithin(range, input.dimension)));
		else if (input.kind === 'choice') scope.set(id, input.default ?? Object.keys(input.options)[0]);
		else if (input.kind === 'yes_no') scope.set(id, input.default ?? true);
	}
	for (const id of rules.tables.keys()) scope.set(id, true);

	// A derived value that failed is reported once; formulas using it are not reported again.
	const failed = new Set<string>();
	const run = (formula: CompiledFormula, path: Array<string | number>): {ok: true; value: unknown} | {ok: false; outsideValidity?: boolean} => {
		if ([...formula.names].some((name) => failed.has(name))) return {ok: false};
		const results: unknown[] = [];
		for (const part of formula.parts) {
			try {
				results.push(part.evaluate(scope));
			} catch (error) {
				// A sample value outside a calculation's validity says nothing about the formula.
				if (error instanceof CalculationInputError) return {ok: false, outsideValidity: true};
				const {code, detail} = classifyError(error);
				problems.push(problem(code, {detail: `${detail} (in ${part.text})`}, where(path, undefined, formula.text)));
				return {ok: false};
			}
		}
		formula.parts.forEach((part, index) => {
			if (part.pairedWith === undefined) return;
			const [a, b] = [results[index], results[part.pairedWith]];
			const same = (isQuantity(a) && isQuantity(b) && a.equalBase(b)) || (typeof a === typeof b && !isQuantity(a) && !isQuantity(b));
			if (!same) problems.push(problem('dimension-mismatch', {detail: `the two branches of a ? b : c differ: ${describeResult(a)} and ${describeResult(b)}`}, where(path, undefined, formula.text)));
		});
		try {
			return {ok: true, value: formula.evaluate(scope)};
		} catch (error) {
			if (error instanceof CalculationInputError) return {ok: false, outsideValidity: true};
			const {code, detail} = classifyError(error);
			problems.push(problem(code, {detail}, where(path, undefined, formula.text)));
			return {ok: false};
		}
	};
	const mustBeBoolean = (formula: CompiledFormula | undefined, path: Array<string | number>, what: string) => {
		if (!formula) return;
		const result = run(formula, path);
		if (result.ok && typeof result.value !== 'boolean') problems.push(problem('not-boolean', {what, received: describeResult(result.value)}, where(path, undefined, formula.text)));
	};

	for (const {derived, formula} of rules.derived) {
		const path = ['derived', rules.rules.derived.indexOf(derived), 'formula'];
		const result = run(formula, path);
		if (!result.ok && result.outsideValidity) {
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
		if (!fits) problems.push(problem('wrong-dimension', {what: `derived value "${derived.id}"`, expected: info.noun, received: describeResult(result.value)}, where(path, undefined, formula.text)));
		else scope.set(derived.id, result.value);
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
	rules.checks.forEach((compiled, index) => {
		const {check} = compiled;
		mustBeBoolean(compiled.when, ['checks', index, 'when'], 'condition (when)');
		mustBeBoolean(compiled.holds, ['checks', index, 'holds'], 'condition (holds)');
		if (!compiled.value || !compiled.limit || !compiled.relation) return;
		const value = run(compiled.value, ['checks', index, 'value']);
		const limit = run(compiled.limit, ['checks', index, compiled.relation]);
		if (!value.ok || !limit.ok) return;
		const comparable = (isQuantity(value.value) && isQuantity(limit.value) && value.value.equalBase(limit.value)) || (typeof value.value === 'number' && typeof limit.value === 'number');
		if (!comparable) {
			problems.push(problem('compare-mismatch', {value: describeResult(value.value), limit: describeResult(limit.value)}, where(['checks', index, compiled.relation], undefined, check.at_most ?? check.at_least)));
			return;
		}
		if (check.dimension) {
			const info = dimensions[check.dimension];
			const fits = hasDimension(value.value, check.dimension);
			if (!fits) problems.push(problem('wrong-dimension', {what: `value of check "${check.id}"`, expected: info.noun, received: describeResult(value.value)}, where(['checks', index, 'dimension'])));
		}
	});
	return problems;
}
