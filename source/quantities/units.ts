import {combine, dimensionless, scale, type Exponents} from './quantity.js';

/**
 * A unit: how many SI units it is, its dimension, an offset (for degC, degF) and whether it
 * takes prefixes. `decade` is k when the factor is exactly 10^k, so a value can be scaled in
 * decimal (exactly) rather than by multiplying doubles; `scale` names a temperature scale.
 */
export type UnitDefinition = {factor: number; exponents: Exponents; offset?: number; prefixable: boolean; decade?: number; scale?: TemperatureScale};

/** A temperature scale with an offset from kelvin. */
export type TemperatureScale = 'degC' | 'degF';

const e = (m: number, kg: number, s: number, A: number, K: number, rad = 0): Exponents => [m, kg, s, A, K, rad];

/** The units prelase understands, by symbol. Kept small on purpose: these cover bench work. */
export const unitTable: Readonly<Record<string, UnitDefinition>> = {
	m: {factor: 1, exponents: e(1, 0, 0, 0, 0), prefixable: true, decade: 0},
	g: {factor: 1e-3, exponents: e(0, 1, 0, 0, 0), prefixable: true, decade: -3},
	s: {factor: 1, exponents: e(0, 0, 1, 0, 0), prefixable: true, decade: 0},
	A: {factor: 1, exponents: e(0, 0, 0, 1, 0), prefixable: true, decade: 0},
	K: {factor: 1, exponents: e(0, 0, 0, 0, 1), prefixable: true, decade: 0},
	rad: {factor: 1, exponents: e(0, 0, 0, 0, 0, 1), prefixable: true, decade: 0},
	deg: {factor: Math.PI / 180, exponents: e(0, 0, 0, 0, 0, 1), prefixable: false},
	Hz: {factor: 1, exponents: e(0, 0, -1, 0, 0), prefixable: true, decade: 0},
	N: {factor: 1, exponents: e(1, 1, -2, 0, 0), prefixable: true, decade: 0},
	J: {factor: 1, exponents: e(2, 1, -2, 0, 0), prefixable: true, decade: 0},
	W: {factor: 1, exponents: e(2, 1, -3, 0, 0), prefixable: true, decade: 0},
	V: {factor: 1, exponents: e(2, 1, -3, -1, 0), prefixable: true, decade: 0},
	ohm: {factor: 1, exponents: e(2, 1, -3, -2, 0), prefixable: true, decade: 0},
	S: {factor: 1, exponents: e(-2, -1, 3, 2, 0), prefixable: true, decade: 0},
	C: {factor: 1, exponents: e(0, 0, 1, 1, 0), prefixable: true, decade: 0},
	F: {factor: 1, exponents: e(-2, -1, 4, 2, 0), prefixable: true, decade: 0},
	min: {factor: 60, exponents: e(0, 0, 1, 0, 0), prefixable: false},
	h: {factor: 3600, exponents: e(0, 0, 1, 0, 0), prefixable: false},
	day: {factor: 86_400, exponents: e(0, 0, 1, 0, 0), prefixable: false},
	days: {factor: 86_400, exponents: e(0, 0, 1, 0, 0), prefixable: false},
	in: {factor: 0.0254, exponents: e(1, 0, 0, 0, 0), prefixable: false},
	ft: {factor: 0.3048, exponents: e(1, 0, 0, 0, 0), prefixable: false},
	mil: {factor: 2.54e-5, exponents: e(1, 0, 0, 0, 0), prefixable: false},
	degC: {factor: 1, exponents: e(0, 0, 0, 0, 1), offset: 273.15, prefixable: false, scale: 'degC'},
	degF: {factor: 5 / 9, exponents: e(0, 0, 0, 0, 1), offset: (459.67 * 5) / 9, prefixable: false, scale: 'degF'},
};

const prefixDecades: Readonly<Record<string, number>> = {f: -15, p: -12, n: -9, u: -6, m: -3, c: -2, k: 3, M: 6, G: 9, T: 12};

