import {CalculationInputError, type Calculation} from './calculation.js';
import {nanometres} from './optical/edges.js';
import {classCovered, continuousLimits, limitsOnEverySide, rankOf} from './optical/emission-limits.js';
import {opticalCaution} from './optical/optical-caution.js';
import {opticalRanges} from './optical/optical-ranges.js';

export {continuousLimits} from './optical/emission-limits.js';

/** Names of the indicative classes by rank, as the output `class_rank` counts them. */
export const classNames = ['', 'Class 1', 'Class 2', 'Class 3R', 'Class 3B', 'Class 4'] as const;

/** An indicative hazard class of a CW beam from its power and wavelength. */
export const hazardClass: Calculation = {
	name: 'hazard-class',
	summary: 'Indicative hazard class of a CW beam from its power and wavelength (180 nm to 1 mm); the manufacturer’s classification is what counts',
	inputs: {
		power: {dimension: 'power', description: 'Largest accessible CW output power', range: opticalRanges.power},
		wavelength: {dimension: 'length', description: 'Wavelength', range: opticalRanges.wavelength},
	},
	outputs: {
		class_rank: {dimension: 'number', description: 'Indicative class: 1 = Class 1, 2 = Class 2, 3 = Class 3R, 4 = Class 3B, 5 = Class 4'},
		class1_limit: {dimension: 'power', description: 'Class 1 accessible emission limit (CW; time base 100 s, 3×10⁴ s at and below 400 nm)'},
		class3r_limit: {dimension: 'power', description: 'Class 3R accessible emission limit'},
		class3b_limit: {dimension: 'power', description: 'Class 3B accessible emission limit'},
	},
	main: 'class_rank',
	formula:
		'Class 1: below 400 nm the ocular dose limit over the 1 mm aperture at 3×10⁴ s (30 J/m², C2, 10⁴ J/m²); 400–1400 nm 3.9×10⁻⁴·C_A·C_C W (and 3.9×10⁻⁵·C_B W below 600 nm; from 1200 nm capped at the far-IR value); 1400 nm–1 mm 1000 W/m² over 3.5 mm, at most 10 mW. Class 2: 1 mW (400–700 nm only). Class 3R: 5 mW visible, else 5× Class 1. Class 3B: 0.5 W (1.5 mW for 180–302.5 nm, 5×10⁻⁵·C2 W for 302.5–315 nm). Above: Class 4. On a band edge the higher class of the two sides',
	basis: [
		'IEC 60825-1:2007 Table 4 / IEC 60825-1:2014 Table 3, CW accessible emission limits for a point source as commonly reproduced (from memory: high for the 400–1400 nm thermal rows, medium for the photochemical Class 1 row, the 3R factor of 5, the 10 mW Class 1 in 1400 nm–1 mm and the UV Class 3B rows)',
		'Below 400 nm Class 1 is the 2014 exposure limit (dose held to 3×10⁴ s, the more protective reading of Directive 2006/25/EC as applied in DGUV Information 203-042 Annex 6) over the 1 mm aperture, time base 3×10⁴ s (IEC 60825-1 time bases, from memory); lower than the printed table where the table steps to 10 W/m²',
		'Above 1200 nm the 2014 factor C_C is not bounded by the lens limit here, so Class 1 is capped at the 1400 nm value, as the exposure limits are',
		'On a band edge (within a relative 10⁻¹⁰, whatever the spelling) both sides are evaluated: the higher class and the lower limits apply',
		'Not modelled: Class 1M, 2M and 1C, the measurement conditions (apertures and distances), pulsed criteria, extended sources',
	],
	caution: `${opticalCaution} The class is indicative: the manufacturer's classification under IEC 60825-1 is what counts.`,
	compute: ({power, wavelength}) => {
		const inNanometres = nanometres(wavelength!);
		if (!classCovered(inNanometres)) throw new CalculationInputError('hazard-class', 'wavelength', 'between 180 nm and 1 mm (outside that no class limits are known here; ask the laser safety officer)');
		const rank = Math.max(...limitsOnEverySide(inNanometres).map((limits) => rankOf(power!, limits)));
		const limits = continuousLimits(inNanometres);
		return {class_rank: rank, class1_limit: limits.class1, class3r_limit: limits.class3r, class3b_limit: limits.class3b};
	},
	notes: ({power, wavelength}, outputs) => {
		const notes = [`Indicative class: ${classNames[outputs['class_rank']!] ?? '?'} (CW, point source).`];
		if (power === undefined || wavelength === undefined) return notes;
		const ranks = new Set(limitsOnEverySide(nanometres(wavelength)).map((limits) => rankOf(power, limits)));
		if (ranks.size > 1) notes.push('The wavelength is on a band edge where the class tables differ: the higher class of the two sides is given.');
		return notes;
	},
};
