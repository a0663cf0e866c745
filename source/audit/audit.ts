/**
 * The audit of signed records, one record at a time, in memory that does not grow with the
 * records' size: each file is read, verified and judged in turn (judgeRecord, the PER-RECORD
 * HOOK), and only a small summary of it is kept; when every file is done, the records are
 * related to each other (endOfRun, the END-OF-RUN HOOK). A new finding about a record on its
 * own goes in its own file, called from judgeRecord; a finding across records (a chain, a
 * history, the site's store) goes in its own file, called from endOfRun.
 */
import type {CompiledRules} from '../rules/compile/compiled-rules.js';
import {evaluate} from '../rules/evaluate/evaluate.js';
import {evaluationKey} from '../rules/evaluate/evaluation-key.js';
import type {Evaluation} from '../rules/evaluate/evaluation.js';
import {version} from '../shared/version.js';
import {answersFromRecord, type RecordAnswers} from './audit-answers.js';
import {sensitivityFindings} from './audit-sensitivity.js';
import {consistencyFindings} from './audit-consistency.js';
import type {Finding, FindingKind} from '../records/findings.js';
import {describeProblem} from '../shared/problems.js';
import {notChecked} from './audit-findings.js';
import {relateRecords, type History, type HistoryEntry} from './audit-history.js';
import {ChainAudit, ChainEntry, chainEntry, type ChainData} from './audit-chain.js';
import {KeyCache, readIntegrity} from '../records/integrity.js';
import {interlockTestConsistency, interlockTestToday, summariseInterlockTest, type InterlockTestSummary} from './audit-interlock.js';
import {linkInterlockTests} from './audit-interlock-link.js';
import type {RecordSummary} from './record-summary.js';
import {policyReport, type PolicyReport} from './audit-policy.js';
import {signatureReports, type SignatureReport, type Trust} from './audit-trust.js';
import {confirmationList, inputEntry, type RecordBody} from '../records/record-schema.js';
import {locationInput} from '../interlock/plan/plan-input.js';
import {RuleTexts, type RecordRules} from './audit-rule-texts.js';
import {ruleWords, type RuleWords} from '../records/record-words.js';
import {reviewRepository, type RepositoryHistory} from './audit-repository.js';
import {isCountersigned, signingFindings} from './audit-signing.js';
import {signingPolicy} from './signing-policy.js';
import {addFindingList, addFindings, SummaryAudit, type SummaryData} from './summary-audit.js';

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
export type AuditTotals = {records: number; authentic: number; integrityFailures: number; consistent: number; withFindings: number; findings: Record<FindingKind, number>; /** Authentic records made before the chain: a deletion among them cannot show. */ beforeChain: number};

/** How often a finding occurs in the audit. */
export type FindingCount = {kind: FindingKind; code: Finding['code']; count: number; example: string};

/** A record with findings, in the short form of a summarised audit: each finding as code and data, put in words as it is written out (describeProblem), so that a large audit does not hold the words of every finding at once. */
export type RecordWithFindings = {file: string; authentic: boolean; kind: 'bench-check' | 'interlock-test' | null; createdAt: string | null; outcome: string | null; findings: Finding[]};

/** The whole audit. It says whether records are authentic and their conclusions follow, never that a setup is safe. */
export type AuditReport = {
	tool: {name: 'prelase'; version: string};
	currentRules: {name: string; file: string; sha256: string};
	trust: {own: string | null; trusted: number};
	/** `all`: every record's audit is in `records`; `summary`: `records` is empty and `withFindings` lists the records with findings. */
	listing: 'all' | 'summary';
	records: RecordAudit[];
	/** Each finding code that occurs, how often, with the words of its first occurrence. */
	findingCodes: FindingCount[];
	/** With `listing: 'summary'`: each record with findings, in short. */
	withFindings: RecordWithFindings[];
	/** Records folders that are git repositories: how many commits were read, and what their history shows. */
	repositories?: Array<{folder: string; commits: number; remote: string | null; findings: ReportedFinding[]}>;
	totals: AuditTotals;
	status: 'authentic_and_consistent' | 'authentic_with_findings' | 'integrity_failure';
	exitCode: 0 | 1 | 3;
};

/** What the audit needs besides the files: the site's current rules and the keys the auditor trusts. */
export type AuditOptions = {current: CompiledRules; trust: Trust; onProgress?: (done: number, total: number) => void; /** The time of the audit (records dated after it are reported). @default now */ now?: Date; /** Keep every record's audit (`all`), or only what the summary needs. @default 'all' */ listing?: 'all' | 'summary'; /** The history of each records folder that is a git repository. */ repositories?: RepositoryHistory[]};

