import type {Calculation} from './calculation.js';
import {derating} from './derating.js';
import {dissipation} from './dissipation.js';
import {forwardVoltage} from './forward-voltage.js';
import {lightCurrent} from './light-current.js';
import {photodiode} from './photodiode.js';
import {threshold} from './threshold.js';

/** Every calculation, in the order they are listed. */
export const calculations: readonly Calculation[] = [forwardVoltage, dissipation, derating, threshold, lightCurrent, photodiode];

/** Finds a calculation by its kebab-case name. */
export function findCalculation(name: string): Calculation | undefined {
	return calculations.find((calculation) => calculation.name === name);
}
