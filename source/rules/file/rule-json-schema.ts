import {editorJsonSchema} from '../../shared/json-schema.js';
import {ruleFileSchema} from './schema.js';
import {siteFileSchema} from './site-schema.js';

/** Removes `kind` from the required fields of quantity inputs, as the loader allows. */
function relaxKind(node: unknown): void {
	if (!node || typeof node !== 'object') return;
	const record = node as Record<string, unknown>;
	const properties = record['properties'] as Record<string, {const?: unknown}> | undefined;
	if (properties?.['kind']?.const === 'quantity' && Array.isArray(record['required'])) {
		record['required'] = (record['required'] as string[]).filter((key) => key !== 'kind');
	}
	for (const value of Object.values(record)) relaxKind(value);
}

/** The JSON Schema of rule files, with `kind` optional on quantity inputs as the loader allows. */
export function ruleFileJsonSchema(): Record<string, unknown> {
	return editorJsonSchema('prelase rule file', ruleFileSchema, relaxKind);
}

/** The JSON Schema of site rule files (those with `extends`). */
export function siteFileJsonSchema(): Record<string, unknown> {
	return editorJsonSchema('prelase site rule file (extends a base)', siteFileSchema, relaxKind);
}
