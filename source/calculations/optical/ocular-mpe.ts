import {factorA, factorB, factorC, factorC1, factorC2, uvTime} from './correction-factors.js';
import {edgeText, probes, snapToEdge} from './edges.js';

/** Editions whose tables are implemented: IEC 60825-1:2014 (= ICNIRP 2013, ANSI Z136.1-2014) and IEC 60825-1:2007. */
export type Edition = 2007 | 2014;

/** The exposure limit found, with the row of the table it came from. */
export type OcularMpe = {
	/** Radiant exposure limit over the duration, J/m². */
	radiantExposure: number;
	/** Irradiance limit averaged over the duration, W/m². */
	irradiance: number;
	/** Which limit applied, in words, with the table row. */
	limit: string;
	/** The edition used, in words. */
	edition: string;
};

/** A wavelength or duration outside the implemented tables: refused, never guessed. */
export class NotCoveredError extends Error {
	constructor(
		readonly key: 'wavelength' | 'duration',
		readonly allowed: string,
	) {
		super(`${key} must be ${allowed}`);
	}
}

const editionNames: Record<Edition, string> = {
	2014: 'IEC 60825-1:2014 / ICNIRP 2013 / ANSI Z136.1-2014, point source',
	2007: 'IEC 60825-1:2007 / ICNIRP 2000, point source',
};

type Row = {radiantExposure?: number; irradiance?: number; limit: string};

/** Where a row is looked up: the band and duration row are chosen by `pick`, values use the exact λ and t. */
type Pick = {wavelength: number; t: number};

/** Wavelength edges (nm) of the exposure-limit tables, including the ends of the covered range. */
const wavelengthEdges = [180, 302.5, 315, 400, 450, 600, 700, 1050, 1150, 1200, 1400, 1500, 1800, 2600, 1e6];

/** Duration breakpoints (s) at a wavelength (nm), including T1 of the 302.5–315 nm rows. */
function durationEdges(wavelength: number): number[] {
	const edges = [1e-13, 1e-11, 1e-9, 1e-7, 5e-6, 1.3e-5, 1.8e-5, 5e-5, 1e-3, 10, 100, 1e3, 3e4];
	if (wavelength >= 302.5 && wavelength < 315) edges.push(uvTime(wavelength));
	return edges;
}

const isRetinal = (wavelength: number) => wavelength >= 400 && wavelength <= 1400;

/**
 * Maximum permissible exposure of the eye to a point source (α ≤ 1.5 mrad, so C_E = 1) at a
 * wavelength (nm) for an exposure duration (s), 180 nm to 1 mm and 10⁻¹³ s (400–1400 nm) or
 * 10⁻⁹ s (elsewhere) to 3×10⁴ s. Between 400 and 600 nm from 10 s on, the thermal and the
 * photochemical limits are both evaluated and the lower applies. A wavelength or duration within
 * a relative 10⁻¹⁰ of a table edge (band edge, duration breakpoint, T1) is on the edge, whatever
 * its spelling, and on an edge the rows on both sides are evaluated and the lower limit applies
 * (the limit text says so where they differ). For 1200–1400 nm the 2014 factor C_C grows to 10⁶;
 * the lens limit that bounds it there is not implemented, so the retinal limit is capped by the
 * 1400–1500 nm corneal row (never a higher limit than just past 1400 nm).
 */
export function ocularMpe(wavelengthEntered: number, durationEntered: number, edition: Edition = 2014): OcularMpe {
	const band = snapToEdge(wavelengthEntered, wavelengthEdges);
	const wavelength = band.value;
	if (!(wavelength >= 180 && wavelength <= 1e6)) throw new NotCoveredError('wavelength', 'between 180 nm and 1 mm (outside that prelase has no exposure limit)');
	const breakpoint = snapToEdge(durationEntered, durationEdges(wavelength));
	const t = breakpoint.value;
	if (!(t <= 3e4)) throw new NotCoveredError('duration', 'at most 30 000 s (3×10⁴ s, the longest duration the tables cover)');
	const found: Array<{row: Row; radiantExposure: number; pick: Pick}> = [];
	for (const pickWavelength of probes(band)) {
		if (pickWavelength < 180 || pickWavelength > 1e6) continue;
		const shortest = isRetinal(pickWavelength) ? 1e-13 : 1e-9;
		if (!(t >= shortest)) throw new NotCoveredError('duration', `at least ${shortest === 1e-13 ? '10⁻¹³ s' : '10⁻⁹ s'} at this wavelength (shorter pulses are not covered)`);
		for (const pickT of probes(breakpoint)) {
			if (pickT < shortest || pickT > 3e4) continue;
			const pick = {wavelength: pickWavelength, t: pickT};
			const row = rowAt(wavelength, t, edition, pick);
			found.push({row, radiantExposure: row.radiantExposure ?? row.irradiance! * t, pick});
		}
	}
	// The row the value itself falls in stays unless a row on the other side of an edge is lower.
	const differs = (a: number, b: number) => Math.abs(a - b) > 1e-12 * Math.max(a, b);
	const center = found.find(({pick}) => pick.wavelength === wavelength && pick.t === t) ?? found[0]!;
	const lowest = found.reduce((low, next) => (next.radiantExposure < low.radiantExposure && differs(next.radiantExposure, low.radiantExposure) ? next : low), center);
	// Name the edges across which the rows differ: the wavelength edge, the breakpoint, or both.
	const across = (same: (entry: (typeof found)[number]) => boolean) => found.some((entry) => same(entry) && differs(entry.radiantExposure, center.radiantExposure));
	const where = [
		band.edge !== undefined && across(({pick}) => pick.t === t) ? edgeText(band.edge, 'nm') : '',
		breakpoint.edge !== undefined && across(({pick}) => pick.wavelength === wavelength) ? edgeText(breakpoint.edge, 's') : '',
	].filter(Boolean);
	if (where.length === 0 && found.some((entry) => differs(entry.radiantExposure, center.radiantExposure))) where.push(edgeText(band.edge!, 'nm'), edgeText(breakpoint.edge!, 's'));
	const limit = where.length > 0 ? `${lowest.row.limit}; on the table edge at ${where.join(' and ')} the adjoining rows differ, and the lower limit applies` : lowest.row.limit;
	const radiantExposure = lowest.radiantExposure;
	const irradiance = lowest.row.irradiance ?? radiantExposure / t;
	return {radiantExposure, irradiance, limit, edition: editionNames[edition]};
}

