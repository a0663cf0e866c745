import {describeProblem, type Problem} from './problems.js';

/**
 * A user's mistake found while reading this machine's own files (the settings, the trusted
 * keys) deep inside a load that no caller can go on from. The command line reports it like a
 * usage error (exit 2); everything else that a user can get wrong comes back as a Result.
 */
export class ProblemError extends Error {
	constructor(readonly problem: Problem) {
		super(describeProblem(problem));
	}
}
