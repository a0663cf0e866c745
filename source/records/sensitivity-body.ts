import type {WhatIf} from '../rules/evaluate/what-if.js';

/**
 * The what-if analysis as a record keeps it: for each judged check with a flip point, each input
 * that flips it, and the SI value(s) of the flip (the last value on the passing side; the way it
 * moves and the verdict it turns to follow from the value entered and the check's verdict). The
 * closest calls and the changes that clear a fail follow from these and are not stored.
 */
export type SensitivityBody = Record<string, Record<string, number[]>>;

/** The record's sensitivity section of a what-if analysis. */
export function sensitivityBody(result: WhatIf): SensitivityBody {
	const body: SensitivityBody = {};
	for (const entry of result.checks) {
		if (entry.flips.length === 0) continue;
		const inputs: Record<string, number[]> = {};
		for (const flip of entry.flips) (inputs[flip.input] ??= []).push(flip.at.si);
		body[entry.check] = inputs;
	}
	return body;
}
