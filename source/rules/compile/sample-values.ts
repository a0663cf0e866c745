import type {Dimension} from '../../quantities/dimensions.js';
import {formulaValueOf} from '../../quantities/dimension-value.js';
import type {SiValue} from './compiled-rules.js';

/** The value a formula sees for an SI number of a dimension: a unit value (a temperature of its kind), or a plain number. */
export function toFormulaValue(value: SiValue): unknown {
	return formulaValueOf(value.si, value.dimension);
}

/**
 * A representative value inside a range, for linting formulas with sample inputs: the middle
 * by default, or another point (`fraction` of the way, on a log scale for wide positive ranges).
 */
export function sampleWithin(range: {min: number; max: number} | undefined, dimension: Dimension, fraction = 0.5): SiValue {
	if (!range) return {si: fraction === 0.5 ? 1 : 2 * fraction, dimension};
	const {min, max} = range;
	const wide = min > 0 && max / min > 100;
	if (fraction === 0.5) return {si: wide ? Math.sqrt(min * max) : (min + max) / 2, dimension};
	const si = wide ? min * (max / min) ** fraction : min + (max - min) * fraction;
	return {si, dimension};
}
