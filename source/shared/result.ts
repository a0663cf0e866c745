/** A value or the problems that stopped it; the core returns these instead of throwing. */
export type Result<T, P> = {ok: true; value: T; warnings: P[]} | {ok: false; errors: P[]};

/** Wraps a value as a successful result. */
export function success<T, P>(value: T, warnings: P[] = []): Result<T, P> {
	return {ok: true, value, warnings};
}

/** Wraps problems as a failed result. */
export function failure<T, P>(errors: P[]): Result<T, P> {
	return {ok: false, errors};
}