function summarise(body: RecordBody, words: RuleWords | undefined): RecordSummary {
	return {
		createdAt: body.createdAt,
		tool: body.tool,
		operator: body.operator,
		setup: {name: body.setup.name, fingerprint: body.setup.fingerprint},
		outcome: body.outcome,
		rules: {name: body.rules.name, file: body.rules.file, sha256: body.rules.sha256},
		interlockTest: body.interlockTest ?? null,
		exceptions: confirmationList(body)
			.filter((entry) => entry.status === 'no' || entry.status === 'not_applicable')
			.map((entry) => ({id: entry.id, statement: entry.statement ?? words?.statement(entry.id) ?? entry.id, status: entry.status, ...(entry.note ? {note: entry.note} : {})})),
	};
}

function historyEntry(file: string, bodySha256: string, body: RecordBody, words: RuleWords | undefined): HistoryEntry {
	const identifying = Object.fromEntries((body.setup.identifying ?? words?.identifying ?? []).map((id) => [id, inputEntry(body.inputs[id])?.entered ?? null]));
	return {file, bodySha256, createdAt: body.createdAt, setupName: body.setup.name, fingerprint: body.setup.fingerprint, identifying, ...(body.amends ? {amends: body.amends} : {})};
}

/** Audits one authentic record's contents: consistency under its own rules, and what the current rules would change. */
/**
 * Evaluations already made in this audit, by evaluation key: records of one setup with the
 * same numbers under the same rules are evaluated once (evaluate is pure). Bounded: the oldest
 * is dropped first.
 */
class Evaluations {
	readonly #known = new Map<string, Evaluation>();

