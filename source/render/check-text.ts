import type {InterlockLink} from '../interlock/functional-test/test-link.js';
import {deferral} from '../shared/deferral.js';
import type {Paint} from '../shared/paint.js';
import type {Answers, InputAnswer} from '../rules/evaluate/answers.js';
import type {Input} from '../rules/file/schema.js';
import type {CompiledRules} from '../rules/compile/compiled-rules.js';
import {outcomeWords, type CheckResult, type ConfirmationResult, type DerivedResult, type Evaluation, type Verdict} from '../rules/evaluate/evaluation.js';
import {shownDerived} from '../rules/evaluate/shown-derived.js';
import {formatQuantity} from '../quantities/format.js';
import {confirmationWords, countVerdicts, verdictWords} from '../rules/evaluate/verdict-words.js';
import {version} from '../shared/version.js';
import {wrap} from '../shared/wrap.js';
import {oneLine} from '../shared/one-line.js';
import {displayPath} from '../shared/display-path.js';
import {cornerWords, rangeText} from '../rules/evaluate/worst-corner.js';

const order = {fail: 0, advise: 1, open: 2, pass: 3, skip: 4} as const;

function paintVerdict(paint: Paint, verdict: Verdict, text: string): string {
	if (verdict === 'pass') return paint.pass(text);
	if (verdict === 'fail') return paint.fail(text);
	if (verdict === 'advise') return paint.advise(text);
	if (verdict === 'open') return paint.open(text);
	return paint.dim(text);
}

/** The figures of a check in one line: `1.74 W ≤ 2 W · margin 261 mW (13 %)`. */
export function checkFigures(check: CheckResult): string | undefined {
	if (!check.value || !check.limit || !check.margin) return undefined;
	const sign = check.relation === 'at_most' ? '≤' : '≥';
	const fraction = check.margin.fraction === null ? '' : ` (${formatQuantity(Math.abs(check.margin.fraction), 'ratio')})`;
	const amount = check.margin.text.replace(/^-/, '');
	if (check.verdict === 'pass') return `${check.value.text} ${sign} ${check.limit.text} · margin ${amount}${fraction}`;
	const miss = check.relation === 'at_most' ? 'over the limit by' : 'short of the limit by';
	return `${check.value.text}, limit ${sign} ${check.limit.text} · ${miss} ${amount}${fraction}`;
}

function checkLines(check: CheckResult, paint: Paint, width: number, withMessage: boolean): string[] {
	const label = paintVerdict(paint, check.verdict, verdictWords[check.verdict].padEnd(12));
	const lines = wrap(check.title, width, '                ');
	lines[0] = `   ${label} ${lines[0]!.trimStart()}`;
	const figures = checkFigures(check);
	if (figures) lines.push(...wrap(figures, width, '                '));
	if (check.corner) lines.push(...wrap(cornerWords(check.corner), width, '                '));
	if (check.needs?.length) lines.push(...wrap(`needs ${check.needs.join(', ')}`, width, '                '));
	if (check.error) lines.push(...wrap(check.error, width, '                '));
	if (check.reason) lines.push(...wrap(check.reason, width, '                '));
	if (withMessage && check.message) lines.push(...wrap(check.message, width, '                '));
	return lines;
}

function derivedLines(entry: DerivedResult, text: string, width: number): string[] {
	const lines = wrap(entry.label, width, '                ');
	lines[0] = `   ${'derived'.padEnd(12)} ${lines[0]!.trimStart()}`;
	lines.push(...wrap(`= ${text}`, width, '                '));
	return lines;
}

function confirmationLines(entry: ConfirmationResult, paint: Paint, width: number): string[] {
	const status = entry.status;
	const text = confirmationWords[status].padEnd(12);
	const painted = status === 'yes' ? paint.pass(text) : status === 'no' ? paint.fail(text) : status === 'unanswered' || status === 'open' ? paint.open(text) : paint.dim(text);
	const lines = wrap(entry.statement, width, '                ');
	lines[0] = `   ${painted} ${lines[0]!.trimStart()}`;
	if (entry.note) lines.push(...wrap(`note: ${entry.note}`, width, '                '));
	return lines;
}

