import {EvaluationError} from './evaluation-error.js';
import {isQuantity, Quantity, sameExponents, type Exponents, type TemperatureKind} from './quantity.js';

/**
 * How absolute temperatures and temperature differences combine inside a formula. Inputs say
 * which they are by their dimension; a number typed in degC or degF inside a formula (a
 * literal) is read as a difference beside a difference and as a point otherwise; a value in K
 * with no kind takes the kind of what it meets.
 */

const kelvin: Exponents = [0, 0, 0, 0, 1, 0];

type Role = TemperatureKind | 'open' | 'literal';

/** True for a quantity whose dimension is exactly kelvin. */
export function isTemperature(value: unknown): value is Quantity {
	return isQuantity(value) && sameExponents(value.exponents, kelvin);
}

/** A value in kelvin of a kind (or of no particular kind). */
export function kelvinValue(value: number, kind?: TemperatureKind): Quantity {
	return new Quantity(value, kelvin, kind);
}

function role(value: Quantity): Role {
	return value.asDifference !== undefined ? 'literal' : (value.kind ?? 'open');
}

/** A temperature read as a point or as a step; a literal takes the matching reading. */
export function readAs(value: Quantity, kind: TemperatureKind): Quantity {
	return kelvinValue(kind === 'difference' && value.asDifference !== undefined ? value.asDifference : value.value, kind);
}

function mismatch(what: string): never {
	throw new EvaluationError('temperature-kind-mismatch', `${what} an absolute temperature and a temperature difference; subtract two temperatures to get a difference, or write the limit in K`);
}

/** Two temperatures made comparable (a literal beside a difference reads as a difference); a point against a step is refused. */
export function alignTemperatures(a: Quantity, b: Quantity, what: string): [Quantity, Quantity] {
	const [ra, rb] = [role(a), role(b)];
	if ((ra === 'absolute' && rb === 'difference') || (ra === 'difference' && rb === 'absolute')) mismatch(what);
	if (ra === 'literal' && rb === 'difference') return [readAs(a, 'difference'), b];
	if (rb === 'literal' && ra === 'difference') return [a, readAs(b, 'difference')];
	return [ra === 'literal' ? readAs(a, 'absolute') : a, rb === 'literal' ? readAs(b, 'absolute') : b];
}

/** a + b: a point plus a step is a point, two steps a step, two points neither (half of it is an average). */
export function addTemperatures(a: Quantity, b: Quantity): Quantity {
	let [ra, rb] = [role(a), role(b)];
	// A literal added to a point or a step is a step; two literals: the first is the point.
	if (ra === 'literal' && rb === 'literal') [a, b, ra, rb] = [readAs(a, 'absolute'), readAs(b, 'difference'), 'absolute', 'difference'];
	if (ra === 'literal') [a, ra] = rb === 'open' ? [readAs(a, 'absolute'), 'absolute'] : [readAs(a, 'difference'), 'difference'];
	if (rb === 'literal') [b, rb] = ra === 'open' ? [readAs(b, 'absolute'), 'absolute'] : [readAs(b, 'difference'), 'difference'];
	const sum = a.value + b.value;
	if (ra === 'absolute' && rb === 'absolute') return kelvinValue(sum);
	if (ra === 'absolute' || rb === 'absolute') return kelvinValue(sum, 'absolute');
	if (ra === 'difference' || rb === 'difference') return kelvinValue(sum, 'difference');
	return kelvinValue(sum);
}

/** a − b: two points give a step, a point less a step a point, two steps a step; a step less a point is refused. */
export function subtractTemperatures(a: Quantity, b: Quantity): Quantity {
	let [ra, rb] = [role(a), role(b)];
	if (ra === 'literal') [a, ra] = [readAs(a, 'absolute'), 'absolute'];
	if (rb === 'literal') [b, rb] = ra === 'difference' ? [readAs(b, 'difference'), 'difference'] : [readAs(b, 'absolute'), 'absolute'];
	const difference = a.value - b.value;
	if (ra === 'difference' && rb === 'absolute') mismatch('cannot subtract from each other');
	if (rb === 'absolute' || (ra === 'difference' && rb === 'difference') || (ra === 'difference' && rb === 'open')) return kelvinValue(difference, 'difference');
	if (ra === 'absolute') return kelvinValue(difference, 'absolute');
	return kelvinValue(difference);
}

/** A temperature times a plain number: a step stays a step, a literal scales both readings, a point loses its kind. */
export function scaleTemperature(value: Quantity, factor: number): Quantity {
	if (value.asDifference !== undefined) return new Quantity(value.value * factor, kelvin, undefined, value.asDifference * factor);
	return kelvinValue(value.value * factor, value.kind === 'difference' ? 'difference' : undefined);
}

/** −a: a step negated is a step; anything else negated has no meaning as a point. */
export function negateTemperature(value: Quantity): Quantity {
	if (value.asDifference !== undefined) return kelvinValue(-value.asDifference, 'difference');
	return kelvinValue(-value.value, value.kind === 'difference' ? 'difference' : undefined);
}

/** |a| with the kind (and both readings of a literal) kept. */
export function absoluteValueOfTemperature(value: Quantity): Quantity {
	return new Quantity(Math.abs(value.value), kelvin, value.kind, value.asDifference === undefined ? undefined : Math.abs(value.asDifference));
}
