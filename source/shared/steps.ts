/**
 * Long work written as a generator that yields between its parts: run at once with `finish`, or
 * a part at a time by a caller that lets other work (a signal, a keystroke) in between.
 */
export type Steps<T> = Generator<void, T, void>;

/** Runs every step at once and returns the result: the same result a step-wise run gives. */
export function finish<T>(steps: Steps<T>): T {
	for (;;) {
		const next = steps.next();
		if (next.done) return next.value;
	}
}
