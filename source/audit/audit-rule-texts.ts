import {formatProblem, type Problem} from '../shared/problems.js';
import type {Result} from '../shared/result.js';
import {sha256Hex} from '../shared/sha256.js';
import type {CompiledRules} from '../rules/compile/compiled-rules.js';
import {loadRulesFromText} from '../rules/load.js';
import {finding, type Finding} from '../records/findings.js';
import type {RecordBody} from '../records/record-schema.js';
import {readRuleText, ruleTextFolders, ruleTextPath, type StoredRuleText} from '../records/rule-texts.js';
import {displayPath} from '../shared/display-path.js';

/** The rules a record was made under, as the audit found them. */
export type RecordRules = {
	/** The compiled rules, or null when no text with the stated hash could be had (the findings say why). */
	rules: CompiledRules | null;
	/** SHA-256 of the text the audit used (null when it had none). */
	sha256: string | null;
	findings: Finding[];
};

/**
 * The rule texts of the records audited, each read and checked against its hash once, and
 * each distinct text compiled once: a folder of records mostly shares one or two texts.
 * A record names its text by SHA-256; the text is stored once in the records folder
 * (`rules/<sha256>.yaml`, in the record's folder or one above it). Records made before that
 * embed the text, which is checked against the stated hash as before. When no stored copy
 * can be had, the current rules serve if their text has the same SHA-256 (the same text,
 * byte for byte).
 */
export class RuleTexts {
	readonly #compiled = new Map<string, Result<CompiledRules, Problem>>();
	readonly #stored = new Map<string, StoredRuleText>();
	readonly #embedded = new Map<string, {text: string; sha256: string}>();
	readonly #current: CompiledRules;

	constructor(current: CompiledRules) {
		this.#current = current;
		this.#compiled.set(current.sha256, {ok: true, value: current, warnings: []});
	}

	/** The rules of a bench-check record in the file at `path`, with findings about its rule text. */
	forRecord(body: RecordBody, path: string): RecordRules {
		const stated = body.rules.sha256;
		if (body.rules.text !== undefined) return this.#embeddedRules(body.rules.text, stated, body.rules.file);
		const findings: Finding[] = [];
		const stored = this.#find(path, stated);
		if (stored.status === 'ok') return {...this.#compile(stored.text, stated, body.rules.file), findings};
		if (stored.status === 'mismatch') findings.push(finding('consistency', 'audit-rules-text-altered', {file: displayPath(stored.path), stated, actual: stored.actual}));
		else if (stored.status === 'unreadable') findings.push(finding('consistency', 'audit-rules-text-unreadable', {file: displayPath(stored.path), reason: stored.reason}));
		if (stated === this.#current.sha256) return {rules: this.#current, sha256: stated, findings};
		if (stored.status === 'missing') findings.push(finding('consistency', 'audit-rules-text-missing', {sha256: stated, file: displayPath(ruleTextPath(ruleTextFolders(path)[0]!, stated))}));
		return {rules: null, sha256: null, findings};
	}

	/** A text embedded in an older record: its hash is checked (equal text already hashed is not hashed again). */
	#embeddedRules(text: string, stated: string, file: string): RecordRules {
		const known = this.#embedded.get(stated) ?? (stated === this.#current.sha256 ? {text: this.#current.text, sha256: stated} : undefined);
		const sha256 = known && known.text === text ? known.sha256 : sha256Hex(text);
		if (!known) this.#embedded.set(stated, {text, sha256});
		const findings: Finding[] = [];
		if (sha256 !== stated) findings.push(finding('consistency', 'audit-rules-hash-mismatch', {stated, actual: sha256}));
		const compiled = this.#compile(text, sha256, file);
		return {...compiled, findings: [...findings, ...compiled.findings]};
	}

	/** Compiles a text whose SHA-256 is known, once per distinct text. */
	#compile(text: string, sha256: string, file: string): RecordRules {
		let loaded = this.#compiled.get(sha256);
		if (!loaded) {
			loaded = loadRulesFromText(text, file);
			this.#compiled.set(sha256, loaded);
		}
		if (loaded.ok) return {rules: loaded.value, sha256, findings: []};
		return {rules: null, sha256, findings: [finding('consistency', 'audit-rules-do-not-load', {detail: loaded.errors.map(formatProblem).join('; ')})]};
	}

	/** The stored text nearest the record, each file read and hashed once per audit. */
	#find(path: string, sha256: string): StoredRuleText {
		for (const folder of ruleTextFolders(path)) {
			const file = ruleTextPath(folder, sha256);
			let found = this.#stored.get(file);
			if (!found) {
				found = readRuleText(file, sha256);
				this.#stored.set(file, found);
			}
			if (found.status !== 'missing') return found;
		}
		return {status: 'missing'};
	}
}
