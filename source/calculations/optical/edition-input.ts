import {CalculationInputError, type CalculationInput} from '../calculation.js';
import {NotCoveredError, type Edition} from './ocular-mpe.js';
import {opticalRanges} from './optical-ranges.js';

/** The `edition` input shared by the optical calculations: 2014 (default) or 2007. */
export const editionInput: CalculationInput = {
	dimension: 'number',
	description: 'Edition of the exposure limits: 2014 (IEC 60825-1:2014 = ICNIRP 2013 = ANSI Z136.1-2014) or 2007',
	range: opticalRanges.edition,
	default: 2014,
};

/** The `repetition_rate` input: repetitive pulses are refused as not covered, never approximated. */
export const repetitionInput: CalculationInput = {
	dimension: 'frequency',
	description: 'Pulse repetition rate. Repetitive pulses (the single-pulse, average-power and pulse-train rules) are not covered: give one pulse as the duration, and ask the laser safety officer for the pulse train',
	range: opticalRanges.repetitionRate,
	optional: true,
};

/** Refuses a repetition rate: the three-rule evaluation of pulse trains is not implemented. */
export function refuseRepetition(calculation: string, value: number | undefined): void {
	if (value !== undefined) throw new CalculationInputError(calculation, 'repetition_rate', 'left out: repetitive pulses are not covered (the pulse-train rules are not implemented); evaluate one pulse and ask the laser safety officer');
}

/** Reads the edition number, refusing anything but 2007 and 2014. */
export function readEdition(calculation: string, value: number | undefined): Edition {
	if (value === 2007 || value === 2014 || value === undefined) return value ?? 2014;
	throw new CalculationInputError(calculation, 'edition', '2014 or 2007');
}

/** Runs an exposure-limit lookup, turning "not covered" into the calculation's input error. */
export function covered<T>(calculation: string, run: () => T): T {
	try {
		return run();
	} catch (error) {
		if (error instanceof NotCoveredError) throw new CalculationInputError(calculation, error.key, error.allowed);
		throw error;
	}
}
