import {canonicalJson} from './canonical-json.js';

/**
 * The text of a record file: JSON laid out so that a person can read it and a diff shows what
 * changed, at about half the size of two-space indentation (a tab a level). A value whose compact JSON fits in
 * `width` columns is one line; a larger one is laid out one name or item a line, down to `depth`
 * levels, below which each value is one line (one check, one confirmation, one input or one
 * signature a line).
 */
export function recordJson(value: unknown, depth = 3): string {
	// Names are written in canonical (RFC 8785) order, so that an audit reads the body's canonical form on its fast path (canonical-json.ts).
	return `${layout(value, depth, '')}\n`;
}

const width = 100;

function layout(value: unknown, depth: number, indent: string): string {
	const compact = canonicalJson(value);
	if (depth === 0 || value === null || typeof value !== 'object' || indent.length + compact.length <= width) return compact;
	const inner = `${indent}\t`;
	if (Array.isArray(value)) {
		if (value.length === 0) return '[]';
		return `[\n${value.map((item) => `${inner}${layout(item, depth - 1, inner)}`).join(',\n')}\n${indent}]`;
	}
	const entries = Object.entries(value)
		.filter(([, item]) => item !== undefined)
		.sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0));
	if (entries.length === 0) return '{}';
	return `{\n${entries.map(([name, item]) => `${inner}${JSON.stringify(name)}: ${layout(item, depth - 1, inner)}`).join(',\n')}\n${indent}}`;
}
