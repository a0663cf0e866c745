import {dimensions, type Dimension} from './dimensions.js';
import {quantity, toUnit} from './engine.js';
import {isQuantity, type Quantity} from './quantity.js';
import {isTemperature, kelvinValue, readAs} from './temperature-kind.js';

/**
 * Moving values between SI numbers of a declared dimension and formula values: temperatures
 * carry their kind (absolute or difference) from the dimension they were declared with.
 */

/** The value a formula sees for an SI number of a dimension: a plain number, a quantity, or a temperature of its kind. */
export function formulaValueOf(si: number, dimension: Dimension): Quantity | number {
	if (dimension === 'temperature') return kelvinValue(si, 'absolute');
	if (dimension === 'temperature_difference') return kelvinValue(si, 'difference');
	const unit = dimensions[dimension].si;
	return unit === '' ? si : quantity(si, unit);
}

/** A formula value as an SI number of a dimension; a degC literal read as a difference gives its step. */
export function siOf(value: Quantity | number, dimension: Dimension): number {
	if (typeof value === 'number') return value;
	if (dimension === 'temperature_difference' && value.asDifference !== undefined) return value.asDifference;
	return toUnit(value, dimensions[dimension].si);
}

/** A formula result given the kind its declared dimension says (a derived temperature difference is a difference). */
export function asDeclared(value: unknown, dimension: Dimension): unknown {
	if (!isQuantity(value) || !isTemperature(value)) return value;
	if (dimension === 'temperature') return readAs(value, 'absolute');
	if (dimension === 'temperature_difference') return readAs(value, 'difference');
	return value;
}
