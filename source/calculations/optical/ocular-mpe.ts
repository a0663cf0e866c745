import {factorA, factorB, factorC, factorC1, factorC2, uvTime} from './correction-factors.js';

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

/**
 * Maximum permissible exposure of the eye to a point source (α ≤ 1.5 mrad, so C_E = 1) at a
 * wavelength (nm) for an exposure duration (s), 180 nm to 1 mm and 10⁻¹³ s (400–1400 nm) or
 * 10⁻⁹ s (elsewhere) to 3×10⁴ s. Between 400 and 600 nm from 10 s on, the thermal and the
 * photochemical limits are both evaluated and the lower applies. A duration exactly on a
 * breakpoint belongs to the longer-duration row, except at T1 for 302.5–315 nm, where the table
 * itself writes t ≤ T1. For 1200–1400 nm the 2014 factor C_C grows to 10⁶; the lens limit that
 * bounds it there is not implemented, so the retinal limit is capped by the 1400–1500 nm
 * corneal row (never a higher limit than just past 1400 nm).
 */
export function ocularMpe(wavelength: number, duration: number, edition: Edition = 2014): OcularMpe {
	if (!(wavelength >= 180 && wavelength <= 1e6)) throw new NotCoveredError('wavelength', 'between 180 nm and 1 mm (outside that prelase has no exposure limit)');
	if (!(duration <= 3e4)) throw new NotCoveredError('duration', 'at most 30 000 s (3×10⁴ s, the longest duration the tables cover)');
	const retinal = wavelength >= 400 && wavelength <= 1400;
	const shortest = retinal ? 1e-13 : 1e-9;
	if (!(duration >= shortest)) throw new NotCoveredError('duration', `at least ${retinal ? '10⁻¹³ s' : '10⁻⁹ s'} at this wavelength (shorter pulses are not covered)`);
	const row = retinal ? cappedRetinalRow(wavelength, duration, edition) : wavelength < 400 ? ultravioletRow(wavelength, duration) : infraredRow(wavelength, duration);
	const radiantExposure = row.radiantExposure ?? row.irradiance! * duration;
	const irradiance = row.irradiance ?? row.radiantExposure! / duration;
	return {radiantExposure, irradiance, limit: row.limit, edition: editionNames[edition]};
}

function cappedRetinalRow(wavelength: number, t: number, edition: Edition): Row {
	const retinal = retinalRow(wavelength, t, edition);
	if (edition !== 2014 || wavelength < 1200) return retinal;
	const corneal = infraredRow(1450, t);
	const exposure = (row: Row) => row.radiantExposure ?? row.irradiance! * t;
	if (exposure(retinal) <= exposure(corneal)) return retinal;
	return {...corneal, limit: `${corneal.limit}, used as a cautious cap: the 2014 retinal limit with C_C = 8 + 10^(0.04(λ − 1250)) is higher here, and the lens limit is not implemented`};
}

function retinalRow(wavelength: number, t: number, edition: Edition): Row {
	const cA = factorA(wavelength);
	const cC = factorC(wavelength, edition);
	const nir = wavelength >= 1050;
	const band = wavelength < 700 ? '400–700 nm' : nir ? '1050–1400 nm' : '700–1050 nm';
	const factors = wavelength < 700 ? '' : nir ? '·C_C' : '·C_A';
	const k = nir ? cC : cA;
	if (t < 1e-11) return {radiantExposure: (nir ? 1.5e-3 : 1.5e-4) * k, limit: `retinal, ${band}, 10⁻¹³–10⁻¹¹ s: H = ${nir ? '1.5×10⁻³' : '1.5×10⁻⁴'}${factors} J/m²`};
	const [plateauEnd, plateau] = edition === 2014 ? [nir ? 1.3e-5 : 5e-6, nir ? 2e-2 : 2e-3] : [nir ? 5e-5 : 1.8e-5, nir ? 5e-2 : 5e-3];
	if (edition === 2007 && t < 1e-9) return {radiantExposure: (nir ? 2.7e5 : 2.7e4) * t ** 0.75 * k, limit: `retinal, ${band}, 10⁻¹¹–10⁻⁹ s: H = ${nir ? '2.7×10⁵' : '2.7×10⁴'}${factors}·t^0.75 J/m²`};
	if (t < plateauEnd) return {radiantExposure: plateau * k, limit: `retinal thermal, ${band}, up to ${formatTime(plateauEnd)}: H = ${plateau}${factors} J/m²`};
	if (t < 10) {
		const coefficient = nir ? 90 : 18;
		return {radiantExposure: coefficient * k * t ** 0.75, limit: `retinal thermal, ${band}, ${formatTime(plateauEnd)}–10 s: H = ${coefficient}${factors}·t^0.75 J/m²`};
	}
	const thermal: Row = {irradiance: 10 * cA * cC, limit: `retinal thermal, ${band}, 10 s–3×10⁴ s: E = 10${wavelength < 700 ? '' : '·C_A·C_C'} W/m²`};
	if (wavelength >= 600) return thermal;
	const cB = factorB(wavelength);
	const photochemical: Row =
		t < 100
			? {radiantExposure: 100 * cB, limit: 'retinal photochemical (blue light), 400–600 nm, 10–100 s: H = 100·C_B J/m²'}
			: {irradiance: cB, limit: 'retinal photochemical (blue light), 400–600 nm, 100 s–3×10⁴ s: E = 1·C_B W/m²'};
	const photochemicalIrradiance = photochemical.irradiance ?? photochemical.radiantExposure! / t;
	return photochemicalIrradiance < thermal.irradiance! ? {...photochemical, limit: `${photochemical.limit} (lower than the thermal limit, so it applies)`} : {...thermal, limit: `${thermal.limit} (lower than the photochemical limit, so it applies)`};
}

