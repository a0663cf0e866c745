import {sha256Hex} from '../../shared/sha256.js';
import {readdirSync} from 'node:fs';
import {readRecordFile} from '../../shared/record-file-read.js';
import {isAbsolute, join, resolve} from 'node:path';
import {displayPath} from '../../shared/display-path.js';
import {formatProblem} from '../../shared/problems.js';
import type {Answers, ConfirmationAnswer} from '../../rules/evaluate/answers.js';
import type {CompiledRules} from '../../rules/compile/compiled-rules.js';
import {readTextFile} from '../../shared/yaml-source.js';
import {KeyCache} from '../../records/integrity.js';
import {checkRecordText} from '../../records/read-record.js';
import type {InterlockTestBody} from '../../records/record-schema.js';
import {durationText} from '../analysis/duration-text.js';
import {localDay} from './load-results.js';
import {loadPlanFromText} from '../plan/load-plan.js';
import {interlockPolicy} from '../plan/policy.js';
import {interlockPlanInput, locationInput} from '../plan/plan-input.js';
import {futureDated, latestTest, normaliseLocation} from './test-choice.js';
import {reasonsUnderPolicy} from './test-rejudge.js';
import {operatorSignatureIndex} from '../../records/signature-purpose.js';

/** A test record that passed integrity checking and whose first signer's key is trusted. */
export type FoundTest = {file: string; bodySha256: string; body: InterlockTestBody};

/**
 * How the bench check stands against the interlock test of its plan:
 * `current`: the latest test of this plan text at this location passed, would pass under the
 * policy in force, and is within the policy's interval; `overdue`: it passed, but longer ago
 * than the interval; `failed`: the latest test failed; `stricter-policy`: it passed under the
 * policy it was recorded with, but would not under the policy in force; `other-location`: the
 * plan names another location than the check (or none); `untested`: no trusted test record of
 * this plan text here; `unreadable`: the plan file or the interlock policy cannot be read.
 */
