import fc from 'fast-check';
import {describe, expect, it} from 'vitest';
import {awgDiameter, wire} from '../../source/calculations/wire.js';

const kiloFoot = 304.8;
const at75 = 348.15;

// NFPA 70 (NEC) Chapter 9 Table 8, uncoated solid copper at 75 °C, Ω/kft. The table rounds to
// three figures and uses slightly different copper than 100 % IACS, so ±0.5 % is allowed.
const necSolid = [
	{awg: 18, ohmsPerKiloFoot: 7.77}, // NEC Chapter 9 Table 8: 18 AWG solid 7.77 Ω/kft at 75 °C
	{awg: 16, ohmsPerKiloFoot: 4.89}, // NEC Chapter 9 Table 8: 16 AWG solid 4.89 Ω/kft
	{awg: 14, ohmsPerKiloFoot: 3.07}, // NEC Chapter 9 Table 8: 14 AWG solid 3.07 Ω/kft
	{awg: 12, ohmsPerKiloFoot: 1.93}, // NEC Chapter 9 Table 8: 12 AWG solid 1.93 Ω/kft
	{awg: 10, ohmsPerKiloFoot: 1.21}, // NEC Chapter 9 Table 8: 10 AWG solid 1.21 Ω/kft
];

const diameters = [
	{awg: 18, inches: 0.0403}, // ASTM B258 / NBS Handbook 100 (from memory; matches public AWG tables): 18 AWG 0.04030 in
	{awg: 20, inches: 0.03196}, // same: 20 AWG 0.03196 in
	{awg: 22, inches: 0.02535}, // same: 22 AWG 0.02535 in
	{awg: 24, inches: 0.0201}, // same: 24 AWG 0.02010 in
];

describe('wire reference values', () => {
	it.each(necSolid)('$awg AWG at 75 °C is $ohmsPerKiloFoot Ω/kft', ({awg, ohmsPerKiloFoot}) => {
		const result = wire.compute({awg, length: kiloFoot, temperature: at75});
		expect(Math.abs(result['resistance']! / ohmsPerKiloFoot - 1)).toBeLessThan(0.005);
	});

	it.each(diameters)('$awg AWG is $inches in across', ({awg, inches}) => {
		expect(awgDiameter(awg) / 0.0254).toBeCloseTo(inches, 5);
	});

	it('uses annealed copper at 20 °C: 1/58 Ω·mm²/m', () => {
		// NBS Handbook 100 (from memory): 1 m of 1 mm² annealed copper at 20 °C is 1/58 Ω
		const area = (Math.PI * awgDiameter(18) ** 2) / 4;
		const result = wire.compute({awg: 18, length: 1, temperature: 293.15});
		expect(result['resistance']! * area * 1e6).toBeCloseTo(1 / 58, 12);
	});
});

describe('wire properties', () => {
	const gauge = fc.integer({min: -3, max: 40});
	const length = fc.double({min: 0.01, max: 1000, noNaN: true});
	const temperature = fc.double({min: 200, max: 500, noNaN: true});

	it('rises with gauge number, length and temperature', () => {
		fc.assert(
			fc.property(gauge, length, temperature, (awg, metres, kelvin) => {
				const base = wire.compute({awg, length: metres, temperature: kelvin})['resistance']!;
				const thinner = wire.compute({awg: awg + 1, length: metres, temperature: kelvin})['resistance']!;
				const longer = wire.compute({awg, length: metres * 1.5, temperature: kelvin})['resistance']!;
				const hotter = wire.compute({awg, length: metres, temperature: kelvin + 10})['resistance']!;
				return thinner > base && longer > base && hotter > base;
			}),
		);
	});
});
