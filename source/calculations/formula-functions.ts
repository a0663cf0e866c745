import {dimensions} from '../quantities/dimensions.js';
import type {Quantity} from '../quantities/engine.js';
import {formulaValueOf, siOf} from '../quantities/dimension-value.js';
import {hasDimension} from '../quantities/parse-quantity.js';
import {checkAllowed, formulaName, type Calculation} from './calculation.js';
import {calculations} from './registry.js';

/** A call from a rule formula with the wrong number or kind of arguments. */
export class FormulaCallError extends Error {
	constructor(
		readonly detail: string,
	) {
		super(detail);
	}
}

function toSi(calculation: Calculation, args: unknown[]): Record<string, number> {
	const keys = Object.keys(calculation.inputs);
	// Trailing inputs that are optional or have a default may be left out of a formula call.
	let required = keys.length;
	while (required > 0 && (calculation.inputs[keys[required - 1]!]!.optional || calculation.inputs[keys[required - 1]!]!.default !== undefined)) required -= 1;
	const name = formulaName(calculation);
	if (args.length < required || args.length > keys.length) {
		const count = required === keys.length ? `${required}` : `${required} to ${keys.length}`;
		throw new FormulaCallError(`${name}() takes ${count} arguments (${keys.join(', ')}), got ${args.length}`);
	}
	const values: Record<string, number> = {};
	keys.slice(0, args.length).forEach((key, index) => {
		const input = calculation.inputs[key]!;
		const arg = args[index];
		const info = dimensions[input.dimension];
		if (info.si === '') {
			if (typeof arg !== 'number') throw new FormulaCallError(`${name}(): argument ${index + 1} (${key}) must be a plain number`);
			values[key] = arg;
		} else {
			if (!hasDimension(arg, input.dimension)) throw new FormulaCallError(`${name}(): argument ${index + 1} (${key}) must be ${info.noun}`);
			values[key] = siOf(arg as Quantity, input.dimension);
		}
	});
	for (const key of keys.slice(args.length)) {
		const fallback = calculation.inputs[key]!.default;
		if (fallback !== undefined) values[key] = fallback;
	}
	return values;
}

/** The function a rule formula calls for a calculation: its main output as a unit value. */
function asFormulaFunction(calculation: Calculation) {
	const output = calculation.outputs[calculation.main]!;
	return (...args: unknown[]) => {
		const values = toSi(calculation, args);
		checkAllowed(calculation, values);
		const result = calculation.compute(values)[calculation.main];
		if (result === undefined) throw new FormulaCallError(`${formulaName(calculation)}() needs more arguments to give ${calculation.main}`);
		return formulaValueOf(result, output.dimension);
	};
}

/** Every calculation as a formula function, keyed by the name formulas call. */
export const formulaFunctions: ReadonlyMap<string, (...args: unknown[]) => unknown> = new Map(calculations.map((calculation) => [formulaName(calculation), asFormulaFunction(calculation)]));
