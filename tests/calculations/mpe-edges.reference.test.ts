import {describe, expect, it} from 'vitest';
import {hazardClass} from '../../source/calculations/hazard-class.js';
import {mpe} from '../../source/calculations/mpe.js';
import {od} from '../../source/calculations/od.js';
import {limitingAperture, ocularMpe, type Edition} from '../../source/calculations/optical/ocular-mpe.js';
import {parseQuantity} from '../../source/quantities/parse-quantity.js';

// Every regime edge of the exposure-limit, class and aperture code, each typed several ways. A value on
// an edge must give one result whatever its spelling, and where the table is discontinuous there the
// lower limit (the higher class, the smaller aperture) of the two rows that meet applies.

/** SI value of a typed quantity, through the same parser the screens and answers files use. */
function typed(text: string, dimension: 'length' | 'time'): number {
	const parsed = parseQuantity(text, dimension);
	if (!parsed.ok) throw new Error(`cannot parse ${text}`);
	return parsed.value.si;
}

/** Spellings of a wavelength edge in nm: parsed nm, µm, m, scientific, and the bare products a parser might form. */
function wavelengthSpellings(nanometres: number): number[] {
	const micrometres = nanometres / 1000;
	return [
		typed(`${nanometres} nm`, 'length'),
		typed(`${micrometres} um`, 'length'),
		typed(`${nanometres / 1e9} m`, 'length'),
		typed(`${nanometres}e-9 m`, 'length'),
		typed(`${micrometres}e3 nm`, 'length'),
		nanometres * 1e-9,
		micrometres * 1e-6,
		(nanometres / 1e6) * 1e-3,
		Number(`${nanometres}e-9`),
	];
}

/** Spellings of a duration edge in s: parsed s, ms, µs, ns, scientific, and bare products. */
function durationSpellings(seconds: number): number[] {
	return [
		typed(`${seconds} s`, 'time'),
		typed(`${seconds * 1e3} ms`, 'time'),
		typed(`${seconds * 1e6} us`, 'time'),
		typed(`${seconds * 1e9} ns`, 'time'),
		typed(`${seconds.toExponential()} s`, 'time'),
		(seconds * 1e9) * 1e-9,
		(seconds * 1e6) * 1e-6,
		(seconds * 1e3) * 1e-3,
	];
}

/** Each edge: where it is, the limit on each side (hand values from the tables), and which is lower. */
type Edge = {name: string; wavelength: number; duration: number; edition: Edition; below: number; above: number};

const durationEdges = new Set([1e-13, 1e-11, 1e-9, 1e-7, 5e-6, 1.3e-5, 1.8e-5, 5e-5, 1e-3, 10, 100, 1e3, 3e4]);

