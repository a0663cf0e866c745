import {describe, expect, it} from 'vitest';
import {custom, number, object, string} from 'zod';
import {ruleFileJsonSchema, siteFileJsonSchema} from '../../source/rules/file/rule-json-schema.js';
import {editorJsonSchema} from '../../source/shared/json-schema.js';

type Node = {type?: unknown; properties?: Record<string, Node>; required?: string[]; title?: string; $defs?: Record<string, Node>; [key: string]: unknown};

describe('the JSON Schema made for editors', () => {
	it.each([
		// JSON Schema 2020-12, section 6.1.1: "type" may be an array of the allowed type names.
		{name: 'a value checked by prelase\'s own parser: text or a bare number', field: custom<string | number>(() => true), expected: ['string', 'number']},
		// The input side of a transform: what a person writes is the string the transform reads.
		{name: 'a transformed field: what is written', field: string().transform(Number), expected: 'string'},
		{name: 'a plain number', field: number(), expected: 'number'},
	])('$name', ({field, expected}) => {
		const made = editorJsonSchema('a file', object({value: field})) as Node;
		expect(made.properties!['value']!.type).toEqual(expected);
	});

	it('puts the title first and lets the caller adjust the schema before', () => {
		const made = editorJsonSchema('a file', object({a: string(), b: string()}), (schema) => {
			schema['required'] = ['a'];
		});
		expect(Object.keys(made)[0]).toBe('title');
		expect(made['title']).toBe('a file');
		expect(made['required']).toEqual(['a']);
	});
});

/** Every object in the schema with `kind: quantity`, wherever it is. */
function quantityInputs(node: unknown, found: Node[] = []): Node[] {
	if (!node || typeof node !== 'object') return found;
	const record = node as Node;
	if ((record.properties?.['kind'] as {const?: unknown} | undefined)?.const === 'quantity') found.push(record);
	for (const value of Object.values(record)) quantityInputs(value, found);
	return found;
}

describe('the JSON Schemas of rule files', () => {
	it.each([
		{name: 'rule files', schema: ruleFileJsonSchema(), title: 'prelase rule file'},
		{name: 'site rule files', schema: siteFileJsonSchema(), title: 'prelase site rule file (extends a base)'},
	])('$name: titled, with kind optional on every quantity input (the loader allows it left out)', ({schema, title}) => {
		expect(schema['title']).toBe(title);
		const inputs = quantityInputs(schema);
		expect(inputs.length).toBeGreaterThan(0);
		for (const input of inputs) expect(input.required ?? []).not.toContain('kind');
	});
});
