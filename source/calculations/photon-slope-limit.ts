import type {Calculation} from './calculation.js';
import {opticalRanges} from './optical/optical-ranges.js';

/** Planck constant, J·s (CODATA 2018, exact by the 2019 SI definition). */
const planck = 6.62607015e-34;
/** Speed of light in vacuum, m/s (exact). */
const light = 299792458;
/** Elementary charge, C (CODATA 2018, exact by the 2019 SI definition). */
const charge = 1.602176634e-19;

/**
 * The largest slope efficiency one emitter can have at a wavelength: at most one photon per
 * electron, so dP/dI ≤ h·c/(q·λ). A datasheet value above it is a typing mistake (or a stack
 * of emitters in series).
 */
export const photonSlopeLimit: Calculation = {
	name: 'photon-slope-limit',
	summary: 'Largest possible slope efficiency of one emitter at a wavelength (one photon per electron)',
	inputs: {wavelength: {dimension: 'length', description: 'Emission wavelength', range: opticalRanges.wavelength}},
	outputs: {slope_limit: {dimension: 'slope_efficiency', description: 'Photon-energy limit of the slope efficiency, h·c/(q·λ)'}},
	main: 'slope_limit',
	formula: 'η_max = h·c/(q·λ) = 1.23984 µm·W/A ÷ λ (the photon energy in eV, read as W/A)',
	basis: [
		'Photon energy E = h·c/λ and quantum efficiency ≤ 1: Saleh & Teich, Fundamentals of Photonics, laser diode chapter (from memory); Coldren, Corzine & Mašanović, Diode Lasers and Photonic Integrated Circuits, 2nd ed., ch. 2 (from memory)',
		'h, c and q exact by the 2019 SI definition (CODATA 2018)',
	],
	compute: ({wavelength}) => ({slope_limit: (planck * light) / (charge * wavelength!)}),
	notes: () => ['Holds for one emitter (or emitters in parallel); emitters in series, as in a stack, multiply it by their number.'],
};
