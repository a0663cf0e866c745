import {problem, type Problem} from '../../shared/problems.js';
import {failure, success, type Result} from '../../shared/result.js';
import {parseYamlSource, readTextFile, type YamlSource} from '../../shared/yaml-source.js';
import type {Answers, ConfirmationAnswer, InputAnswer} from './answers.js';
import type {CompiledRules} from '../compile/compiled-rules.js';
import {parseConfirmationEntry, parseInputEntry} from './input-entry.js';
import {foldLegacyTolerances} from './legacy-tolerance.js';
import {didYouMean} from '../../shared/did-you-mean.js';
import {hasLineBreak} from '../../shared/one-line.js';

const expected = 'an answers file (YAML with setup, inputs and confirmations)';
const topKeys = new Set(['setup', 'inputs', 'confirmations']);
/** Unknown ids get a "did you mean" hint up to this many; past it, a file is not a typo but a wrong file, and the hints would cost time for nothing. */
const hintedUnknownIds = 20;

/** Reads an answers file against the rules; every problem names file, line and field. */
export function loadAnswers(file: string, rules: CompiledRules): Result<Answers, Problem> {
	const text = readTextFile(file, expected);
	if (!text.ok) return text;
	return loadAnswersFromText(text.value, file, rules);
}

/** The same as loadAnswers, for text already in hand. */
export function loadAnswersFromText(text: string, file: string, rules: CompiledRules): Result<Answers, Problem> {
	const parsed = parseYamlSource(text, file, expected);
	if (!parsed.ok) return parsed;
	const source = parsed.value;
	const data = source.data as Record<string, unknown>;
	const problems: Problem[] = [];
	let unknownIds = 0;
	const hint = (id: string, known: Iterable<string>) => (++unknownIds <= hintedUnknownIds ? didYouMean(id, known) : '');
	const at = (path: Array<string | number>) => ({file, ...source.locate(path), field: path.join('.')});

	for (const key of Object.keys(data)) if (!topKeys.has(key)) problems.push(problem('answers-unknown-key', {key}, at([key])));
	if (data['setup'] !== undefined && typeof data['setup'] !== 'string') problems.push(problem('answers-not-text', {label: 'setup', received: typeof data['setup']}, at(['setup'])));
	else if (typeof data['setup'] === 'string' && hasLineBreak(data['setup'])) problems.push(problem('single-line', {label: 'the setup name'}, at(['setup'])));

	const inputs = new Map<string, InputAnswer>();
	const given = entries(data['inputs'], 'inputs', source, problems);
	const folded = foldLegacyTolerances(Object.fromEntries(given), rules);
	for (const {id, problem: refused} of folded.problems) problems.push(problem(refused.code, refused.data, at(['inputs', id])));
	for (const [id] of given) {
		if (!Object.hasOwn(folded.entries, id)) continue;
		const raw = folded.entries[id];
		const compiled = rules.inputs.get(id);
		if (!compiled) {
			problems.push(problem('answers-unknown-input', {id, hint: hint(id, rules.inputs.keys())}, at(['inputs', id])));
			continue;
		}
		if (raw === null || raw === undefined || raw === '') continue;
		// .inf and .nan read as numbers; echo what the operator wrote, not JavaScript's spelling.
		const written = typeof raw === 'number' && !Number.isFinite(raw) ? scalarSource(source, ['inputs', id]) ?? raw : raw;
		const entry = parseInputEntry(compiled, written);
		if (entry.ok) inputs.set(id, entry.value);
		else problems.push(problem(entry.problem.code, entry.problem.data, at(['inputs', id])));
	}

	const confirmations = new Map<string, ConfirmationAnswer>();
	for (const [id, raw] of entries(data['confirmations'], 'confirmations', source, problems)) {
		const compiled = rules.confirmations.get(id);
		if (!compiled) {
			problems.push(problem('answers-unknown-confirmation', {id, hint: hint(id, rules.confirmations.keys())}, at(['confirmations', id])));
			continue;
		}
		if (raw === null || raw === undefined || raw === '') continue;
		const isObject = typeof raw === 'object' && !Array.isArray(raw);
		const record = isObject ? (raw as Record<string, unknown>) : {answer: raw};
		const entry = parseConfirmationEntry(compiled, record['answer'], record['note']);
		if (entry.ok) confirmations.set(id, entry.value);
		else problems.push(problem(entry.problem.code, entry.problem.data, at(['confirmations', id])));
	}

	if (problems.length > 0) return failure(problems);
	// Kept as written (the record holds it byte for byte); anything shown on a terminal is stripped there.
	const setup = typeof data['setup'] === 'string' && data['setup'].trim() !== '' ? data['setup'] : undefined;
	return success({...(setup ? {setup} : {}), inputs, confirmations}, parsed.warnings);
}

function entries(value: unknown, key: string, source: YamlSource, problems: Problem[]): Array<[string, unknown]> {
	if (value === undefined || value === null) return [];
	if (typeof value !== 'object' || Array.isArray(value)) {
		problems.push(problem('schema', {detail: `${key} must be a mapping of ids to values`}, {file: source.file, ...source.locate([key]), field: key}));
		return [];
	}
	return Object.entries(value as Record<string, unknown>);
}

function scalarSource(source: YamlSource, path: Array<string | number>): string | undefined {
	const node = source.document.getIn(path, true) as {source?: unknown} | undefined;
	return typeof node?.source === 'string' ? node.source : undefined;
}