function rowAt(wavelength: number, t: number, edition: Edition, pick: Pick): Row {
	if (isRetinal(pick.wavelength)) return cappedRetinalRow(wavelength, t, edition, pick);
	return pick.wavelength < 400 ? ultravioletRow(wavelength, t, edition, pick) : infraredRow(t, pick);
}

function cappedRetinalRow(wavelength: number, t: number, edition: Edition, pick: Pick): Row {
	const retinal = retinalRow(wavelength, t, edition, pick);
	if (edition !== 2014 || pick.wavelength < 1200) return retinal;
	const corneal = infraredRow(t, {wavelength: 1450, t: pick.t});
	const exposure = (row: Row) => row.radiantExposure ?? row.irradiance! * t;
	if (exposure(retinal) <= exposure(corneal)) return retinal;
	return {...corneal, limit: `${corneal.limit}, used as a cautious cap: the 2014 retinal limit with C_C = 8 + 10^(0.04(λ − 1250)) is higher here, and the lens limit is not implemented`};
}

function retinalRow(wavelength: number, t: number, edition: Edition, pick: Pick): Row {
	const cA = factorA(wavelength, pick.wavelength);
	const cC = factorC(wavelength, edition, pick.wavelength);
	const visible = pick.wavelength < 700;
	const nir = pick.wavelength >= 1050;
	const band = visible ? '400–700 nm' : nir ? '1050–1400 nm' : '700–1050 nm';
	const factors = visible ? '' : nir ? '·C_C' : '·C_A';
	const k = nir ? cC : cA;
	if (pick.t < 1e-11) return {radiantExposure: (nir ? 1.5e-3 : 1.5e-4) * k, limit: `retinal, ${band}, 10⁻¹³–10⁻¹¹ s: H = ${nir ? '1.5×10⁻³' : '1.5×10⁻⁴'}${factors} J/m²`};
	const [plateauEnd, plateau] = edition === 2014 ? [nir ? 1.3e-5 : 5e-6, nir ? 2e-2 : 2e-3] : [nir ? 5e-5 : 1.8e-5, nir ? 5e-2 : 5e-3];
	if (edition === 2007 && pick.t < 1e-9) return {radiantExposure: (nir ? 2.7e5 : 2.7e4) * t ** 0.75 * k, limit: `retinal, ${band}, 10⁻¹¹–10⁻⁹ s: H = ${nir ? '2.7×10⁵' : '2.7×10⁴'}${factors}·t^0.75 J/m²`};
	if (pick.t < plateauEnd) return {radiantExposure: plateau * k, limit: `retinal thermal, ${band}, up to ${formatTime(plateauEnd)}: H = ${plateau}${factors} J/m²`};
	if (pick.t < 10) {
		const coefficient = nir ? 90 : 18;
		return {radiantExposure: coefficient * k * t ** 0.75, limit: `retinal thermal, ${band}, ${formatTime(plateauEnd)}–10 s: H = ${coefficient}${factors}·t^0.75 J/m²`};
	}
	const thermal: Row = {irradiance: 10 * cA * cC, limit: `retinal thermal, ${band}, 10 s–3×10⁴ s: E = 10${visible ? '' : '·C_A·C_C'} W/m²`};
	if (pick.wavelength >= 600) return thermal;
	const cB = factorB(wavelength, pick.wavelength);
	const photochemical: Row =
		pick.t < 100
			? {radiantExposure: 100 * cB, limit: 'retinal photochemical (blue light), 400–600 nm, 10–100 s: H = 100·C_B J/m²'}
			: {irradiance: cB, limit: 'retinal photochemical (blue light), 400–600 nm, 100 s–3×10⁴ s: E = 1·C_B W/m²'};
	const photochemicalIrradiance = photochemical.irradiance ?? photochemical.radiantExposure! / t;
	return photochemicalIrradiance < thermal.irradiance! ? {...photochemical, limit: `${photochemical.limit} (lower than the thermal limit, so it applies)`} : {...thermal, limit: `${thermal.limit} (lower than the photochemical limit, so it applies)`};
}

