import {brownout} from './brownout.js';
import type {Calculation} from './calculation.js';
import {derating} from './derating.js';
import {dissipation} from './dissipation.js';
import {forwardVoltage} from './forward-voltage.js';
import {hazardClass} from './hazard-class.js';
import {headroom} from './headroom.js';
import {heatsink} from './heatsink.js';
import {lightCurrent} from './light-current.js';
import {modulation} from './modulation.js';
import {mpe} from './mpe.js';
import {nohd} from './nohd.js';
import {noise} from './noise.js';
import {od} from './od.js';
import {photodiode} from './photodiode.js';
import {photonSlopeLimit} from './photon-slope-limit.js';
import {risetime} from './risetime.js';
import {threshold} from './threshold.js';
import {wire} from './wire.js';

/** Every calculation, in the order they are listed. */
export const calculations: readonly Calculation[] = [
	forwardVoltage,
	headroom,
	dissipation,
	derating,
	heatsink,
	threshold,
	lightCurrent,
	photonSlopeLimit,
	photodiode,
	modulation,
	risetime,
	noise,
	wire,
	brownout,
	mpe,
	nohd,
	od,
	hazardClass,
];

/** Finds a calculation by its kebab-case name. */
export function findCalculation(name: string): Calculation | undefined {
	return calculations.find((calculation) => calculation.name === name);
}
