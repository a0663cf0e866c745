import {canonicalJson, NotCanonicalError} from './canonical-json.js';

export {NotCanonicalError} from './canonical-json.js';

/**
 * The RFC 8785 (JSON Canonicalization Scheme) form of plain data, as UTF-8 bytes. Refuses
 * NaN, Infinity and anything that JSON.stringify would silently turn into null or drop.
 */
export function canonicalBytes(value: unknown): Buffer {
	let text: string;
	try {
		text = canonicalJson(value);
	} catch (error) {
		// Where the value is not plain is found only now: the fast path does not track it.
		assertPlain(value, '$');
		throw error instanceof NotCanonicalError ? error : new NotCanonicalError((error as Error).message);
	}
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
