import fc from 'fast-check';
import {all, create} from 'mathjs';
import {describe, expect, it} from 'vitest';
import {quantity} from '../../source/quantities/engine.js';
import {evaluateExpression} from '../../source/quantities/expression-evaluate.js';
import {parseExpression} from '../../source/quantities/expression-parser.js';
import {isQuantity, type Quantity} from '../../source/quantities/quantity.js';
import {parseUnitExpression, unitTable} from '../../source/quantities/units.js';

// mathjs is a general-purpose reference library here: prelase's own engine must agree with it.
const math = create(all!);
const baseOrder = ['LENGTH', 'MASS', 'TIME', 'CURRENT', 'TEMPERATURE', 'ANGLE'] as const;

function mathjsSi(text: string) {
	const value = math.unit(text);
	const si = value.toSI();
	const dimensions = (value as unknown as {dimensions: number[]}).dimensions;
	const names = (math as unknown as {Unit: {BASE_DIMENSIONS: string[]}}).Unit.BASE_DIMENSIONS;
	const exponents = baseOrder.map((name) => dimensions[names.indexOf(name)] ?? 0);
	return {value: si.toNumeric() as number, exponents};
}

const symbols = Object.keys(unitTable).filter((symbol) => !unitTable[symbol]!.offset);
const prefixed = ['mA', 'uA', 'nA', 'kV', 'mV', 'mW', 'kW', 'mohm', 'kohm', 'Mohm', 'ms', 'us', 'ns', 'mm', 'um', 'nm', 'cm', 'kHz', 'MHz', 'GHz', 'mrad', 'uJ', 'mJ', 'kg', 'mg', 'pF', 'nF'];
const compound = ['mW/cm^2', 'W/m^2', 'J/cm^2', 'K/W', 'A/W', 'W/A', 'A/V', 'nA/Hz^0.5', 'mm^2', 'V/A', 'W s'];

describe('units agree with mathjs (reference library)', () => {
	it.each([...symbols, ...prefixed, ...compound])('1 %s has the same SI value and dimension', (symbol) => {
		const ours = parseUnitExpression(symbol);
		expect(ours, symbol).toBeDefined();
		const reference = mathjsSi(`1 ${symbol}`);
		expect(ours!.factor).toBeCloseTo(reference.value, 12);
		expect(ours!.factor / reference.value).toBeCloseTo(1, 12);
		expect([...ours!.exponents]).toEqual(reference.exponents);
	});

	it.each([
		['25 degC', 298.15],
		['-40 degC', 233.15],
		['98.6 degF', 310.15],
		['-40 degF', 233.15],
	])('%s is %d K absolute', (text, kelvin) => {
		const [value, unit] = text.split(' ') as [string, string];
		expect(quantity(Number(value), unit) as Quantity).toMatchObject({value: expect.closeTo(kelvin, 9)});
		expect(math.unit(text).toNumber('K')).toBeCloseTo(kelvin, 9);
	});

	it('evaluates products and quotients of random quantities like mathjs', () => {
		const units = ['V', 'A', 'ohm', 'W', 's', 'Hz', 'm', 'K'];
		fc.assert(
			fc.property(
				fc.double({min: 1e-6, max: 1e6, noNaN: true}),
				fc.double({min: 1e-6, max: 1e6, noNaN: true}),
				fc.constantFrom(...units),
				fc.constantFrom(...units),
				fc.constantFrom('*', '/'),
				(a, b, ua, ub, op) => {
					const text = `${a} ${ua} ${op} ${b} ${ub}`;
					const ours = evaluateExpression(parseExpression(text), new Map());
					const theirs = math.evaluate(text) as unknown;
					const theirValue = typeof theirs === 'number' ? theirs : ((theirs as {toSI(): {toNumeric(): number}}).toSI().toNumeric() as number);
					const ourValue = isQuantity(ours) ? ours.value : (ours as number);
					expect(ourValue / theirValue).toBeCloseTo(1, 10);
				},
			),
			{numRuns: 300},
		);
	});
});
