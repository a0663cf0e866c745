/** The key under which a lazy schema gives the schema it stands for (for code that needs the very object). */
const builtKey = Symbol('lazy-schema-built');

/**
 * A value built on first use: the object `build` returns, stood in for by a proxy until then.
 * Schemas are declared at module level but cost time to construct; a program that never reads
 * a record or a plan (most runs of a command) then never builds them. Every property read,
 * `in`, `instanceof` and key listing goes to the built object.
 */
export function lazySchema<T extends object>(build: () => T): T {
	let built: T | undefined;
	const target = (): T => (built ??= build());
	return new Proxy({} as T, {
		get: (_, key) => (key === builtKey ? target() : Reflect.get(target(), key)),
		has: (_, key) => Reflect.has(target(), key),
		set: (_, key, value) => Reflect.set(target(), key, value),
		getPrototypeOf: () => Reflect.getPrototypeOf(target()),
		ownKeys: () => Reflect.ownKeys(target()),
		getOwnPropertyDescriptor: (_, key) => {
			const found = Reflect.getOwnPropertyDescriptor(target(), key);
			// The proxy's own target is an empty object: a property it lacks must be reported configurable.
			return found === undefined ? undefined : {...found, configurable: true};
		},
	});
}

/** The object a lazy schema stands for (the value itself when it is not lazy): for identity-keyed lookups such as a schema's metadata. */
export function builtSchema<T extends object>(value: T): T {
	return ((value as Record<symbol, unknown>)[builtKey] as T | undefined) ?? value;
}

/** Runs `build` once, on first call, and keeps what it returns. */
export function once<T>(build: () => T): () => T {
	let built: T | undefined;
	let done = false;
	return () => {
		if (!done) {
			built = build();
			done = true;
		}
		return built as T;
	};
}
