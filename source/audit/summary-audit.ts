import type {Finding} from '../records/findings.js';
import type {InterlockTestSummary} from './audit-interlock.js';
import type {RecordSummary} from './record-summary.js';

/** The empty list every summarised record shares (frozen: addFindings gives a record its own list). */
export const noFindings: never[] = Object.freeze([]) as unknown as never[];

/** The short form of a bench check that a summary lists and the interlock-test link reads. */
export type ShortRecord = Pick<RecordSummary, 'createdAt' | 'outcome' | 'interlockTest'>;

/**
 * What a summarised audit keeps of one record until the end of the run: one object with fixed
 * fields, its texts shared with the record's chain and history entries, and no list of its own
 * until it has a finding. A large folder has one for every record; the short form of the record
 * (`record`) is built when read, which is rare: for the records with findings, and the checks
 * that used an interlock test.
 */
/** A summarised record's audit as plain data: what a worker thread posts back (see SummaryAudit.from). */
export type SummaryData = {file: string; authentic: boolean; bodySha256: string | null; consistent: boolean | null; bench: ShortRecord | null; interlockTest: InterlockTestSummary | null; findings: Finding[]};

export class SummaryAudit {
	findings: Finding[];

	static from(data: SummaryData): SummaryAudit {
		return new SummaryAudit(data.file, data.authentic, data.bodySha256, data.consistent, data.bench, data.interlockTest, data.findings);
	}

	/** The audit as plain data, which SummaryAudit.from reads back. */
	data(): SummaryData {
		return {file: this.file, authentic: this.authentic, bodySha256: this.bodySha256, consistent: this.consistent, bench: this.record, interlockTest: this.interlockTest, findings: this.findings};
	}

	/**
	 * @param bodySha256 Kept for an interlock test record only (a bench check names it by it); null otherwise.
	 * @param consistent Whether the record's conclusions follow from its numbers; null when it is not authentic.
	 * @param bench For a bench check: when it was made, its outcome and the interlock test it used; null otherwise (kept flat, read back by `record`).
	 */
	constructor(
		readonly file: string,
		readonly authentic: boolean,
		readonly bodySha256: string | null,
		readonly consistent: boolean | null,
		bench: ShortRecord | null,
		readonly interlockTest: InterlockTestSummary | null,
		findings: Finding[],
	) {
		this.findings = findings.length === 0 ? noFindings : findings;
		this.#isBench = bench !== null;
		this.#createdAt = bench?.createdAt ?? '';
		this.#outcome = bench?.outcome ?? 'incomplete';
		this.#interlockUsed = bench?.interlockTest ?? null;
	}

	readonly #isBench: boolean;
	readonly #createdAt: string;
	readonly #outcome: ShortRecord['outcome'];
	readonly #interlockUsed: ShortRecord['interlockTest'];

	get record(): ShortRecord | null {
		return this.#isBench ? {createdAt: this.#createdAt, outcome: this.#outcome, interlockTest: this.#interlockUsed} : null;
	}

	get consistency(): {consistent: boolean} | null {
		return this.consistent === null ? null : {consistent: this.consistent};
	}

	/** A summary keeps no notes per record. */
	get notChecked(): Array<{item: string; text: string}> {
		return noFindings;
	}
}

/** Adds findings to a record's audit; a record that shares the empty list gets a list of its own. */
export function addFindings(audit: {findings: Finding[]}, ...found: Finding[]): void {
	addFindingList(audit, found);
}

/** Adds a list of findings; a record that shares the empty list takes the list itself (no copy). */
export function addFindingList(audit: {findings: Finding[]}, found: Finding[]): void {
	if (found.length === 0) return;
	if (Object.isFrozen(audit.findings)) audit.findings = found;
	else audit.findings.push(...found);
}
