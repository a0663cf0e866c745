import fc from 'fast-check';
import {describe, expect, it} from 'vitest';
import {limitingAperture, NotCoveredError, ocularMpe, type Edition} from '../../source/calculations/optical/ocular-mpe.js';

// Point source (α ≤ 1.5 mrad, C_E = 1). λ in nm, t in s, H in J/m², E in W/m².
// "IEC-2007 handout (seen)" = IEC 60825-1:2007 Table A.1 in SI units as read from a BS EN 60825-1:2007
// handout; "EU-AOR (seen)" = Directive 2006/25/EC Annex II; IEC-2014 / ICNIRP-2013 / ANSI-2014
// values are from memory unless stated. 1 mW/cm² = 10 W/m²; 1 J/cm² = 10⁴ J/m².

/** Relative difference |a/b − 1|. */
const off = (actual: number, expected: number) => Math.abs(actual / expected - 1);
const below = (x: number) => x * (1 - 1e-9);
const above = (x: number) => x * (1 + 1e-9);
const both: Edition[] = [2007, 2014];

type Reference = {
	name: string;
	wavelength: number;
	duration: number;
	editions: Edition[];
	/** Expected radiant exposure (J/m²) or irradiance (W/m²). */
	H?: number;
	E?: number;
	/** Relative tolerance: 1e-9 for values computed exactly from a table formula. */
	tolerance: number;
	/** A fragment of the `limit` text naming the row that must apply. */
	row: string;
};

const exact = 1e-9;

