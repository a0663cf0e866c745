import {verdictWords} from '../rules/evaluate/verdict-words.js';
import {formatQuantity, roundedText} from '../quantities/format.js';
import {outcomeWords} from '../rules/evaluate/evaluation.js';
import {deferral} from '../shared/deferral.js';
import {shortFingerprint} from '../records/key-material.js';
import type {TrustedKey} from '../records/key-files.js';
import {confirmationList, derivedEntry, inputEntry, type AnyRecord, type RecordConfirmation, type BenchRecord, type RecordBody} from '../records/record-schema.js';
import {ruleOutline, type RuleOutline} from './report-rule-outline.js';
import {cornerWords} from '../rules/evaluate/worst-corner.js';
import {dimensions, type Dimension} from '../quantities/dimensions.js';
import {looksLikeRange, parseRange, parseTolerance, withTolerance} from '../quantities/range-entry.js';
import {parseQuantity} from '../quantities/parse-quantity.js';
import {readRecordedCorner} from '../records/record-corner.js';
import {purposeOf} from '../records/signature-purpose.js';

type RecordCheck = RecordBody['checks'][number];

/** How each signature fared when the record was read (from the integrity check). */
export type SignatureStatus = {index: number; valid: boolean; reason?: string};

/** Whose keys the reader holds: their own key's fingerprint and the colleagues' keys they trust. */
export type TrustInfo = {own?: string; trusted: readonly TrustedKey[]};

/** Verdicts and answers as a word with a symbol, so they read without colour. */
/** Confirmation answers as a word with a symbol. */
export const answerWords = {yes: '✓ yes', no: '✗ NO', not_applicable: '– not applicable', unanswered: '? unanswered', skip: '– skip', open: '? open'} as const;

/** One check, as a report shows it. */
export type CheckRow = {
	id: string;
	verdict: RecordCheck['verdict'];
	verdictText: string;
	title: string;
	severity: string;
	value: string;
	limit: string;
	margin: string;
	fraction: string;
	/** Message, needs and error: what the check says beyond its figures. */
	notes: string[];
	explanation: string;
	basis: string;
};

/** One confirmation with its answer and note. */
export type ConfirmationRow = {id: string; status: RecordConfirmation['status']; answerText: string; statement: string; note: string};

/** One input as entered and as recorded. */
export type InputRow = {id: string; label: string; entered: string; value: string; si: string};

/** One signature: who, what it means, when, which key, verified or not, trusted or not. */
export type SignatureRow = {number: number; name: string; role: string; meaning: string; signedAt: string; key: string; fingerprint: string; verified: boolean; verifiedText: string; trusted: boolean; trustText: string};

/** Everything a printed report shows, in the order it shows it; the writers only lay it out. */
export type ReportModel = {
	title: string;
	setupName: string;
	/** The setup fingerprint short enough to read aloud (hex digits in groups of four). */
	setupKey: string;
	outcome: RecordBody['outcome'];
	outcomeText: string;
	caution: string;
	deferral: string;
	countsText: string;
	/** Failing, advisory and open checks, failures first. */
	attention: CheckRow[];
	/** Confirmations answered no, then those unanswered or open. */
	attentionConfirmations: ConfirmationRow[];
	missingInputs: string[];
	details: Array<[string, string]>;
	amendment?: {record: string; bodySha256: string; reason: string};
	steps: Array<{id: string; title: string; inputs: InputRow[]; checks: CheckRow[]; confirmations: ConfirmationRow[]}>;
	derived: Array<{id: string; label: string; value: string}>;
	signatures: SignatureRow[];
};

const attentionOrder = {fail: 0, advise: 1, open: 2, pass: 3, skip: 4} as const;

// Control characters in text from a record are removed at the output boundary (cli/terminal-io.ts), as for every renderer.
const clean = (text: string | null | undefined): string => text ?? '';

/**
 * The link of a record to the previous record its key wrote to the same folder, in words: how
 * an auditor sees that no record of the chain went missing (prelase audit checks the links).
 */
