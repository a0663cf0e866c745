import {parse} from 'yaml';

/** Step titles and value labels read from the rule file text a record carries. */
export type RuleOutline = {
	/** Steps in the order the rule file walks them. */
	steps: Array<{id: string; title: string}>;
	/** Label, step and option labels of each input, and label of each derived value, by id. */
	labels: Map<string, {label: string; step?: string; options?: Record<string, string>; /** A quantity input's dimension, as the rule text names it. */ dimension?: string; /** Its default tolerance (policy), as written. */ tolerance?: string}>;
};

function isObject(value: unknown): value is Record<string, unknown> {
	return typeof value === 'object' && value !== null && !Array.isArray(value);
}

function list(value: unknown): Array<Record<string, unknown>> {
	return Array.isArray(value) ? value.filter(isObject) : [];
}

function words(value: unknown): string | undefined {
	return typeof value === 'string' && value.trim() !== '' ? value : undefined;
}

/**
 * Reads step titles and labels from the embedded rule text. The text is covered by the
 * signatures, but a report must still print when it cannot be read: it then gives ids only.
 */
export function ruleOutline(text: string): RuleOutline {
	const outline: RuleOutline = {steps: [], labels: new Map()};
	let data: unknown;
	try {
		data = parse(text, {maxAliasCount: 100, logLevel: 'silent'});
	} catch {
		return outline;
	}
	if (!isObject(data)) return outline;
	for (const step of list(data['steps'])) {
		const id = words(step['id']);
		if (!id) continue;
		outline.steps.push({id, title: words(step['title']) ?? id});
		for (const input of list(step['inputs'])) {
			const inputId = words(input['id']);
			if (!inputId) continue;
			const options = isObject(input['options']) ? Object.fromEntries(Object.entries(input['options']).filter((entry): entry is [string, string] => typeof entry[1] === 'string')) : undefined;
			const dimension = words(input['dimension']);
			const tolerance = typeof input['default_tolerance'] === 'string' || typeof input['default_tolerance'] === 'number' ? String(input['default_tolerance']) : undefined;
			outline.labels.set(inputId, {label: words(input['label']) ?? inputId, step: id, ...(options ? {options} : {}), ...(dimension ? {dimension} : {}), ...(tolerance ? {tolerance} : {})});
		}
	}
	for (const derived of list(data['derived'])) {
		const id = words(derived['id']);
		if (id) outline.labels.set(id, {label: words(derived['label']) ?? id});
	}
	return outline;
}