// prettier-ignore
const references: Reference[] = [
	// Visible, 400–700 nm
	{name: '532 nm, 0.25 s: 18·0.25^0.75 = 6.36396 J/m², E = 25.4558 W/m²', wavelength: 532, duration: 0.25, editions: both, E: 25.455844, tolerance: 1e-7, row: 'H = 18·t^0.75'}, // IEC-2007 handout (seen) 18·t^0.75 row; IEC-2014 the same row (from memory, high); FoS-2015 (seen)
	{name: '532 nm, 1 ps: 1.5×10⁻⁴ J/m² (2007)', wavelength: 532, duration: 1e-12, editions: [2007], H: 1.5e-4, tolerance: exact, row: '10⁻¹³–10⁻¹¹ s'}, // IEC-2007 handout (seen): 400–700 nm, 10⁻¹³–10⁻¹¹ s
	{name: '532 nm, 1 ps: 1.5×10⁻⁴ J/m² (2014, from memory, medium)', wavelength: 532, duration: 1e-12, editions: [2014], H: 1.5e-4, tolerance: exact, row: '10⁻¹³–10⁻¹¹ s'}, // IEC-2014 (from memory, medium): "same" as 2007
	{name: '532 nm, 100 ps: 2.7×10⁴·(10⁻¹⁰)^0.75 = 8.5381×10⁻⁴ J/m² (2007)', wavelength: 532, duration: 1e-10, editions: [2007], H: 2.7e4 * 10 ** -7.5, tolerance: exact, row: '2.7×10⁴·t^0.75'}, // IEC-2007 handout (seen): 10⁻¹¹–10⁻⁹ s row
	{name: '532 nm, 100 ns: 5×10⁻³ J/m² (2007)', wavelength: 532, duration: 1e-7, editions: [2007], H: 5e-3, tolerance: exact, row: 'H = 0.005 J/m²'}, // IEC-2007 handout (seen): 10⁻⁹–1.8×10⁻⁵ s
	{name: '532 nm, 100 ns: 2×10⁻³ J/m² (2014, from memory, high)', wavelength: 532, duration: 1e-7, editions: [2014], H: 2e-3, tolerance: exact, row: 'H = 0.002 J/m²'}, // IEC-2014 / ANSI-2014 2.0×10⁻⁷ J/cm² (from memory, high): 10⁻¹¹–5×10⁻⁶ s
	// FoS-2015 worked example 1 (seen): 488 nm at 0.25 s, MPE = 2.55 mW/cm² = 25.5 W/m², published to three figures,
	// so the code's 25.456 W/m² must lie within half a unit of the third figure (±0.05 W/m²)
	{name: '488 nm, 0.25 s: 2.55 mW/cm² as published (±0.005 mW/cm²)', wavelength: 488, duration: 0.25, editions: both, E: 25.5, tolerance: 0.05 / 25.5, row: 'H = 18·t^0.75'}, // FoS-2015 (seen): 2.55 mW/cm²
	// Photochemical (400–600 nm, t ≥ 10 s): the lower of thermal 10 W/m² and photochemical applies
	{name: '450 nm, 1000 s: photochemical E = 1·C_B = 1 W/m²', wavelength: 450, duration: 1000, editions: both, E: 1, tolerance: exact, row: 'E = 1·C_B W/m² (lower than the thermal'}, // IEC-2007 handout (seen): 100 s–3×10⁴ s, E = 1·C_B W/m², C_B = 1 at 450 nm (EU-AOR T2.5, seen)
	{name: '488 nm, 100 s: photochemical E = C_B = 10^(0.02·38) = 10^0.76 = 5.7544 W/m² < thermal 10 W/m²', wavelength: 488, duration: 100, editions: both, E: 10 ** 0.76, tolerance: exact, row: 'E = 1·C_B W/m² (lower than the thermal'}, // IEC-2007 handout (seen) + C_B EU-AOR T2.5 (seen)
	{name: '430 nm, 50 s: photochemical H = 100·C_B = 100 J/m² (E = 2 W/m² < 10 W/m²)', wavelength: 430, duration: 50, editions: both, H: 100, tolerance: exact, row: '10–100 s: H = 100·C_B J/m² (lower than the thermal'}, // IEC-2007 handout (seen): 10–100 s, H = 100·C_B; C_B = 1 below 450 nm (EU-AOR, seen)
	{name: '532 nm, 100 s: thermal E = 10 W/m² < photochemical C_B = 10^1.64 = 43.65 W/m²', wavelength: 532, duration: 100, editions: both, E: 10, tolerance: exact, row: 'E = 10 W/m² (lower than the photochemical'}, // EU-AOR T2.3 / ANSI-2014 1.0 mW/cm² (from memory, high); C_B EU-AOR (seen)
	// Near IR 700–1050 nm
	{name: '808 nm, 100 s: E = 10·C_A = 10·10^(0.002·108) = 10^1.216 = 16.4437 W/m²', wavelength: 808, duration: 100, editions: both, E: 10 * 10 ** 0.216, tolerance: exact, row: 'E = 10·C_A·C_C'}, // 700–1400 nm 10–3×10⁴ s row (from memory, high); C_A EU-AOR T2.5 (seen)
	{name: '905 nm, 100 ns: 5×10⁻³·C_A = 5×10⁻³·10^0.41 = 1.28520×10⁻² J/m² (2007)', wavelength: 905, duration: 1e-7, editions: [2007], H: 5e-3 * 10 ** 0.41, tolerance: exact, row: '700–1050 nm, up to 18 µs'}, // IEC-2007 handout (seen): 700–1050 nm, 10⁻⁹–1.8×10⁻⁵ s
	{name: '905 nm, 100 ns: 2×10⁻³·C_A = 5.14079×10⁻³ J/m² (2014, from memory)', wavelength: 905, duration: 1e-7, editions: [2014], H: 2e-3 * 10 ** 0.41, tolerance: exact, row: '700–1050 nm, up to 5 µs'}, // IEC-2014 (from memory): 10⁻¹¹–5×10⁻⁶ s, 2×10⁻³·C_A
	{name: '808 nm, 1 s: 18·C_A·1^0.75 = 29.599 J/m²', wavelength: 808, duration: 1, editions: both, H: 18 * 10 ** 0.216, tolerance: exact, row: '18·C_A·t^0.75'}, // IEC-2007 handout (seen): 700–1050 nm, H = 18·C_A·t^0.75
	// Near IR 1050–1400 nm
	// The booklet's pulse is 1 ns, exactly on the 2007 table's 10⁻⁹ s breakpoint, where the lower row now applies
	// (see the edge tests); its row, 10⁻⁹–5×10⁻⁵ s, is checked just inside, at 2 ns.
	{name: '1064 nm, 2 ns: 0.05 J/m² = 5×10⁻⁶ J/cm² (2007)', wavelength: 1064, duration: 2e-9, editions: [2007], H: 0.05, tolerance: exact, row: '1050–1400 nm, up to 50 µs'}, // training booklet OD example (seen): 5×10⁻⁶ J/cm²; IEC-2007 handout (seen) 5×10⁻²·C_C
	{name: '1064 nm, 1 ns: 2×10⁻²·C_C = 0.02 J/m² (2014, from memory)', wavelength: 1064, duration: 1e-9, editions: [2014], H: 0.02, tolerance: exact, row: '1050–1400 nm, up to 13 µs'}, // IEC-2014 (from memory): 10⁻¹¹–1.3×10⁻⁵ s, 2×10⁻²·C_C
	{name: '1064 nm, 1 ms: 90·(10⁻³)^0.75 = 90·10^−2.25 = 0.506107 J/m²', wavelength: 1064, duration: 1e-3, editions: both, H: 90 * 10 ** -2.25, tolerance: exact, row: '90·C_C·t^0.75'}, // IEC-2007 handout (seen): 90·C_C·t^0.75; ANSI 9.0·C_C·t^0.75 mJ/cm²
	{name: '1064 nm, 100 s: E = 10·C_A·C_C = 50 W/m² (ANSI 5.0·C_C mW/cm²)', wavelength: 1064, duration: 100, editions: both, E: 50, tolerance: exact, row: '1050–1400 nm, 10 s–3×10⁴ s'}, // ANSI-2014 5.0·C_C×10⁻³ W/cm² (from memory, high)
	{name: '1175 nm, 100 s: 50·C_C = 50·10^(0.018·25) = 50·10^0.45 = 140.92 W/m²', wavelength: 1175, duration: 100, editions: both, E: 50 * 10 ** 0.45, tolerance: exact, row: '1050–1400 nm, 10 s–3×10⁴ s'}, // C_C 1150–1200 EU-AOR T2.5 (seen); row from memory (high)
	{name: '1300 nm, 100 s: 10·5·8 = 400 W/m² (2007, C_C = 8)', wavelength: 1300, duration: 100, editions: [2007], E: 400, tolerance: exact, row: '1050–1400 nm, 10 s–3×10⁴ s'}, // EU-AOR T2.5 (seen): C_C = 8.0 for 1200–1400; row from memory (high)
	// 2014: the retinal limit 10·5·(8 + 10^(0.04·50)) = 5400 W/m² (ICNIRP-2013 C_C, from memory, high) is above the
	// 1400–1500 nm corneal 1000 W/m² (from memory, high), which prelase uses as a cautious cap while the lens limit is not implemented
	{name: '1300 nm, 100 s: capped at the corneal 1000 W/m² (2014)', wavelength: 1300, duration: 100, editions: [2014], E: 1000, tolerance: exact, row: 'cautious cap'}, // cap by the 1400–1500 nm row (from memory, high)
	// Far IR (cornea)
	{name: '1550 nm, 100 s: E = 1000 W/m² (100 mW/cm²)', wavelength: 1550, duration: 100, editions: both, E: 1000, tolerance: exact, row: '10 s–3×10⁴ s: E = 1000 W/m²'}, // IEC 60825-1 far-infrared row, 10 s–3×10⁴ s (from memory, high)
	{name: '1550 nm, 1 ns: H = 10⁴ J/m² (1 J/cm²)', wavelength: 1550, duration: 1e-9, editions: both, H: 1e4, tolerance: exact, row: '1500–1800 nm, up to 10 s'}, // IEC-2007 handout (seen): 1500–1800 nm, 10⁻⁹–10 s
	{name: '1450 nm, 10 µs: H = 10³ J/m²', wavelength: 1450, duration: 1e-5, editions: both, H: 1e3, tolerance: exact, row: '1400–1500 nm, up to 1 ms'}, // IEC-2007 handout (seen)
	{name: '2000 nm, 10 ms: 5600·0.01^0.25 = 1770.88 J/m²', wavelength: 2000, duration: 0.01, editions: both, H: 5600 * 0.1 ** 0.5, tolerance: exact, row: '1800–2600 nm, 1 ms–10 s'}, // IEC-2007 handout (seen)
	{name: '10 600 nm, 10 ns: H = 100 J/m²', wavelength: 10600, duration: 1e-8, editions: both, H: 100, tolerance: exact, row: '2600 nm–1 mm, up to 100 ns'}, // IEC-2007 handout (seen)
	{name: '10 600 nm, 100 µs: 5600·(10⁻⁴)^0.25 = 560 J/m²', wavelength: 10600, duration: 1e-4, editions: both, H: 560, tolerance: exact, row: '2600 nm–1 mm, 100 ns–10 s'}, // IEC-2007 handout (seen)
	// Ultraviolet
	{name: '355 nm, 100 s: H = 10⁴ J/m² (1 J/cm²)', wavelength: 355, duration: 100, editions: [2007], H: 1e4, tolerance: exact, row: '315–400 nm, 10 s–10³ s'}, // IEC-2007 handout (seen)
	{name: '355 nm, 100 s: H = 10⁴ J/m² (2014 reading)', wavelength: 355, duration: 100, editions: [2014], H: 1e4, tolerance: exact, row: '315–400 nm, 10 s–3×10⁴ s: H = 10⁴ J/m²'}, // IEC-2007 handout (seen) 10⁴ J/m²; DGUV Information 203-042 Annex 6 keeps the dose to 3×10⁴ s
	{name: '355 nm, 1 s: C1 = 5.6×10³·1^0.25 = 5600 J/m²', wavelength: 355, duration: 1, editions: both, H: 5600, tolerance: exact, row: '315–400 nm, up to 10 s'}, // IEC-2007 handout (seen)
	{name: '355 nm, 10⁴ s: E = 10 W/m², H = 10⁵ J/m²', wavelength: 355, duration: 1e4, editions: [2007], E: 10, tolerance: exact, row: '315–400 nm, 10³ s–3×10⁴ s'}, // IEC-2007 handout (seen): 1 mW/cm²
	{name: '355 nm, 10⁴ s: H = 10⁴ J/m², E = 1 W/m² (2014 reading, more protective)', wavelength: 355, duration: 1e4, editions: [2014], E: 1, tolerance: exact, row: 'DGUV Information 203-042'}, // DGUV Information 203-042 Annex 6 (Directive 2006/25/EC): 10⁴ J/m² up to 3×10⁴ s; 10⁴ J/m² / 10⁴ s = 1 W/m² (hand arithmetic)
	{name: '250 nm, 1 s: H = 30 J/m²', wavelength: 250, duration: 1, editions: both, H: 30, tolerance: exact, row: '180–302.5 nm'}, // IEC-2007 handout (seen): 3×10⁻³ J/cm²
	{name: '250 nm, 3×10⁴ s: H = 30 J/m²', wavelength: 250, duration: 3e4, editions: both, H: 30, tolerance: exact, row: '180–302.5 nm'}, // IEC-2007 handout (seen)
	// 302.5–315 nm: T1 = 10^(0.8(λ−295))×10⁻¹⁵ s; at 310 nm T1 = 10^12×10⁻¹⁵ = 1 ms, C2 = 10^(0.2·15) = 1000 J/m²
	{name: '310 nm, 100 µs (t ≤ T1 = 1 ms): C1 = 5.6×10³·(10⁻⁴)^0.25 = 560 J/m²', wavelength: 310, duration: 1e-4, editions: both, H: 560, tolerance: exact, row: 't ≤ T1'}, // IEC-2007 handout (seen): C1 for t ≤ T1
	{name: '310 nm, 1 s (t > T1 = 1 ms): C2 = 1000 J/m²', wavelength: 310, duration: 1, editions: both, H: 1000, tolerance: exact, row: 't > T1'}, // IEC-2007 handout (seen): C2 for t > T1
	{name: '305 nm, 10⁴ s: C2 = 10^(0.2·10) = 100 J/m²', wavelength: 305, duration: 1e4, editions: both, H: 100, tolerance: exact, row: 't > T1'}, // IEC-2007 handout (seen): 10–3×10⁴ s, C2
];

