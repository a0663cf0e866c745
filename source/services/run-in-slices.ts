import type {Steps} from '../shared/steps.js';

/** How long long work runs before it lets the event loop turn, in milliseconds. */
const sliceMs = 25;

/**
 * Runs long work a step at a time, letting the event loop turn (setImmediate: after the poll phase
 * where signals and input arrive) whenever a slice of time has passed. A SIGTERM or a keystroke is
 * then handled within the longest single step, not after the whole work. The result is the one
 * `finish` gives, or undefined when `stop` was aborted first.
 */
export async function runInSlices<T>(steps: Steps<T>, stop?: AbortSignal): Promise<T | undefined> {
	// The caller (a key handler) returns and its frame is drawn before the work begins.
	await new Promise((resolve) => setImmediate(resolve));
	let sliceStart = performance.now();
	for (;;) {
		const next = steps.next();
		if (next.done) return next.value;
		if (performance.now() - sliceStart >= sliceMs) {
			await new Promise((resolve) => setImmediate(resolve));
			// Work no one waits for any more (the screen has gone) stops here rather than holding the program open.
			if (stop?.aborted) return undefined;
			sliceStart = performance.now();
		}
	}
}
