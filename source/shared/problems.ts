import {messages, type ProblemCode} from './messages.js';

/**
 * The shape every coded message shares (a problem, a plan finding): a code whose words live in
 * messages.ts, and the values that fill the words' placeholders.
 */
export type CodedMessage<C extends ProblemCode = ProblemCode> = {
	code: C;
	/** Values that fill the message's placeholders. */
	data: Record<string, string | number>;
};

/** A problem found in a rule file, an answers file or an entry, located where it arises. */
export type Problem = CodedMessage & {
	severity: 'error' | 'warning';
	/** Path of the file, when the problem is in one. */
	file?: string;
	/** 1-based line and column in that file. */
	line?: number;
	column?: number;
	/** The field concerned, as a dotted path (`checks.3.at_most`). */
	field?: string;
};

/** Makes an error-severity problem. */
export function problem(code: ProblemCode, data: Problem['data'] = {}, where: Partial<Pick<Problem, 'file' | 'line' | 'column' | 'field'>> = {}): Problem {
	return {code, severity: 'error', data, ...where};
}

/** Makes a warning-severity problem. */
export function warning(code: ProblemCode, data: Problem['data'] = {}, where: Partial<Pick<Problem, 'file' | 'line' | 'column' | 'field'>> = {}): Problem {
	return {code, severity: 'warning', data, ...where};
}

/** Fills `{{name}}` placeholders from data; unknown ones stay visible so they are noticed. */
export function fillPlaceholders(template: string, data: Record<string, string | number>): string {
	return template.replaceAll(/\{\{\s*([a-zA-Z_][\w]*)\s*\}\}/g, (whole, name: string) => (Object.hasOwn(data, name) ? String(data[name]) : whole));
}

/** A coded message in words (a problem without its location, a plan finding without its subject). */
export function describeProblem(found: CodedMessage): string {
	return fillPlaceholders(messages[found.code], found.data);
}

/** One line for a person: `file:line:column: error: field: message`. */
export function formatProblem(found: Problem): string {
	const where = [found.file, found.line, found.line === undefined ? undefined : found.column].filter((part) => part !== undefined).join(':');
	const field = found.field ? `${found.field}: ` : '';
	return `${where ? `${where}: ` : ''}${found.severity}: ${field}${describeProblem(found)}`;
}