const cases = references.flatMap((reference) => reference.editions.map((edition) => ({...reference, edition})));

describe('ocular MPE against the published tables', () => {
	it.each(cases)('$name [edition $edition]', ({wavelength, duration, edition, H, E, tolerance, row}) => {
		const result = ocularMpe(wavelength, duration, edition);
		if (H !== undefined) expect(off(result.radiantExposure, H)).toBeLessThan(tolerance);
		if (E !== undefined) expect(off(result.irradiance, E)).toBeLessThan(tolerance);
		expect(result.limit).toContain(row);
		expect(result.edition).toContain(edition === 2014 ? '60825-1:2014' : '60825-1:2007');
	});

	it('gives the training booklet its OD 6.4 for 1064 nm, H₀ = 12.5 J/cm² in the 10⁻⁹–5×10⁻⁵ s row (2007)', () => {
		// training booklet ch. 1 (seen): OD = log₁₀(12.5 / 5×10⁻⁶) = 6.3979 → quoted 6.4. Its 1 ns sits on the
		// breakpoint, where the lower 10⁻¹¹–10⁻⁹ s row now applies; the row itself is taken at 2 ns.
		const mpeJoulesPerSquareCentimetre = ocularMpe(1064, 2e-9, 2007).radiantExposure * 1e-4;
		expect(Math.log10(12.5 / mpeJoulesPerSquareCentimetre)).toBeCloseTo(6.3979, 4);
	});

	it('gives FoS-2015 its OD 3.2 for 488 nm at 0.25 s and 3.8 W/cm²', () => {
		// FoS-2015 (seen): OD = log₁₀(3800 mW/cm² / 2.55 mW/cm²) = 3.1732 → 3.2; the code's 2.5456 mW/cm² gives 3.1740
		const mpeMilliwattsPerSquareCentimetre = ocularMpe(488, 0.25).irradiance / 10;
		expect(Math.ceil(Math.log10(3800 / mpeMilliwattsPerSquareCentimetre) * 10) / 10).toBe(3.2);
	});
});

type Side = {wavelength: number; duration: number; row: string; H: number};
type Boundary = {
	name: string;
	editions: Edition[];
	lower: Side;
	upper: Side;
	/**
	 * Largest |H_upper/H_lower − 1| the table itself has at this edge (its rounding), or null where the
	 * table changes to a different limit with a real step (then only the rows and values are checked).
	 */
	step: number | null;
};

