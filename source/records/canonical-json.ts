/** A value that is not plain JSON data (a function, NaN, Infinity…): it cannot be canonicalised. */
export class NotCanonicalError extends Error {}

type WellFormed = {isWellFormed(): boolean};

/**
 * The RFC 8785 (JSON Canonicalization Scheme) text of plain JSON data, in one pass: object
 * names sorted by UTF-16 code units (the default sort), numbers in the ECMAScript form that
 * JSON.stringify gives, strings escaped as JSON.stringify escapes them. Refuses what has no
 * canonical form (NaN, Infinity, a lone surrogate) and what JSON.stringify would silently turn
 * into null or drop (undefined, a function, a class instance), naming where it is.
 *
 * The canonicalize package is the reference for this in the tests (equal output over random
 * JSON values, and the RFC's own examples); this one checks plainness in the same pass and
 * tests strings with isWellFormed() instead of a character loop, which makes an audit's
 * canonical forms about twice as fast (docs/decisions.md, "The audit's own canonical form").
 */
export function canonicalJson(value: unknown): string {
	return write(value);
}

/** Where the value is not canonical is found by the caller on failure (canonical.ts), not tracked on the fast path. */
function write(value: unknown): string {
	switch (typeof value) {
		case 'string':
			return quoted(value);
		case 'number':
			if (!Number.isFinite(value)) throw new NotCanonicalError(`${value} is not a JSON number`);
			return JSON.stringify(value);
		case 'boolean':
			return value ? 'true' : 'false';
		case 'object': {
			if (value === null) return 'null';
			if (Array.isArray(value)) {
				let out = '[';
				for (let index = 0; index < value.length; index += 1) {
					if (index > 0) out += ',';
					out += write(value[index]);
				}
				return `${out}]`;
			}
			const prototype = Object.getPrototypeOf(value) as unknown;
			if (prototype !== Object.prototype && prototype !== null) break;
			const object = value as Record<string, unknown>;
			const names = Object.keys(object).sort();
			let out = '{';
			for (let index = 0; index < names.length; index += 1) {
				const name = names[index]!;
				const item = object[name];
				if (item === undefined) throw new NotCanonicalError(`${name} is undefined`);
				if (index > 0) out += ',';
				out += `${quoted(name)}:${write(item)}`;
			}
			return `${out}}`;
		}
		default:
			break;
	}
	throw new NotCanonicalError('a value is not plain JSON data');
}

function quoted(text: string): string {
	if (!(text as unknown as WellFormed).isWellFormed()) throw new NotCanonicalError('a string holds a lone surrogate, which has no canonical form');
	return JSON.stringify(text);
}

/** A lone surrogate as JSON.stringify escapes it (a pair is written as it is): such text has no canonical form. */
const loneSurrogate = /\\ud[89a-f][0-9a-f]{2}/;

/**
 * The canonical text of data read by JSON.parse, on a fast path when the data is already in
 * canonical order: then JSON.stringify, which writes names in the order they were read, gives
 * the canonical text itself (its numbers and strings are RFC 8785's by definition). prelase
 * writes records in canonical order (record-json.ts), so an audit takes the fast path for
 * them; anything else, and anything JSON.stringify would write with an escaped lone surrogate,
 * goes the full way. Only for data from JSON.parse: it holds no undefined, function or NaN.
 */
export function canonicalJsonOfParsed(value: unknown): string {
	if (inCanonicalOrder(value)) {
		const text = JSON.stringify(value);
		if (!loneSurrogate.test(text)) return text;
	}
	return canonicalJson(value);
}

/**
 * The canonical text of an object read by JSON.parse, and the canonical text of each of its
 * members' values by name, on the fast path of canonicalJsonOfParsed only (undefined otherwise:
 * use canonicalJsonOfParsed). The text is the same as canonicalJsonOfParsed's, built member by
 * member, so a caller can tell records apart by some of their members without writing them again.
 */
export function canonicalMembersOfParsed(value: unknown): {text: string; members: Map<string, string>} | undefined {
	if (typeof value !== 'object' || value === null || Array.isArray(value) || !inCanonicalOrder(value)) return undefined;
	const members = new Map<string, string>();
	const parts: string[] = [];
	for (const [name, item] of Object.entries(value)) {
		const nameText = JSON.stringify(name);
		const itemText = JSON.stringify(item);
		if (loneSurrogate.test(nameText) || loneSurrogate.test(itemText)) return undefined;
		parts.push(`${nameText}:${itemText}`);
		members.set(name, itemText);
	}
	return {text: `{${parts.join(',')}}`, members};
}

/** Whether every object's names, in the order JSON.stringify writes them, are in strictly rising UTF-16 order. */
function inCanonicalOrder(value: unknown): boolean {
	if (typeof value !== 'object' || value === null) return true;
	if (Array.isArray(value)) {
		for (let index = 0; index < value.length; index += 1) if (!inCanonicalOrder(value[index])) return false;
		return true;
	}
	let previous: string | undefined;
	const object = value as Record<string, unknown>;
	for (const name of Object.keys(object)) {
		if (previous !== undefined && !(previous < name)) return false;
		if (!inCanonicalOrder(object[name])) return false;
		previous = name;
	}
	return true;
}