// H in J/m² on each side of the edge, as the rows give it at the edge value itself.
// prettier-ignore
const edges: Edge[] = [
	// Wavelength edges
	{name: '180 nm (start of the tables)', wavelength: 180, duration: 1, edition: 2014, below: 30, above: 30}, // IEC-2007 handout (seen): 180–302.5 nm, 30 J/m²
	{name: '302.5 nm', wavelength: 302.5, duration: 1, edition: 2014, below: 30, above: 10 ** 1.5}, // IEC-2007 handout (seen): 30 J/m² vs C2(302.5) = 10^1.5 = 31.62 J/m²
	{name: '315 nm, 10⁴ s (2007)', wavelength: 315, duration: 1e4, edition: 2007, below: 1e4, above: 1e5}, // IEC-2007 handout (seen): C2(315) = 10⁴ J/m² vs 10 W/m²·10⁴ s
	{name: '400 nm, 1 ms', wavelength: 400, duration: 1e-3, edition: 2014, below: 5600 * 10 ** -0.75, above: 18 * 10 ** -2.25}, // IEC-2007 handout (seen): C1 = 995.8 J/m² vs 18·t^0.75 = 0.1012 J/m²
	{name: '400 nm, 3×10⁴ s', wavelength: 400, duration: 3e4, edition: 2014, below: 1e4, above: 3e4}, // 10⁴ J/m² dose (DGUV Information 203-042) vs photochemical 1·C_B W/m²·3×10⁴ s (IEC-2007 handout, seen)
	{name: '450 nm, 1000 s', wavelength: 450, duration: 1000, edition: 2014, below: 1000, above: 1000}, // C_B = 1 on both sides (EU-AOR T2.5, seen)
	{name: '600 nm, 1000 s', wavelength: 600, duration: 1000, edition: 2014, below: 1e4, above: 1e4}, // thermal 10 W/m² on both sides (photochemical C_B(600) = 1000 W/m² is higher)
	{name: '700 nm, 1 s', wavelength: 700, duration: 1, edition: 2014, below: 18, above: 18}, // C_A(700) = 1 (EU-AOR T2.5, seen)
	{name: '1050 nm, 1 s', wavelength: 1050, duration: 1, edition: 2014, below: 18 * 10 ** 0.7, above: 90}, // 18·C_A = 18·5.0119 = 90.21 vs 90·C_C = 90 (IEC-2007 handout, seen)
	{name: '1050 nm, 1 µs (2014)', wavelength: 1050, duration: 1e-6, edition: 2014, below: 2e-3 * 10 ** 0.7, above: 2e-2}, // 2×10⁻³·C_A = 0.01002 vs 2×10⁻²·C_C (IEC-2014, from memory): the 13 µs row is 2× higher
	{name: '1050 nm, 1 µs (2007)', wavelength: 1050, duration: 1e-6, edition: 2007, below: 5e-3 * 10 ** 0.7, above: 5e-2}, // IEC-2007 handout (seen): 0.02506 vs 0.05 J/m²
	{name: '1150 nm, 100 s', wavelength: 1150, duration: 100, edition: 2014, below: 5000, above: 5000}, // C_C(1150) = 1 (EU-AOR T2.5, seen)
	{name: '1200 nm, 100 s (2007)', wavelength: 1200, duration: 100, edition: 2007, below: 5000 * 10 ** 0.9, above: 40000}, // C_C: 10^0.9 = 7.943 below, 8 above (EU-AOR T2.5, seen)
	{name: '1400 nm, 1 ns (2007)', wavelength: 1400, duration: 1e-9, edition: 2007, below: 2.7e5 * 10 ** -6.75 * 8, above: 1e3}, // IEC-2007 handout (seen): corneal 10³ J/m² vs retinal 5×10⁻²·C_C = 0.4 J/m², itself on the 1 ns breakpoint with 2.7×10⁵·C_C·t^0.75 = 0.38411 J/m²
	{name: '1400 nm, 100 s (2007)', wavelength: 1400, duration: 100, edition: 2007, below: 40000, above: 1e5}, // 10·5·8 = 400 W/m² vs 1000 W/m² (from memory, high)
	{name: '1500 nm, 100 µs', wavelength: 1500, duration: 1e-4, edition: 2014, below: 1e3, above: 1e4}, // IEC-2007 handout (seen)
	{name: '1800 nm, 100 µs', wavelength: 1800, duration: 1e-4, edition: 2014, below: 1e4, above: 1e3}, // IEC-2007 handout (seen)
	{name: '2600 nm, 10 ns', wavelength: 2600, duration: 1e-8, edition: 2014, below: 1e3, above: 100}, // IEC-2007 handout (seen)
	{name: '1 mm (end of the tables)', wavelength: 1e6, duration: 1, edition: 2014, below: 5600, above: 5600}, // IEC-2007 handout (seen): 5600·t^0.25
	// Duration breakpoints
	{name: '10⁻¹³ s at 532 nm (start)', wavelength: 532, duration: 1e-13, edition: 2007, below: 1.5e-4, above: 1.5e-4}, // IEC-2007 handout (seen)
	{name: '10⁻¹¹ s at 532 nm (2007)', wavelength: 532, duration: 1e-11, edition: 2007, below: 1.5e-4, above: 2.7e4 * 10 ** -8.25}, // IEC-2007 handout (seen): 1.5×10⁻⁴ vs 1.5183×10⁻⁴
	{name: '10⁻¹¹ s at 532 nm (2014)', wavelength: 532, duration: 1e-11, edition: 2014, below: 1.5e-4, above: 2e-3}, // IEC-2014 (from memory, medium)
	{name: '1 ns at 532 nm (2007)', wavelength: 532, duration: 1e-9, edition: 2007, below: 2.7e4 * 10 ** -6.75, above: 5e-3}, // IEC-2007 handout (seen): 4.8014×10⁻³ vs 5×10⁻³
	{name: '1 ns at 1064 nm (2007)', wavelength: 1064, duration: 1e-9, edition: 2007, below: 2.7e5 * 10 ** -6.75, above: 5e-2}, // IEC-2007 handout (seen): 0.048014 vs 0.05
	{name: '1 ns at 1550 nm (start of the corneal rows)', wavelength: 1550, duration: 1e-9, edition: 2014, below: 1e4, above: 1e4}, // IEC-2007 handout (seen)
	{name: '100 ns at 10 600 nm', wavelength: 10600, duration: 1e-7, edition: 2014, below: 100, above: 5600 * 10 ** -1.75}, // IEC-2007 handout (seen): 100 vs 99.58 J/m²
	{name: '5 µs at 532 nm (2014)', wavelength: 532, duration: 5e-6, edition: 2014, below: 2e-3, above: 18 * 5e-6 ** 0.75}, // IEC-2014 (from memory, high): 2×10⁻³ vs 1.9033×10⁻³
	{name: '13 µs at 1064 nm (2014)', wavelength: 1064, duration: 1.3e-5, edition: 2014, below: 2e-2, above: 90 * 1.3e-5 ** 0.75}, // IEC-2014 (from memory): 0.02 vs 0.019485
	{name: '18 µs at 532 nm (2007)', wavelength: 532, duration: 1.8e-5, edition: 2007, below: 5e-3, above: 18 * 1.8e-5 ** 0.75}, // IEC-2007 handout (seen): 5×10⁻³ vs 4.9742×10⁻³
	{name: '50 µs at 1064 nm (2007)', wavelength: 1064, duration: 5e-5, edition: 2007, below: 5e-2, above: 90 * 5e-5 ** 0.75}, // IEC-2007 handout (seen): 0.05 vs 0.053514
	{name: '1 ms at 1450 nm', wavelength: 1450, duration: 1e-3, edition: 2014, below: 1e3, above: 5600 * 10 ** -0.75}, // IEC-2007 handout (seen): 10³ vs 995.84
	{name: 'T1 = 1 ms at 310 nm', wavelength: 310, duration: 1e-3, edition: 2014, below: 5600 * 10 ** -0.75, above: 1000}, // IEC-2007 handout (seen): C1(T1) = 995.84 vs C2(310) = 10³ J/m²
	{name: '10 s at 532 nm', wavelength: 532, duration: 10, edition: 2014, below: 18 * 10 ** 0.75, above: 100}, // IEC-2007 handout (seen): 101.22 vs 10 W/m²·10 s
	{name: '10 s at 355 nm', wavelength: 355, duration: 10, edition: 2014, below: 5600 * 10 ** 0.25, above: 1e4}, // IEC-2007 handout (seen): 9958.4 vs 10⁴
	{name: '10 s at 1450 nm', wavelength: 1450, duration: 10, edition: 2014, below: 5600 * 10 ** 0.25, above: 1e4}, // IEC-2007 handout (seen) + from memory (high)
	{name: '100 s at 450 nm', wavelength: 450, duration: 100, edition: 2014, below: 100, above: 100}, // IEC-2007 handout (seen)
	{name: '10³ s at 355 nm (2007)', wavelength: 355, duration: 1e3, edition: 2007, below: 1e4, above: 1e4}, // IEC-2007 handout (seen)
	{name: '3×10⁴ s at 532 nm (end)', wavelength: 532, duration: 3e4, edition: 2014, below: 3e5, above: 3e5}, // 10 W/m² (from memory, high)
];

