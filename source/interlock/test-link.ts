import {sha256Hex} from '../sha256.js';
import {readdirSync} from 'node:fs';
import {isAbsolute, join, resolve} from 'node:path';
import {displayPath} from '../display-path.js';
import type {Answers, ConfirmationAnswer} from '../rules/answers.js';
import type {CompiledRules} from '../rules/compiled-rules.js';
import {readTextFile} from '../yaml-source.js';
import {KeyCache} from '../records/audit-integrity.js';
import {readRecord} from '../records/read-record.js';
import type {InterlockTestBody} from '../records/record-schema.js';
import {durationText} from './duration-text.js';
import {localDay} from './load-results.js';
import {interlockPolicy} from './policy.js';

import {interlockPlanInput} from './plan-input.js';

/** A test record that passed integrity checking and whose first signer's key is trusted. */
export type FoundTest = {file: string; bodySha256: string; body: InterlockTestBody};

/**
 * How the bench check stands against the interlock test of its plan:
 * `current`: the latest test of this plan text passed within the policy's interval;
 * `overdue`: it passed, but longer ago than the interval; `failed`: the latest test failed;
 * `untested`: no trusted test record of this plan text; `unreadable`: the plan file cannot be read.
 */
export type InterlockLink = {
	status: 'current' | 'overdue' | 'failed' | 'untested' | 'unreadable';
	plan: {file: string; sha256: string | null};
	record: {file: string; bodySha256: string; testedOn: string; outcome: 'passed' | 'failed'; dueBy: string} | null;
	/** One line for a person, naming the record used (or why none could be). */
	text: string;
};

/** Where to look for test records and whose keys to believe. */
export type LinkContext = {
	/** Relative plan paths are read from here (the answers file's folder, or the working folder on screen). */
	base: string;
	/** The records folder. */
	folder: string;
	/** Fingerprints of the keys whose test records count: the operator's own and the trusted ones. */
	trusted: ReadonlySet<string>;
	now: Date;
};

/** Adds whole days to a YYYY-MM-DD date. */
export function addDays(day: string, days: number): string {
	const date = new Date(`${day}T00:00:00Z`);
	date.setUTCDate(date.getUTCDate() + days);
	return date.toISOString().slice(0, 10);
}

/**
 * The interlock test records in a folder (its own files only, named as prelase names them):
 * authentic, and first signed with a trusted key. Returns them with how many were passed over.
 */
export function findTestRecords(folder: string, trusted: ReadonlySet<string>): {found: FoundTest[]; untrusted: number; damaged: number} {
	let names: string[];
	try {
		names = readdirSync(folder).filter((name) => name.endsWith('.json') && name.includes('-interlock-test-'));
	} catch {
		return {found: [], untrusted: 0, damaged: 0};
	}
	const found: FoundTest[] = [];
	const keys = new KeyCache();
	let untrusted = 0;
	let damaged = 0;
	for (const name of names) {
		const file = join(folder, name);
		const read = readRecord(file, keys);
		if (!read.ok || read.record.body.kind !== 'interlock-test') {
			damaged += 1;
			continue;
		}
		if (!trusted.has(read.record.signatures[0]!.fingerprint)) {
			untrusted += 1;
			continue;
		}
		found.push({file, bodySha256: read.bodySha256, body: read.record.body});
	}
	return {found, untrusted, damaged};
}

/** The latest test of a plan text: by test day, then by when it was recorded. */
function latest(tests: readonly FoundTest[]): FoundTest | undefined {
	return [...tests].sort((a, b) => (a.body.testedOn === b.body.testedOn ? a.body.createdAt.localeCompare(b.body.createdAt) : a.body.testedOn.localeCompare(b.body.testedOn))).at(-1);
}