/** Why the 2014 UV-A row keeps the dose limit to 3×10⁴ s; shown in the limit text. */
const ultravioletDoseReading =
	'the dose limit held to 3×10⁴ s, the more protective reading: Directive 2006/25/EC as applied in DGUV Information 203-042 Annex 6 (the simplified 10 W/m² holds only to 10³ s); IEC 60825-1:2007 steps to 10 W/m² after 10³ s';

function ultravioletRow(wavelength: number, t: number, edition: Edition, pick: Pick): Row {
	if (pick.wavelength < 302.5) return {radiantExposure: 30, limit: 'ultraviolet photochemical, 180–302.5 nm: H = 30 J/m²'};
	if (pick.wavelength < 315) {
		const crossover = uvTime(wavelength);
		return pick.t <= crossover
			? {radiantExposure: factorC1(t), limit: '302.5–315 nm, t ≤ T1: H = C1 = 5.6×10³·t^0.25 J/m²'}
			: {radiantExposure: factorC2(wavelength), limit: '302.5–315 nm, t > T1: H = C2 = 10^(0.2(λ − 295)) J/m²'};
	}
	if (pick.t < 10) return {radiantExposure: factorC1(t), limit: '315–400 nm, up to 10 s: H = C1 = 5.6×10³·t^0.25 J/m²'};
	if (edition === 2014) return {radiantExposure: 1e4, limit: `315–400 nm, 10 s–3×10⁴ s: H = 10⁴ J/m² (${ultravioletDoseReading})`};
	if (pick.t < 1e3) return {radiantExposure: 1e4, limit: '315–400 nm, 10 s–10³ s: H = 10⁴ J/m²'};
	return {irradiance: 10, limit: '315–400 nm, 10³ s–3×10⁴ s: E = 10 W/m²'};
}

function infraredRow(t: number, pick: Pick): Row {
	if (pick.t >= 10) return {irradiance: 1000, limit: 'far infrared (cornea), 1400 nm–1 mm, 10 s–3×10⁴ s: E = 1000 W/m²'};
	const rising = (from: string) => ({radiantExposure: 5600 * t ** 0.25, limit: `far infrared (cornea), ${from}: H = 5600·t^0.25 J/m²`});
	const wavelength = pick.wavelength;
	if (wavelength < 1500) return pick.t < 1e-3 ? {radiantExposure: 1e3, limit: 'far infrared (cornea), 1400–1500 nm, up to 1 ms: H = 10³ J/m²'} : rising('1400–1500 nm, 1 ms–10 s');
	if (wavelength < 1800) return {radiantExposure: 1e4, limit: 'far infrared (cornea), 1500–1800 nm, up to 10 s: H = 10⁴ J/m²'};
	if (wavelength < 2600) return pick.t < 1e-3 ? {radiantExposure: 1e3, limit: 'far infrared (cornea), 1800–2600 nm, up to 1 ms: H = 10³ J/m²'} : rising('1800–2600 nm, 1 ms–10 s');
	return pick.t < 1e-7 ? {radiantExposure: 100, limit: 'far infrared (cornea), 2600 nm–1 mm, up to 100 ns: H = 100 J/m²'} : rising('2600 nm–1 mm, 100 ns–10 s');
}

function formatTime(seconds: number): string {
	if (seconds >= 1e-3) return `${seconds * 1e3} ms`;
	return `${Number((seconds * 1e6).toPrecision(3))} µs`;
}

/**
 * Diameter (m) of the limiting aperture for the eye at a wavelength (nm) and duration (s):
 * 7 mm for 400–1400 nm, 1 mm in the UV, 1 mm / 1.5·t^(3/8) mm / 3.5 mm from 1400 nm to 0.1 mm,
 * 11 mm from 0.1 mm to 1 mm (IEC 60825-1, ANSI Z136.1 Table 8; from memory). On a regime edge
 * (400 nm, 1400 nm, 0.1 mm, 0.35 s, 10 s, within a relative 10⁻¹⁰) the smaller aperture of the
 * two sides is used: averaging over less area gives the higher, safer exposure.
 */
export function limitingAperture(wavelengthEntered: number, durationEntered: number): number {
	const band = snapToEdge(wavelengthEntered, [400, 1400, 1e5]);
	const regime = snapToEdge(durationEntered, [0.35, 10]);
	const t = regime.value;
	return Math.min(...probes(band).flatMap((wavelength) => probes(regime).map((pickT) => apertureAt(wavelength, t, pickT))));
}

function apertureAt(wavelength: number, t: number, pickT: number): number {
	if (wavelength >= 400 && wavelength <= 1400) return 7e-3;
	if (wavelength < 400) return 1e-3;
	if (wavelength >= 1e5) return 11e-3;
	if (pickT <= 0.35) return 1e-3;
	if (pickT < 10) return 1.5e-3 * t ** (3 / 8);
	return 3.5e-3;
}
