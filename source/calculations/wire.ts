import {between, wholeBetween, type Calculation} from './calculation.js';

const inch = 0.0254;
/** Annealed copper, 100 % IACS, at 20 °C, in Ω·m. */
export const copperResistivity20 = 1 / 58e6;
/** Temperature coefficient of resistance of 100 % IACS copper at 20 °C, per kelvin. */
export const copperCoefficient20 = 0.00393;

/** Diameter in metres of an AWG gauge: 0.005 in × 92^((36 − n)/39). 0000 is −3. */
export function awgDiameter(gauge: number): number {
	return 0.005 * inch * 92 ** ((36 - gauge) / 39);
}

/** Resistance of a solid copper conductor from its AWG size, length and temperature. */
export const wire: Calculation = {
	name: 'wire',
	summary: 'Resistance of a solid copper conductor from its AWG size, length and temperature',
	inputs: {
		awg: {dimension: 'number', description: 'Gauge (AWG), whole gauges; 0 is 1/0, −1 is 2/0, −3 is 4/0', range: wholeBetween(-3, 40)},
		length: {dimension: 'length', description: 'Conductor length (one conductor; double it for a loop)', range: between(0, 10e3)},
		temperature: {dimension: 'temperature', description: 'Conductor temperature (the linear coefficient holds from about −100 °C to 250 °C)', range: between(173.15, 523.15), default: 293.15},
	},
	outputs: {
		resistance: {dimension: 'resistance', description: 'Conductor resistance'},
		diameter: {dimension: 'length', description: 'Conductor diameter'},
		area: {dimension: 'area', description: 'Conductor cross-section'},
	},
	main: 'resistance',
	formula: 'd = 0.005 in × 92^((36 − AWG)/39); R = ρ₂₀·(1 + 0.00393·(T − 20 °C))·L/(π·d²/4), ρ₂₀ = 1/58 Ω·mm²/m',
	basis: ['NBS Handbook 100, Copper Wire Tables (1966): AWG diameters (ASTM B258), annealed copper resistivity 1/58 Ω·mm²/m and α₂₀ = 0.00393 /K (from memory)'],
	compute: ({awg, length, temperature}) => {
		const diameter = awgDiameter(awg!);
		const area = (Math.PI * diameter ** 2) / 4;
		const resistivity = copperResistivity20 * (1 + copperCoefficient20 * (temperature! - 293.15));
		return {resistance: (resistivity * length!) / area, diameter, area};
	},
};
