import type {Calculation} from './calculation.js';
import {covered, editionInput, readEdition, refuseRepetition, repetitionInput} from './optical/edition-input.js';
import {limitingAperture, ocularMpe} from './optical/ocular-mpe.js';
import {opticalCaution} from './optical/optical-caution.js';
import {opticalRanges} from './optical/optical-ranges.js';

/** Optical density protective eyewear needs for a beam. */
export const od: Calculation = {
	name: 'od',
	summary: 'Optical density eyewear needs: log10 of the worst-case exposure over the limiting aperture divided by the MPE',
	inputs: {
		power: {dimension: 'power', description: 'Largest power that can reach the eye: at least what the setup can emit at its current limit when coldest (peak power over the duration for a single pulse)', range: opticalRanges.power},
		diameter: {dimension: 'length', description: 'Narrowest beam diameter where it can reach the eye, at the 1/e points (0, the worst case, when a lens could focus it into the aperture; not the exit diameter of a wide beam)', range: opticalRanges.diameter},
		wavelength: {dimension: 'length', description: 'Wavelength', range: opticalRanges.wavelength},
		duration: {dimension: 'time', description: 'Exposure duration (pulse duration for a single pulse; at least 1 ns outside 400–1400 nm)', range: opticalRanges.duration},
		edition: editionInput,
		repetition_rate: repetitionInput,
	},
	outputs: {
		od: {dimension: 'number', description: 'Required optical density (0 when the exposure is already below the MPE); round up to the next step the eyewear is marked with'},
		exposure: {dimension: 'irradiance', description: 'Worst-case irradiance: the power over the limiting aperture, or over the beam if it is larger'},
		mpe_irradiance: {dimension: 'irradiance', description: 'MPE used, as an irradiance'},
		aperture: {dimension: 'length', description: 'Limiting aperture diameter used'},
	},
	main: 'od',
	formula: 'OD = log10(E₀/E_MPE), E₀ = P / (π·max(d, d_aperture)²/4); d_aperture = 7 mm for 400–1400 nm',
	basis: [
		'Required OD = log10(H₀/MPE) or log10(E₀/MPE): "Appendix X – Sample Calculations" (laser safety, 2015, after AS/NZS 2211.1 and IEC 60825-14), and a photonics course text on eyewear OD',
		'Limiting apertures: 7 mm for 400–1400 nm, 1 mm in the UV, 1 mm to 3.5 mm in the far IR (IEC 60825-1 / ANSI Z136.1, from memory)',
	],
	caution: opticalCaution,
	compute: ({power, diameter, wavelength, duration, edition, repetition_rate}) => {
		refuseRepetition('od', repetition_rate);
		const nanometres = wavelength! * 1e9;
		const limit = covered('od', () => ocularMpe(nanometres, duration!, readEdition('od', edition)));
		const aperture = limitingAperture(nanometres, duration!);
		const width = Math.max(diameter!, aperture);
		const exposure = power! / ((Math.PI * width ** 2) / 4);
		const density = exposure > 0 ? Math.max(0, Math.log10(exposure / limit.irradiance)) : 0;
		return {od: density, exposure, mpe_irradiance: limit.irradiance, aperture};
	},
	notes: (_inputs, outputs) => (outputs['od']! === 0 ? ['The exposure is already at or below the MPE: no optical density is needed for this beam alone.'] : []),
};
