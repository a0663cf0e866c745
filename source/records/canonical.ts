import canonicalize from 'canonicalize';

/** A value that is not plain JSON data (a function, NaN, Infinity…): it cannot be canonicalised. */
export class NotCanonicalError extends Error {}

/**
 * The RFC 8785 (JSON Canonicalization Scheme) form of plain data, as UTF-8 bytes. Refuses
 * NaN, Infinity and anything that JSON.stringify would silently turn into null or drop.
 */
export function canonicalBytes(value: unknown): Buffer {
	assertPlain(value, '$');
	let text: string | undefined;
	try {
		text = canonicalize(value);
	} catch (error) {
		throw new NotCanonicalError((error as Error).message);
	}
	if (text === undefined) throw new NotCanonicalError('the value has no JSON form');
	return Buffer.from(text, 'utf8');
}

function assertPlain(value: unknown, path: string): void {
	if (value === null || typeof value === 'string' || typeof value === 'boolean') return;
	if (typeof value === 'number') {
		if (!Number.isFinite(value)) throw new NotCanonicalError(`${path} is ${value}, which JSON cannot hold`);
		return;
	}
	if (Array.isArray(value)) {
		value.forEach((item, index) => assertPlain(item, `${path}[${index}]`));
		return;
	}
	if (typeof value === 'object' && Object.getPrototypeOf(value) === Object.prototype) {
		for (const [key, item] of Object.entries(value)) {
			if (item === undefined) throw new NotCanonicalError(`${path}.${key} is undefined`);
			assertPlain(item, `${path}.${key}`);
		}
		return;
	}
	throw new NotCanonicalError(`${path} is not plain JSON data`);
}