// Expected H on each side is the table formula evaluated at the breakpoint; the 1e-9 relative offset
// moves it by less than 1e-8, so each side is checked to 1e-6.
// prettier-ignore
const boundaries: Boundary[] = [
	// Wavelength edges
	{name: '302.5 nm at 1 s: 30 J/m² → C2 = 10^1.5 = 31.62 J/m² (the table rounds C2(302.5) to 30: 5.4 %)', editions: both, // IEC-2007 handout (seen)
		lower: {wavelength: below(302.5), duration: 1, row: '180–302.5 nm', H: 30}, upper: {wavelength: above(302.5), duration: 1, row: 't > T1', H: 10 ** 1.5}, step: 0.055},
	{name: '315 nm at 1 s: C1 = 5600 J/m² on both sides (T1(315) = 10 s)', editions: both, // IEC-2007 handout (seen)
		lower: {wavelength: below(315), duration: 1, row: '302.5–315 nm, t ≤ T1', H: 5600}, upper: {wavelength: above(315), duration: 1, row: '315–400 nm, up to 10 s', H: 5600}, step: 1e-6},
	{name: '315 nm at 100 s: C2(315) = 10⁴ J/m² = 10⁴ J/m²', editions: [2007], // IEC-2007 handout (seen)
		lower: {wavelength: below(315), duration: 100, row: 't > T1', H: 1e4}, upper: {wavelength: above(315), duration: 100, row: '315–400 nm, 10 s–10³ s', H: 1e4}, step: 1e-6},
	{name: '315 nm at 100 s: C2(315) = 10⁴ J/m² = 10⁴ J/m² (2014 reading)', editions: [2014], // IEC-2007 handout (seen); DGUV Information 203-042 Annex 6
		lower: {wavelength: below(315), duration: 100, row: 't > T1', H: 1e4}, upper: {wavelength: above(315), duration: 100, row: '315–400 nm, 10 s–3×10⁴ s', H: 1e4}, step: 1e-6},
	{name: '315 nm at 10⁴ s: C2 = 10⁴ J/m² → 10 W/m²·10⁴ s = 10⁵ J/m² (the table steps: C2 runs to 3×10⁴ s)', editions: [2007], // IEC-2007 handout (seen)
		lower: {wavelength: below(315), duration: 1e4, row: 't > T1', H: 1e4}, upper: {wavelength: above(315), duration: 1e4, row: '315–400 nm, 10³ s–3×10⁴ s', H: 1e5}, step: null},
	{name: '315 nm at 10⁴ s: C2 = 10⁴ J/m² on both sides (2014 reading keeps the dose to 3×10⁴ s)', editions: [2014], // IEC-2007 handout (seen) C2; DGUV Information 203-042 Annex 6
		lower: {wavelength: below(315), duration: 1e4, row: 't > T1', H: 1e4}, upper: {wavelength: above(315), duration: 1e4, row: '315–400 nm, 10 s–3×10⁴ s', H: 1e4}, step: 1e-6},
	{name: '400 nm at 1 ms: cornea C1 = 995.8 J/m² → retina 18·t^0.75 = 0.1012 J/m² (different tissue)', editions: both, // IEC-2007 handout (seen)
		lower: {wavelength: below(400), duration: 1e-3, row: '315–400 nm, up to 10 s', H: 5600 * 10 ** -0.75}, upper: {wavelength: above(400), duration: 1e-3, row: 'retinal thermal, 400–700 nm', H: 18 * 10 ** -2.25}, step: null},
	{name: '450 nm at 1000 s: photochemical E = C_B = 1 W/m² on both sides', editions: both, // IEC-2007 handout (seen); C_B EU-AOR (seen)
		lower: {wavelength: below(450), duration: 1000, row: 'photochemical (blue light), 400–600 nm, 100 s', H: 1000}, upper: {wavelength: above(450), duration: 1000, row: 'photochemical (blue light), 400–600 nm, 100 s', H: 1000}, step: 1e-6},
	{name: '600 nm at 1000 s: thermal 10 W/m² both sides; the photochemical limit (C_B(600) = 1000 W/m²) is only weighed below 600 nm', editions: both, // IEC-2007 handout (seen): photochemical 400–600 nm
		lower: {wavelength: below(600), duration: 1000, row: '(lower than the photochemical limit, so it applies)', H: 1e4}, upper: {wavelength: above(600), duration: 1000, row: 'retinal thermal, 400–700 nm, 10 s–3×10⁴ s: E = 10 W/m²', H: 1e4}, step: 1e-6},
	{name: '700 nm at 1 s: 18 J/m² = 18·C_A(700) J/m²', editions: both, // IEC-2007 handout (seen); C_A(700) = 1 (EU-AOR, seen)
		lower: {wavelength: below(700), duration: 1, row: '400–700 nm', H: 18}, upper: {wavelength: above(700), duration: 1, row: '700–1050 nm', H: 18}, step: 1e-6},
	{name: '700 nm at 100 s: 10 W/m² on both sides', editions: both, // from memory (high): E = 10·C_A·C_C
		lower: {wavelength: below(700), duration: 100, row: '400–700 nm, 10 s', H: 1000}, upper: {wavelength: above(700), duration: 100, row: '700–1050 nm, 10 s', H: 1000}, step: 1e-6},
	{name: '1050 nm at 1 s: 18·10^0.7 = 90.21 → 90 J/m² (the table rounds C_A(1050) = 5.012 to 5: 0.24 %)', editions: both, // IEC-2007 handout (seen); C_A EU-AOR (seen)
		lower: {wavelength: below(1050), duration: 1, row: '700–1050 nm', H: 18 * 10 ** 0.7}, upper: {wavelength: above(1050), duration: 1, row: '1050–1400 nm', H: 90}, step: 0.003},
	{name: '1050 nm at 1 µs (2007): 5×10⁻³·C_A = 0.02506 → 5×10⁻² J/m² (the table\'s pulse plateaus differ 2×)', editions: [2007], // IEC-2007 handout (seen)
		lower: {wavelength: below(1050), duration: 1e-6, row: '700–1050 nm, up to 18 µs', H: 5e-3 * 10 ** 0.7}, upper: {wavelength: above(1050), duration: 1e-6, row: '1050–1400 nm, up to 50 µs', H: 5e-2}, step: null},
	{name: '1050 nm at 1 µs (2014, from memory): 2×10⁻³·C_A = 0.01002 → 2×10⁻² J/m²', editions: [2014], // IEC-2014 (from memory)
		lower: {wavelength: below(1050), duration: 1e-6, row: '700–1050 nm, up to 5 µs', H: 2e-3 * 10 ** 0.7}, upper: {wavelength: above(1050), duration: 1e-6, row: '1050–1400 nm, up to 13 µs', H: 2e-2}, step: null},
	{name: '1150 nm at 100 s: C_C = 1 → 10^(0.018·0) = 1: 50 W/m² both sides', editions: both, // C_C EU-AOR T2.5 (seen); row from memory (high)
		lower: {wavelength: below(1150), duration: 100, row: '1050–1400 nm, 10 s', H: 5000}, upper: {wavelength: above(1150), duration: 100, row: '1050–1400 nm, 10 s', H: 5000}, step: 1e-6},
	{name: '1200 nm at 100 s (2007): 50·10^0.9 = 397.2 → 50·8 = 400 W/m² (table rounds 7.94 to 8: 0.72 %)', editions: [2007], // EU-AOR T2.5 (seen)
		lower: {wavelength: below(1200), duration: 100, row: '1050–1400 nm, 10 s', H: 5000 * 10 ** 0.9}, upper: {wavelength: above(1200), duration: 100, row: '1050–1400 nm, 10 s', H: 40000}, step: 0.008},
	{name: '1200 nm at 100 s (2014, from memory): 50·10^0.9 = 397.2 → 50·(8 + 10^−2) = 400.5 W/m² (0.84 %)', editions: [2014], // ICNIRP-2013 C_C (from memory, high)
		lower: {wavelength: below(1200), duration: 100, row: '1050–1400 nm, 10 s', H: 5000 * 10 ** 0.9}, upper: {wavelength: above(1200), duration: 100, row: '1050–1400 nm, 10 s', H: 40050}, step: 0.009},
	{name: '1400 nm at 100 s (2007): retina 10·5·8 = 400 W/m² → cornea 1000 W/m²', editions: [2007], // EU-AOR (seen) C_C; rows from memory (high)
		lower: {wavelength: below(1400), duration: 100, row: 'retinal thermal, 1050–1400 nm', H: 40000}, upper: {wavelength: above(1400), duration: 100, row: 'far infrared (cornea)', H: 1e5}, step: null},
	// 2014: the retinal 10·5·(8 + 10^6) = 5.00004×10⁷ W/m² (ICNIRP-2013 C_C, from memory, high) is capped by the corneal
	// 1000 W/m² until the lens limit is implemented, so the two sides agree
	{name: '1400 nm at 100 s (2014, from memory): retina capped at the cornea 1000 W/m²', editions: [2014], // cautious cap (from memory, high)
		lower: {wavelength: below(1400), duration: 100, row: 'cautious cap', H: 1e5}, upper: {wavelength: above(1400), duration: 100, row: 'far infrared (cornea)', H: 1e5}, step: null},
	{name: '1500 nm at 100 µs: 10³ → 10⁴ J/m² (the table steps 10×)', editions: both, // IEC-2007 handout (seen)
		lower: {wavelength: below(1500), duration: 1e-4, row: '1400–1500 nm, up to 1 ms', H: 1e3}, upper: {wavelength: above(1500), duration: 1e-4, row: '1500–1800 nm', H: 1e4}, step: null},
	{name: '1500 nm at 100 s: 1000 W/m² both sides', editions: both, // from memory (high)
		lower: {wavelength: below(1500), duration: 100, row: '10 s–3×10⁴ s', H: 1e5}, upper: {wavelength: above(1500), duration: 100, row: '10 s–3×10⁴ s', H: 1e5}, step: 1e-6},
	{name: '1800 nm at 1 s: 10⁴ → 5600·1^0.25 = 5600 J/m² (the table steps)', editions: both, // IEC-2007 handout (seen)
		lower: {wavelength: below(1800), duration: 1, row: '1500–1800 nm', H: 1e4}, upper: {wavelength: above(1800), duration: 1, row: '1800–2600 nm, 1 ms–10 s', H: 5600}, step: null},
	{name: '1800 nm at 100 µs: 10⁴ → 10³ J/m²', editions: both, // IEC-2007 handout (seen)
		lower: {wavelength: below(1800), duration: 1e-4, row: '1500–1800 nm', H: 1e4}, upper: {wavelength: above(1800), duration: 1e-4, row: '1800–2600 nm, up to 1 ms', H: 1e3}, step: null},
	{name: '2600 nm at 10 ns: 10³ → 100 J/m² (the table steps 10×)', editions: both, // IEC-2007 handout (seen)
		lower: {wavelength: below(2600), duration: 1e-8, row: '1800–2600 nm, up to 1 ms', H: 1e3}, upper: {wavelength: above(2600), duration: 1e-8, row: '2600 nm–1 mm, up to 100 ns', H: 100}, step: null},
	{name: '2600 nm at 1 s: 5600 J/m² both sides', editions: both, // IEC-2007 handout (seen)
		lower: {wavelength: below(2600), duration: 1, row: '1800–2600 nm, 1 ms–10 s', H: 5600}, upper: {wavelength: above(2600), duration: 1, row: '2600 nm–1 mm, 100 ns–10 s', H: 5600}, step: 1e-6},
	// Duration breakpoints
	{name: '532 nm at 10⁻¹¹ s (2007): 1.5×10⁻⁴ → 2.7×10⁴·10^−8.25 = 1.5183×10⁻⁴ J/m² (1.2 %, the table\'s rounding)', editions: [2007], // IEC-2007 handout (seen)
		lower: {wavelength: 532, duration: below(1e-11), row: '10⁻¹³–10⁻¹¹ s', H: 1.5e-4}, upper: {wavelength: 532, duration: above(1e-11), row: '10⁻¹¹–10⁻⁹ s', H: 2.7e4 * 10 ** -8.25}, step: 0.013},
	{name: '532 nm at 10⁻¹¹ s (2014, from memory, medium): 1.5×10⁻⁴ → 2×10⁻³ J/m² (13× step, see report)', editions: [2014], // IEC-2014 (from memory, medium / high)
		lower: {wavelength: 532, duration: below(1e-11), row: '10⁻¹³–10⁻¹¹ s', H: 1.5e-4}, upper: {wavelength: 532, duration: above(1e-11), row: 'up to 5 µs', H: 2e-3}, step: null},
	{name: '1064 nm at 10⁻¹¹ s (2007, 10⁻¹³–10⁻¹¹ row from memory): 1.5×10⁻³ → 2.7×10⁵·10^−8.25 = 1.5183×10⁻³ J/m² (1.2 %)', editions: [2007], // IEC-2007 Table A.1 1050–1400 nm sub-ns rows (from memory, medium: not in the handout excerpt)
		lower: {wavelength: 1064, duration: below(1e-11), row: '10⁻¹³–10⁻¹¹ s', H: 1.5e-3}, upper: {wavelength: 1064, duration: above(1e-11), row: '10⁻¹¹–10⁻⁹ s', H: 2.7e5 * 10 ** -8.25}, step: 0.013},
	{name: '532 nm at 1 ns (2007): 2.7×10⁴·10^−6.75 = 4.8014×10⁻³ → 5×10⁻³ J/m² (4.1 %, the table\'s rounding)', editions: [2007], // IEC-2007 handout (seen)
		lower: {wavelength: 532, duration: below(1e-9), row: '10⁻¹¹–10⁻⁹ s', H: 2.7e4 * 10 ** -6.75}, upper: {wavelength: 532, duration: above(1e-9), row: 'up to 18 µs', H: 5e-3}, step: 0.042},
	{name: '808 nm at 1 ns (2007): ×C_A on both sides, same 4.1 %', editions: [2007], // IEC-2007 handout (seen)
		lower: {wavelength: 808, duration: below(1e-9), row: '10⁻¹¹–10⁻⁹ s', H: 2.7e4 * 10 ** -6.75 * 10 ** 0.216}, upper: {wavelength: 808, duration: above(1e-9), row: 'up to 18 µs', H: 5e-3 * 10 ** 0.216}, step: 0.042},
	{name: '532 nm at 1 ns (2014): no breakpoint, 2×10⁻³ J/m² both sides', editions: [2014], // IEC-2014 (from memory, high)
		lower: {wavelength: 532, duration: below(1e-9), row: 'up to 5 µs', H: 2e-3}, upper: {wavelength: 532, duration: above(1e-9), row: 'up to 5 µs', H: 2e-3}, step: 1e-12},
	{name: '532 nm at 5 µs (2014): 2×10⁻³ → 18·(5×10⁻⁶)^0.75 = 1.9033×10⁻³ J/m² (4.8 % step the 2014 table has)', editions: [2014], // IEC-2014 (from memory, high)
		lower: {wavelength: 532, duration: below(5e-6), row: 'up to 5 µs', H: 2e-3}, upper: {wavelength: 532, duration: above(5e-6), row: '5 µs–10 s', H: 18 * 5e-6 ** 0.75}, step: 0.05},
	{name: '905 nm at 5 µs (2014): same 4.8 % step, ×C_A', editions: [2014], // IEC-2014 (from memory, high)
		lower: {wavelength: 905, duration: below(5e-6), row: 'up to 5 µs', H: 2e-3 * 10 ** 0.41}, upper: {wavelength: 905, duration: above(5e-6), row: '5 µs–10 s', H: 18 * 5e-6 ** 0.75 * 10 ** 0.41}, step: 0.05},
	{name: '532 nm at 18 µs (2007): 5×10⁻³ → 18·(1.8×10⁻⁵)^0.75 = 4.9742×10⁻³ J/m² (0.52 %)', editions: [2007], // IEC-2007 handout (seen)
		lower: {wavelength: 532, duration: below(1.8e-5), row: 'up to 18 µs', H: 5e-3}, upper: {wavelength: 532, duration: above(1.8e-5), row: '18 µs–10 s', H: 18 * 1.8e-5 ** 0.75}, step: 0.006},
	{name: '1064 nm at 13 µs (2014, from memory): 2×10⁻² → 90·(1.3×10⁻⁵)^0.75 = 1.9485×10⁻² J/m² (2.6 %)', editions: [2014], // IEC-2014 (from memory)
		lower: {wavelength: 1064, duration: below(1.3e-5), row: 'up to 13 µs', H: 2e-2}, upper: {wavelength: 1064, duration: above(1.3e-5), row: '13 µs–10 s', H: 90 * 1.3e-5 ** 0.75}, step: 0.027},
	{name: '1064 nm at 50 µs (2007): 5×10⁻² → 90·(5×10⁻⁵)^0.75 = 5.3514×10⁻² J/m² (7.0 %, the table\'s rounding)', editions: [2007], // IEC-2007 handout (seen)
		lower: {wavelength: 1064, duration: below(5e-5), row: 'up to 50 µs', H: 5e-2}, upper: {wavelength: 1064, duration: above(5e-5), row: '50 µs–10 s', H: 90 * 5e-5 ** 0.75}, step: 0.071},
	{name: '532 nm at 10 s: 18·10^0.75 = 101.22 → 10 W/m²·10 s = 100 J/m² (1.2 %)', editions: both, // IEC-2007 handout (seen); the two rows meet at 10 s with a 1.2 % step
		lower: {wavelength: 532, duration: below(10), row: 'H = 18·t^0.75', H: 18 * 10 ** 0.75}, upper: {wavelength: 532, duration: above(10), row: '10 s–3×10⁴ s', H: 100}, step: 0.013},
	{name: '808 nm at 10 s: 18·C_A·10^0.75 → 10·C_A·10 (1.2 %)', editions: both, // IEC-2007 handout (seen) + from memory (high)
		lower: {wavelength: 808, duration: below(10), row: '18·C_A·t^0.75', H: 18 * 10 ** 0.75 * 10 ** 0.216}, upper: {wavelength: 808, duration: above(10), row: '10 s–3×10⁴ s', H: 100 * 10 ** 0.216}, step: 0.013},
	{name: '1064 nm at 10 s: 90·10^0.75 = 506.1 → 50 W/m²·10 s = 500 J/m² (1.2 %)', editions: both, // IEC-2007 handout (seen) + ANSI (from memory, high)
		lower: {wavelength: 1064, duration: below(10), row: '90·C_C·t^0.75', H: 90 * 10 ** 0.75}, upper: {wavelength: 1064, duration: above(10), row: '10 s–3×10⁴ s', H: 500}, step: 0.013},
	{name: '450 nm at 10 s: thermal 18·10^0.75 = 101.2 → photochemical 100·C_B = 100 J/m² (below thermal 10 W/m²·t just after 10 s)', editions: both, // IEC-2007 handout (seen)
		lower: {wavelength: 450, duration: below(10), row: 'H = 18·t^0.75', H: 18 * 10 ** 0.75}, upper: {wavelength: 450, duration: above(10), row: '10–100 s: H = 100·C_B J/m² (lower than the thermal', H: 100}, step: 0.013},
	{name: '355 nm at 10 s: C1 = 5600·10^0.25 = 9958.4 → 10⁴ J/m² (0.42 %)', editions: both, // IEC-2007 handout (seen)
		lower: {wavelength: 355, duration: below(10), row: 'up to 10 s', H: 5600 * 10 ** 0.25}, upper: {wavelength: 355, duration: above(10), row: '10 s–', H: 1e4}, step: 0.005},
	{name: '1450 nm at 10 s: 5600·10^0.25 = 9958.4 → 1000 W/m²·10 s = 10⁴ J/m² (0.42 %)', editions: both, // IEC-2007 handout (seen) + from memory (high)
		lower: {wavelength: 1450, duration: below(10), row: '1 ms–10 s', H: 5600 * 10 ** 0.25}, upper: {wavelength: 1450, duration: above(10), row: '10 s–3×10⁴ s', H: 1e4}, step: 0.005},
	{name: '1550 nm at 10 s: 10⁴ J/m² → 1000 W/m²·10 s (continuous)', editions: both, // IEC-2007 handout (seen) + from memory (high)
		lower: {wavelength: 1550, duration: below(10), row: '1500–1800 nm, up to 10 s', H: 1e4}, upper: {wavelength: 1550, duration: above(10), row: '10 s–3×10⁴ s', H: 1e4}, step: 1e-6},
	{name: '10 600 nm at 10 s: 9958.4 → 10⁴ J/m² (0.42 %)', editions: both, // IEC-2007 handout (seen) + from memory (high)
		lower: {wavelength: 10600, duration: below(10), row: '100 ns–10 s', H: 5600 * 10 ** 0.25}, upper: {wavelength: 10600, duration: above(10), row: '10 s–3×10⁴ s', H: 1e4}, step: 0.005},
	{name: '450 nm at 100 s: H = 100·C_B = 100 J/m² → E = C_B = 1 W/m²·100 s (continuous)', editions: both, // IEC-2007 handout (seen)
		lower: {wavelength: 450, duration: below(100), row: '10–100 s', H: 100}, upper: {wavelength: 450, duration: above(100), row: '100 s–3×10⁴ s', H: 100}, step: 1e-6},
	{name: '488 nm at 100 s: 100·10^0.76 J/m² → 10^0.76 W/m²·100 s (continuous)', editions: both, // IEC-2007 handout (seen)
		lower: {wavelength: 488, duration: below(100), row: '10–100 s', H: 100 * 10 ** 0.76}, upper: {wavelength: 488, duration: above(100), row: '100 s–3×10⁴ s', H: 100 * 10 ** 0.76}, step: 1e-6},
	{name: '480 nm at T1 = 10·10^(0.02·30) = 39.81 s: thermal 10 W/m² gives way to photochemical 100·C_B (continuous)', editions: both, // EU-AOR T2.5 (seen): T1 = 10·10^(0.02(λ−450)) s for 450–500 nm
		lower: {wavelength: 480, duration: below(10 * 10 ** 0.6), row: 'thermal, 400–700 nm, 10 s', H: 100 * 10 ** 0.6}, upper: {wavelength: 480, duration: above(10 * 10 ** 0.6), row: 'photochemical', H: 100 * 10 ** 0.6}, step: 1e-6},
	{name: '355 nm at 10³ s: 10⁴ J/m² → 10 W/m²·10³ s (continuous)', editions: [2007], // IEC-2007 handout (seen)
		lower: {wavelength: 355, duration: below(1e3), row: '10 s–10³ s', H: 1e4}, upper: {wavelength: 355, duration: above(1e3), row: '10³ s–3×10⁴ s', H: 1e4}, step: 1e-6},
	{name: '1450 nm at 1 ms: 10³ → 5600·10^−0.75 = 995.84 J/m² (0.42 %)', editions: both, // IEC-2007 handout (seen)
		lower: {wavelength: 1450, duration: below(1e-3), row: 'up to 1 ms', H: 1e3}, upper: {wavelength: 1450, duration: above(1e-3), row: '1 ms–10 s', H: 5600 * 10 ** -0.75}, step: 0.005},
	{name: '2000 nm at 1 ms: 10³ → 995.84 J/m² (0.42 %)', editions: both, // IEC-2007 handout (seen)
		lower: {wavelength: 2000, duration: below(1e-3), row: 'up to 1 ms', H: 1e3}, upper: {wavelength: 2000, duration: above(1e-3), row: '1 ms–10 s', H: 5600 * 10 ** -0.75}, step: 0.005},
	{name: '10 600 nm at 100 ns: 100 → 5600·10^−1.75 = 99.584 J/m² (0.42 %)', editions: both, // IEC-2007 handout (seen)
		lower: {wavelength: 10600, duration: below(1e-7), row: 'up to 100 ns', H: 100}, upper: {wavelength: 10600, duration: above(1e-7), row: '100 ns–10 s', H: 5600 * 10 ** -1.75}, step: 0.005},
	{name: '310 nm at T1 = 1 ms: C1 = 5600·10^−0.75 = 995.84 → C2 = 1000 J/m² (0.42 %: 5.6×10³·10^−3.75 = 0.99585)', editions: both, // IEC-2007 handout (seen)
		lower: {wavelength: 310, duration: below(1e-3), row: 't ≤ T1', H: 5600 * 10 ** -0.75}, upper: {wavelength: 310, duration: above(1e-3), row: 't > T1', H: 1000}, step: 0.005},
];

