import {dimensionNames, dimensions, type Dimension} from '../quantities/dimensions.js';
import {hasUnitDimension, isQuantity, toUnit, type Quantity} from '../quantities/engine.js';
import {formatQuantity} from '../quantities/format.js';
import type {Shown} from './evaluation.js';

/** The dimension of a formula result; kelvin reads as an absolute temperature unless told otherwise. */
export function inferDimension(value: unknown, declared?: Dimension): Dimension | undefined {
	if (declared) return declared;
	if (typeof value === 'number') return 'number';
	if (!isQuantity(value)) return undefined;
	return dimensionNames.find((name) => dimensions[name].si !== '' && hasUnitDimension(value, dimensions[name].si));
}

/** A formula result as an SI number of a dimension, with its text. */
export function toShown(value: unknown, dimension: Dimension): Shown {
	const si = typeof value === 'number' ? value : toUnit(value as Quantity, dimensions[dimension].si);
	return {si, dimension, text: formatQuantity(si, dimension)};
}

/** A number already in SI, with its text. */
export function shownSi(si: number, dimension: Dimension): Shown {
	return {si, dimension, text: formatQuantity(si, dimension)};
}
