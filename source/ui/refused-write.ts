import {machineFailure} from '../shared/machine-failure.js';

/**
 * Runs a save a screen makes on the side (the draft after each answer, the settings after
 * signing) and returns why the machine refused it (a full disk, a read-only folder), so the
 * screen shows it and goes on; undefined when it was saved. Anything else is a bug and is thrown.
 */
export function refusedWrite(save: () => void): string | undefined {
	try {
		save();
		return undefined;
	} catch (error) {
		const refused = machineFailure(error);
		if (refused === undefined) throw error;
		return refused;
	}
}
