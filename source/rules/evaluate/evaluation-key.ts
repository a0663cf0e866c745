import type {CompiledFormula} from '../compile/formula.js';
import type {CompiledRules} from '../compile/compiled-rules.js';
import type {Answers} from './answers.js';

const referencedByRules = new WeakMap<CompiledRules, ReadonlySet<string>>();

/**
 * The names an evaluation under these rules reads the value of: those used by any condition,
 * formula or table, and those a check's message puts in its text. Any other input enters the
 * evaluation only by being given or not (a missing input).
 */
function referencedNames(rules: CompiledRules): ReadonlySet<string> {
	const known = referencedByRules.get(rules);
	if (known) return known;
	const names = new Set<string>();
	const add = (formula: CompiledFormula | undefined) => {
		for (const name of formula?.names ?? []) names.add(name);
	};
	for (const input of rules.inputs.values()) add(input.when);
	for (const confirmation of rules.confirmations.values()) add(confirmation.when);
	for (const derived of rules.derived) add(derived.formula);
	for (const table of rules.tables.values()) names.add(table.key).add(table.value);
	for (const check of rules.checks) {
		for (const formula of [check.when, check.holds, check.value, check.limit]) add(formula);
		for (const match of (check.check.message ?? '').matchAll(/\{\{\s*([a-zA-Z_]\w*)\s*\}\}/g)) names.add(match[1]!);
	}
	referencedByRules.set(rules, names);
	return names;
}

/**
 * A key that is equal for two sets of answers exactly when evaluate() gives them the same
 * evaluation under these rules: every input the evaluation reads by value (everything of the
 * answer but the text as typed, which the evaluation never reads), whether each other input is
 * given, and every confirmation's answer and note. Inputs the rules do not have are left out,
 * as evaluate() leaves them out. Records of one setup with the same numbers share a key, so an
 * audit evaluates them once (evaluate is pure).
 */
export function evaluationKey(rules: CompiledRules, answers: Answers): string {
	const referenced = referencedNames(rules);
	const inputs: string[] = [];
	for (const id of rules.inputs.keys()) {
		const answer = answers.inputs.get(id);
		if (!answer) inputs.push('0');
		else if (!referenced.has(id)) inputs.push('1');
		else inputs.push(answerText(answer));
	}
	const confirmations = [...answers.confirmations].sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0));
	// The JSON text of [sha256, inputs, confirmations], with each answer's part written once per answer object.
	return `[${JSON.stringify(rules.sha256)},[${inputs.join(',')}],${JSON.stringify(confirmations)}]`;
}

/** The JSON text of an answer without the text as typed; kept per answer object (an audit reads each distinct entry once and shares its answer). */
const answerTexts = new WeakMap<object, string>();

function answerText(answer: object): string {
	let text = answerTexts.get(answer);
	if (text === undefined) {
		text = JSON.stringify({...answer, entered: undefined});
		answerTexts.set(answer, text);
	}
	return text;
}