function answerText(input: Input, answer: InputAnswer): string {
	if (answer.kind === 'quantity') return answer.range && answer.range.high > answer.range.low ? rangeText(answer.range, answer.dimension) : formatQuantity(answer.si, answer.dimension);
	if (answer.kind === 'choice' && input.kind === 'choice') return oneLine(input.options[answer.option] ?? answer.option);
	if (answer.kind === 'yes_no') return answer.value ? 'yes' : 'no';
	return oneLine(answer.entered);
}

/**
 * The bench check as text for a person: header, caution, each step's inputs, checks and
 * confirmations, a summary with failures first, the interlock test used (if a plan is named),
 * and the outcome with the deferral.
 */
export function checkText(rules: CompiledRules, answers: Answers, evaluation: Evaluation, paint: Paint, width = 100, interlock: InterlockLink | null = null): string {
	const out: string[] = [];
	out.push(paint.bold(`prelase ${version} · bench check`));
	// Single-line fields are refused with a line break at load; oneLine keeps that true here too.
	out.push(`Rules   ${oneLine(rules.rules.name)}`);
	out.push(`        ${displayPath(rules.file)} · sha256 ${rules.sha256.slice(0, 16)}`);
	if (answers.setup) out.push(`Setup   ${oneLine(answers.setup)}`);
	out.push('', paint.bold('CAUTION'), ...wrap(rules.rules.caution, width, '  '));

	rules.rules.steps.forEach((step, index) => {
		out.push('', paint.bold(`${index + 1}. ${oneLine(step.title)}`));
		if (step.summary) out.push(...wrap(step.summary, width, '   ').map((line) => paint.dim(line)));
		for (const input of step.inputs) {
			const answer = answers.inputs.get(input.id);
			const asked = Boolean(answer) || evaluation.missingInputs.includes(input.id) || input.optional;
			const shown = answer ? answerText(input, answer) : asked ? paint.open('? not given') : paint.dim('- not asked');
			out.push(`   ${input.id.padEnd(30)} ${shown}`);
		}
		for (const {entry, text} of shownDerived(evaluation, step.id)) out.push(...derivedLines(entry, text, width));
		for (const check of evaluation.checks.filter((entry) => entry.step === step.id)) out.push(...checkLines(check, paint, width, false));
		for (const entry of evaluation.confirmations.filter((item) => item.step === step.id)) out.push(...confirmationLines(entry, paint, width));
	});

	if (rules.switchedOff.length > 0) {
		out.push('', paint.bold('Switched off by the rule file'));
		for (const {check} of rules.switchedOff) out.push(...wrap(`- off      ${check.title}: ${check.switched_off ?? ''}`, width, '             ').map((line, index) => (index === 0 ? `   ${line.trimStart()}` : line)));
	}

	const counts = countVerdicts(evaluation.checks);
	out.push('', paint.bold(`Summary: ${counts.fail} fail · ${counts.advise} advise · ${counts.open} open · ${counts.pass} pass · ${counts.skip} skip`));
	const notable = evaluation.checks.filter((check) => check.verdict !== 'pass' && check.verdict !== 'skip').sort((a, b) => order[a.verdict] - order[b.verdict]);
	for (const check of notable) out.push(...checkLines(check, paint, width, true));
	for (const entry of evaluation.confirmations.filter((item) => item.status === 'no')) out.push(...confirmationLines(entry, paint, width));
	for (const entry of evaluation.confirmations.filter((item) => item.status === 'unanswered' || item.status === 'open')) out.push(...confirmationLines(entry, paint, width));
	if (evaluation.missingInputs.length > 0) out.push(...wrap(`Inputs not given: ${evaluation.missingInputs.join(', ')}`, width, '   '));
	if (notable.length === 0) out.push('   Every check that applies holds.');
	if (interlock) {
		const mark = interlock.status === 'current' ? paint.pass('✓') : paint.fail('✗');
		out.push('', ...wrap(`${mark} Interlock test (${interlock.status}): ${interlock.text}`, width, '   '));
	}

	const words = outcomeWords[evaluation.outcome].toUpperCase();
	const outcome = evaluation.outcome === 'clear_to_energize' ? paint.pass(words) : evaluation.outcome === 'do_not_energize' ? paint.fail(words) : paint.open(words);
	out.push('', paint.bold('Outcome: ') + outcome);
	out.push(...wrap(deferral, width, '  '));
	return out.join('\n');
}