describe('every exposure-limit edge, typed every way', () => {
	it.each(edges)('$name: one result for every spelling, the lower row on the edge', ({wavelength, duration, edition, below, above}) => {
		const results = wavelengthSpellings(wavelength).flatMap((metres) =>
			// off a breakpoint a duration is used as given (its spellings may differ in the last bit), so only
			// durations on a breakpoint are re-spelled
			(durationEdges.has(duration) ? durationSpellings(duration) : [duration]).map((seconds) => mpe.compute({wavelength: metres, duration: seconds, edition})),
		);
		const first = results[0]!;
		for (const result of results) {
			expect(result['radiant_exposure']).toBe(first['radiant_exposure']);
			expect(result['irradiance']).toBe(first['irradiance']);
		}
		expect(Math.abs(first['radiant_exposure']! / Math.min(below, above) - 1)).toBeLessThan(1e-9);
	});

	it('says on the edge that the lower of two differing rows applies', () => {
		// 1400 nm, 1 ns, 2007: 0.4 J/m² (retinal) against 10³ J/m² (cornea), IEC-2007 handout (seen)
		const notes = mpe.notes!({wavelength: typed('1.4 um', 'length'), duration: typed('1 ns', 'time'), edition: 2007}, {}).join(' ');
		expect(notes).toContain('the lower limit applies');
		expect(notes).toContain('1400 nm');
		expect(notes).toContain('1 ns');
		expect(ocularMpe(1400, 1e-6, 2007).radiantExposure).toBe(0.05 * 8);
		// 400 nm at 1 ms: the rows differ across the wavelength edge only (C1 995.8 J/m² vs 18·t^0.75 0.1012 J/m²,
		// IEC-2007 handout, seen), so only that edge is named
		const at400 = ocularMpe(400, 1e-3).limit;
		expect(at400).toContain('on the table edge at 400 nm the adjoining rows differ');
		expect(at400).not.toContain('1 ms the adjoining');
		// off an edge nothing is said
		expect(ocularMpe(1064, 1e-6, 2007).limit).not.toContain('lower limit applies');
	});
});

