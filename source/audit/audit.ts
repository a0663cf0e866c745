import {sha256Hex} from '../shared/sha256.js';
import {formatProblem, type Problem} from '../shared/problems.js';
import type {Result} from '../shared/result.js';
import type {CompiledRules} from '../rules/compile/compiled-rules.js';
import {evaluate} from '../rules/evaluate/evaluate.js';
import type {Evaluation} from '../rules/evaluate/evaluation.js';
import {loadRulesFromText} from '../rules/load.js';
import {version} from '../shared/version.js';
import {answersFromRecord, type RecordAnswers} from './audit-answers.js';
import {consistencyFindings} from './audit-consistency.js';
import {describeFinding, finding, type Finding, type FindingKind} from '../records/findings.js';
import {notChecked} from './audit-findings.js';
import {relateRecords, type History, type HistoryEntry} from './audit-history.js';
import {KeyCache, readIntegrity} from '../records/integrity.js';
import {interlockTestConsistency, interlockTestToday, summariseInterlockTest, type InterlockTestSummary} from './audit-interlock.js';
import {linkInterlockTests} from './audit-interlock-link.js';
import type {RecordSummary} from './record-summary.js';
import {policyReport, type PolicyReport} from './audit-policy.js';
import {signatureReports, type SignatureReport, type Trust} from './audit-trust.js';
import type {RecordBody} from '../records/record-schema.js';
import {locationInput} from '../interlock/plan/plan-input.js';
import {signingFindings} from './audit-signing.js';
import {signingPolicy} from './signing-policy.js';

/** A finding with its message in words. */
export type ReportedFinding = Finding & {text: string};

export type {RecordSummary} from './record-summary.js';

/** Everything the audit found about one record file. */
export type RecordAudit = {
	file: string;
	/** Parsed, of the record shape, and every signature verifies. */
	authentic: boolean;
	bodySha256: string | null;
	/** The summary of a bench-check record; null for an interlock test record or a file that is not a record. */
	record: RecordSummary | null;
	/** The summary of an interlock test record; null otherwise. */
	interlockTest: InterlockTestSummary | null;
	signatures: SignatureReport[];
	/** Re-evaluation under the embedded rules: null when the record is not authentic. */
	consistency: {reevaluated: boolean; consistent: boolean; rulesSha256: string | null} | null;
	currentPolicy: PolicyReport | null;
	history: History | null;
	notChecked: Array<{item: string; text: string}>;
	findings: ReportedFinding[];
};

/** How the records audited stand together; `exitCode` follows the command-line contract. */
export type AuditTotals = {records: number; authentic: number; integrityFailures: number; consistent: number; withFindings: number; findings: Record<FindingKind, number>};

/** The whole audit. It says whether records are authentic and their conclusions follow, never that a setup is safe. */
export type AuditReport = {
	tool: {name: 'prelase'; version: string};
	currentRules: {name: string; file: string; sha256: string};
	trust: {own: string | null; trusted: number};
	records: RecordAudit[];
	totals: AuditTotals;
	status: 'authentic_and_consistent' | 'authentic_with_findings' | 'integrity_failure';
	exitCode: 0 | 1 | 3;
};

/** What the audit needs besides the files: the site's current rules and the keys the auditor trusts. */
export type AuditOptions = {current: CompiledRules; trust: Trust; onProgress?: (done: number, total: number) => void; /** The time of the audit (records dated after it are reported). @default now */ now?: Date};

/** Embedded rule texts loaded and compiled once each (a folder of records mostly shares one or two). */
class RuleCache {
	readonly #byStated = new Map<string, {text: string; sha256: string}>();
	readonly #bySha = new Map<string, Result<CompiledRules, Problem>>();

	constructor(current: CompiledRules) {
		this.#bySha.set(current.sha256, {ok: true, value: current, warnings: []});
		this.#byStated.set(current.sha256, {text: current.text, sha256: current.sha256});
	}

