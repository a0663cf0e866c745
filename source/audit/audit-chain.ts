import {existsSync} from 'node:fs';
import {basename, dirname, join} from 'node:path';
import {futureAllowanceMs, instantOf} from '../interlock/functional-test/test-choice.js';
import {finding, type Finding} from '../records/findings.js';
import {readHead} from '../records/chain.js';
import type {IntegrityCheck} from '../records/integrity.js';
import type {ChainLink} from '../records/record-schema.js';
import {isoWithOffset} from '../shared/iso-time.js';

/** What the chain audit reads of an authentic record: its key, its link, when and what it is. */
type Chained = {
	/** The fingerprint of the first signature's key (the operator's or tester's). */
	key: string;
	/** The link the body states; undefined in a record made before the chain. */
	previous: ChainLink | undefined;
	createdAt: string;
	kind: 'bench-check' | 'interlock-test';
	version: number;
};

/**
 * What the chain audit keeps of one record file, in flat fields (a large folder has one for
 * every record, so no nested objects): `chained` reads them back, and is there only for an
 * authentic record.
 */
/** A chain entry as plain data: what a worker thread posts back (see ChainEntry.from). */
export type ChainData = {index: number; file: string; fileSha256: string | null; key: string | null; previousFile: string | undefined; previousSha: string | null | undefined; createdAt: string; kind: Chained['kind']; version: number};

export class ChainEntry {
	/** The fingerprint of the first signature's key; null when the record is not authentic. */
	key: string | null = null;
	/** The previous record's file name and SHA-256; `previousSha` is null for a first record and undefined before the chain. */
	previousFile: string | undefined;
	previousSha: string | null | undefined;
	createdAt = '';
	kind: Chained['kind'] = 'bench-check';
	version = 0;

	/**
	 * @param index The record's place in the audit.
	 * @param fileSha256 SHA-256 of the file's exact bytes; null when it could not be read.
	 */
	constructor(
		readonly index: number,
		readonly file: string,
		readonly fileSha256: string | null,
	) {}

	static from(data: ChainData): ChainEntry {
		const entry = new ChainEntry(data.index, data.file, data.fileSha256);
		entry.key = data.key;
		entry.previousFile = data.previousFile;
		entry.previousSha = data.previousSha;
		entry.createdAt = data.createdAt;
		entry.kind = data.kind;
		entry.version = data.version;
		return entry;
	}

	/** The entry as plain data, which ChainEntry.from reads back. */
	data(): ChainData {
		return {index: this.index, file: this.file, fileSha256: this.fileSha256, key: this.key, previousFile: this.previousFile, previousSha: this.previousSha, createdAt: this.createdAt, kind: this.kind, version: this.version};
	}

	get chained(): Chained | undefined {
		if (this.key === null) return undefined;
		const previous = this.previousSha === undefined ? undefined : this.previousSha === null ? null : {file: this.previousFile!, sha256: this.previousSha};
		return {key: this.key, previous, createdAt: this.createdAt, kind: this.kind, version: this.version};
	}
}

/** The chain entry of one record file, from its integrity check. */
export function chainEntry(index: number, file: string, checked: IntegrityCheck): ChainEntry {
	const entry = new ChainEntry(index, file, checked.fileSha256 ?? null);
	if (!checked.ok) return entry;
	const {body, signatures, version} = checked.record;
	entry.key = signatures[0]!.fingerprint;
	entry.previousSha = body.previous === undefined ? undefined : (body.previous?.sha256 ?? null);
	entry.previousFile = body.previous?.file;
	entry.createdAt = body.createdAt;
	entry.kind = body.kind;
	entry.version = version;
	return entry;
}

/** The instant of a date-time, later than any other when it cannot be read (it then sorts last and is never "earliest"). */
const instant = (createdAt: string) => {
	const value = instantOf(createdAt);
	return Number.isNaN(value) ? Number.POSITIVE_INFINITY : value;
};

/** A file's path in the form a link's name joined to its folder gives (the same text, not a copy, when it already is). */
function pathKey(file: string): string {
	const joined = join(dirname(file), basename(file));
	return joined === file ? file : joined;
}

/** The words for the others in a fork: "both" for one other record, "all" for more. */
const forkWords = (others: readonly ChainEntry[]) => ({others: others.map((other) => basename(other.file)).join(', '), both: others.length === 1 ? 'both' : 'all'});

