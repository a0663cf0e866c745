import {finding, type Finding} from '../records/findings.js';

/** What the audit keeps of an authentic record to relate it to the others. */
export type HistoryEntry = {
	file: string;
	bodySha256: string;
	createdAt: string;
	setupName: string | null;
	fingerprint: string;
	/** The identifying inputs as entered (null when not given). */
	identifying: Record<string, string | null>;
	amends?: {record: string; bodySha256: string; reason: string};
	/** It carries a countersignature the signing policy accepts. */
	countersigned?: boolean;
};

/** Another record, named by file and time. */
export type RecordRef = {file: string; createdAt: string};

/** How a record relates to the other records audited with it. */
export type History = {
	/** The record this one corrects; `file` is null when it is not among the records audited. */
	amends?: {record: string; bodySha256: string; reason: string; file: string | null};
	/** Later records that correct this one. */
	amendedBy: Array<RecordRef & {reason: string}>;
	/** A later record that corrects this one and is countersigned: it stands for this one's missing countersignature. */
	countersignedBy?: RecordRef;
	/** The next later record for the same setup fingerprint. */
	supersededBy?: RecordRef;
	/** The previous record of the same setup name, when its fingerprint differs: which identifying inputs changed. */
	setupChangedFrom?: RecordRef & {changed: string[]};
};

function time(entry: HistoryEntry): number {
	const parsed = Date.parse(entry.createdAt);
	return Number.isNaN(parsed) ? Number.NEGATIVE_INFINITY : parsed;
}

function changedInputs(before: HistoryEntry, after: HistoryEntry): string[] {
	const ids = [...new Set([...Object.keys(before.identifying), ...Object.keys(after.identifying)])];
	return ids.filter((id) => (before.identifying[id] ?? null) !== (after.identifying[id] ?? null));
}

/**
 * Relates authentic records to each other: amendment chains (by body SHA-256), a later record
 * for the same setup fingerprint (the earlier is superseded), and a setup name whose
 * fingerprint changed since its previous record. Returns, per entry, its history and findings.
 */
export function relateRecords(entries: readonly HistoryEntry[], sparse = false): Array<{history: History; findings: Finding[]}> {
	// A sparse result (for a summary of many records) has an entry only where a record relates to another: forEach skips the rest.
	const results: Array<{history: History; findings: Finding[]}> = sparse ? new Array(entries.length) : entries.map(() => ({history: {amendedBy: []}, findings: []}));
	const resultOf = (index: number) => (results[index] ??= {history: {amendedBy: []}, findings: []});
	const ref = (index: number): RecordRef => ({file: entries[index]!.file, createdAt: entries[index]!.createdAt});
	const bySha = new Map<string, number>();
	entries.forEach((entry, index) => {
		if (!bySha.has(entry.bodySha256)) bySha.set(entry.bodySha256, index);
	});
	// An amendment comes after what it corrects, even when both were made in the same second.
	const depths = new Map<number, number>();
	const depth = (index: number, seen = new Set<number>()): number => {
		const known = depths.get(index);
		if (known !== undefined) return known;
		const original = entries[index]!.amends ? bySha.get(entries[index]!.amends!.bodySha256) : undefined;
		seen.add(index);
		const value = original === undefined || seen.has(original) ? 0 : depth(original, seen) + 1;
		depths.set(index, value);
		return value;
	};
	// Each record's time read once (not at every comparison of the sort).
	const times = Float64Array.from(entries, time);
	const order = entries
		.map((_, index) => index)
		.sort((a, b) => times[a]! - times[b]! || depth(a) - depth(b) || entries[a]!.createdAt.localeCompare(entries[b]!.createdAt) || entries[a]!.file.localeCompare(entries[b]!.file));
	entries.forEach((entry, index) => {
		if (!entry.amends) return;
		const original = bySha.get(entry.amends.bodySha256);
		resultOf(index).history.amends = {...entry.amends, file: original === undefined ? null : entries[original]!.file};
		if (original === undefined) {
			resultOf(index).findings.push(finding('history', 'audit-amended-missing', {record: entry.amends.record, bodySha256: entry.amends.bodySha256}));
			return;
		}
		resultOf(original).history.amendedBy.push({...ref(index), reason: entry.amends.reason});
		if (entry.countersigned && !resultOf(original).history.countersignedBy) resultOf(original).history.countersignedBy = ref(index);
		resultOf(original).findings.push(finding('history', 'audit-amended-by', {...ref(index), reason: entry.amends.reason}));
	});

	const groups = (key: (entry: HistoryEntry) => string | null) => {
		const grouped = new Map<string, number[]>();
		for (const index of order) {
			const value = key(entries[index]!);
			if (value === null) continue;
			const group = grouped.get(value);
			if (group) group.push(index);
			else grouped.set(value, [index]);
		}
		return grouped.values();
	};
	for (const group of groups((entry) => entry.fingerprint)) {
		for (let at = 0; at + 1 < group.length; at += 1) {
			const [earlier, later] = [group[at]!, group[at + 1]!];
			const superseding = ref(later);
			resultOf(earlier).history.supersededBy = superseding;
			// An amendment of this very record already says more than "superseded".
			if (entries[later]!.amends?.bodySha256 !== entries[earlier]!.bodySha256) resultOf(earlier).findings.push(finding('history', 'audit-superseded', superseding));
		}
	}
	for (const group of groups((entry) => entry.setupName)) {
		for (let at = 1; at < group.length; at += 1) {
			const [previous, current] = [entries[group[at - 1]!]!, entries[group[at]!]!];
			if (previous.fingerprint === current.fingerprint) continue;
			const changed = changedInputs(previous, current);
			resultOf(group[at]!).history.setupChangedFrom = {...ref(group[at - 1]!), changed};
			const words = changed.length > 0 ? changed.join(', ') : 'none of the same inputs (the rules identify the setup by other inputs)';
			resultOf(group[at]!).findings.push(finding('history', 'audit-setup-changed', {setup: current.setupName!, ...ref(group[at - 1]!), changed: words}));
		}
	}
	return results;
}