export function previousText(previous: RecordBody['previous']): string {
	if (previous === undefined) return 'not stated (the record was made before records were chained)';
	if (previous === null) return 'none: the first record of this key in its records folder';
	return `${clean(previous.file)} (SHA-256 of its bytes ${previous.sha256})`;
}

/** Said in place of a check's basis or a confirmation's statement when the rule text a record names could not be read. */
const missingWords = 'in the rule text this record names, which could not be read';

/** Said in place of the rule file's caution when the rule text a record names could not be read. */
const missingCaution = 'The rule text this record names could not be read, so its caution is not shown here. Laser radiation can injure eyes and skin: follow the site\'s procedures and wear the eyewear they require.';

/**
 * A check's margin with its fraction of the limit. Records since the lean body state the margin
 * as shown; its number and fraction follow from the value and the limit, as in the evaluation.
 */
function marginOf(check: RecordCheck): {text: string; fraction: number | null} | undefined {
	const margin = check.margin;
	if (margin === undefined) return undefined;
	if (typeof margin !== 'string') return {text: margin.text, fraction: margin.fraction};
	if (!check.value || !check.limit || !check.relation || check.limit.si === 0) return {text: margin, fraction: null};
	const si = check.relation === 'at_most' ? check.limit.si - check.value.si : check.value.si - check.limit.si;
	return {text: margin, fraction: si / Math.abs(check.limit.si)};
}

/**
 * Where a check was judged, in words, from a record's corner line: each end's number read from
 * the range the record keeps as entered (or the single value and the rules' default tolerance),
 * in its unit when the rule text names the input's dimension; else the end alone.
 */
function cornerNote(line: string, inputs: RecordBody['inputs'], outline: RuleOutline): string {
	const corner = readRecordedCorner(line);
	if (!corner) return `judged at ${line}`;
	const shown = corner.inputs.map(({id, end, si}) => {
		const known = outline.labels.get(id);
		const dimension = known?.dimension !== undefined && Object.hasOwn(dimensions, known.dimension) ? (known.dimension as Dimension) : undefined;
		const value = si ?? (dimension ? endOf(inputEntry(inputs[id])?.entered ?? '', end, dimension, known?.tolerance) : undefined);
		return {id, end, value: {si: value ?? Number.NaN, dimension: dimension ?? 'ratio', text: value !== undefined && dimension ? formatQuantity(value, dimension) : ''}};
	});
	// Without a number, the end alone: "supply_nominal (low end)".
	return cornerWords({method: corner.method, inputs: shown}).replaceAll(/ {2,}/g, ' ');
}

/** The SI number at one end of what was entered for an input: its range, or its value widened by the rules' default tolerance. */
function endOf(entered: string, end: 'low' | 'high' | 'inside', dimension: Dimension, tolerance: string | undefined): number | undefined {
	if (end === 'inside') return undefined;
	let range: {low: number; high: number} | undefined;
	if (looksLikeRange(entered)) {
		const read = parseRange(entered, dimension);
		range = read.ok ? read.value : undefined;
	} else if (tolerance !== undefined) {
		const value = parseQuantity(entered, dimension);
		const spread = parseTolerance(tolerance, dimension);
		range = value.ok && spread.ok ? withTolerance(value.value.si, spread.value) : undefined;
	}
	return range?.[end];
}

