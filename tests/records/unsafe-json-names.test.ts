import {describe, expect, it} from 'vitest';
import {unsafeJsonKey} from '../../source/records/unsafe-json-names.js';

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
	])('$name', ({text, found}) => {
		expect(() => JSON.parse(text) as unknown).not.toThrow();
		expect(unsafeJsonKey(text)).toEqual(found);
	});
});
