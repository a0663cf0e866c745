import type {Dimension} from '../quantities/dimensions.js';

/** What values an input of a calculation may take, in SI. */
export type Allowed = 'positive' | 'non-negative' | 'any';

/** One input of a calculation. */
export type CalculationInput = {
	dimension: Dimension;
	description: string;
	/** Values outside this are refused with a clear error. @default 'non-negative' */
	allowed?: Allowed;
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

/** Refuses inputs outside each input's allowed values. */
export function checkAllowed(calculation: Calculation, values: Record<string, number>): void {
	for (const [key, input] of Object.entries(calculation.inputs)) {
		const value = values[key];
		if (value === undefined && input.optional) continue;
		if (value === undefined || !Number.isFinite(value)) throw new CalculationInputError(calculation.name, key, 'a finite number');
		const allowed = input.allowed ?? 'non-negative';
		if (allowed === 'positive' && !(value > 0)) throw new CalculationInputError(calculation.name, key, 'greater than zero');
		if (allowed === 'non-negative' && !(value >= 0)) throw new CalculationInputError(calculation.name, key, 'zero or more');
	}
}

/** The name a rule formula uses to call a calculation: `forward-voltage` → `forward_voltage`. */
export function formulaName(calculation: Calculation): string {
	return calculation.name.replaceAll('-', '_');
}