/** How a bench check stands against the interlock test of the plan at `planPath`, under the rule file's test interval. */
export function interlockLink(planPath: string, rules: CompiledRules, context: LinkContext): InterlockLink {
	const file = isAbsolute(planPath) ? planPath : resolve(context.base, planPath);
	const shown = displayPath(file);
	const text = readTextFile(file, 'a prelase interlock plan (YAML)');
	if (!text.ok) return {status: 'unreadable', plan: {file: shown, sha256: null}, record: null, text: `the interlock plan ${shown} cannot be read, so no test record can be matched to it`};
	const sha256 = sha256Hex(text.value);
	const policy = interlockPolicy(rules);
	const intervalDays = policy.ok ? Math.floor(policy.value.test_interval / 86_400) : 0;
	const {found, untrusted} = findTestRecords(context.folder, context.trusted);
	const test = latest(found.filter((entry) => entry.body.plan.sha256 === sha256));
	const plan = {file: shown, sha256};
	const passedOver = untrusted > 0 ? ` (${untrusted} test record${untrusted === 1 ? '' : 's'} signed with keys you do not trust were passed over)` : '';
	if (!test) {
		const older = latest(found.filter((entry) => entry.body.plan.file === shown));
		const changed = older ? `; the plan has changed since its last test (${displayPath(older.file)}, ${older.body.testedOn})` : '';
		return {status: 'untested', plan, record: null, text: `no interlock test record of this plan (sha256 ${sha256.slice(0, 16)}) in ${displayPath(context.folder)}${changed}${passedOver}; test the loop and record it: prelase plan ${shown} --record-test RESULTS`};
	}
	const dueBy = addDays(test.body.testedOn, intervalDays);
	const record = {file: displayPath(test.file), bodySha256: test.bodySha256, testedOn: test.body.testedOn, outcome: test.body.outcome, dueBy};
	const named = `interlock test record ${record.file} (tested ${record.testedOn}, body sha256 ${record.bodySha256.slice(0, 16)})`;
	if (test.body.outcome === 'failed') return {status: 'failed', plan, record, text: `the latest ${named} FAILED: ${test.body.outcomeText}`};
	const today = localDay(context.now);
	if (today > dueBy) return {status: 'overdue', plan, record, text: `the latest ${named} passed, but it is OVERDUE: the policy's interval is ${durationText(intervalDays * 86_400)}, so it was due again by ${dueBy}`};
	return {status: 'current', plan, record, text: `answered from the ${named}: passed, due again by ${dueBy}`};
}

/**
 * The answers with every confirmation the rule file has answered by the interlock test taken
 * from the link: yes when the latest test of the plan passed within the interval, no (with
 * the reason) when it is overdue, failed, missing or the plan cannot be read. Without an
 * `interlock_plan` input the answers are returned as they are.
 */
export function answerFromInterlockTest(rules: CompiledRules, answers: Answers, context: LinkContext): {answers: Answers; link: InterlockLink | null} {
	const plan = namedPlan(answers);
	return plan === undefined ? {answers, link: null} : applyLink(rules, answers, interlockLink(plan, rules, context));
}

/** The interlock plan the answers name, if any. */
function namedPlan(answers: Answers): string | undefined {
	const entry = answers.inputs.get(interlockPlanInput);
	return entry === undefined || entry.kind !== 'text' || entry.value.trim() === '' ? undefined : entry.value.trim();
}

/**
 * answerFromInterlockTest for the screens, where answers change at every keystroke: the link
 * of a plan path is worked out again only when it is older than `freshMs` (a test recorded in
 * another terminal is seen within that time).
 */
export function cachedLinker(rules: CompiledRules, context: () => LinkContext, freshMs = 2000): (answers: Answers) => {answers: Answers; link: InterlockLink | null} {
	const cache = new Map<string, {at: number; link: InterlockLink}>();
	return (answers) => {
		const plan = namedPlan(answers);
		if (plan === undefined) return {answers, link: null};
		const now = Date.now();
		let entry = cache.get(plan);
		if (entry === undefined || now - entry.at > freshMs) {
			entry = {at: now, link: interlockLink(plan, rules, context())};
			cache.set(plan, entry);
		}
		return applyLink(rules, answers, entry.link);
	};
}

function applyLink(rules: CompiledRules, answers: Answers, link: InterlockLink): {answers: Answers; link: InterlockLink} {
	const answer: ConfirmationAnswer = {answer: link.status === 'current' ? 'yes' : 'no', note: link.text};
	const confirmations = new Map(answers.confirmations);
	for (const [id, compiled] of rules.confirmations) {
		if (compiled.confirmation.answered_by === 'interlock_test') confirmations.set(id, answer);
	}
	return {answers: {...answers, confirmations}, link};
}
