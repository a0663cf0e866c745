import {dimensions} from './dimensions.js';
import {isQuantity, sameExponents} from './quantity.js';
import {parseUnitExpression} from './units.js';

const nouns = Object.values(dimensions)
	.filter((info) => info.si !== '')
	.map((info) => ({noun: info.noun, exponents: parseUnitExpression(info.si)!.exponents}));

/** A value's kind in words for messages: "a current", "true or false", "a plain number". */
export function describeValue(value: unknown): string {
	if (typeof value === 'boolean') return 'true or false';
	if (typeof value === 'number') return 'a plain number';
	if (typeof value === 'string') return 'text';
	if (isQuantity(value)) {
		if (value.kind === 'difference') return 'a temperature difference';
		const known = nouns.find((entry) => sameExponents(entry.exponents, value.exponents));
		if (known) return known.noun;
		if (sameExponents(value.exponents, parseUnitExpression('C')!.exponents)) return 'a charge';
		if (sameExponents(value.exponents, parseUnitExpression('kg')!.exponents)) return 'a mass';
		return `a quantity in ${value.formatUnits()}`;
	}
	return 'something that is not a number';
}
