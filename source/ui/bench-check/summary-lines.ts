import {checkFigures} from '../../render/check-text.js';
import type {CheckResult, Evaluation} from '../../rules/evaluate/evaluation.js';
import {confirmationStyle, verdictStyle} from '../verdict-style.js';

/** One line of the summary, before wrapping. */
export type SummaryLine = {key: string; text: string; color?: string; dim?: boolean; /** Laid out already (a chart): cut at the width, never re-wrapped. */ preformatted?: boolean};

/** What the summary lists, in the order it lists them: what blocks energizing comes first. */
export type SummaryGroup = 'fail' | 'open' | 'advise' | 'pass';

function checkLines(check: CheckResult): SummaryLine[] {
	const style = verdictStyle[check.verdict];
	const lines: SummaryLine[] = [{key: check.id, text: `${style.label.padEnd(10)}${check.title}`, color: style.color}];
	const figures = checkFigures(check) ?? (check.needs?.length ? `needs ${check.needs.join(', ')}` : check.error);
	if (figures) lines.push({key: `${check.id}-figures`, text: `          ${figures}`, dim: true});
	if (check.message && check.verdict !== 'pass') lines.push({key: `${check.id}-message`, text: `          ${check.message}`});
	return lines;
}

/**
 * The summary's lines by group: failures (checks that fail, confirmations answered no), then
 * what is unanswered or open (confirmations, open checks, inputs not given), then advice, then
 * passes. Skipped checks and confirmations answered yes are counted, not listed.
 */
export function summaryGroups(evaluation: Evaluation, interlock?: {status: string; text: string} | null): Record<SummaryGroup, SummaryLine[]> {
	const groups: Record<SummaryGroup, SummaryLine[]> = {fail: [], open: [], advise: [], pass: []};
	for (const entry of evaluation.confirmations) {
		if (entry.status === 'yes' || entry.status === 'skip') continue;
		const style = confirmationStyle[entry.status];
		const line = {key: `c-${entry.id}`, text: `${style.label.padEnd(13)}${entry.statement}${entry.note ? ` (${entry.note})` : ''}`, color: style.color};
		if (entry.status === 'no') groups.fail.push(line);
		else if (entry.status === 'not_applicable') groups.pass.push(line);
		else groups.open.push(line);
	}
	const byVerdict = (verdict: CheckResult['verdict']) => evaluation.checks.filter((check) => check.verdict === verdict).flatMap(checkLines);
	groups.fail.unshift(...byVerdict('fail'));
	groups.open.push(...byVerdict('open'));
	if (evaluation.missingInputs.length > 0) groups.open.push({key: 'missing', text: `Inputs not given: ${evaluation.missingInputs.join(', ')}`, color: 'cyan'});
	groups.advise.push(...byVerdict('advise'));
	groups.pass.unshift(...byVerdict('pass'));
	if (interlock?.status === 'current') groups.pass.push({key: 'interlock', text: `${'Interlock'.padEnd(13)}${interlock.text}`, color: 'green'});
	return groups;
}

/** Every line of the summary in its order. */
export function summaryLines(evaluation: Evaluation, interlock?: {status: string; text: string} | null): SummaryLine[] {
	const groups = summaryGroups(evaluation, interlock);
	return [...groups.fail, ...groups.open, ...groups.advise, ...groups.pass];
}

const plural = (count: number, one: string, many: string) => `${count} ${count === 1 ? one : many}`;

/** The one line that says why the outcome is what it is, naming the first thing that decides it. */
export function outcomeReason(evaluation: Evaluation): string {
	const stops = evaluation.checks.filter((check) => check.severity === 'stop');
	const failing = stops.filter((check) => check.verdict === 'fail');
	const refused = evaluation.confirmations.filter((entry) => entry.status === 'no');
	if (evaluation.outcome === 'do_not_energize') {
		const parts = [failing.length ? plural(failing.length, 'stop check fails', 'stop checks fail') : '', refused.length ? plural(refused.length, 'confirmation answered no', 'confirmations answered no') : ''].filter(Boolean);
		const first = failing[0]?.title ?? refused[0]?.statement ?? '';
		return `${parts.join(', ')}: ${first}`;
	}
	if (evaluation.outcome === 'incomplete') {
		const unanswered = evaluation.confirmations.filter((entry) => entry.status === 'unanswered' || entry.status === 'open');
		const open = stops.filter((check) => check.verdict === 'open');
		const parts = [
			unanswered.length ? plural(unanswered.length, 'confirmation unanswered', 'confirmations unanswered') : '',
			open.length ? plural(open.length, 'stop check open', 'stop checks open') : '',
			evaluation.missingInputs.length ? plural(evaluation.missingInputs.length, 'input not given', 'inputs not given') : '',
		].filter(Boolean);
		const first = unanswered[0]?.statement ?? open[0]?.title ?? evaluation.missingInputs[0] ?? '';
		return `${parts.join(', ')}: ${first}`;
	}
	return 'every stop check holds and every confirmation that applies is answered';
}