	/** The rules of a record's embedded text, with the text's actual SHA-256. */
	get(text: string, stated: string, file: string): {sha256: string; loaded: Result<CompiledRules, Problem>} {
		const known = this.#byStated.get(stated);
		// Equal text to one already hashed needs no hashing again.
		const sha256 = known && known.text === text ? known.sha256 : sha256Hex(text);
		if (!known) this.#byStated.set(stated, {text, sha256});
		let loaded = this.#bySha.get(sha256);
		if (!loaded) {
			loaded = loadRulesFromText(text, file);
			this.#bySha.set(sha256, loaded);
		}
		return {sha256, loaded};
	}
}

function summarise(body: RecordBody): RecordSummary {
	return {
		createdAt: body.createdAt,
		tool: body.tool,
		operator: body.operator,
		setup: {name: body.setup.name, fingerprint: body.setup.fingerprint},
		outcome: body.outcome,
		rules: {name: body.rules.name, file: body.rules.file, sha256: body.rules.sha256},
		interlockTest: body.interlockTest ?? null,
		exceptions: body.confirmations
			.filter((entry) => entry.status === 'no' || entry.status === 'not_applicable')
			.map((entry) => ({id: entry.id, statement: entry.statement, status: entry.status, ...(entry.note ? {note: entry.note} : {})})),
	};
}

function historyEntry(file: string, bodySha256: string, body: RecordBody): HistoryEntry {
	const identifying = Object.fromEntries(body.setup.identifying.map((id) => [id, body.inputs[id]?.entered ?? null]));
	return {file, bodySha256, createdAt: body.createdAt, setupName: body.setup.name, fingerprint: body.setup.fingerprint, identifying, ...(body.amends ? {amends: body.amends} : {})};
}

/** Audits one authentic record's contents: consistency under its own rules, and what the current rules would change. */
function auditContents(body: RecordBody, rules: RuleCache, current: CompiledRules): {consistency: NonNullable<RecordAudit['consistency']>; policy: PolicyReport; findings: Finding[]; switchedOff: number} {
	const findings: Finding[] = [];
	const embedded = rules.get(body.rules.text, body.rules.sha256, body.rules.file);
	if (embedded.sha256 !== body.rules.sha256) findings.push(finding('consistency', 'audit-rules-hash-mismatch', {stated: body.rules.sha256, actual: embedded.sha256}));
	let own: {rules: CompiledRules; read: RecordAnswers; evaluation: Evaluation} | undefined;
	if (embedded.loaded.ok) {
		const read = answersFromRecord(embedded.loaded.value, body);
		own = {rules: embedded.loaded.value, read, evaluation: evaluate(embedded.loaded.value, read.answers)};
		findings.push(...consistencyFindings(body, own.rules, read, own.evaluation));
	} else {
		findings.push(finding('consistency', 'audit-rules-do-not-load', {detail: embedded.loaded.errors.map(formatProblem).join('; ')}));
	}
	const consistency = {reevaluated: own !== undefined, consistent: findings.length === 0, rulesSha256: embedded.sha256};

	// The same rule text and the same answers give the same evaluation: evaluate is pure.
	const read = own && own.rules === current ? own.read : answersFromRecord(current, body);
	const evaluation = own && own.rules === current ? own.evaluation : evaluate(current, read.answers);
	const policy = policyReport(body, current, read, evaluation);
	return {consistency, policy: policy.report, findings: [...findings, ...policy.findings], switchedOff: own?.rules.switchedOff.length ?? 0};
}

const emptyFindings = (): Record<FindingKind, number> => ({integrity: 0, trust: 0, consistency: 0, policy: 0, history: 0});

/**
 * Audits record files: for each, integrity (every signature verifies; who signed, and whether
 * their key is trusted), consistency (the recorded conclusions follow from the recorded
 * numbers under the embedded rules), what the current rules would change; then how the
 * records relate (amendments, superseded records, changed setups). Pure apart from reading
 * the files.
 */
