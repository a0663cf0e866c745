import {countVerdicts} from '../rules/evaluate/verdict-words.js';
import {formatQuantity} from '../quantities/format.js';
import type {CompiledRules} from '../rules/compile/compiled-rules.js';
import {outcomeWords, type Evaluation, type Shown, type Verdict} from '../rules/evaluate/evaluation.js';
import type {RecordAnswers} from './audit-answers.js';
import {finding, type Finding} from '../records/findings.js';
import {setupFingerprint} from '../records/build-body.js';
import {confirmationList, derivedEntry, inputEntry, type RecordBody} from '../records/record-schema.js';
import {cornerFinding} from './audit-corner.js';

type RecordedShown = {si: number; text: string} | undefined;

/** Equal SI numbers, allowing for the last bits of a different floating-point path. */
export function sameNumber(a: number, b: number): boolean {
	return a === b || Math.abs(a - b) <= 1e-9 * Math.max(Math.abs(a), Math.abs(b));
}

function describeList(items: readonly string[]): string {
	return items.length === 0 ? 'none' : items.join(', ');
}

function describeCounts(counts: Record<string, number>): string {
	return (['pass', 'fail', 'advise', 'open', 'skip'] as const).map((verdict) => `${counts[verdict] ?? 0} ${verdict}`).join(' · ');
}

/** Inputs: each as re-read from what was entered must give the value the record holds. */
function inputFindings(body: RecordBody, read: RecordAnswers): Finding[] {
	const found: Finding[] = [];
	for (const id of read.unknownInputs) found.push(finding('consistency', 'audit-input-unknown', {id}));
	for (const refused of read.refusedInputs) found.push(finding('consistency', 'audit-input-refused', {...refused}));
	for (const [id, answer] of read.answers.inputs) {
		const recorded = inputEntry(body.inputs[id])!;
		// A record made since the lean body keeps only what was entered: nothing else to compare.
		if (recorded.si === undefined && recorded.option === undefined && recorded.value === undefined) continue;
		const mismatch = (computed: string, held: string) => found.push(finding('consistency', 'audit-input-value-mismatch', {id, entered: recorded.entered, computed, recorded: held}));
		if (answer.kind === 'quantity') {
			if (recorded.si === undefined || !sameNumber(recorded.si, answer.si)) mismatch(formatQuantity(answer.si, answer.dimension), recorded.si === undefined ? 'no value' : (recorded.text ?? String(recorded.si)));
		} else if (answer.kind === 'choice') {
			if (recorded.option !== answer.option) mismatch(answer.option, recorded.option ?? 'no option');
		} else if (recorded.value !== answer.value) {
			mismatch(String(answer.value), recorded.value === undefined ? 'no value' : String(recorded.value));
		}
	}
	for (const id of read.unknownConfirmations) found.push(finding('consistency', 'audit-confirmation-unknown', {id}));
	return found;
}

function derivedFindings(body: RecordBody, evaluation: Evaluation): Finding[] {
	const found: Finding[] = [];
	const describe = (entry: ReturnType<typeof derivedEntry> | undefined) => (!entry ? 'absent' : 'si' in entry ? entry.text : 'open' in entry ? 'open' : 'not computable');
	const seen = new Set<string>();
	for (const entry of evaluation.derived) {
		seen.add(entry.id);
		const stated = body.derived[entry.id];
		const recorded = stated === undefined ? undefined : derivedEntry(stated);
		const computed = entry.status === 'value' ? entry.value.text : entry.status === 'open' ? 'open' : 'not computable';
		const same =
			entry.status === 'value' ? recorded !== undefined && 'si' in recorded && sameNumber(recorded.si, entry.value.si) : entry.status === 'open' ? recorded !== undefined && 'open' in recorded : recorded !== undefined && 'error' in recorded;
		if (!same) found.push(finding('consistency', 'audit-derived-mismatch', {id: entry.id, recorded: describe(recorded), computed}));
	}
	for (const id of Object.keys(body.derived)) if (!seen.has(id)) found.push(finding('consistency', 'audit-derived-mismatch', {id, recorded: describe(derivedEntry(body.derived[id]!)), computed: 'absent'}));
	return found;
}

function figureFinding(id: string, what: 'value' | 'limit', recorded: RecordedShown, computed: Shown | undefined): Finding | undefined {
	if (!recorded && !computed) return undefined;
	if (recorded && computed && sameNumber(recorded.si, computed.si)) return undefined;
	return finding('consistency', 'audit-figure-mismatch', {id, what, recorded: recorded?.text ?? 'absent', computed: computed?.text ?? 'absent'});
}

