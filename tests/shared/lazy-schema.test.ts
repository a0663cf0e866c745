import {describe, expect, it} from 'vitest';
import {object, string, number, array, ZodType, toJSONSchema} from 'zod';
import {builtSchema, lazySchema, once} from '../../source/shared/lazy-schema.js';
import {planSchema} from '../../source/interlock/plan/plan-schema.js';
import {editorJsonSchema} from '../../source/shared/json-schema.js';

describe('lazySchema: built on first use, then the same as the schema itself', () => {
	it('does not build until used, and builds once', () => {
		let builds = 0;
		const lazy = lazySchema(() => {
			builds += 1;
			return object({name: string(), count: number()}).strict();
		});
		expect(builds).toBe(0);
		// Values checked by hand: a valid object passes, an extra key fails under strict().
		expect(lazy.safeParse({name: 'a', count: 2}).success).toBe(true);
		expect(lazy.safeParse({name: 'a', count: 2, extra: 1}).success).toBe(false);
		expect(builds).toBe(1);
		expect(lazy instanceof ZodType).toBe(true);
		expect('safeParse' in lazy).toBe(true);
		// Used inside another schema, it checks as itself.
		expect(array(lazy).safeParse([{name: 'b', count: 'x'}]).success).toBe(false);
		expect(builds).toBe(1);
	});

	it('builtSchema gives the very schema (its JSON Schema equals the eager one), and a plain value unchanged', () => {
		const make = () => object({name: string().describe('A name')}).strict();
		const lazy = lazySchema(make);
		expect(toJSONSchema(builtSchema(lazy))).toEqual(toJSONSchema(make()));
		const plain = {a: 1};
		expect(builtSchema(plain)).toBe(plain);
	});

	it('the plan schema read through its stand-in keeps its field descriptions in the editor schema', () => {
		const schema = JSON.stringify(editorJsonSchema('plan', planSchema as unknown as ZodType));
		expect(schema).toContain('The largest loop resistance the input still reads as closed');
	});

	it('once runs its builder on the first call only', () => {
		let runs = 0;
		const value = once(() => ++runs);
		expect(runs).toBe(0);
		expect([value(), value()]).toEqual([1, 1]);
	});
});
