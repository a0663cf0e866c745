import {describe, expect, it} from 'vitest';
import {canonicalBytes, NotCanonicalError} from '../../source/records/canonical.js';

/** A double from its IEEE-754 binary64 bit pattern, written as 16 hex digits. */
function doubleFromHex(bits: string): number {
	const view = new DataView(new ArrayBuffer(8));
	view.setBigUint64(0, BigInt(`0x${bits}`));
	return view.getFloat64(0);
}

const text = (value: unknown) => canonicalBytes(value).toString('utf8');

describe('RFC 8785 §3.2.2 input → §3.2.3 output (the values example)', () => {
	// The input is JSON text, parsed as a reader would; written raw so every escape stays as in the RFC.
	const input = String.raw`{
  "numbers": [333333333.33333329, 1E30, 4.50, 2e-3, 0.000000000000000000000000001],
  "string": "\u20ac$\u000F\u000aA'\u0042\u0022\u005c\\\"\/",
  "literals": [null, true, false]
}`; // RFC 8785 §3.2.2
	const expected = String.raw`{"literals":[null,true,false],"numbers":[333333333.3333333,1e+30,4.5,0.002,1e-27],"string":"` + '\u20ac' + String.raw`$\u000f\nA'B\"\\\\\"/"}`; // RFC 8785 §3.2.3

	it('gives the exact canonical text', () => {
		expect(text(JSON.parse(input))).toBe(expected);
	});

	it('gives the exact UTF-8 bytes (the euro sign as e2 82 ac, nothing else outside ASCII)', () => {
		const bytes = canonicalBytes(JSON.parse(input));
		expect(bytes.equals(Buffer.from(expected, 'utf8'))).toBe(true);
		expect(bytes.length).toBe(expected.length + 2); // RFC 8785 §3.2.3: U+20AC is the only non-ASCII character, 3 bytes in UTF-8
		expect(bytes.subarray(bytes.indexOf('"string":"') + 10, bytes.indexOf('"string":"') + 13).toString('hex')).toBe('e282ac');
	});
});