function checkRow(check: RecordCheck, inputs: RecordBody['inputs'], outline: RuleOutline): CheckRow {
	// Without the rule text a lean record does not say which side of its limit a check holds on.
	const sign = check.relation === 'at_least' ? '≥' : check.relation === 'at_most' ? '≤' : 'limit';
	const figures = marginOf(check);
	let margin = '';
	if (figures) {
		const amount = clean(figures.text).replace(/^[-\u2212]/, '');
		margin = check.verdict === 'pass' ? amount : `${check.relation === 'at_least' ? 'short by' : check.relation === 'at_most' ? 'over by' : 'misses by'} ${amount}`;
	}
	const fraction = figures?.fraction === null || figures?.fraction === undefined ? '' : formatQuantity(Math.abs(figures.fraction), 'ratio');
	const notes = [check.message, check.needs?.length ? `needs ${check.needs.join(', ')}` : undefined, check.error, check.corner ? cornerNote(check.corner, inputs, outline) : undefined].filter((entry): entry is string => Boolean(entry)).map(clean);
	return {
		id: clean(check.id),
		verdict: check.verdict,
		verdictText: verdictWords[check.verdict],
		title: clean(check.title ?? check.id),
		severity: check.severity ?? 'severity unknown',
		value: check.value ? clean(check.value.text) : '',
		limit: check.limit ? `${sign} ${clean(check.limit.text)}` : '',
		margin,
		fraction,
		notes,
		explanation: clean(check.explanation ?? ''),
		basis: clean(check.basis ?? missingWords),
	};
}

function confirmationRow(entry: RecordConfirmation): ConfirmationRow {
	const needs = entry.needs?.length ? `needs ${entry.needs.join(', ')}` : '';
	return {id: clean(entry.id), status: entry.status, answerText: answerWords[entry.status], statement: clean(entry.statement ?? missingWords), note: clean(entry.note ?? needs)};
}

/** One signature of a record with its verification and trust, for printing. */
export function signatureRow(record: AnyRecord, status: SignatureStatus | undefined, index: number, trust: TrustInfo): SignatureRow {
	const signature = record.signatures[index]!;
	const verified = status?.valid === true;
	const trustedKey = trust.trusted.find((key) => key.fingerprint === signature.fingerprint);
	const own = trust.own === signature.fingerprint;
	return {
		number: index + 1,
		name: clean(signature.signer.name),
		role: clean(signature.signer.role),
		meaning: purposeOf(signature),
		signedAt: clean(signature.signedAt),
		key: shortFingerprint(signature.fingerprint),
		fingerprint: signature.fingerprint,
		verified,
		verifiedText: verified ? '✓ verified' : `✗ NOT VERIFIED${status?.reason ? `: ${clean(status.reason)}` : ''}`,
		trusted: own || Boolean(trustedKey),
		trustText: own ? '✓ your own key' : trustedKey ? `✓ trusted as ${clean(trustedKey.name)}` : '! not among your trusted keys',
	};
}

/**
 * Prepares a record for printing (control characters are removed at the output boundary),
 * checks are grouped by step in the rule file's order, failures are gathered
 * for the summary, and each signature carries its verification and trust status.
 */
