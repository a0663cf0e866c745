import type {Calculation} from './calculation.js';
import {covered, editionInput, readEdition, refuseRepetition, repetitionInput} from './optical/edition-input.js';
import {ocularMpe} from './optical/ocular-mpe.js';
import {nanometres} from './optical/edges.js';
import {opticalCaution} from './optical/optical-caution.js';
import {opticalRanges} from './optical/optical-ranges.js';

/** Maximum permissible exposure of the eye to a point source. */
export const mpe: Calculation = {
	name: 'mpe',
	summary: 'Maximum permissible exposure of the eye to a point source, by wavelength and exposure duration',
	inputs: {
		wavelength: {dimension: 'length', description: 'Wavelength', range: opticalRanges.wavelength},
		duration: {dimension: 'time', description: 'Exposure duration (pulse duration for a single pulse): 0.25 s for an accidental visible exposure, 10 s otherwise; at least 1 ns outside 400–1400 nm', range: opticalRanges.duration},
		edition: editionInput,
		repetition_rate: repetitionInput,
	},
	outputs: {
		irradiance: {dimension: 'irradiance', description: 'Irradiance limit, averaged over the duration'},
		radiant_exposure: {dimension: 'radiant_exposure', description: 'Radiant exposure limit over the duration'},
	},
	main: 'irradiance',
	formula: 'IEC 60825-1 / ICNIRP table rows for a point source (C_E = 1): H = 18·C_A·t^0.75 J/m², E = 10·C_A·C_C W/m², photochemical 100·C_B J/m² or C_B W/m² (the lower applies), UV and far-IR rows; see the notes for the row used',
	basis: [
		'ICNIRP 2013 guidelines (Health Phys. 105(3)) = IEC 60825-1:2014 Annex A = ANSI Z136.1-2014 Tables 5a/5b (2014 values from memory where they differ from 2007)',
		'IEC 60825-1:2007 Table A.1 and its correction factors (as reproduced in a university MPE handout)',
		'Directive 2006/25/EC Annex II, Tables 2.2–2.6 (correction factors C_A, C_B, C_C, T1)',
		'315–400 nm from 10 s (2014 edition): the dose 10⁴ J/m² is held to 3×10⁴ s (E = 0.33 W/m² at 3×10⁴ s), the more protective of the readings: Directive 2006/25/EC as applied in DGUV Information 203-042 Annex 6, where the simplified 10 W/m² holds only to 10³ s; the 2007 edition steps to 10 W/m² after 10³ s and is kept as printed',
		'Table edges: a wavelength or duration within a relative 10⁻¹⁰ of a band edge, breakpoint or T1 is on it, whatever its spelling; on an edge the rows that meet there are all evaluated and the lower limit applies (common practice for a safety tool: the safe side)',
	],
	caution: opticalCaution,
	compute: ({wavelength, duration, edition, repetition_rate}) => {
		refuseRepetition('mpe', repetition_rate);
		const found = covered('mpe', () => ocularMpe(nanometres(wavelength!), duration!, readEdition('mpe', edition)));
		return {irradiance: found.irradiance, radiant_exposure: found.radiantExposure};
	},
	notes: ({wavelength, duration, edition}) => {
		const found = ocularMpe(nanometres(wavelength!), duration!, readEdition('mpe', edition));
		return [`Limit applied: ${found.limit} (${found.edition}).`];
	},
};
