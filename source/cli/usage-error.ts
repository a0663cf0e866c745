import type {Problem} from '../shared/problems.js';

/** A mistake in how the program was called or in what it was given: exit 2 with a clear message. */
export class UsageError extends Error {
	constructor(
		message: string,
		readonly problems: readonly Problem[] = [],
	) {
		super(message);
	}
}