	of(rules: CompiledRules, answers: RecordAnswers['answers']): Evaluation {
		const key = evaluationKey(rules, answers);
		let evaluation = this.#known.get(key);
		if (!evaluation) {
			evaluation = evaluate(rules, answers);
			if (this.#known.size >= 512) this.#known.delete(this.#known.keys().next().value!);
			this.#known.set(key, evaluation);
		}
		return evaluation;
	}
}

function auditContents(body: RecordBody, own: RecordRules, current: CompiledRules, evaluations: Evaluations): {consistency: NonNullable<RecordAudit['consistency']>; policy: PolicyReport; findings: Finding[]; switchedOff: number} {
	const findings: Finding[] = [...own.findings];
	let judged: {rules: CompiledRules; read: RecordAnswers; evaluation: Evaluation} | undefined;
	if (own.rules) {
		const read = answersFromRecord(own.rules, body);
		judged = {rules: own.rules, read, evaluation: evaluations.of(own.rules, read.answers)};
		findings.push(...consistencyFindings(body, judged.rules, read, judged.evaluation));
		findings.push(...sensitivityFindings(body, judged.rules, read.answers, judged.evaluation));
	}
	const consistency = {reevaluated: judged !== undefined, consistent: findings.length === 0, rulesSha256: own.sha256};

	// The same rule text and the same answers give the same evaluation: evaluate is pure.
	const read = judged && judged.rules === current ? judged.read : answersFromRecord(current, body);
	const evaluation = judged && judged.rules === current ? judged.evaluation : evaluations.of(current, read.answers);
	const policy = policyReport(body, current, read, evaluation);
	return {consistency, policy: policy.report, findings: [...findings, ...policy.findings], switchedOff: judged?.rules.switchedOff.length ?? 0};
}

const emptyFindings = (): Record<FindingKind, number> => ({integrity: 0, trust: 0, consistency: 0, policy: 0, history: 0});

/** One record as the audit keeps it until the end of the run. */
type Judged = Omit<RecordAudit, 'findings'> & {findings: Finding[]};

/** A record's audit as kept: all of it, or (in a summary) its short form. */
type Kept = Judged | SummaryAudit;

/** What the per-record step needs besides the file. */
type RunContext = {evaluations: Evaluations; keys: KeyCache; rules: RuleTexts; options: AuditOptions; now: Date; notChecked: ReadonlyArray<{item: string; text: string}>; signing: ReturnType<typeof signingPolicy>};

/** What one record leaves for the end of the run: its audit, and for a bench check what relates it to the others. */
type Judgement = {audit: Judged; bench?: {entry: HistoryEntry; location: string | undefined}; /** What the chain audit keeps of the file. */ chained: ChainEntry};

/** A record judged in a summarised audit, in its short form: what a worker thread sends back (plain data, see judgeForSummary). */
export type JudgedShort = {audit: SummaryData; bench?: {entry: HistoryEntry; location: string | undefined}; chained: ChainData};

/**
 * PER-RECORD HOOK. Reads one file, checks its integrity and judges it: trust, consistency
 * under its own rules, what the current rules would change. A new finding about one record
 * on its own is added here. Only this record's data is in hand; the file's text and parsed
 * body are dropped when it returns.
 */
function judgeRecord(file: string, index: number, context: RunContext): Judgement {
	const {keys, rules, options} = context;
	const checked = readIntegrity(file, keys);
	const chained = chainEntry(index, file, checked);
	// A bench check's words (statements, the identifying inputs) are its rule text's, read from the text it names.
	const body = checked.record?.body;
	const own = checked.ok && body?.kind === 'bench-check' ? rules.forRecord(body, file) : undefined;
	const words = own?.rules ? ruleWords(own.rules) : undefined;
	const record = body?.kind === 'bench-check' ? summarise(body, words) : null;
	const interlockTest = body?.kind === 'interlock-test' ? summariseInterlockTest(body) : null;
	const trust = checked.record ? signatureReports(checked.record, checked.signatures, options.trust, context.signing.authorityRoles) : {signatures: [], findings: []};
	const versionNote = checked.record?.version === 1 ? [{item: 'signature-order', text: describeProblem({code: 'audit-not-checked-signature-order', data: {}})}] : [];
	if (!checked.ok) {
		return {chained, audit: {file, authentic: false, bodySha256: null, record, interlockTest, signatures: trust.signatures, consistency: null, currentPolicy: null, history: null, notChecked: [], findings: [checked.finding]}};
	}
	if (checked.record.body.kind === 'interlock-test') {
		const contents = interlockTestConsistency(checked.record.body);
		const consistency = {reevaluated: contents.reevaluated, consistent: contents.findings.length === 0, rulesSha256: checked.record.body.policy.rules.sha256};
		const today = interlockTestToday(checked.record.body, options.current, context.now, contents.findings.length === 0);
		const signed = signingFindings(checked.record.body, trust.signatures, context.signing);
		return {chained, audit: {file, authentic: true, bodySha256: checked.bodySha256, record, interlockTest, signatures: trust.signatures, consistency, currentPolicy: null, history: null, notChecked: versionNote, findings: [...trust.findings, ...signed, ...contents.findings, ...today]}};
	}
	const bench = body as RecordBody;
	const contents = auditContents(bench, own!, options.current, context.evaluations);
	return {
		audit: {
			file,
			authentic: true,
			bodySha256: checked.bodySha256,
			record,
			interlockTest,
			signatures: trust.signatures,
			consistency: contents.consistency,
			currentPolicy: contents.policy,
			history: null,
			notChecked: [...context.notChecked, ...versionNote],
			findings: [...trust.findings, ...signingFindings(bench, trust.signatures, context.signing, {switchedOff: contents.switchedOff}), ...contents.findings],
		},
		bench: {entry: {...historyEntry(file, checked.bodySha256, bench, words), ...(isCountersigned(trust.signatures, context.signing) ? {countersigned: true} : {})}, location: inputEntry(bench.inputs[locationInput])?.entered},
		chained,
	};
}

/** The context of the per-record step, for the audit in this thread or in a worker thread. */
export function runContext(options: AuditOptions): RunContext {
	return {evaluations: new Evaluations(), keys: new KeyCache(), rules: new RuleTexts(options.current), options, now: options.now ?? new Date(), notChecked: notChecked.map(({item, code}) => ({item, text: describeProblem({code, data: {}})})), signing: signingPolicy(options.current)};
}

/** Judges one record for a summarised audit and gives its short form as plain data (a worker thread posts it to the audit's thread). */
export function judgeForSummary(file: string, index: number, context: RunContext): JudgedShort {
	const {audit, bench, chained} = judgeRecord(file, index, context);
	return {audit: slim(audit).data(), ...(bench ? {bench} : {}), chained: chained.data()};
}

/**
 * END-OF-RUN HOOK. Relates the records audited to each other, from what each left behind:
 * the interlock tests the checks used, amendments, superseded records, changed setups. A new
 * finding that needs more than one record is added here, from small per-record summaries.
 */
function endOfRun(audits: Kept[], entries: readonly HistoryEntry[], entryOf: readonly number[], benchLocations: ReadonlyMap<number, string | undefined>, listing: 'all' | 'summary'): void {
	linkInterlockTests(audits, benchLocations);
	relateRecords(entries, listing === 'summary').forEach(({history, findings}, index) => {
		const audit = audits[entryOf[index]!]!;
		// A summary shows each record's findings, not its history: it is not kept for every record.
		if (listing === 'all') (audit as Judged).history = history;
		// A countersigned amendment completes a record that lacked its countersignature (the amendment is reported).
		if (history.countersignedBy) audit.findings = audit.findings.filter((found) => found.code !== 'audit-countersign-required');
		addFindingList(audit, findings);
	});
}

/** One copy of each text kept from many records (names, rule hashes, identifying inputs repeat from record to record). */
class Interned {
	readonly #texts = new Map<string, string>();

