import type {Dimension} from '../quantities/dimensions.js';
import {formulaValueOf} from '../quantities/dimension-value.js';
import type {SiValue} from './compiled-rules.js';

/** The value a formula sees for an SI number of a dimension: a unit value (a temperature of its kind), or a plain number. */
export function toFormulaValue(value: SiValue): unknown {
	return formulaValueOf(value.si, value.dimension);
}

/** A representative value inside a range, for linting formulas with sample inputs. */
export function sampleWithin(range: {min: number; max: number} | undefined, dimension: Dimension): SiValue {
	if (!range) return {si: 1, dimension};
	const {min, max} = range;
	const si = min > 0 && max / min > 100 ? Math.sqrt(min * max) : (min + max) / 2;
	return {si, dimension};
}