const boundaryCases = boundaries.flatMap((boundary) => boundary.editions.map((edition) => ({...boundary, edition})));

describe('ocular MPE on each side of every table edge', () => {
	it('weighs the photochemical limit just below 600 nm and not from 600 nm on (1000 s)', () => {
		// IEC-2007 handout (seen): the photochemical rows cover 400–600 nm only; both sides give thermal 10 W/m²
		expect(ocularMpe(below(600), 1000).limit).toContain('photochemical');
		expect(ocularMpe(600, 1000).limit).not.toContain('photochemical');
		expect(ocularMpe(above(600), 1000).limit).not.toContain('photochemical');
	});

	it.each(boundaryCases)('$name [edition $edition]', ({edition, lower, upper, step}) => {
		const low = ocularMpe(lower.wavelength, lower.duration, edition);
		const high = ocularMpe(upper.wavelength, upper.duration, edition);
		expect(low.limit).toContain(lower.row);
		expect(high.limit).toContain(upper.row);
		expect(off(low.radiantExposure, lower.H)).toBeLessThan(1e-6);
		expect(off(high.radiantExposure, upper.H)).toBeLessThan(1e-6);
		if (step === null) expect(low.limit).not.toBe(high.limit);
		else expect(off(high.radiantExposure, low.radiantExposure)).toBeLessThanOrEqual(step);
	});
});

