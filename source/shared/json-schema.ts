// Named imports (not the z namespace) let the bundler leave out the parts of zod not used.
import {toJSONSchema, type ZodType} from 'zod';
import {builtSchema} from './lazy-schema.js';

/**
 * The one way a file's JSON Schema is made for editors: of what a person writes (the input side
 * of each transform), a part JSON Schema cannot say left open, and a value checked by prelase's
 * own parser (a quantity with its unit) given as text or a bare number. `adjust` changes the
 * schema in place before the title is put first.
 */
export function editorJsonSchema(title: string, schema: ZodType, adjust?: (schema: Record<string, unknown>) => void): Record<string, unknown> {
	// A lazy schema is read through a stand-in; the schema itself carries the descriptions.
	const made = toJSONSchema(builtSchema(schema), {
		io: 'input',
		unrepresentable: 'any',
		override(context) {
			if (context.zodSchema._zod.def.type === 'custom') context.jsonSchema['type'] = ['string', 'number'];
		},
	}) as Record<string, unknown>;
	adjust?.(made);
	return {title, ...made};
}