export type InterlockLink = {
	status: 'current' | 'overdue' | 'failed' | 'stricter-policy' | 'other-location' | 'untested' | 'unreadable';
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
 * The start of a bench-check record as the store writes it. A file that starts so can never be an
 * authentic interlock test record (a second "kind" name is refused), so the rest of it is not read:
 * most of a records folder is bench checks.
 */
const benchCheckStart = /^\{\s*"format":\s*"prelase-record",\s*"version":\s*\d+,\s*"body":\s*\{\s*"kind":\s*"bench-check"/;

/**
 * The interlock test records in a folder (its own `.json` files, whatever their names): those whose
 * content states the interlock-test kind, authentic, and first signed with a trusted key. Returns
 * them with how many were passed over.
 */
export function findTestRecords(folder: string, trusted: ReadonlySet<string>): {found: FoundTest[]; untrusted: number; damaged: number} {
	let names: string[];
	try {
		names = readdirSync(folder).filter((name) => name.endsWith('.json') && !name.startsWith('.'));
	} catch {
		return {found: [], untrusted: 0, damaged: 0};
	}
	const found: FoundTest[] = [];
	const keys = new KeyCache();
	let untrusted = 0;
	let damaged = 0;
	for (const name of names) {
		const file = join(folder, name);
		// Only regular files of a record's size are read: a link, pipe or device named *.json is no test record.
		const bytesRead = readRecordFile(file);
		if (!bytesRead.ok) continue;
		if (benchCheckStart.test(bytesRead.bytes.toString('utf8', 0, 256))) continue;
		const text = bytesRead.bytes.toString('utf8');
		// A file that does not spell out the kind (nor could hide it in a \u escape) is a bench check or something else: not read further.
		if (!text.includes('"interlock-test"') && !text.includes('\\u')) continue;
		const read = checkRecordText(text, keys);
		if (!read.ok) damaged += 1;
		if (!read.ok || read.record.body.kind !== 'interlock-test') continue;
		if (!trusted.has(read.record.signatures[operatorSignatureIndex(read.record.signatures)]?.fingerprint ?? '')) {
			untrusted += 1;
			continue;
		}
		found.push({file, bodySha256: read.bodySha256, body: read.record.body});
	}
	return {found, untrusted, damaged};
}

/** The tests of the folder that could answer: not dated after now, and of the check's location. The rest are set aside, with why. */
function answering(tests: readonly FoundTest[], location: string, now: Date): {usable: FoundTest[]; setAside: string[]} {
	const usable: FoundTest[] = [];
	const future: string[] = [];
	const elsewhere: string[] = [];
	for (const test of tests) {
		const ahead = futureDated(test.body, now);
		if (ahead !== undefined) future.push(`${displayPath(test.file)} (${ahead})`);
		else if (test.body.location === undefined || normaliseLocation(test.body.location) !== location) elsewhere.push(displayPath(test.file));
		else usable.push(test);
	}
	const setAside = [
		...(future.length > 0 ? [`dated after now, set aside: ${future.join(', ')} (a wrong clock? such a record answers nothing)`] : []),
		...(elsewhere.length > 0 ? [`recorded for another location or for none, set aside: ${elsewhere.join(', ')}`] : []),
	];
	return {usable, setAside};
}

/**
 * How a bench check at `location` stands against the interlock test of the plan at
 * `planPath`, under the rule file's interlock policy: the latest trusted test of exactly this
 * plan text, recorded for this location and not dated after now (by test day, then the
 * absolute instant it was recorded), re-judged under the policy in force.
 */
export function interlockLink(planPath: string, rules: CompiledRules, context: LinkContext, location?: string): InterlockLink {
	const file = isAbsolute(planPath) ? planPath : resolve(context.base, planPath);
	const shown = displayPath(file);
	const text = readTextFile(file, 'a prelase interlock plan (YAML)');
	if (!text.ok) return {status: 'unreadable', plan: {file: shown, sha256: null}, record: null, text: `the interlock plan ${shown} cannot be read, so no test record can be matched to it`};
	const sha256 = sha256Hex(text.value);
	const plan = {file: shown, sha256};
	const none = (status: InterlockLink['status'], why: string): InterlockLink => ({status, plan, record: null, text: why});
	const policy = interlockPolicy(rules);
	if (!policy.ok) return none('unreadable', `the rule file in force has no complete interlock policy (${policy.errors.map(formatProblem).join('; ')}), so no interlock test can be judged`);
	const loaded = loadPlanFromText(text.value, file);
	if (!loaded.ok) return none('unreadable', `the interlock plan ${shown} has problems (${loaded.errors.map(formatProblem).join('; ')}), so no test record can be matched to it`);
	const planLocation = loaded.value.location;
	if (planLocation === undefined) return none('other-location', `the plan names no location, so its tests cannot be tied to this bench; add \`location:\` (the room and bench, as the check gives it) to ${shown} and test the loop again`);
	if (location === undefined || location.trim() === '') return none('other-location', `the check gives no location, so no test of the plan for "${planLocation}" can be matched to it; give the location`);
	if (normaliseLocation(planLocation) !== normaliseLocation(location)) return none('other-location', `the plan is for "${planLocation}", but this check is at "${location}": a test of another bench's loop answers nothing here; write a plan for this bench and test its loop`);
	const intervalDays = Math.floor(policy.value.test_interval / 86_400);
	const {found, untrusted} = findTestRecords(context.folder, context.trusted);
	const {usable, setAside} = answering(found.filter((entry) => entry.body.plan.sha256 === sha256), normaliseLocation(location), context.now);
	const test = latestTest(usable);
	const notes = [...(untrusted > 0 ? [`${untrusted} test record${untrusted === 1 ? '' : 's'} signed with keys you do not trust were passed over`] : []), ...setAside];
	const passedOver = notes.length > 0 ? ` (${notes.join('; ')})` : '';
	if (!test) {
		const older = latestTest(found.filter((entry) => entry.body.plan.file === shown && entry.body.plan.sha256 !== sha256 && futureDated(entry.body, context.now) === undefined));
		const changed = older ? `; the plan has changed since its last test (${displayPath(older.file)}, ${older.body.testedOn})` : '';
		return none('untested', `no interlock test record of this plan (sha256 ${sha256.slice(0, 16)}) in ${displayPath(context.folder)}${changed}${passedOver}; test the loop and record it: prelase plan ${shown} --record-test RESULTS`);
	}
	const dueBy = addDays(test.body.testedOn, intervalDays);
	const record = {file: displayPath(test.file), bodySha256: test.bodySha256, testedOn: test.body.testedOn, outcome: test.body.outcome, dueBy};
	const named = `interlock test record ${record.file} (tested ${record.testedOn}, body sha256 ${record.bodySha256.slice(0, 16)})`;
	if (test.body.outcome === 'failed') return {status: 'failed', plan, record, text: `the latest ${named} FAILED: ${test.body.outcomeText}${passedOver}`};
	const reasons = reasonsUnderPolicy(test.body, policy.value);
	if (reasons.length > 0) {
		return {status: 'stricter-policy', plan, record, text: `the latest ${named} passed under the policy of ${test.body.policy.rules.name} (${test.body.policy.rules.file}), but would NOT pass under the policy in force (${rules.rules.name}): ${reasons.join('; ')}; test the loop again${passedOver}`};
	}
	const today = localDay(context.now);
	if (today > dueBy) return {status: 'overdue', plan, record, text: `the latest ${named} passed, but it is OVERDUE: the policy's interval is ${durationText(intervalDays * 86_400)}, so it was due again by ${dueBy}${passedOver}`};
	return {status: 'current', plan, record, text: `answered from the ${named}: passed, due again by ${dueBy}${passedOver}`};
}

/**
 * The answers with every confirmation the rule file has answered by the interlock test taken
 * from the link: yes when the latest test of the plan passed within the interval, no (with
 * the reason) when it is overdue, failed, missing or the plan cannot be read. Without an
 * `interlock_plan` input the answers are returned as they are.
 */
export function answerFromInterlockTest(rules: CompiledRules, answers: Answers, context: LinkContext): {answers: Answers; link: InterlockLink | null} {
	const plan = namedPlan(answers);
	return plan === undefined ? {answers, link: null} : applyLink(rules, answers, interlockLink(plan, rules, context, checkLocation(answers)));
}

/** The location the check gives, if any. */
function checkLocation(answers: Answers): string | undefined {
	const entry = answers.inputs.get(locationInput);
	return entry === undefined || entry.kind !== 'text' ? undefined : entry.value;
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
		const location = checkLocation(answers);
		const key = `${plan}\n${location === undefined ? '' : normaliseLocation(location)}`;
		let entry = cache.get(key);
		if (entry === undefined || now - entry.at > freshMs) {
			entry = {at: now, link: interlockLink(plan, rules, context(), location)};
			cache.set(key, entry);
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
