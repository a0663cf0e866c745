import {dimensions} from '../quantities/dimensions.js';
import {formatQuantity} from '../quantities/format.js';
import {parseQuantity} from '../quantities/parse-quantity.js';
import {describeProblem, problem, type Problem} from '../shared/problems.js';
import {didYouMean} from '../shared/did-you-mean.js';
import {compactExample, fieldWords, type ExampleField} from '../quantities/field-example.js';
import {failure, success, type Result} from '../shared/result.js';
import {CalculationInputError, checkAllowed, type Calculation, type CalculationInput} from './calculation.js';

/** One value in a calculation's result: SI number, SI unit, formatted text. */
export type CalculatedValue = {si: number; unit: string; text: string};

/** A calculation run on entries such as `supply=28V`: its inputs and outputs in SI with text. */
export type CalculationRun = {
	calc: string;
	inputs: Record<string, CalculatedValue & {entered?: string}>;
	outputs: Record<string, CalculatedValue>;
	notes: string[];
	basis: string[];
	/** Present for calculations whose results need a caution (the optical-hazard ones). */
	caution?: string;
};

function value(si: number, dimension: keyof typeof dimensions): CalculatedValue {
	return {si, unit: dimensions[dimension].si, text: formatQuantity(si, dimension)};
}

/**
 * Runs a calculation on `key=value` entries: each value is read with the input's dimension,
 * defaults fill keys left out, and every problem (unknown key, wrong dimension, missing input,
 * value outside the calculation's validity) is reported by key.
 */
export function runCalculation(calculation: Calculation, entries: ReadonlyArray<string>): Result<CalculationRun, Problem> {
	const problems: Problem[] = [];
	const si: Record<string, number> = {};
	const entered: Record<string, string> = {};
	for (const entry of entries) {
		const equals = entry.indexOf('=');
		if (equals <= 0) {
			problems.push(problem('calc-entry', {entry}));
			continue;
		}
		const key = entry.slice(0, equals).trim();
		const text = entry.slice(equals + 1);
		const input = Object.hasOwn(calculation.inputs, key) ? calculation.inputs[key] : undefined;
		if (!input) {
			problems.push(problem('calc-unknown-key', {key, calc: calculation.name, allowed: Object.keys(calculation.inputs).join(', '), hint: didYouMean(key, Object.keys(calculation.inputs))}, {field: key}));
			continue;
		}
		if (Object.hasOwn(si, key)) {
			problems.push(problem('calc-repeated-key', {key}, {field: key}));
			continue;
		}
		const parsed = parseQuantity(text, input.dimension);
		if (!parsed.ok) {
			const words = {label: key, hint: '', ...fieldWords(exampleField(input))};
			problems.push(problem(parsed.problem.code, {...parsed.problem, ...words}, {field: key}));
			continue;
		}
		si[key] = parsed.value.si;
		entered[key] = text;
	}
	for (const [key, input] of Object.entries(calculation.inputs)) {
		if (Object.hasOwn(si, key)) continue;
		if (input.default !== undefined) si[key] = input.default;
		else if (!input.optional && !problems.some((found) => found.field === key)) {
			problems.push(problem('calc-missing-input', {key, calc: calculation.name, noun: dimensions[input.dimension].noun, example: compactExample(exampleField(input))}, {field: key}));
		}
	}
	if (problems.length > 0) return failure(problems);
	let outputs: Record<string, number>;
	try {
		checkAllowed(calculation, si);
		outputs = calculation.compute(si);
	} catch (error) {
		if (error instanceof CalculationInputError) return failure([problem('calc-outside-validity', {key: error.key, allowed: error.allowed, calc: calculation.name}, {field: error.key})]);
		throw error;
	}
	const nonFinite = Object.entries(outputs).find(([, result]) => !Number.isFinite(result));
	if (nonFinite) return failure([problem('calc-not-finite', {key: nonFinite[0], calc: calculation.name})]);
	return success({
		calc: calculation.name,
		inputs: Object.fromEntries(
			Object.entries(si).map(([key, number]) => [key, {...value(number, calculation.inputs[key]!.dimension), ...(entered[key] === undefined ? {} : {entered: entered[key]})}]),
		),
		outputs: Object.fromEntries(Object.entries(outputs).map(([key, number]) => [key, value(number, calculation.outputs[key]!.dimension)])),
		notes: calculation.notes?.(si, outputs) ?? [],
		basis: calculation.basis,
		...(calculation.caution ? {caution: calculation.caution} : {}),
	});
}

/** The message of a calc problem, prefixed by the key it concerns. */
export function describeCalcProblem(found: Problem): string {
	const message = describeProblem(found);
	// Messages that already name the key read better without it in front again.
	const named = found.field !== undefined && new RegExp(`\\b${found.field}\\b`).test(message);
	return `${found.field && !named ? `${found.field}: ` : ''}${message}`;
}

/** What a calculation input's examples are made from: its dimension, range and default. */
function exampleField(input: CalculationInput): ExampleField {
	return {dimension: input.dimension, range: input.range, ...(input.default === undefined ? {} : {default: input.default})};
}
