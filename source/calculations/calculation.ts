import type {Dimension} from '../quantities/dimensions.js';
import {formatQuantity} from '../quantities/format.js';

/**
 * The values an input is valid for, in SI: from `min` to `max` (both included unless
 * `aboveMin`), whole numbers only when `whole`. Shown as text in errors, --help and the docs.
 */
export type InputRange = {min: number; max: number; aboveMin?: boolean; whole?: boolean};

/** A range from min to max, both included. */
export function between(min: number, max: number): InputRange {
	return {min, max};
}

/** A range above min (excluded) up to max (included). */
export function above(min: number, max: number): InputRange {
	return {min, max, aboveMin: true};
}

/** Whole numbers from min to max, both included. */
export function wholeBetween(min: number, max: number): InputRange {
	return {min, max, whole: true};
}

/**
 * A condition between inputs that no single range can say; `description` completes
 * "KEY must be …" for the first key, e.g. "above rated_ambient".
 */
export type InputCondition = {keys: [string, ...string[]]; holds(inputs: Record<string, number>): boolean; description: string};

/** One input of a calculation. */
export type CalculationInput = {
	dimension: Dimension;
	description: string;
	/** The values this input is valid for; values outside are refused, naming the key and the range. */
	range: InputRange;
	/** Default value in SI, used by `calc` when the key is left out. */
	default?: number;
	/** May be left out; outputs that need it are then not given. */
	optional?: boolean;
};

/** One output of a calculation. */
export type CalculationOutput = {dimension: Dimension; description: string};

/**
 * A self-describing bench calculation: SI numbers in, SI numbers out. The registry feeds
 * rule formulas, the calc command, the docs and the reference tests from this one shape.
 */
export type Calculation = {
	/** Kebab-case name, as typed after `prelase calc`; rule formulas call it with _ for -. */
	name: string;
	summary: string;
	/** Inputs in the order rule formulas pass them. */
	inputs: Record<string, CalculationInput>;
	/** Conditions between inputs that a range of one input cannot say (checked after the ranges). */
	conditions?: InputCondition[];
	outputs: Record<string, CalculationOutput>;
	/** The output a rule formula's call returns. */
	main: string;
	/** Formula in words, for the docs. */
	formula: string;
	/** Published sources, or "common practice". */
	basis: string[];
	/** Pure: SI numbers in, SI numbers out. Outputs that need a left-out optional input are absent. */
	compute(inputs: Record<string, number>): Record<string, number>;
	/** A caution shown with every result (the optical-hazard calculations defer to the laser safety officer). */
	caution?: string;
	/** Plain-words remarks on a result (e.g. "no heat sink can do it"), shown by `calc`. */
	notes?(inputs: Record<string, number>, outputs: Record<string, number>): string[];
};

/** A value outside what a calculation is valid for. */
export class CalculationInputError extends Error {
	constructor(
		readonly calculation: string,
		readonly key: string,
		readonly allowed: string,
	) {
		super(`${calculation}: ${key} must be ${allowed}`);
	}
}

/** A range as text in the input's own units: "between −3 and 40, whole numbers only". */
export function rangeText(range: InputRange, dimension: Dimension): string {
	const [min, max] = [formatQuantity(range.min, dimension), formatQuantity(range.max, dimension)];
	const span = range.aboveMin ? `above ${min} and at most ${max}` : `between ${min} and ${max}`;
	return range.whole ? `a whole number ${span}` : span;
}

/** A range as short text for tables: "−3 to 40 (whole)", "above 0 V to 1 kV". */
export function rangeShortText(range: InputRange, dimension: Dimension): string {
	const [min, max] = [formatQuantity(range.min, dimension), formatQuantity(range.max, dimension)];
	return `${range.aboveMin ? 'above ' : ''}${min} to ${max}${range.whole ? ' (whole)' : ''}`;
}

/** Relative slack at a range edge, so an edge holds however it is spelled (−100 °C is 173.15 K). */
const edgeSlack = 1e-12;

function withinRange(value: number, range: InputRange): boolean {
	const low = range.aboveMin ? value > range.min : value >= range.min - edgeSlack * Math.abs(range.min);
	return low && value <= range.max + edgeSlack * Math.abs(range.max) && (!range.whole || Number.isInteger(value));
}

/**
 * Refuses inputs outside each input's range, then inputs that contradict each other; throws a
 * CalculationInputError naming the key.
 */
export function checkAllowed(calculation: Calculation, values: Record<string, number>): void {
	for (const [key, input] of Object.entries(calculation.inputs)) {
		const value = values[key];
		if (value === undefined && input.optional) continue;
		if (value === undefined || !Number.isFinite(value)) throw new CalculationInputError(calculation.name, key, 'a finite number');
		if (!withinRange(value, input.range)) throw new CalculationInputError(calculation.name, key, `${rangeText(input.range, input.dimension)} (${formatQuantity(value, input.dimension)} given)`);
	}
	for (const condition of calculation.conditions ?? []) {
		if (condition.keys.some((key) => values[key] === undefined)) continue;
		if (condition.holds(values)) continue;
		const given = condition.keys.map((key) => `${key} ${formatQuantity(values[key]!, calculation.inputs[key]!.dimension)}`).join(', ');
		throw new CalculationInputError(calculation.name, condition.keys[0], `${condition.description} (${given} given)`);
	}
}

/** The name a rule formula uses to call a calculation: `forward-voltage` → `forward_voltage`. */
export function formulaName(calculation: Calculation): string {
	return calculation.name.replaceAll('-', '_');
}
