import {factorA, factorB, factorC, factorC2} from './correction-factors.js';
import {probes, snapToEdge} from './edges.js';

/** CW accessible emission limits (W) of the classes that exist at a wavelength; Class 2 only 400–700 nm. */
export type ContinuousLimits = {class1: number; class2: number | undefined; class3r: number; class3b: number};

/** Wavelength edges (nm) where a limit of the class tables changes its form. */
const wavelengthEdges = [180, 302.5, 315, 400, 450, 600, 700, 1050, 1150, 1200, 1400, 1e5, 1e6];

/** Area (m²) of a circular aperture of the given diameter (m). */
const area = (diameter: number) => (Math.PI * diameter ** 2) / 4;

/** Time base (s) of Class 1 at and below 400 nm (IEC 60825-1 time bases, from memory). */
export const ultravioletTimeBase = 3e4;

/**
 * Class 1 in 1400 nm–1 mm, and the cap above 1200 nm: 1000 W/m² over the 3.5 mm aperture
 * (9.62 mW), not above the 10 mW the class table prints (from memory, medium).
 */
function farInfraredClass1(band: number): number {
	return Math.min(1e-2, 1000 * area(band >= 1e5 ? 11e-3 : 3.5e-3));
}

function limitsAt(wavelength: number, band: number): ContinuousLimits {
	if (band < 400) {
		// Class 1 is the ocular dose limit over the 1 mm aperture at the 3×10⁴ s time base:
		// 30 J/m² (180–302.5 nm), C2 (302.5–315 nm, T1 ≤ 10 s), 10⁴ J/m² (315–400 nm, the dose
		// reading held to 3×10⁴ s, as the exposure limits use).
		const dose = band < 302.5 ? 30 : band < 315 ? factorC2(wavelength) : 1e4;
		const class1 = (dose * area(1e-3)) / ultravioletTimeBase;
		const class3b = band < 302.5 ? 1.5e-3 : band < 315 ? Math.min(5e-5 * factorC2(wavelength), 0.5) : 0.5;
		return {class1, class2: undefined, class3r: 5 * class1, class3b};
	}
	if (band > 1400) {
		const class1 = farInfraredClass1(band);
		return {class1, class2: undefined, class3r: 5 * class1, class3b: 0.5};
	}
	const thermal = 3.9e-4 * factorA(wavelength, band) * factorC(wavelength, 2014, band);
	const photochemical = band < 600 ? 3.9e-5 * factorB(wavelength, band) : Number.POSITIVE_INFINITY;
	const retinal = Math.min(thermal, photochemical);
	const class1 = band >= 1200 ? Math.min(retinal, farInfraredClass1(band)) : retinal;
	const visible = band < 700;
	return {class1, class2: visible ? 1e-3 : undefined, class3r: visible ? 5e-3 : 5 * class1, class3b: 0.5};
}

/** The rank of a power under one set of limits: 1 = Class 1 … 5 = Class 4. */
export function rankOf(power: number, limits: ContinuousLimits): number {
	if (power <= limits.class1) return 1;
	if (limits.class2 !== undefined && power <= limits.class2) return 2;
	if (power <= limits.class3r) return 3;
	if (power <= limits.class3b) return 4;
	return 5;
}

/**
 * The CW limits at a wavelength (nm), 180 nm–1 mm, each for every side of a band edge the
 * wavelength lies on (within a relative 10⁻¹⁰): one entry off an edge, up to three on one.
 */
export function limitsOnEverySide(wavelengthEntered: number): ContinuousLimits[] {
	const band = snapToEdge(wavelengthEntered, wavelengthEdges);
	return probes(band)
		.filter((pick) => pick >= 180 && pick <= 1e6)
		.map((pick) => limitsAt(band.value, pick));
}

/** Whether a class can be indicated at a wavelength (nm): the tables cover 180 nm to 1 mm. */
export function classCovered(wavelengthEntered: number): boolean {
	const wavelength = snapToEdge(wavelengthEntered, wavelengthEdges).value;
	return wavelength >= 180 && wavelength <= 1e6;
}

/**
 * CW accessible emission limits (W) at a wavelength (nm), 180 nm–1 mm. On a band edge the lower
 * limit of the two sides is given for each class, and Class 2 only where both sides have it.
 */
export function continuousLimits(wavelength: number): ContinuousLimits {
	const sides = limitsOnEverySide(wavelength);
	const lowest = (pick: (limits: ContinuousLimits) => number) => Math.min(...sides.map(pick));
	const class2 = sides.every((limits) => limits.class2 !== undefined) ? lowest((limits) => limits.class2!) : undefined;
	return {class1: lowest((limits) => limits.class1), class2, class3r: lowest((limits) => limits.class3r), class3b: lowest((limits) => limits.class3b)};
}
