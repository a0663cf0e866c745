import type {Calculation} from './calculation.js';
import {covered, editionInput, readEdition} from './optical/edition-input.js';
import {ocularMpe} from './optical/ocular-mpe.js';
import {opticalCaution} from './optical/optical-caution.js';
import {opticalRanges} from './optical/optical-ranges.js';

/** Nominal ocular hazard distance of a diverging beam. */
export const nohd: Calculation = {
	name: 'nohd',
	summary: 'Nominal ocular hazard distance: how far from the exit the beam stays above the MPE',
	inputs: {
		power: {dimension: 'power', description: 'Largest output power: at least what the setup can emit at its current limit when coldest', range: opticalRanges.power},
		diameter: {dimension: 'length', description: 'Beam diameter at the exit (1/e points; 0 for a bare diode)', range: opticalRanges.diameter},
		divergence: {dimension: 'angle', description: 'Full-angle divergence at the 1/e points: a datasheet FWHM figure × 1.2011, a 1/e² figure ÷ √2 (Gaussian beam); for an elliptical beam the smaller angle is the cautious one', range: opticalRanges.divergence},
		wavelength: {dimension: 'length', description: 'Wavelength', range: opticalRanges.wavelength},
		duration: {dimension: 'time', description: 'Exposure duration for the MPE (at least 1 ns outside 400–1400 nm)', range: opticalRanges.duration},
		edition: editionInput,
	},
	outputs: {
		nohd: {dimension: 'length', description: 'Nominal ocular hazard distance (0 when the beam is below the MPE at the exit)'},
		mpe_irradiance: {dimension: 'irradiance', description: 'MPE used, as an irradiance'},
	},
	main: 'nohd',
	formula: 'NOHD = (√(4P/(π·E_MPE)) − a)/φ, and 0 when √(4P/(π·E_MPE)) ≤ a',
	basis: [
		'ANSI Z136.1 Appendix B, diverging beam from an aperture (from memory); University of Chicago Office of Radiation Safety, Laser Safety Calculations (formula seen)',
		'Linear beam growth d(R) = a + φ·R is used (not the quadrature form, which gives slightly larger distances)',
	],
	caution: opticalCaution,
	compute: ({power, diameter, divergence, wavelength, duration, edition}) => {
		const limit = covered('nohd', () => ocularMpe(wavelength! * 1e9, duration!, readEdition('nohd', edition)));
		const reach = Math.sqrt((4 * power!) / (Math.PI * limit.irradiance));
		return {nohd: Math.max(0, (reach - diameter!) / divergence!), mpe_irradiance: limit.irradiance};
	},
};