function checkFindings(body: RecordBody, evaluation: Evaluation): Finding[] {
	const found: Finding[] = [];
	const recorded = new Map(body.checks.map((check) => [check.id, check]));
	for (const check of evaluation.checks) {
		const held = recorded.get(check.id);
		recorded.delete(check.id);
		if (!held) {
			found.push(finding('consistency', 'audit-check-missing', {id: check.id}));
			continue;
		}
		if (held.verdict !== check.verdict) {
			found.push(finding('consistency', 'audit-verdict-mismatch', {id: check.id, recorded: held.verdict, computed: check.verdict}));
			continue;
		}
		for (const what of ['value', 'limit'] as const) {
			const figure = figureFinding(check.id, what, held[what], check[what]);
			if (figure) found.push(figure);
		}
		const corner = cornerFinding(check.id, held.corner, check.corner);
		if (corner) found.push(corner);
	}
	for (const id of recorded.keys()) found.push(finding('consistency', 'audit-check-extra', {id}));

	// The counts summarise the record's own list of checks (whose verdicts are compared above).
	const counts = countVerdicts(body.checks);
	const countsDiffer = Object.keys({...counts, ...body.counts}).some((key) => (body.counts[key] ?? 0) !== (counts[key as Verdict] ?? 0));
	if (countsDiffer) found.push(finding('consistency', 'audit-counts-mismatch', {recorded: describeCounts(body.counts), computed: describeCounts(counts)}));
	return found;
}

function confirmationFindings(body: RecordBody, evaluation: Evaluation): Finding[] {
	const found: Finding[] = [];
	const recorded = new Map(confirmationList(body).map((entry) => [entry.id, entry.status as string]));
	for (const entry of evaluation.confirmations) {
		const held = recorded.get(entry.id) ?? 'absent';
		recorded.delete(entry.id);
		if (held !== entry.status) found.push(finding('consistency', 'audit-confirmation-mismatch', {id: entry.id, recorded: held, computed: entry.status}));
	}
	for (const [id, held] of recorded) found.push(finding('consistency', 'audit-confirmation-mismatch', {id, recorded: held, computed: 'absent'}));
	return found;
}

/**
 * Whether a record's conclusions follow from its numbers: the inputs as entered, re-read and
 * re-evaluated under the rules embedded in the record, must give every recorded value,
 * verdict, confirmation status, the missing inputs, the counts, the setup fingerprint and
 * the outcome. Each difference is a finding.
 */
export function consistencyFindings(body: RecordBody, rules: CompiledRules, read: RecordAnswers, evaluation: Evaluation): Finding[] {
	return [...identityFindings(body, rules, read), ...conclusionFindings(body, evaluation)];
}

/** The part of consistencyFindings that reads the record's own inputs as entered and its setup: different in every record. */
export function identityFindings(body: RecordBody, rules: CompiledRules, read: RecordAnswers): Finding[] {
	const found = inputFindings(body, read);
	const setup = setupFingerprint(rules, read.answers).fingerprint;
	if (setup !== body.setup.fingerprint) found.push(finding('consistency', 'audit-setup-fingerprint-mismatch', {recorded: body.setup.fingerprint, computed: setup}));
	return found;
}

/**
 * The part of consistencyFindings that compares the record's conclusions with the evaluation:
 * it reads only the evaluation and the body's derived values, checks, counts, confirmations,
 * missing inputs and outcome (conclusionParts), so records that hold the same conclusions under
 * the same evaluation get the same findings.
 */
export function conclusionFindings(body: RecordBody, evaluation: Evaluation): Finding[] {
	const found = [...derivedFindings(body, evaluation), ...checkFindings(body, evaluation), ...confirmationFindings(body, evaluation)];
	const missing = [...evaluation.missingInputs].sort();
	const heldMissing = [...body.missingInputs].sort();
	if (missing.join('\n') !== heldMissing.join('\n')) found.push(finding('consistency', 'audit-missing-inputs-mismatch', {recorded: describeList(heldMissing), computed: describeList(missing)}));
	if (evaluation.outcome !== body.outcome) found.push(finding('consistency', 'audit-outcome-mismatch', {recorded: outcomeWords[body.outcome], computed: outcomeWords[evaluation.outcome]}));
	return found;
}

/** Every part of a body that conclusionFindings reads. */
export function conclusionParts(body: RecordBody): unknown[] {
	return [body.derived, body.checks, body.counts, body.confirmations, body.missingInputs, body.outcome];
}