describe('a duration exactly on a breakpoint takes the lower of the two rows that meet there', () => {
	it('532 nm at exactly 10 s is 10 W/m², not 18·10^0.75/10 = 10.122 W/m²', () => {
		// the rows meet at 10 s: 1.0 mW/cm² (long-duration row) vs 1.0122 mW/cm²
		const result = ocularMpe(532, 10);
		expect(result.irradiance).toBe(10);
		expect(result.limit).toContain('10 s–3×10⁴ s');
	});

	// prettier-ignore
	const onBreakpoint = [
		{wavelength: 532, duration: 1e-11, edition: 2007 as Edition, row: '10⁻¹³–10⁻¹¹ s', H: 1.5e-4}, // IEC-2007 handout (seen): 1.5×10⁻⁴ below, 2.7×10⁴·10^−8.25 = 1.5183×10⁻⁴ above
		{wavelength: 532, duration: 1e-9, edition: 2007 as Edition, row: '10⁻¹¹–10⁻⁹ s', H: 2.7e4 * 10 ** -6.75}, // IEC-2007 handout (seen): 2.7×10⁴·10^−6.75 = 4.8014×10⁻³ below, 5×10⁻³ above
		{wavelength: 532, duration: 1.8e-5, edition: 2007 as Edition, row: '18 µs–10 s', H: 18 * 1.8e-5 ** 0.75}, // IEC-2007 handout (seen)
		{wavelength: 532, duration: 5e-6, edition: 2014 as Edition, row: '5 µs–10 s', H: 18 * 5e-6 ** 0.75}, // IEC-2014 (from memory, high)
		{wavelength: 1064, duration: 5e-5, edition: 2007 as Edition, row: 'up to 50 µs', H: 5e-2}, // IEC-2007 handout (seen): 0.05 below, 90·(5×10⁻⁵)^0.75 = 0.053514 above
		{wavelength: 1064, duration: 1.3e-5, edition: 2014 as Edition, row: '13 µs–10 s', H: 90 * 1.3e-5 ** 0.75}, // IEC-2014 (from memory)
		{wavelength: 450, duration: 100, edition: 2014 as Edition, row: '100 s–3×10⁴ s', H: 100}, // IEC-2007 handout (seen)
		{wavelength: 355, duration: 10, edition: 2014 as Edition, row: 'up to 10 s', H: 5600 * 10 ** 0.25}, // IEC-2007 handout (seen): C1(10 s) = 9958.4 below, 10⁴ above
		{wavelength: 355, duration: 1e3, edition: 2007 as Edition, row: '10³ s–3×10⁴ s', H: 1e4}, // IEC-2007 handout (seen): 10⁴ J/m² on both sides, the table's own row kept
		{wavelength: 1450, duration: 1e-3, edition: 2014 as Edition, row: '1 ms–10 s', H: 5600 * 10 ** -0.75}, // IEC-2007 handout (seen)
		{wavelength: 10600, duration: 1e-7, edition: 2014 as Edition, row: '100 ns–10 s', H: 5600 * 10 ** -1.75}, // IEC-2007 handout (seen)
		{wavelength: 1450, duration: 10, edition: 2014 as Edition, row: '1 ms–10 s', H: 5600 * 10 ** 0.25}, // IEC-2007 handout (seen): 5600·10^0.25 = 9958.4 below; 1000 W/m²·10 s above (from memory, high)
	];
	it.each(onBreakpoint)('$wavelength nm at exactly $duration s [edition $edition] takes the lower row', ({wavelength, duration, edition, row, H}) => {
		const result = ocularMpe(wavelength, duration, edition);
		expect(result.limit).toContain(row);
		expect(off(result.radiantExposure, H)).toBeLessThan(1e-9);
	});

	it('302.5–315 nm at exactly t = T1 uses C1, as the table writes "t ≤ T1"', () => {
		// IEC-2007 handout (seen): C1 for t ≤ T1, C2 for t > T1. The table's own wording overrides the general
		// convention here; at 310 nm T1 = 10^(0.8·15)×10⁻¹⁵ = 10⁻³ s and C1(T1) = 995.84 J/m².
		const t1 = 10 ** (0.8 * (310 - 295)) * 1e-15;
		const result = ocularMpe(310, t1);
		expect(result.limit).toContain('t ≤ T1');
		expect(off(result.radiantExposure, 5600 * 10 ** -0.75)).toBeLessThan(1e-9);
	});
});