function ultravioletRow(wavelength: number, t: number): Row {
	if (wavelength < 302.5) return {radiantExposure: 30, limit: 'ultraviolet photochemical, 180–302.5 nm: H = 30 J/m²'};
	if (wavelength < 315) {
		const crossover = uvTime(wavelength);
		return t <= crossover
			? {radiantExposure: factorC1(t), limit: '302.5–315 nm, t ≤ T1: H = C1 = 5.6×10³·t^0.25 J/m²'}
			: {radiantExposure: factorC2(wavelength), limit: '302.5–315 nm, t > T1: H = C2 = 10^(0.2(λ − 295)) J/m²'};
	}
	if (t < 10) return {radiantExposure: factorC1(t), limit: '315–400 nm, up to 10 s: H = C1 = 5.6×10³·t^0.25 J/m²'};
	if (t < 1e3) return {radiantExposure: 1e4, limit: '315–400 nm, 10 s–10³ s: H = 10⁴ J/m²'};
	return {irradiance: 10, limit: '315–400 nm, 10³ s–3×10⁴ s: E = 10 W/m²'};
}

function infraredRow(wavelength: number, t: number): Row {
	if (t >= 10) return {irradiance: 1000, limit: 'far infrared (cornea), 1400 nm–1 mm, 10 s–3×10⁴ s: E = 1000 W/m²'};
	const rising = (from: string) => ({radiantExposure: 5600 * t ** 0.25, limit: `far infrared (cornea), ${from}: H = 5600·t^0.25 J/m²`});
	if (wavelength < 1500) return t < 1e-3 ? {radiantExposure: 1e3, limit: 'far infrared (cornea), 1400–1500 nm, up to 1 ms: H = 10³ J/m²'} : rising('1400–1500 nm, 1 ms–10 s');
	if (wavelength < 1800) return {radiantExposure: 1e4, limit: 'far infrared (cornea), 1500–1800 nm, up to 10 s: H = 10⁴ J/m²'};
	if (wavelength < 2600) return t < 1e-3 ? {radiantExposure: 1e3, limit: 'far infrared (cornea), 1800–2600 nm, up to 1 ms: H = 10³ J/m²'} : rising('1800–2600 nm, 1 ms–10 s');
	return t < 1e-7 ? {radiantExposure: 100, limit: 'far infrared (cornea), 2600 nm–1 mm, up to 100 ns: H = 100 J/m²'} : rising('2600 nm–1 mm, 100 ns–10 s');
}

function formatTime(seconds: number): string {
	if (seconds >= 1e-3) return `${seconds * 1e3} ms`;
	return `${Number((seconds * 1e6).toPrecision(3))} µs`;
}

/**
 * Diameter (m) of the limiting aperture for the eye at a wavelength (nm) and duration (s):
 * 7 mm for 400–1400 nm, 1 mm in the UV, 1 mm / 1.5·t^(3/8) mm / 3.5 mm from 1400 nm to 0.1 mm,
 * 11 mm from 0.1 mm to 1 mm (IEC 60825-1, ANSI Z136.1 Table 8; from memory).
 */
export function limitingAperture(wavelength: number, duration: number): number {
	if (wavelength >= 400 && wavelength <= 1400) return 7e-3;
	if (wavelength < 400) return 1e-3;
	if (wavelength >= 1e5) return 11e-3;
	if (duration <= 0.35) return 1e-3;
	if (duration < 10) return 1.5e-3 * duration ** (3 / 8);
	return 3.5e-3;
}