	text(value: string): string {
		const known = this.#texts.get(value);
		if (known !== undefined) return known;
		this.#texts.set(value, value);
		return value;
	}

	nullable(value: string | null | undefined): string | null {
		return value === null || value === undefined ? null : this.text(value);
	}

	/** One copy of each small object of texts that repeats from record to record (a tool, an operator, a rule file, a setup). */
	object<T extends Record<string, string | number | boolean | null>>(value: T): T {
		const key = JSON.stringify(value);
		const known = this.#objects.get(key);
		if (known !== undefined) return known as T;
		const kept = Object.fromEntries(Object.entries(value).map(([name, item]) => [name, typeof item === 'string' ? this.text(item) : item])) as T;
		this.#objects.set(key, kept);
		return kept;
	}

	readonly #objects = new Map<string, object>();
}

/** What a summarised audit keeps of a record: its short form, its texts shared with the other records'. */
function slim(audit: Judged): SummaryAudit {
	const bench = audit.record && {createdAt: audit.record.createdAt, outcome: audit.record.outcome, interlockTest: audit.record.interlockTest};
	return new SummaryAudit(audit.file, audit.authentic, audit.interlockTest ? audit.bodySha256 : null, audit.consistency?.consistent ?? null, bench, audit.interlockTest, audit.findings);
}

/** What relates a record to the others, its texts shared with the other records'. */
function slimEntry(entry: HistoryEntry, keep: Interned): HistoryEntry {
	return {...entry, setupName: keep.nullable(entry.setupName), fingerprint: keep.text(entry.fingerprint), identifying: keep.object(entry.identifying)};
}

const reported = (found: Finding): ReportedFinding => ({...found, text: describeProblem(found)});

/**
 * Audits record files: for each, integrity (every signature verifies; who signed, and whether
 * their key is trusted), consistency (the recorded conclusions follow from the recorded
 * numbers under the record's own rules), what the current rules would change; then how the
 * records relate (amendments, superseded records, changed setups). Pure apart from reading
 * the files. The records are read and judged one by one; only a small summary of each is
 * kept (all of its audit with `listing: 'all'`, the default).
 */
export function auditRecords(files: readonly string[], options: AuditOptions): AuditReport {
	const run = new AuditRun(files, options);
	files.forEach((file, index) => run.accept(judgeRecord(file, index, run.context)));
	return run.finish();
}

/**
 * An audit whose records are judged one by one (in this thread, or in worker threads that
 * post back each record's short form) and accepted in the order of the files; `finish` relates
 * them and gives the report.
 */
export class AuditRun {
	readonly context: RunContext;
	readonly #listing: 'all' | 'summary';
	readonly #audits: Kept[] = [];
	readonly #keep = new Interned();
	readonly #entries: HistoryEntry[] = [];
	readonly #entryOf: number[] = [];
	readonly #benchLocations = new Map<number, string | undefined>();
	readonly #chain: ChainAudit;

	constructor(
		readonly files: readonly string[],
		readonly options: AuditOptions,
	) {
		this.#listing = options.listing ?? 'all';
		this.context = runContext(options);
		this.#chain = new ChainAudit(this.context.now);
	}