describe('RFC 8785 §3.2.3 sorting example', () => {
	// Keys written as \u escapes: U+FB33 has no NFC-stable form, so a literal character could be rewritten by an editor.
	const input = {
		'\u20ac': 'Euro Sign', // RFC 8785 §3.2.3
		'\r': 'Carriage Return', // RFC 8785 §3.2.3
		'\ufb33': 'Hebrew Letter Dalet With Dagesh', // RFC 8785 §3.2.3
		'1': 'One', // RFC 8785 §3.2.3
		'\ud83d\ude00': 'Emoji: Grinning Face', // RFC 8785 §3.2.3
		'\u0080': 'Control', // RFC 8785 §3.2.3
		'\u00f6': 'Latin Small Letter O With Diaeresis', // RFC 8785 §3.2.3
	};
	const expectedHex =
		'7b225c72223a2243617272696167652052657475726e222c2231223a224f6e65222c22c280223a22436f6e74726f6c222c22c3b6223a224c6174696e20536d616c6c204c6574746572204f205769746820446961657265736973222c22e282ac223a224575726f205369676e222c22f09f9880223a22456d6f6a693a204772696e6e696e672046616365222c22efacb3223a22486562726577204c65747465722044616c6574205769746820446167657368227d'; // RFC 8785 §3.2.3

	it('gives the canonical output byte for byte', () => {
		expect(canonicalBytes(input).toString('hex')).toBe(expectedHex);
	});

	it('sorts by UTF-16 code units: \\r, 1, U+0080, ö, €, the surrogate pair, then U+FB33', () => {
		// Read the keys off the text: Object.keys would put the integer-like "1" first.
		const keys = [...text(input).matchAll(/[{,]("(?:[^"\\]|\\.)*"):/g)].map((match) => JSON.parse(match[1]!) as string);
		expect(keys).toEqual(['\r', '1', '\u0080', '\u00f6', '\u20ac', '\ud83d\ude00', '\ufb33']); // RFC 8785 §3.2.3
	});

	it('gives the same bytes whatever order the keys were inserted in', () => {
		const reversed = Object.fromEntries(Object.entries(input).reverse());
		expect(canonicalBytes(reversed).toString('hex')).toBe(expectedHex);
	});

	it('sorts nested objects too and keeps array order', () => {
		expect(text({b: [3, 1, 2], a: {z: 1, y: {d: 0, c: 0}}})).toBe('{"a":{"y":{"c":0,"d":0},"z":1},"b":[3,1,2]}'); // RFC 8785 §3.2.3
	});
});

describe('RFC 8785 Appendix B number serialisation', () => {
	const table: Array<[bits: string, expected: string]> = [
		['0000000000000000', '0'], // RFC 8785 Appendix B: zero
		['8000000000000000', '0'], // RFC 8785 Appendix B: minus zero
		['0000000000000001', '5e-324'], // RFC 8785 Appendix B: min positive
		['8000000000000001', '-5e-324'], // RFC 8785 Appendix B
		['7fefffffffffffff', '1.7976931348623157e+308'], // RFC 8785 Appendix B: max positive
		['ffefffffffffffff', '-1.7976931348623157e+308'], // RFC 8785 Appendix B
		['4340000000000000', '9007199254740992'], // RFC 8785 Appendix B: 2^53
		['c340000000000000', '-9007199254740992'], // RFC 8785 Appendix B
		['4430000000000000', '295147905179352830000'], // RFC 8785 Appendix B: about 2^68
		['44b52d02c7e14af5', '9.999999999999997e+22'], // RFC 8785 Appendix B
		['44b52d02c7e14af6', '1e+23'], // RFC 8785 Appendix B
		['44b52d02c7e14af7', '1.0000000000000001e+23'], // RFC 8785 Appendix B
		['444b1ae4d6e2ef4e', '999999999999999700000'], // RFC 8785 Appendix B
		['444b1ae4d6e2ef4f', '999999999999999900000'], // RFC 8785 Appendix B
		['444b1ae4d6e2ef50', '1e+21'], // RFC 8785 Appendix B
		['3eb0c6f7a0b5ed8c', '9.999999999999997e-7'], // RFC 8785 Appendix B
		['3eb0c6f7a0b5ed8d', '0.000001'], // RFC 8785 Appendix B
		['41b3de4355555553', '333333333.3333332'], // RFC 8785 Appendix B
		['41b3de4355555554', '333333333.33333325'], // RFC 8785 Appendix B
		['41b3de4355555555', '333333333.3333333'], // RFC 8785 Appendix B
		['41b3de4355555556', '333333333.3333334'], // RFC 8785 Appendix B
		['41b3de4355555557', '333333333.33333343'], // RFC 8785 Appendix B
		['becbf647612f3696', '-0.0000033333333333333333'], // RFC 8785 Appendix B
		['43143ff3c1cb0959', '1424953923781206.2'], // RFC 8785 Appendix B: round to even
	];

	it.each(table)('%s → %s', (bits, expected) => {
		expect(text(doubleFromHex(bits))).toBe(expected);
		expect(text({value: doubleFromHex(bits)})).toBe(`{"value":${expected}}`);
	});

	it('builds the doubles from their bit patterns (minus zero is really minus zero)', () => {
		expect(Object.is(doubleFromHex('8000000000000000'), -0)).toBe(true);
		expect(doubleFromHex('4340000000000000')).toBe(2 ** 53);
		expect(doubleFromHex('0000000000000001')).toBe(Number.MIN_VALUE);
		expect(doubleFromHex('7fefffffffffffff')).toBe(Number.MAX_VALUE);
	});

	it.each([
		['7fffffffffffffff', 'NaN'], // RFC 8785 Appendix B: NaN is an error
		['7ff0000000000000', 'Infinity'], // RFC 8785 Appendix B: Infinity is an error
		['fff0000000000000', '-Infinity'], // RFC 8785 §3.2.2.3: no JSON form
	])('%s (%s) throws NotCanonicalError, alone and nested', (bits) => {
		const value = doubleFromHex(bits);
		expect(Number.isFinite(value)).toBe(false);
		expect(() => canonicalBytes(value)).toThrow(NotCanonicalError);
		expect(() => canonicalBytes({outer: {inner: [1, value]}})).toThrow(NotCanonicalError);
	});

	it('writes -0 as 0 (RFC 8785 §3.2.2.3)', () => {
		expect(text(-0)).toBe('0');
		expect(text([-0, 0])).toBe('[0,0]');
	});
});

describe('RFC 8785 §3.2.2.2 strings', () => {
	it('escapes only the quote, the backslash and U+0000–U+001F, with short forms and lower-case hex', () => {
		expect(text('\b\t\n\f\r')).toBe(String.raw`"\b\t\n\f\r"`); // RFC 8785 §3.2.2.2
		expect(text('\u0000\u001b\u001f')).toBe(String.raw`"\u0000\u001b\u001f"`); // RFC 8785 §3.2.2.2
		expect(text('"\\/')).toBe(String.raw`"\"\\/"`); // RFC 8785 §3.2.2.2: the solidus is not escaped
	});

	it('writes DEL, C1 controls and non-ASCII characters raw in UTF-8', () => {
		expect(canonicalBytes('\u007f\u0085\u202e').toString('hex')).toBe('227fc285e280ae22'); // RFC 8785 §3.2.2.2
	});

	it('refuses a lone surrogate (RFC 8785 §3.2.2.2, I-JSON RFC 7493 §2.1)', () => {
		expect(() => canonicalBytes('\ud800')).toThrow(NotCanonicalError);
		expect(() => canonicalBytes({['\udc00']: 1})).toThrow(NotCanonicalError);
	});
});

describe('only plain data is canonicalised (nothing is silently dropped)', () => {
	it('throws on a function-valued property instead of dropping it', () => {
		expect(() => canonicalBytes({a: 1, f: () => 1})).toThrow(NotCanonicalError);
		expect(() => canonicalBytes({nested: {f() {}}})).toThrow(NotCanonicalError);
	});

	it('throws on an undefined property instead of dropping it', () => {
		expect(() => canonicalBytes({a: 1, b: undefined})).toThrow(NotCanonicalError);
		expect(() => canonicalBytes([1, undefined])).toThrow(NotCanonicalError);
		expect(() => canonicalBytes(undefined)).toThrow(NotCanonicalError);
	});

	it('throws on values whose JSON form would differ from the value (a date, a big integer, a symbol, a map)', () => {
		expect(() => canonicalBytes({when: new Date(0)})).toThrow(NotCanonicalError);
		expect(() => canonicalBytes({n: 1n})).toThrow(NotCanonicalError);
		expect(() => canonicalBytes({s: Symbol('s')})).toThrow(NotCanonicalError);
		expect(() => canonicalBytes(new Map([['a', 1]]))).toThrow(NotCanonicalError);
	});

	it('still canonicalises null, booleans and empty containers', () => {
		expect(text({t: true, f: false, n: null, a: [], o: {}})).toBe('{"a":[],"f":false,"n":null,"o":{},"t":true}');
	});
});