/** Where the rounded rows of the table make H fall (factor < 1) or E rise (factor > 1) as t grows. */
type Step = {at: number | ((wavelength: number) => number); factor: number};
type Band = {name: string; from: number; to: number; shortest: number; editions: Edition[]; hFalls: Step[]; eRises: Step[]};

// Step sizes, each from the table formulas at the breakpoint:
const tenSecondsRetinal = 100 / (18 * 10 ** 0.75); // 100 / 101.221 = 0.98793 (also 500/(90·10^0.75) in 1050–1400 nm, and min(100·C_B, 100) ≥ 100 in 400–600 nm)
const tenSecondsCornea = 1e4 / (5600 * 10 ** 0.25); // 10⁴ / 9958.36 = 1.00418 (C1 or 5600·t^0.25 at 10 s vs 10⁴ J/m²)
const millisecondCornea = (5600 * 10 ** -0.75) / 1e3; // 995.84 / 1000 = 0.99584
const uvT1 = 1 / (5600 * 10 ** -3.75); // C2 / C1(T1) = 1 / 0.99585 = 1.00418
const visible2014 = (18 * 5e-6 ** 0.75) / 2e-3; // 1.9033×10⁻³ / 2×10⁻³ = 0.95163
const visible2007 = (18 * 1.8e-5 ** 0.75) / 5e-3; // 4.9742×10⁻³ / 5×10⁻³ = 0.99485
const nir2014 = (90 * 1.3e-5 ** 0.75) / 2e-2; // 1.9485×10⁻² / 2×10⁻² = 0.97425
const nir2007 = (90 * 5e-5 ** 0.75) / 5e-2; // 5.3514×10⁻² / 5×10⁻² = 1.07029
const nanosecond2007 = 5e-3 / (2.7e4 * 1e-9 ** 0.75); // 5×10⁻³ / 4.8014×10⁻³ = 1.04137 (same ×10 in 1050–1400 nm)
const picosecond2007 = (2.7e4 * 1e-11 ** 0.75) / 1.5e-4; // 1.5183×10⁻⁴ / 1.5×10⁻⁴ = 1.01221
const picosecond2014 = 2e-3 / 1.5e-4; // 13.33 (2014 rows from memory)

// Retinal bands are sampled from 10⁻¹³ s (their shortest covered duration), the others from 10⁻⁹ s.
// prettier-ignore
const bands: Band[] = [
	{name: '180–302.5 nm', from: 180, to: 302.4, shortest: 1e-9, editions: both, hFalls: [], eRises: []},
	{name: '302.5–315 nm', from: 302.6, to: 314.9, shortest: 1e-9, editions: both, hFalls: [], eRises: [{at: (wavelength) => 10 ** (0.8 * (wavelength - 295)) * 1e-15, factor: uvT1}]},
	{name: '315–400 nm', from: 315.1, to: 399.9, shortest: 1e-9, editions: both, hFalls: [], eRises: [{at: 10, factor: tenSecondsCornea}]},
	{name: '400–700 nm (2014)', from: 400.1, to: 699.9, shortest: 1e-13, editions: [2014], hFalls: [{at: 5e-6, factor: visible2014}, {at: 10, factor: tenSecondsRetinal}], eRises: [{at: 1e-11, factor: picosecond2014}]},
	{name: '400–700 nm (2007)', from: 400.1, to: 699.9, shortest: 1e-13, editions: [2007], hFalls: [{at: 1.8e-5, factor: visible2007}, {at: 10, factor: tenSecondsRetinal}], eRises: [{at: 1e-11, factor: picosecond2007}, {at: 1e-9, factor: nanosecond2007}]},
	{name: '700–1050 nm (2014)', from: 700.1, to: 1049.9, shortest: 1e-13, editions: [2014], hFalls: [{at: 5e-6, factor: visible2014}, {at: 10, factor: tenSecondsRetinal}], eRises: [{at: 1e-11, factor: picosecond2014}]},
	{name: '700–1050 nm (2007)', from: 700.1, to: 1049.9, shortest: 1e-13, editions: [2007], hFalls: [{at: 1.8e-5, factor: visible2007}, {at: 10, factor: tenSecondsRetinal}], eRises: [{at: 1e-11, factor: picosecond2007}, {at: 1e-9, factor: nanosecond2007}]},
	{name: '1050–1400 nm (2014)', from: 1050.1, to: 1399.9, shortest: 1e-13, editions: [2014], hFalls: [{at: 1.3e-5, factor: nir2014}, {at: 10, factor: tenSecondsRetinal}], eRises: [{at: 1e-11, factor: picosecond2014}]},
	{name: '1050–1400 nm (2007)', from: 1050.1, to: 1399.9, shortest: 1e-13, editions: [2007], hFalls: [{at: 10, factor: tenSecondsRetinal}], eRises: [{at: 1e-11, factor: picosecond2007}, {at: 1e-9, factor: nanosecond2007}, {at: 5e-5, factor: nir2007}]},
	{name: '1400–1500 nm', from: 1400.1, to: 1499.9, shortest: 1e-9, editions: both, hFalls: [{at: 1e-3, factor: millisecondCornea}], eRises: [{at: 10, factor: tenSecondsCornea}]},
	{name: '1500–1800 nm', from: 1500.1, to: 1799.9, shortest: 1e-9, editions: both, hFalls: [], eRises: []},
	{name: '1800–2600 nm', from: 1800.1, to: 2599.9, shortest: 1e-9, editions: both, hFalls: [{at: 1e-3, factor: millisecondCornea}], eRises: [{at: 10, factor: tenSecondsCornea}]},
	{name: '2600 nm–1 mm', from: 2600.1, to: 1e6, shortest: 1e-9, editions: both, hFalls: [{at: 1e-7, factor: millisecondCornea}], eRises: [{at: 10, factor: tenSecondsCornea}]},
];

const bandCases = bands.flatMap((band) => band.editions.map((edition) => ({...band, edition})));

/** Product of the factors of the steps lying in [t1, t2]. */
function allowance(steps: Step[], wavelength: number, t1: number, t2: number): number {
	let product = 1;
	for (const step of steps) {
		const at = typeof step.at === 'number' ? step.at : step.at(wavelength);
		if (at >= t1 && at <= t2) product *= step.factor;
	}
	return product;
}

