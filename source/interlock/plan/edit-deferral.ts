import type {Steps} from '../../shared/steps.js';

/** An edit asked for while deferring and not worked out yet: run its steps (a part at a time), settle it with the result, then ask again. */
export type PendingEdit = {steps: Steps<unknown>; settle(result: unknown): void};

let scope: {pending?: PendingEdit} | undefined;
/** Edits worked out, by the editing state they started from and what they changed. */
const settled = new WeakMap<object, Map<string, unknown>>();

/**
 * Runs `run` with long edits deferred: the first edit it asks for that is not worked out yet is
 * not run (the edit functions answer with a placeholder refusal) but handed back as `pending`.
 * A caller that gets one discards `value`, works the edit out a step at a time, settles it, and
 * runs the same `run` again, which then gets the edit's result at once. `run` must be free of
 * side effects up to its edits (the planner's key handling is: it only computes the next state).
 */
export function deferringEdits<T>(run: () => T): {value: T; pending?: PendingEdit} {
	const outer = scope;
	const current: {pending?: PendingEdit} = {};
	scope = current;
	try {
		const value = run();
		return current.pending ? {value, pending: current.pending} : {value};
	} finally {
		scope = outer;
	}
}

/**
 * For an edit function: outside `deferringEdits`, undefined (work it out now). Inside: the result
 * when it was worked out already, else 'pending' after noting the steps (the first edit only).
 * `key` says what the edit changes; with `from`, the state it starts from, it names the edit.
 */
export function deferredEdit<R>(from: object, key: string, steps: () => Steps<R>): {result: R} | 'pending' | undefined {
	if (!scope) return undefined;
	const known = settled.get(from);
	if (known?.has(key)) return {result: known.get(key) as R};
	scope.pending ??= {
		steps: steps(),
		settle(result) {
			const results = settled.get(from) ?? new Map<string, unknown>();
			results.set(key, result);
			settled.set(from, results);
		},
	};
	return 'pending';
}