export function reportModel(record: BenchRecord, signatures: readonly SignatureStatus[], trust: TrustInfo): ReportModel {
	const body = record.body;
	// A record whose stored rule text could not be found prints with ids instead of titles.
	const outline = ruleOutline(body.rules.text ?? '');
	const setupName = body.setup.name === null ? '(no setup name)' : clean(body.setup.name);
	const outcomeText = outcomeWords[body.outcome];
	const checks = body.checks.map((check) => checkRow(check, body.inputs, outline));
	const recordedConfirmations = confirmationList(body);
	const confirmations = recordedConfirmations.map(confirmationRow);

	const stepIds = [...outline.steps.map((step) => step.id)];
	const inputStep = (id: string) => outline.labels.get(id)?.step ?? '';
	for (const id of [...body.checks.map((check) => check.step ?? ''), ...recordedConfirmations.map((entry) => entry.step ?? ''), ...Object.keys(body.inputs).map(inputStep)]) {
		if (!stepIds.includes(id)) stepIds.push(id);
	}
	const titles = new Map(outline.steps.map((step) => [step.id, step.title]));
	const steps = stepIds
		.map((id) => ({
			id: clean(id),
			title: clean(id === '' ? (outline.steps.length === 0 ? 'Inputs, checks and confirmations (the rule text with their steps could not be read)' : 'Other inputs') : (titles.get(id) ?? id)),
			inputs: Object.entries(body.inputs)
				.filter(([inputId]) => inputStep(inputId) === id)
				.map(([inputId, recorded]): InputRow => {
					const input = inputEntry(recorded)!;
					const known = outline.labels.get(inputId);
					const option = input.option === undefined ? undefined : (known?.options?.[input.option] ?? input.option);
					const value = input.text ?? option ?? (typeof input.value === 'boolean' ? (input.value ? 'yes' : 'no') : (input.value ?? ''));
					const si = input.si === undefined ? '' : `${roundedText(input.si, 6)} ${input.unit ?? ''}`.trim();
					return {id: clean(inputId), label: clean(known?.label ?? inputId), entered: clean(input.entered), value: clean(value), si: clean(si)};
				}),
			checks: checks.filter((_, index) => (body.checks[index]!.step ?? '') === id),
			confirmations: confirmations.filter((_, index) => (recordedConfirmations[index]!.step ?? '') === id),
		}))
		.filter((step) => step.inputs.length + step.checks.length + step.confirmations.length > 0);

	const counts = body.counts;
	const countsText = ['fail', 'advise', 'open', 'pass', 'skip'].map((verdict) => `${counts[verdict] ?? 0} ${verdict}`).join(' · ');
	const signatureRows = signatureRowsOf(record, signatures, trust);

	return {
		title: `Bench check record: ${setupName}`,
		setupName,
		setupKey: shortFingerprint(body.setup.fingerprint),
		outcome: body.outcome,
		outcomeText,
		caution: clean(body.caution ?? missingCaution),
		deferral: clean(body.deferral ?? deferral),
		countsText,
		attention: checks.filter((check) => attentionOrder[check.verdict] < 3).sort((a, b) => attentionOrder[a.verdict] - attentionOrder[b.verdict]),
		attentionConfirmations: [...confirmations.filter((entry) => entry.status === 'no'), ...confirmations.filter((entry) => entry.status === 'unanswered' || entry.status === 'open')],
		missingInputs: body.missingInputs.map(clean),
		details: [
			['Setup', setupName],
			['Setup fingerprint', `${shortFingerprint(body.setup.fingerprint)} (${body.setup.fingerprint})`],
			['Identifying inputs', (body.setup.identifying ?? []).map(clean).join(', ')],
			['Operator', [clean(body.operator.name), clean(body.operator.role)].filter(Boolean).join(', ')],
			['Created', clean(body.createdAt)],
			['Tool', `${clean(body.tool.name)} ${clean(body.tool.version)}`],
			['Rule file', clean(body.rules.name)],
			['Rule file path', clean(body.rules.file)],
			['Rule file SHA-256', body.rules.sha256],
			['Signatures', signaturesSummary(signatureRows)],
			['Previous record of the signing key', previousText(body.previous)],
		],
		...(body.amends ? {amendment: {record: clean(body.amends.record), bodySha256: body.amends.bodySha256, reason: clean(body.amends.reason)}} : {}),
		steps,
		derived: Object.entries(body.derived).map(([id, stated]) => ({ entry: derivedEntry(stated), id })).map(({id, entry}) => ({
			id: clean(id),
			label: clean(outline.labels.get(id)?.label ?? id),
			value: clean('text' in entry ? entry.text : 'open' in entry ? `open: needs ${entry.open.join(', ')}` : `error: ${entry.error}`),
		})),
		signatures: signatureRows,
	};
}

/** Every signature of a record as a row to print. */
export function signatureRowsOf(record: AnyRecord, signatures: readonly SignatureStatus[], trust: TrustInfo): SignatureRow[] {
	return record.signatures.map((_, index) => signatureRow(record, signatures.find((entry) => entry.index === index), index, trust));
}

/** How many signatures, and whether all verified. */
export function signaturesSummary(rows: readonly SignatureRow[]): string {
	const verified = rows.filter((row) => row.verified).length;
	return `${rows.length}, ${verified === rows.length ? 'all verified' : `${rows.length - verified} NOT VERIFIED`}`;
}