	/** Takes the next record's judgement (the records in the order of the files). */
	accept(judged: Judgement | JudgedShort): void {
		const listing = this.#listing;
		if (!(judged.chained instanceof ChainEntry)) shareTexts(judged as JudgedShort, this.files[this.#audits.length]!);
		const kept: Kept = 'signatures' in judged.audit ? (listing === 'all' ? judged.audit : slim(judged.audit)) : SummaryAudit.from(judged.audit);
		const chained = judged.chained instanceof ChainEntry ? judged.chained : ChainEntry.from(judged.chained);
		const copyOf = this.#chain.add(chained);
		const {bench} = judged;
		const at = this.#audits.length;
		if (bench) {
			// The location matters only to a check that used an interlock test (linkInterlockTests).
			if (listing === 'all' || kept.record?.interlockTest?.record) this.#benchLocations.set(at, listing === 'all' ? bench.location : (this.#keep.nullable(bench.location) ?? undefined));
			// A byte-identical copy is the same record: it neither supersedes nor amends the original.
			if (copyOf === undefined) {
				this.#entryOf[this.#entries.length] = at;
				this.#entries.push(listing === 'all' ? bench.entry : slimEntry(bench.entry, this.#keep));
			}
		}
		this.#audits.push(kept);
		this.options.onProgress?.(at + 1, this.files.length);
	}

	finish(): AuditReport {
		return finishAudit(this.#audits, this.#entries, this.#entryOf, this.#benchLocations, this.#chain, this.#listing, this.options);
	}
}

/**
 * A record's short form posted by a worker comes with its own copy of every text: the file's
 * path three times, its date twice. Each is pointed at one copy (the path at the file list's),
 * as in an audit in one thread, where they are the same strings.
 */
function shareTexts(judged: JudgedShort, file: string): void {
	const {audit, bench, chained} = judged;
	if (chained.file === file) chained.file = file;
	if (audit.file === file) audit.file = file;
	if (audit.bench && audit.bench.createdAt === chained.createdAt) audit.bench.createdAt = chained.createdAt;
	if (bench) {
		if (bench.entry.file === file) bench.entry.file = file;
		if (bench.entry.createdAt === chained.createdAt) bench.entry.createdAt = chained.createdAt;
	}
}

function finishAudit(audits: Kept[], entries: HistoryEntry[], entryOf: number[], benchLocations: Map<number, string | undefined>, chain: ChainAudit, listing: 'all' | 'summary', options: AuditOptions): AuditReport {
	endOfRun(audits, entries, entryOf, benchLocations, listing);
	for (const {index, finding: found} of chain.findings()) addFindings(audits[index]!, found);

	const totals: AuditTotals = {records: audits.length, authentic: 0, integrityFailures: 0, consistent: 0, withFindings: 0, findings: emptyFindings(), beforeChain: chain.beforeChain()};
	const codes = new Map<string, FindingCount>();
	for (const audit of audits) {
		if (audit.authentic) totals.authentic += 1;
		else totals.integrityFailures += 1;
		if (audit.consistency?.consistent) totals.consistent += 1;
		if (audit.authentic && audit.findings.length > 0) totals.withFindings += 1;
		for (const found of audit.findings) {
			totals.findings[found.kind] += 1;
			const known = codes.get(found.code);
			if (known) known.count += 1;
			else codes.set(found.code, {kind: found.kind, code: found.code, count: 1, example: describeProblem(found)});
		}
	}
	const records = listing === 'all' ? (audits as Judged[]).map((audit): RecordAudit => ({...audit, findings: audit.findings.map(reported)})) : [];
	const withFindings = listing === 'all' ? [] : audits.filter((audit) => audit.findings.length > 0).map(listedWithFindings);
	const repositories = (options.repositories ?? []).map((history) => ({folder: history.folder, remote: history.remote?.remote ?? null, ...reviewRepository(history)})).map((found) => ({...found, findings: found.findings.map(reported)}));
	const repositoryFindings = repositories.flatMap((found) => found.findings);
	for (const found of repositoryFindings) totals.findings[found.kind] += 1;
	const status = totals.integrityFailures > 0 || repositoryFindings.some((found) => found.kind === 'integrity') ? 'integrity_failure' : totals.withFindings > 0 || repositoryFindings.length > 0 ? 'authentic_with_findings' : 'authentic_and_consistent';
	return {
		tool: {name: 'prelase', version},
		currentRules: {name: options.current.rules.name, file: options.current.file, sha256: options.current.sha256},
		trust: {own: options.trust.own ?? null, trusted: options.trust.trusted.length},
		listing,
		records,
		findingCodes: [...codes.values()].sort((a, b) => b.count - a.count || a.code.localeCompare(b.code)),
		withFindings,
		...(repositories.length > 0 ? {repositories} : {}),
		totals,
		status,
		exitCode: status === 'integrity_failure' ? 3 : status === 'authentic_with_findings' ? 1 : 0,
	};
}

function listedWithFindings(audit: Kept): RecordWithFindings {
	const what = audit.record ? {kind: 'bench-check' as const, createdAt: audit.record.createdAt, outcome: audit.record.outcome} : audit.interlockTest ? {kind: 'interlock-test' as const, createdAt: audit.interlockTest.createdAt, outcome: audit.interlockTest.outcome} : {kind: null, createdAt: null, outcome: null};
	return {file: audit.file, authentic: audit.authentic, ...what, findings: audit.findings};
}