/** Looks a unit symbol up, with an SI prefix if it takes one (`mA`, `kohm`, `mrad`; `c` only in `cm`). */
export function findUnit(symbol: string): UnitDefinition | undefined {
	// Own properties only: "constructor" or "__proto__" must never read as a unit.
	if (Object.hasOwn(unitTable, symbol)) return unitTable[symbol];
	const first = symbol[0] ?? '';
	const rest = symbol.slice(1);
	const decade = Object.hasOwn(prefixDecades, first) ? prefixDecades[first] : undefined;
	const base = Object.hasOwn(unitTable, rest) ? unitTable[rest] : undefined;
	if (decade === undefined || !base?.prefixable || (symbol[0] === 'c' && symbol !== 'cm')) return undefined;
	const factor = base.factor * Number(`1e${decade}`);
	return {factor, exponents: base.exponents, prefixable: false, ...(base.decade === undefined ? {} : {decade: base.decade + decade})};
}

/** True when a name is a unit symbol (so a formula name spelled that way would read as a unit). */
export function isUnitName(name: string): boolean {
	return findUnit(name) !== undefined;
}

/**
 * A unit expression such as `mW/cm^2` or `nA/Hz^0.5` reduced to one factor and dimension;
 * `decade` is k when the factor is exactly 10^k, `scale` a lone degC or degF.
 */
export type CompoundUnit = {factor: number; exponents: Exponents; offset: number; decade?: number; scale?: TemperatureScale};

/**
 * Reads a unit expression: symbols joined by `*`, `/` or a space, each with an optional
 * `^power`; one pair of parentheses after `/` is allowed (`W/(m^2 sr)` style). Units with an
 * offset (degC, degF) must stand alone. Returns undefined for anything else.
 */
export function parseUnitExpression(text: string): CompoundUnit | undefined {
	const tokens = text.match(/[A-Za-z_]+|\^[-+]?\d*\.?\d+|[*/()]|\S/g) ?? [];
	let factor = 1;
	let exponents = dimensionless;
	let offset = 0;
	let decade: number | undefined = 0;
	let temperatureScale: TemperatureScale | undefined;
	let sign: 1 | -1 = 1;
	let groupSign: 1 | -1 = 1;
	let inGroup = false;
	let expectUnit = true;
	let count = 0;
	for (let index = 0; index < tokens.length; index += 1) {
		const token = tokens[index]!;
		if (token === '*' || token === '/') {
			if (expectUnit) return undefined;
			sign = token === '/' ? -1 : 1;
			expectUnit = true;
			continue;
		}
		if (token === '(') {
			if (inGroup || !expectUnit) return undefined;
			inGroup = true;
			groupSign = sign;
			continue;
		}
		if (token === ')') {
			if (!inGroup || expectUnit) return undefined;
			inGroup = false;
			continue;
		}
		if (!/^[A-Za-z_]+$/.test(token)) return undefined;
		const unit = findUnit(token);
		if (!unit) return undefined;
		let power = 1;
		const next = tokens[index + 1];
		if (next?.startsWith('^')) {
			power = Number(next.slice(1));
			if (!Number.isFinite(power)) return undefined;
			index += 1;
		}
		const effective = (inGroup ? groupSign : sign) * power;
		factor *= unit.factor ** effective;
		exponents = combine(exponents, scale(unit.exponents, Math.abs(effective)), effective < 0 ? -1 : 1);
		decade = decade !== undefined && unit.decade !== undefined && Number.isInteger(effective) ? decade + unit.decade * effective : undefined;
		if (unit.offset !== undefined) offset = unit.offset;
		if (unit.scale !== undefined) temperatureScale = unit.scale;
		count += 1;
		if (!inGroup) sign = 1;
		expectUnit = false;
	}
	if (expectUnit || inGroup || count === 0) return undefined;
	if (offset !== 0 && count > 1) return undefined;
	return {factor, exponents, offset, ...(decade === undefined ? {} : {decade}), ...(temperatureScale ? {scale: temperatureScale} : {})};
}