// prettier-ignore
const classEdges = [
	{name: '700 nm, 1 mW', wavelength: 700, power: 1e-3, rank: 3}, // Class 2 ≤ 1 mW below 700 nm; above, Class 1 0.39 mW and 3R 5×0.39 = 1.95 mW (IEC, from memory): 3R
	{name: '400 nm, 0.1 mW', wavelength: 400, power: 1e-4, rank: 4}, // UV side: 3R 5×2.618×10⁻⁷ W (by hand) < 0.1 mW ≤ 0.5 W: 3B; visible side Class 2
	{name: '302.5 nm, 2 mW', wavelength: 302.5, power: 2e-3, rank: 5}, // 3B 1.5 mW below (from memory, medium), 5×10⁻⁵·31.6 = 1.58 mW above: Class 4
	{name: '315 nm, 0.3 W', wavelength: 315, power: 0.3, rank: 4}, // 3B min(5×10⁻⁵·10⁴, 0.5) = 0.5 W on both sides (from memory, medium)
	{name: '1400 nm, 9 mW', wavelength: 1400, power: 9e-3, rank: 1}, // Class 1 9.621 mW on both sides (1000 W/m² × 3.5 mm, by hand)
	{name: '1200 nm, 10 mW', wavelength: 1200, power: 10e-3, rank: 3}, // below 1200 nm: 1.95·10^0.9 = 15.5 mW, class 1; above: capped 9.62 mW: 3R
	{name: '1050 nm, 2 mW', wavelength: 1050, power: 2e-3, rank: 3}, // 3.9×10⁻⁴·5.0119 = 1.955 mW and 3.9×10⁻⁴·5 = 1.95 mW: both below 2 mW
	{name: '450 nm, 30 µW', wavelength: 450, power: 30e-6, rank: 1}, // photochemical 3.9×10⁻⁵·C_B(450) = 39 µW on both sides (from memory, medium)
	{name: '0.1 mm, 9.7 mW', wavelength: 1e5, power: 9.7e-3, rank: 3}, // 9.621 mW below (3.5 mm), 10 mW above (11 mm capped at the table's 10 mW): 3R
	{name: '180 nm, 1 nW', wavelength: 180, power: 1e-9, rank: 3}, // 7.854×10⁻¹⁰ W < 1 nW ≤ 3.9×10⁻⁹ W (by hand)
	{name: '1 mm, 20 mW', wavelength: 1e6, power: 20e-3, rank: 3}, // 10 mW < 20 mW ≤ 50 mW
];

