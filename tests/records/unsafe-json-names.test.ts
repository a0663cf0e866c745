import {describe, expect, it} from 'vitest';
import {unsafeJsonKey} from '../../source/records/unsafe-json-names.js';

/** An object of `count` names n0, n1, …, and then `again` once more when given. */
const names = (count: number, again?: string) => `{${[...Array.from({length: count}, (_, index) => `n${index}`), ...(again ? [again] : [])].map((name, index) => `"${name}": ${index}`).join(', ')}}`;

describe('unsafeJsonKey', () => {
	it.each([
		{name: 'plain object', text: '{"a": 1, "b": {"a": 2}}', found: undefined},
		{name: 'repeated name', text: '{"a": 1, "a": 2}', found: {kind: 'duplicate', name: 'a'}},
		{name: 'repeated name deep inside', text: '{"x": [{"k": 1}, {"k": 2, "k": 3}]}', found: {kind: 'duplicate', name: 'k'}},
		{name: 'same name in sibling objects', text: '[{"k": 1}, {"k": 2}]', found: undefined},
		{name: 'a value equal to a name', text: '{"a": "a", "b": "a"}', found: undefined},
		{name: 'escaped quote inside a value', text: '{"a": "say \\"a\\"", "b": 1}', found: undefined},
		{name: 'backslash before the closing quote', text: '{"a": "C:\\\\", "a": 2}', found: {kind: 'duplicate', name: 'a'}},
		{name: 'escaped name equal to another', text: '{"\\u0061": 1, "a": 2}', found: {kind: 'duplicate', name: 'a'}},
		{name: '__proto__ name', text: '{"inputs": {"__proto__": {}}}', found: {kind: 'prototype', name: '__proto__'}},
		{name: 'escaped __proto__', text: '{"\\u005f_proto__": 1}', found: {kind: 'prototype', name: '__proto__'}},
		{name: '__proto__ as a value', text: '{"a": "__proto__"}', found: undefined},
		// Past 16 names an object's names are kept in a set: a name repeated on either side of that point.
		{name: '40 different names', text: names(40), found: undefined},
		{name: 'the first of 40 names repeated last', text: names(40, 'n0'), found: {kind: 'duplicate', name: 'n0'}},
		{name: 'the 17th name repeated at once', text: `{${Array.from({length: 17}, (_, index) => `"n${index}": ${index}`).join(', ')}, "n16": 0}`, found: {kind: 'duplicate', name: 'n16'}},
		{name: 'the 30th name repeated after 40', text: names(40, 'n29'), found: {kind: 'duplicate', name: 'n29'}},
	])('$name', ({text, found}) => {
		expect(() => JSON.parse(text) as unknown).not.toThrow();
		expect(unsafeJsonKey(text)).toEqual(found);
	});
});