export function auditRecords(files: readonly string[], options: AuditOptions): AuditReport {
	const keys = new KeyCache();
	const rules = new RuleCache(options.current);
	const signing = signingPolicy(options.current);
	const audits: Array<Omit<RecordAudit, 'findings'> & {findings: Finding[]}> = [];
	const entries: HistoryEntry[] = [];
	const entryOf: number[] = [];
	const benchLocations = new Map<number, string | undefined>();
	files.forEach((file, index) => {
		const checked = readIntegrity(file, keys);
		const body = checked.record?.body;
		const record = body?.kind === 'bench-check' ? summarise(body) : null;
		const interlockTest = body?.kind === 'interlock-test' ? summariseInterlockTest(body) : null;
		const trust = checked.record ? signatureReports(checked.record, checked.signatures, options.trust, signing.authorityRoles) : {signatures: [], findings: []};
		const versionNote = checked.record?.version === 1 ? [{item: 'signature-order', text: describeFinding({code: 'audit-not-checked-signature-order', data: {}})}] : [];
		if (!checked.ok) {
			audits.push({file, authentic: false, bodySha256: null, record, interlockTest, signatures: trust.signatures, consistency: null, currentPolicy: null, history: null, notChecked: [], findings: [checked.finding]});
		} else if (checked.record.body.kind === 'interlock-test') {
			const contents = interlockTestConsistency(checked.record.body);
			const consistency = {reevaluated: contents.reevaluated, consistent: contents.findings.length === 0, rulesSha256: checked.record.body.policy.rules.sha256};
			const today = interlockTestToday(checked.record.body, options.current, options.now ?? new Date(), contents.findings.length === 0);
			const signed = signingFindings(checked.record.body, trust.signatures, signing);
			audits.push({file, authentic: true, bodySha256: checked.bodySha256, record, interlockTest, signatures: trust.signatures, consistency, currentPolicy: null, history: null, notChecked: versionNote, findings: [...trust.findings, ...signed, ...contents.findings, ...today]});
		} else {
			const contents = auditContents(checked.record.body, rules, options.current);
			benchLocations.set(audits.length, checked.record.body.inputs[locationInput]?.entered);
			entryOf[entries.length] = audits.length;
			entries.push(historyEntry(file, checked.bodySha256, checked.record.body));
			audits.push({
				file,
				authentic: true,
				bodySha256: checked.bodySha256,
				record,
				interlockTest,
				signatures: trust.signatures,
				consistency: contents.consistency,
				currentPolicy: contents.policy,
				history: null,
				notChecked: [...notChecked.map(({item, code}) => ({item, text: describeFinding({code, data: {}})})), ...versionNote],
				findings: [...trust.findings, ...signingFindings(checked.record.body, trust.signatures, signing, {switchedOff: contents.switchedOff}), ...contents.findings],
			});
		}
		options.onProgress?.(index + 1, files.length);
	});
	linkInterlockTests(audits, benchLocations);
	relateRecords(entries).forEach(({history, findings}, index) => {
		const audit = audits[entryOf[index]!]!;
		audit.history = history;
		audit.findings.push(...findings);
	});

	const totals: AuditTotals = {records: audits.length, authentic: 0, integrityFailures: 0, consistent: 0, withFindings: 0, findings: emptyFindings()};
	const records = audits.map((audit): RecordAudit => {
		if (audit.authentic) totals.authentic += 1;
		else totals.integrityFailures += 1;
		if (audit.consistency?.consistent) totals.consistent += 1;
		if (audit.authentic && audit.findings.length > 0) totals.withFindings += 1;
		for (const found of audit.findings) totals.findings[found.kind] += 1;
		return {...audit, findings: audit.findings.map((found) => ({...found, text: describeFinding(found)}))};
	});
	const status = totals.integrityFailures > 0 ? 'integrity_failure' : totals.withFindings > 0 ? 'authentic_with_findings' : 'authentic_and_consistent';
	return {
		tool: {name: 'prelase', version},
		currentRules: {name: options.current.rules.name, file: options.current.file, sha256: options.current.sha256},
		trust: {own: options.trust.own ?? null, trusted: options.trust.trusted.length},
		records,
		totals,
		status,
		exitCode: status === 'integrity_failure' ? 3 : status === 'authentic_with_findings' ? 1 : 0,
	};
}
