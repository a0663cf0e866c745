import {dimensionNames, dimensions, type Dimension} from '../../quantities/dimensions.js';
import {hasUnitDimension, isQuantity, type Quantity} from '../../quantities/engine.js';
import {siOf} from '../../quantities/dimension-value.js';
import {formatQuantity} from '../../quantities/format.js';
import type {Shown} from './evaluation.js';

/**
 * The dimension of a formula result; kelvin reads as a temperature difference when the formula
 * made a difference (or `beside`, the other side of a comparison, is one), else as an absolute temperature.
 */
export function inferDimension(value: unknown, declared?: Dimension, beside?: unknown): Dimension | undefined {
	if (declared) return declared;
	if (typeof value === 'number') return 'number';
	if (!isQuantity(value)) return undefined;
	if (hasUnitDimension(value, 'K')) {
		const kind = value.kind ?? (isQuantity(beside) ? beside.kind : undefined);
		return kind === 'difference' ? 'temperature_difference' : 'temperature';
	}
	return dimensionNames.find((name) => dimensions[name].si !== '' && hasUnitDimension(value, dimensions[name].si));
}

/** A formula result as an SI number of a dimension, with its text. */
export function toShown(value: unknown, dimension: Dimension): Shown {
	return shownSi(siOf(value as Quantity | number, dimension), dimension);
}

/**
 * A number already in SI, with its text. The text is formatted when first read: the worst-corner
 * search judges a check at many points and shows only one of them.
 */
export function shownSi(si: number, dimension: Dimension): Shown {
	let text: string | undefined;
	return {
		si,
		dimension,
		get text() {
			return (text ??= formatQuantity(si, dimension));
		},
	};
}