/**
 * The per-signer chain, duplicates and clock skew across the records of an audit, built one
 * record at a time: `add` each record's entry (it says when the file is a byte-identical copy of
 * one added before), then `findings()` once all are in. Each record names the previous record its
 * key wrote to the same folder; the audit reports a missing link (a deleted record), a gap at the
 * start of a key's chain, a predecessor whose bytes changed, a fork (two records naming the same
 * predecessor), a record dated before its predecessor, and a bench check dated after the audit.
 */
export class ChainAudit {
	readonly #now: Date;
	readonly #entries: ChainEntry[] = [];
	readonly #copies: Array<{entry: ChainEntry; of: ChainEntry}> = [];
	/** The first record file of each SHA-256, in any folder (a copy is a copy wherever it lies, and has the same bytes and date). */
	readonly #bySha = new Map<string, ChainEntry>();
	/** Every file added, copies too, in the order added; looked up by path only where a link or head names a file not found by its bytes (rare), through an index sorted once. */
	readonly #all: ChainEntry[] = [];
	#byPath: {paths: string[]; order: Uint32Array} | undefined;

	/** @param now The time of the audit: a record dated after it (beyond the allowance for a fast clock) is a finding. */
	constructor(now: Date) {
		this.#now = now;
	}

	/** One copy of each key fingerprint: a folder of many records is signed by a few keys. */
	readonly #keys = new Map<string, string>();

	/** Adds a record file; returns the file it is a byte-identical copy of, if any (the copy is then left out of the chain). */
	add(entry: ChainEntry): string | undefined {
		this.#share(entry);
		this.#all.push(entry);
		this.#byPath = undefined;
		const sha = entry.fileSha256;
		const original = sha === null ? undefined : this.#bySha.get(sha);
		if (original) {
			this.#copies.push({entry, of: original});
			return original.file;
		}
		if (sha !== null) this.#bySha.set(sha, entry);
		this.#entries.push(entry);
		return undefined;
	}

