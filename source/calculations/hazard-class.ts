import {CalculationInputError, type Calculation} from './calculation.js';
import {factorA, factorB} from './optical/correction-factors.js';
import {opticalCaution} from './optical/optical-caution.js';

/** Names of the indicative classes by rank, as the output `class_rank` counts them. */
export const classNames = ['', 'Class 1', 'Class 2', 'Class 3R', 'Class 3B', 'Class 4'] as const;

/** CW accessible emission limits (W) at a wavelength (nm), 400–1150 nm. */
export function continuousLimits(wavelength: number): {class1: number; class2: number | undefined; class3r: number; class3b: number} {
	const visible = wavelength <= 700;
	const thermal = 3.9e-4 * factorA(wavelength);
	const photochemical = wavelength < 600 ? 3.9e-5 * factorB(wavelength) : Number.POSITIVE_INFINITY;
	const class1 = Math.min(thermal, photochemical);
	return {class1, class2: visible ? 1e-3 : undefined, class3r: visible ? 5e-3 : 5 * class1, class3b: 0.5};
}

/** An indicative hazard class of a CW beam from its power and wavelength. */
export const hazardClass: Calculation = {
	name: 'hazard-class',
	summary: 'Indicative hazard class of a CW beam from its power and wavelength (400–1150 nm); the manufacturer’s classification is what counts',
	inputs: {
		power: {dimension: 'power', description: 'Largest accessible CW output power'},
		wavelength: {dimension: 'length', description: 'Wavelength, 400 nm to 1150 nm', allowed: 'positive'},
	},
	outputs: {
		class_rank: {dimension: 'number', description: 'Indicative class: 1 = Class 1, 2 = Class 2, 3 = Class 3R, 4 = Class 3B, 5 = Class 4'},
		class1_limit: {dimension: 'power', description: 'Class 1 accessible emission limit (CW, time base 100 s)'},
		class3r_limit: {dimension: 'power', description: 'Class 3R accessible emission limit'},
		class3b_limit: {dimension: 'power', description: 'Class 3B accessible emission limit'},
	},
	main: 'class_rank',
	formula: 'Class 1: 3.9×10⁻⁴·C_A W (and 3.9×10⁻⁵·C_B W below 600 nm); Class 2: 1 mW (400–700 nm); Class 3R: 5 mW visible, else 5× Class 1; Class 3B: 0.5 W; above: Class 4',
	basis: [
		'IEC 60825-1:2007 Table 4 / IEC 60825-1:2014 Table 3, CW accessible emission limits for a point source as commonly reproduced (from memory: high for the thermal rows, medium for the photochemical Class 1 row and the 3R factor of 5)',
		'Not modelled: Class 1M, 2M and 1C, the measurement conditions (apertures and distances), pulsed criteria, extended sources',
	],
	caution: `${opticalCaution} The class is indicative: the manufacturer's classification under IEC 60825-1 is what counts.`,
	compute: ({power, wavelength}) => {
		const nanometres = wavelength! * 1e9;
		if (!(nanometres >= 400 && nanometres <= 1150)) throw new CalculationInputError('hazard-class', 'wavelength', 'between 400 nm and 1150 nm (elsewhere the class limits are not covered; ask the laser safety officer)');
		const limits = continuousLimits(nanometres);
		let rank = 5;
		if (power! <= limits.class1) rank = 1;
		else if (limits.class2 !== undefined && power! <= limits.class2) rank = 2;
		else if (power! <= limits.class3r) rank = 3;
		else if (power! <= limits.class3b) rank = 4;
		return {class_rank: rank, class1_limit: limits.class1, class3r_limit: limits.class3r, class3b_limit: limits.class3b};
	},
	notes: (_inputs, outputs) => [`Indicative class: ${classNames[outputs['class_rank']!] ?? '?'} (CW, point source).`],
};
