import canonicalize from 'canonicalize';
import fc from 'fast-check';
import {describe, expect, it} from 'vitest';
import {canonicalJson, canonicalJsonOfParsed, canonicalMembersOfParsed, NotCanonicalError} from '../../source/records/canonical-json.js';
import {recordJson} from '../../source/records/record-json.js';

// The reference is the canonicalize package (an RFC 8785 implementation by one of the RFC's
// authors); the RFC's own examples are checked through canonicalBytes in jcs-rfc8785.reference.test.ts.
const reference = (value: unknown) => canonicalize(value);

/** Any JSON value, with strings of any UTF-16 code units except lone surrogates, and names that look like numbers. */
const wellFormedText = fc.string({unit: 'grapheme-composite', maxLength: 12});
const names = fc.oneof(wellFormedText, fc.constantFrom('1', '10', '9', '01', '-1', '\u20ac', '\r', '\ud83d\ude00', '\ufb33'));
const json = fc.letrec((tie) => ({
	value: fc.oneof({depthSize: 'small'}, fc.constant(null), fc.boolean(), fc.double({noNaN: true, noDefaultInfinity: true}), fc.integer(), wellFormedText, tie('array'), tie('object')),
	array: fc.array(tie('value'), {maxLength: 5}),
	object: fc.dictionary(names, tie('value'), {maxKeys: 6}),
})).value;

describe('canonicalJson against the canonicalize package (RFC 8785)', () => {
	it('gives the same text for any JSON value', () => {
		fc.assert(
			fc.property(json, (value) => {
				expect(canonicalJson(value)).toBe(reference(value));
			}),
			{numRuns: 2000},
		);
	});

	it('gives the same text for data read back by JSON.parse, in its own order or in canonical order (the fast path)', () => {
		fc.assert(
			fc.property(json, (value) => {
				const expected = reference(value);
				expect(canonicalJsonOfParsed(JSON.parse(JSON.stringify(value)))).toBe(expected);
				expect(canonicalJsonOfParsed(JSON.parse(expected!))).toBe(expected);
			}),
			{numRuns: 2000},
		);
	});

	it('member by member, gives the same text, and each member the text of its value, for an object in canonical order', () => {
		const objects = fc.dictionary(names, json, {maxKeys: 6});
		fc.assert(
			fc.property(objects, (value) => {
				const expected = reference(value)!;
				const parsed = JSON.parse(expected) as Record<string, unknown>;
				const built = canonicalMembersOfParsed(parsed);
				// JSON.parse puts integer-like names first, out of canonical order, at any depth: then no member texts, as canonicalJsonOfParsed leaves its fast path.
				if (/"(0|[1-9]\d*)":/.test(expected)) return;
				expect(built?.text).toBe(expected);
				expect(Object.fromEntries(built!.members)).toEqual(Object.fromEntries(Object.entries(parsed).map(([name, item]) => [name, reference(item)])));
			}),
			{numRuns: 1000},
		);
		// Not in canonical order, or a lone surrogate: no member texts (the caller goes the full way).
		expect(canonicalMembersOfParsed(JSON.parse('{"b":1,"a":2}'))).toBeUndefined();
		expect(canonicalMembersOfParsed(JSON.parse(String.raw`{"a":"x\ud800y"}`))).toBeUndefined();
		expect(canonicalMembersOfParsed([1, 2])).toBeUndefined();
	});

	it.each([
		['integer-like names, which Object.keys puts first', {b: 1, 10: 2, 9: 3, a: 4}, '{"10":2,"9":3,"a":4,"b":1}'], // RFC 8785 §3.2.3: UTF-16 code-unit order, "10" < "9"
		['minus zero', {z: -0}, '{"z":0}'], // RFC 8785 Appendix B: minus zero is 0
		['control characters and escapes', {s: '\u000f\n"\\/'}, String.raw`{"s":"\u000f\n\"\\/"}`], // RFC 8785 §3.2.2.2
		['a surrogate pair, written as it is', {s: '\ud83d\ude00'}, '{"s":"\ud83d\ude00"}'], // RFC 8785 §3.2.2.2
	])('%s', (_label, value, expected) => {
		expect(canonicalJson(value)).toBe(expected);
		expect(canonicalJsonOfParsed(JSON.parse(JSON.stringify(value)))).toBe(expected);
		expect(reference(value)).toBe(expected);
	});

	it.each([
		['a lone high surrogate', {s: '\ud800'}],
		['a lone low surrogate in a name', {'\udc00': 1}],
		['NaN', {n: Number.NaN}],
		['Infinity', [Number.POSITIVE_INFINITY]],
	])('refuses %s, as the reference does', (_label, value) => {
		expect(() => canonicalJson(value)).toThrow(NotCanonicalError);
		expect(() => reference(value)).toThrow();
	});

	it('refuses a lone surrogate read from JSON text on the fast path too', () => {
		const parsed = JSON.parse(String.raw`{"a":"x\ud800y"}`) as unknown;
		expect(() => canonicalJsonOfParsed(parsed)).toThrow(NotCanonicalError);
	});

	it.each([
		['undefined in an object', {a: undefined}],
		['a function', {f: () => 1}],
		['a class instance', {d: new Date(0)}],
	])('refuses %s, which JSON.stringify would drop or rewrite', (_label, value) => {
		expect(() => canonicalJson(value)).toThrow(NotCanonicalError);
	});
});

describe('record files are written in canonical order', () => {
	/** The names of every object in the order JSON.parse reads them back from the file. */
	const orders = (value: unknown, out: string[][] = []): string[][] => {
		if (Array.isArray(value)) value.forEach((item) => orders(item, out));
		else if (value && typeof value === 'object') {
			out.push(Object.keys(value));
			Object.values(value).forEach((item) => orders(item, out));
		}
		return out;
	};

	// Names that look like array indexes are read back first whatever the file's order (Object.keys): left out here.
	const plainName = fc.string({maxLength: 6}).filter((name) => !/^(0|[1-9]\d*)$/.test(name));
	const plainJson = fc.letrec((tie) => ({
		value: fc.oneof({depthSize: 'small'}, fc.constant(null), fc.boolean(), fc.double({noNaN: true, noDefaultInfinity: true}), wellFormedText, tie('array'), tie('object')),
		array: fc.array(tie('value'), {maxLength: 4}),
		object: fc.dictionary(plainName, tie('value'), {maxKeys: 6}),
	})).value;

	it('so that the body read back is already canonical (the audit takes the fast path)', () => {
		fc.assert(
			fc.property(fc.dictionary(plainName, plainJson, {maxKeys: 8}), (body) => {
				const read = JSON.parse(recordJson({signatures: [], body, version: 2})) as {body: unknown};
				for (const names of orders(read)) expect(names).toEqual([...names].sort());
				expect(JSON.stringify(read.body)).toBe(reference(body));
			}),
			{numRuns: 500},
		);
	});
});