	/** The file audited at a path (the last added there, as a map would keep it), by binary search in the files sorted by path. */
	#atPath(path: string): ChainEntry | undefined {
		if (!this.#byPath) {
			const paths = this.#all.map((entry) => pathKey(entry.file));
			const order = Uint32Array.from(paths.keys()).sort((a, b) => (paths[a]! < paths[b]! ? -1 : paths[a]! > paths[b]! ? 1 : a - b));
			this.#byPath = {paths, order};
		}
		const {paths, order} = this.#byPath;
		let low = 0;
		let high = order.length;
		// The first place after every path at or before the one sought: the last file at it is just before.
		while (low < high) {
			const middle = (low + high) >>> 1;
			if (paths[order[middle]!]! <= path) low = middle + 1;
			else high = middle;
		}
		const found = low > 0 ? order[low - 1]! : undefined;
		return found !== undefined && paths[found] === path ? this.#all[found] : undefined;
	}

	/**
	 * Keeps what the entry holds in one copy where another entry has it already: its key's
	 * fingerprint, and the SHA-256 its link names (the bytes of a record added before).
	 */
	#share(entry: ChainEntry): void {
		if (entry.key === null) return;
		const key = this.#keys.get(entry.key);
		if (key === undefined) this.#keys.set(entry.key, entry.key);
		else entry.key = key;
		const named = entry.previousSha ? this.#bySha.get(entry.previousSha) : undefined;
		if (named?.fileSha256) entry.previousSha = named.fileSha256;
	}

	/** How many authentic records were made before the chain (they state no link). */
	beforeChain(): number {
		return this.#entries.filter((entry) => entry.chained && entry.chained.previous === undefined).length;
	}

	/** Every finding, with the index of the record it belongs to. */
	findings(): Array<{index: number; finding: Finding}> {
		const out: Array<{index: number; finding: Finding}> = [];
		const add = (entry: ChainEntry, found: Finding) => out.push({index: entry.index, finding: found});
		for (const {entry, of} of this.#copies) add(entry, finding('history', 'audit-duplicate', {file: dirname(of.file) === dirname(entry.file) ? basename(of.file) : of.file}));
		const latest = this.#now.getTime() + futureAllowanceMs;
		const groups = new Map<string, ChainEntry[]>();
		for (const entry of this.#entries) {
			const chained = entry.chained;
			if (!chained) continue;
			if (chained.kind === 'bench-check' && instant(chained.createdAt) > latest) {
				add(entry, finding('history', 'audit-dated-after-audit', {dated: chained.createdAt, now: isoWithOffset(this.#now), allowance: `${futureAllowanceMs / 60_000} min`}));
			}
			if (chained.previous === undefined) {
				if (chained.version >= 2) add(entry, finding('history', 'audit-chain-link-missing', {version: chained.version}));
				continue;
			}
			const group = `${dirname(entry.file)}\n${chained.key}`;
			const members = groups.get(group);
			if (members) members.push(entry);
			else groups.set(group, [entry]);
		}
		for (const members of groups.values()) this.#chainFindings(members, add);
		return out.sort((a, b) => a.index - b.index);
	}

	/** The findings of one key's chained records in one folder. */
	#chainFindings(members: readonly ChainEntry[], add: (entry: ChainEntry, found: Finding) => void): void {
		const byPrevious = new Map<string | null, ChainEntry[]>();
		const missing: Array<{entry: ChainEntry; previous: NonNullable<ChainLink>}> = [];
		for (const entry of members) {
			const {previous, createdAt} = entry.chained!;
			const named = previous?.sha256 ?? null;
			const same = byPrevious.get(named);
			if (same) same.push(entry);
			else byPrevious.set(named, [entry]);
			if (!previous) continue;
			// Found by its bytes anywhere in the audit: a record moved into an archive subfolder is not gone.
			const found = this.#bySha.get(previous.sha256);
			if (found?.chained && instant(createdAt) < instant(found.chained.createdAt)) {
				add(entry, finding('history', 'audit-chain-clock-backwards', {dated: createdAt, file: previous.file, previousDated: found.chained.createdAt}));
			}
			if (found) continue;
			const sameName = this.#atPath(join(dirname(entry.file), previous.file));
			if (sameName) add(entry, finding('history', 'audit-chain-changed', {file: previous.file, sha256: previous.sha256, actual: sameName.fileSha256 ?? '(unreadable)'}));
			else missing.push({entry, previous});
		}
		// The chain is cut where a named record is missing. When no record of the key here starts the
		// chain (names none), the earliest cut is its start: the records before it are gone, or were not
		// given to the audit. Every other cut has records of the key on both sides: a deleted record.
		const start = byPrevious.has(null) ? undefined : [...missing].sort((a, b) => instant(a.entry.createdAt) - instant(b.entry.createdAt) || a.entry.file.localeCompare(b.entry.file))[0];
		for (const cut of missing) {
			add(cut.entry, finding('history', cut === start ? 'audit-chain-gap-at-start' : 'audit-chain-missing', {file: cut.previous.file, sha256: cut.previous.sha256}));
		}
		this.#headFindings(members, add);
		for (const [named, fork] of byPrevious) {
			if (fork.length < 2) continue;
			for (const entry of fork) {
				const words = forkWords(fork.filter((other) => other !== entry));
				if (named === null) add(entry, finding('history', 'audit-chain-fork-at-start', words));
				else add(entry, finding('history', 'audit-chain-fork', {...words, file: entry.chained!.previous!.file}));
			}
		}
	}

	/**
	 * The latest record of the key, which no later record names, checked against the head file
	 * beside the records: it must be there with the bytes the head file names. A head that is not
	 * among the files audited but is still in the folder is left alone (an audit of some records).
	 */
	#headFindings(members: readonly ChainEntry[], add: (entry: ChainEntry, found: Finding) => void): void {
		const path = dirname(members[0]!.file);
		const head = readHead(path, members[0]!.key!);
		if (!head || this.#bySha.has(head.sha256)) return;
		const sameName = this.#atPath(join(path, head.file));
		if (sameName) {
			add(sameName, finding('history', 'audit-chain-head-changed', {sha256: head.sha256, actual: sameName.fileSha256 ?? '(unreadable)'}));
			return;
		}
		if (existsSync(join(path, head.file))) return;
		// The record the deleted one followed: of the records no other names, the latest.
		const named = new Set(members.map((entry) => entry.previousSha));
		const tips = members.filter((entry) => entry.fileSha256 === null || !named.has(entry.fileSha256));
		const latest = [...(tips.length > 0 ? tips : members)].sort((a, b) => instant(a.createdAt) - instant(b.createdAt) || a.file.localeCompare(b.file)).at(-1)!;
		add(latest, finding('history', 'audit-chain-head-missing', {file: head.file, sha256: head.sha256}));
	}
}