describe('every class edge, typed every way', () => {
	it.each(classEdges)('$name is rank $rank for every spelling', ({wavelength, power, rank}) => {
		const ranks = wavelengthSpellings(wavelength).map((metres) => hazardClass.compute({power, wavelength: metres})['class_rank']);
		expect(new Set(ranks)).toEqual(new Set([rank]));
		const limits = wavelengthSpellings(wavelength).map((metres) => hazardClass.compute({power, wavelength: metres})['class1_limit']);
		expect(new Set(limits).size).toBe(1);
	});
});

// prettier-ignore
const apertureEdges = [
	{name: '400 nm', wavelength: 400, duration: 0.25, metres: 1e-3}, // 1 mm (UV) vs 7 mm (IEC/ANSI, from memory, high): the smaller
	{name: '1400 nm at 1 s', wavelength: 1400, duration: 1, metres: 1.5e-3}, // 7 mm vs 1.5·1^(3/8) = 1.5 mm (from memory, medium–high)
	{name: '0.1 mm at 100 s', wavelength: 1e5, duration: 100, metres: 3.5e-3}, // 3.5 mm vs 11 mm (from memory, high)
	{name: '0.35 s at 1550 nm', wavelength: 1550, duration: 0.35, metres: 1e-3}, // 1 mm vs 1.5·0.35^(3/8) = 1.0119 mm (by hand)
	{name: '10 s at 1550 nm', wavelength: 1550, duration: 10, metres: 3.5e-3}, // 1.5·10^(3/8) = 3.557 mm vs 3.5 mm (by hand)
];

describe('every aperture edge, typed every way', () => {
	it.each(apertureEdges)('$name: the smaller aperture, $metres m', ({wavelength, duration, metres}) => {
		for (const metresTyped of wavelengthSpellings(wavelength)) {
			for (const seconds of durationSpellings(duration)) expect(limitingAperture(metresTyped * 1e9, seconds)).toBe(metres);
		}
	});

	it('the same eyewear OD at 1400 nm for every spelling (2007, 1 ns, 1 mW, bare beam)', () => {
		// on the edge: H = 0.4 J/m² (retinal side, IEC-2007 handout, seen) over the smaller aperture
		const ods = wavelengthSpellings(1400).map((metres) => od.compute({power: 1e-3, diameter: 0, wavelength: metres, duration: 1e-9, edition: 2007})['od']);
		expect(new Set(ods).size).toBe(1);
	});
});

describe('the class note on an edge', () => {
	it('says the higher class of the two sides is given at 700 nm, 1 mW (Class 2 below, 3R above; IEC, from memory)', () => {
		const inputs = {power: 1e-3, wavelength: typed('0.7 um', 'length')};
		const notes = hazardClass.notes!(inputs, hazardClass.compute(inputs)).join(' ');
		expect(notes).toContain('Class 3R');
		expect(notes).toContain('higher class of the two sides');
	});

	it('says nothing of edges off an edge (650 nm, 1 mW is Class 2)', () => {
		const inputs = {power: 1e-3, wavelength: 650e-9};
		expect(hazardClass.notes!(inputs, hazardClass.compute(inputs)).join(' ')).not.toContain('band edge');
	});
});
