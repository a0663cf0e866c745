import {dimensions, type Dimension} from './dimensions.js';
import {formatQuantity} from './format.js';
import {parseQuantity} from './parse-quantity.js';

/** What is known of a field for its example: its values' span in SI and its default, if any. */
export type ExampleField = {
	readonly dimension: Dimension;
	readonly range?: {readonly min: number; readonly max: number; readonly aboveMin?: boolean; readonly whole?: boolean};
	readonly default?: number;
};

/**
 * Everyday values of each dimension at different scales, tried in order: a field's example is the
 * one that lies in its range (a wire length 1.5 m, a beam diameter 3 mm, a wavelength 905 nm),
 * so a distance is never shown as a wavelength. A dimension not listed uses its generic example.
 */
const candidates: Partial<Record<Dimension, readonly string[]>> = {
	current: ['250 mA', '2 A', '20 uA'],
	voltage: ['2.1 V', '12 V', '28 V'],
	power: ['1.5 W', '5 mW', '100 W'],
	resistance: ['1.2 ohm', '100 ohm', '10 kohm'],
	temperature: ['25 degC', '85 degC'],
	temperature_difference: ['60 K', '5 K'],
	time: ['3 s', '10 ms', '1 us', '1 ns'],
	frequency: ['1 MHz', '1 kHz', '10 GHz'],
	length: ['1.5 m', '3 mm', '905 nm'],
	ratio: ['10 %', '5 %', '50 %'],
};

function inRange(si: number, field: ExampleField): boolean {
	const {range} = field;
	if (!range) return true;
	const low = range.aboveMin ? si > range.min : si >= range.min;
	return low && si <= range.max && (!range.whole || Number.isInteger(si));
}

function siOf(text: string, dimension: Dimension): number | undefined {
	const parsed = parseQuantity(text, dimension);
	return parsed.ok ? parsed.value.si : undefined;
}

/** A round value inside a range that none of the everyday values fits. */
function roundInside(range: NonNullable<ExampleField['range']>): number {
	const {min, max} = range;
	const middle = min > 0 && Number.isFinite(max) ? Math.sqrt(min * max) : Number.isFinite(max) ? (min + max) / 2 : min > 0 ? min * 10 : 1;
	const round = range.whole ? Math.round(middle) : Number(middle.toPrecision(1));
	const fits = (value: number) => (range.aboveMin ? value > min : value >= min) && value <= max;
	return fits(round) ? round : range.whole ? Math.ceil(min + (range.aboveMin ? 1 : 0)) : middle;
}

/**
 * The example entry for one field, as an operator would type it: the field's default when it has
 * one, else the first everyday value of its dimension that lies in its range, else a round value
 * inside the range.
 */
export function fieldExample(field: ExampleField): string {
	const key = [field.dimension, field.default, field.range?.min, field.range?.max, field.range?.aboveMin, field.range?.whole].map(String).join('|');
	let example = examples.get(key);
	if (example === undefined) examples.set(key, (example = exampleOf(field)));
	return example;
}

/** Examples already chosen, by field: the same field is asked for often (every schema field, every message). */
const examples = new Map<string, string>();

function exampleOf(field: ExampleField): string {
	const {dimension} = field;
	if (field.default !== undefined && Number.isFinite(field.default) && inRange(field.default, field)) return formatQuantity(field.default, dimension);
	const fitting = (candidates[dimension] ?? [dimensions[dimension].example]).map((text) => ({text, si: siOf(text, dimension)})).filter((entry) => entry.si !== undefined && inRange(entry.si, field));
	if (fitting.length > 0) return fitting[0]!.text;
	return field.range ? formatQuantity(roundInside(field.range), dimension) : dimensions[dimension].example;
}

/** The noun and the field's own example, to fill entry messages ("a length, for example 1.5 m"). */
export function fieldWords(field: ExampleField): {noun: string; example: string} {
	return {noun: dimensions[field.dimension].noun, example: fieldExample(field)};
}

/** The example as one command-line word (`key=1.5m`): the space left out where the entry still reads the same. */
export function compactExample(field: ExampleField): string {
	const text = fieldExample(field);
	const compact = text.replace(' ', '');
	const [spaced, joined] = [siOf(text, field.dimension), siOf(compact, field.dimension)];
	return spaced !== undefined && spaced === joined ? compact : text;
}