describe('ocular MPE properties', () => {
	it('checks its own step sizes against the hand values', () => {
		expect(tenSecondsRetinal).toBeCloseTo(0.98793, 5);
		expect(tenSecondsCornea).toBeCloseTo(1.00418, 5);
		expect(millisecondCornea).toBeCloseTo(0.99584, 5);
		expect(uvT1).toBeCloseTo(1.00418, 5);
		expect(visible2014).toBeCloseTo(0.95163, 5);
		expect(visible2007).toBeCloseTo(0.99485, 5);
		expect(nir2014).toBeCloseTo(0.97425, 5);
		expect(nir2007).toBeCloseTo(1.07029, 5);
		expect(nanosecond2007).toBeCloseTo(1.04137, 5);
		expect(picosecond2007).toBeCloseTo(1.01221, 5);
	});

	it.each(bandCases)(
		'$name [edition $edition]: H never falls and E never rises with duration, except at the listed steps; E·t = H',
		({from, to, shortest, edition, hFalls, eRises}) => {
			const logShortest = Math.log10(shortest);
			const logLongest = Math.log10(3e4);
			fc.assert(
				fc.property(
					fc.double({min: from, max: to, noNaN: true}),
					fc.double({min: logShortest, max: logLongest, noNaN: true}),
					fc.double({min: logShortest, max: logLongest, noNaN: true}),
					(wavelength, a, b) => {
						// 10 ** log10(3e4) can come out a hair above 3e4, which the tables refuse: clamp both ends.
						const t1 = Math.min(3e4, 10 ** Math.min(a, b));
						const t2 = Math.min(3e4, 10 ** Math.max(a, b));
						const first = ocularMpe(wavelength, t1, edition);
						const second = ocularMpe(wavelength, t2, edition);
						for (const result of [first, second]) {
							if (!(Number.isFinite(result.radiantExposure) && result.radiantExposure > 0)) return false;
							if (!(Number.isFinite(result.irradiance) && result.irradiance > 0)) return false;
						}
						if (off(first.irradiance * t1, first.radiantExposure) > 1e-12) return false;
						if (off(second.irradiance * t2, second.radiantExposure) > 1e-12) return false;
						const hFloor = first.radiantExposure * allowance(hFalls, wavelength, t1, t2) * (1 - 1e-12);
						const eCeiling = first.irradiance * allowance(eRises, wavelength, t1, t2) * (1 + 1e-12);
						return second.radiantExposure >= hFloor && second.irradiance <= eCeiling;
					},
				),
				{numRuns: 500},
			);
		},
	);

	it('steps at the listed breakpoints really are steps (the exceptions are not idle)', () => {
		// Each listed exception is where the property above would fail without it.
		expect(ocularMpe(532, above(5e-6), 2014).radiantExposure).toBeLessThan(ocularMpe(532, below(5e-6), 2014).radiantExposure);
		expect(ocularMpe(532, above(1.8e-5), 2007).radiantExposure).toBeLessThan(ocularMpe(532, below(1.8e-5), 2007).radiantExposure);
		expect(ocularMpe(1064, above(1.3e-5), 2014).radiantExposure).toBeLessThan(ocularMpe(1064, below(1.3e-5), 2014).radiantExposure);
		expect(ocularMpe(532, above(10)).radiantExposure).toBeLessThan(ocularMpe(532, below(10)).radiantExposure);
		expect(ocularMpe(1450, above(1e-3)).radiantExposure).toBeLessThan(ocularMpe(1450, below(1e-3)).radiantExposure);
		expect(ocularMpe(10600, above(1e-7)).radiantExposure).toBeLessThan(ocularMpe(10600, below(1e-7)).radiantExposure);
		expect(ocularMpe(355, above(10)).irradiance).toBeGreaterThan(ocularMpe(355, below(10)).irradiance);
		expect(ocularMpe(1064, above(5e-5), 2007).irradiance).toBeGreaterThan(ocularMpe(1064, below(5e-5), 2007).irradiance);
		expect(ocularMpe(532, above(1e-9), 2007).irradiance).toBeGreaterThan(ocularMpe(532, below(1e-9), 2007).irradiance);
		expect(ocularMpe(310, above(1e-3)).irradiance).toBeGreaterThan(ocularMpe(310, below(1e-3)).irradiance);
	});
});

describe('ocular MPE refusals', () => {
	// prettier-ignore
	const refusals = [
		{what: '179 nm', wavelength: 179, duration: 1, key: 'wavelength'}, // tables start at 180 nm (IEC-2007 handout, seen)
		{what: '1.1 mm', wavelength: 1.1e6, duration: 1, key: 'wavelength'}, // tables end at 1 mm = 10⁶ nm (IEC-2007 handout, seen)
		{what: '4×10⁴ s', wavelength: 532, duration: 4e4, key: 'duration'}, // tables end at 3×10⁴ s (IEC-2007 handout, seen)
		{what: '10⁻¹⁴ s at 532 nm', wavelength: 532, duration: 1e-14, key: 'duration'}, // retinal rows start at 10⁻¹³ s (IEC-2007 handout, seen)
		{what: '10⁻¹⁰ s at 250 nm', wavelength: 250, duration: 1e-10, key: 'duration'}, // UV rows start at 10⁻⁹ s (IEC-2007 handout, seen)
		{what: '10⁻¹⁰ s at 1550 nm', wavelength: 1550, duration: 1e-10, key: 'duration'}, // far-IR rows start at 10⁻⁹ s (IEC-2007 handout, seen)
		{what: 'NaN nm', wavelength: Number.NaN, duration: 1, key: 'wavelength'},
		{what: 'a negative duration', wavelength: 532, duration: -1, key: 'duration'},
	] as const;
	it.each(refusals)('refuses $what with key $key', ({wavelength, duration, key}) => {
		for (const edition of both) {
			let caught: unknown;
			try {
				ocularMpe(wavelength, duration, edition);
			} catch (error) {
				caught = error;
			}
			expect(caught).toBeInstanceOf(NotCoveredError);
			expect((caught as NotCoveredError).key).toBe(key);
		}
	});

	it('accepts the covered extremes: 180 nm and 1 mm at 10⁻⁹ s and 3×10⁴ s, 532 nm at 10⁻¹³ s', () => {
		expect(ocularMpe(180, 1e-9).radiantExposure).toBe(30); // IEC-2007 handout (seen)
		expect(ocularMpe(1e6, 3e4).irradiance).toBe(1000); // from memory (high)
		expect(ocularMpe(532, 1e-13, 2007).radiantExposure).toBe(1.5e-4); // IEC-2007 handout (seen)
		expect(ocularMpe(1399.9, 1e-13, 2007).limit).toContain('retinal'); // below 1400 nm the retinal rows cover 10⁻¹³ s
		// exactly on 1400 nm both sides count, and the corneal rows start at 10⁻⁹ s (IEC-2007 handout, seen): refused
		expect(() => ocularMpe(1400, 1e-13, 2007)).toThrow(NotCoveredError);
	});
});

describe('limiting aperture', () => {
	// prettier-ignore
	const apertures = [
		{wavelength: 400.1, duration: 0.25, metres: 7e-3}, // IEC/ANSI 7 mm for 400–1400 nm (from memory, high)
		{wavelength: 400, duration: 0.25, metres: 1e-3}, // on the 400 nm edge the smaller of 1 mm (UV) and 7 mm: more exposure per area, the safer side
		{wavelength: 532, duration: 100, metres: 7e-3}, // same
		{wavelength: 1399.9, duration: 1, metres: 7e-3}, // same
		{wavelength: 1400, duration: 1, metres: 1.5e-3}, // on the 1400 nm edge the smaller of 7 mm and 1.5·1^(3/8) = 1.5 mm (far IR, from memory)
		{wavelength: 180, duration: 1, metres: 1e-3}, // 1 mm for 180–400 nm (from memory, high)
		{wavelength: 355, duration: 3e4, metres: 1e-3}, // same
		{wavelength: 1550, duration: 1e-9, metres: 1e-3}, // far IR: 1 mm for t ≤ 0.35 s (IEC, from memory, medium–high)
		{wavelength: 1550, duration: 0.35, metres: 1e-3}, // same, at the 0.35 s edge
		{wavelength: 1550, duration: 1, metres: 1.5e-3}, // far IR: 1.5·1^(3/8) = 1.5 mm (from memory, medium–high)
		{wavelength: 10600, duration: 5, metres: 1.5e-3 * 5 ** 0.375}, // far IR: 1.5·5^(3/8) = 1.5·1.8285 = 2.7429 mm (from memory, medium–high)
		{wavelength: 1550, duration: 10, metres: 3.5e-3}, // far IR: 3.5 mm for t ≥ 10 s (from memory, medium–high)
		{wavelength: 2000, duration: 3e4, metres: 3.5e-3}, // same
	];
	it.each(apertures)('$wavelength nm, $duration s → $metres m', ({wavelength, duration, metres}) => {
		expect(off(limitingAperture(wavelength, duration), metres)).toBeLessThan(1e-12);
	});

	it('1.5·t^(3/8) mm is 2.7429 mm at 5 s (hand value)', () => {
		expect(limitingAperture(1550, 5) * 1e3).toBeCloseTo(2.7429, 4);
	});

	// 0.1–1 mm: 11 mm (IEC 60825-1 aperture table / ANSI-2014 Table 8, from memory, high)
	it('0.1–1 mm (500 µm, 100 s) uses the 11 mm aperture (from memory, high)', () => {
		expect(limitingAperture(5e5, 100)).toBe(11e-3);
	});
});
