import {describeProblem, type Problem} from '../shared/problems.js';
import type {Result} from '../shared/result.js';

/** A mistake in how the program was called or in what it was given: exit 2 with a clear message. */
export class UsageError extends Error {
	constructor(
		message: string,
		readonly problems: readonly Problem[] = [],
	) {
		super(message);
	}
}

/**
 * The value of a service's Result, or a UsageError (exit 2) for its failure: the last problem
 * is the message (what was refused), the ones before it are listed above it.
 */
export function valueOrUsageError<T>(result: Result<T, Problem>): T {
	if (result.ok) return result.value;
	const headline = result.errors.at(-1);
	throw new UsageError(headline ? describeProblem(headline) : 'refused', result.errors.slice(0, -1));
}
