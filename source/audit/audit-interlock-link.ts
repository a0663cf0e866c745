import {compareTests, instantOf, normaliseLocation} from '../interlock/functional-test/test-choice.js';
import {finding, type Finding} from '../records/findings.js';
import {describeProblem} from '../shared/problems.js';
import type {InterlockTestSummary} from './audit-interlock.js';
import type {ShortRecord} from './summary-audit.js';
import {addFindings} from './summary-audit.js';

/** What linkInterlockTests reads and adds to of each record's audit. */
type Audited = {file: string; authentic: boolean; bodySha256: string | null; record: ShortRecord | null; interlockTest: InterlockTestSummary | null; notChecked: Array<{item: string; text: string}>; findings: Finding[]};

const testWords = (testedOn: string, outcome: string) => `tested ${testedOn}, ${outcome}`;
const sameLocation = (a: string | null | undefined, b: string | null | undefined) => (a ?? undefined) === undefined ? (b ?? undefined) === undefined : (b ?? undefined) !== undefined && normaliseLocation(a!) === normaliseLocation(b!);

/**
 * A bench check that answered its interlock confirmations from a test record names it by body
 * hash. When that record is among the authentic records audited: it must say what the check
 * used (test day and outcome), be of the check's location, and be the latest test of its plan
 * and location recorded before the check (by the absolute instant). When it is not among them,
 * the audit says so (not a finding). `benchLocations` gives the location input of each bench
 * record by its index in `audits`.
 */
export function linkInterlockTests(audits: Audited[], benchLocations: ReadonlyMap<number, string | undefined>): void {
	const authenticTests = audits.filter((audit) => audit.authentic && audit.interlockTest && audit.bodySha256);
	const tests = new Map(authenticTests.map((audit) => [audit.bodySha256!, audit]));
	// One note shared by every check that named no plan: a large folder has many.
	const notTested = {item: 'interlock-test', text: describeProblem({code: 'audit-not-checked-interlock', data: {}})};
	audits.forEach((audit, index) => {
		if (!audit.authentic || !audit.record) return;
		const used = audit.record.interlockTest?.record;
		if (!audit.record.interlockTest) {
			// A summarised audit keeps no notes per record (its list is shared and frozen).
			if (!Object.isFrozen(audit.notChecked)) audit.notChecked.push(notTested);
			return;
		}
		// The check named a plan but found no usable test: its confirmations say no, and the consistency check covers that.
		if (!used) return;
		const data = {file: used.file, bodySha256: used.bodySha256, recorded: testWords(used.testedOn, used.outcome)};
		const found = tests.get(used.bodySha256);
		if (!found) {
			addFindings(audit, finding('history', 'audit-interlock-record-missing', data));
			return;
		}
		const test = found.interlockTest!;
		if (test.testedOn !== used.testedOn || test.outcome !== used.outcome) addFindings(audit, finding('consistency', 'audit-interlock-record-mismatch', {...data, actual: testWords(test.testedOn, test.outcome)}));
		const bench = benchLocations.get(index);
		if (test.location !== null && !sameLocation(bench, test.location)) addFindings(audit, finding('consistency', 'audit-interlock-bench-location', {bench: bench ?? '(none)', file: used.file, test: test.location ?? '(none)'}));
		const checkedAt = instantOf(audit.record.createdAt);
		const later = authenticTests
			.map((entry) => entry.interlockTest!)
			.filter((other) => other !== test && other.plan.sha256 === test.plan.sha256 && sameLocation(other.location, test.location) && instantOf(other.createdAt) <= checkedAt && compareTests(other, test) > 0)
			.sort(compareTests)
			.at(-1);
		if (later) {
			const file = authenticTests.find((entry) => entry.interlockTest === later)!.file;
			addFindings(audit, finding('consistency', 'audit-interlock-not-latest', {file: used.file, used: testWords(test.testedOn, test.outcome), later: file, laterWords: `${testWords(later.testedOn, later.outcome)}, recorded ${later.createdAt}`}));
		}
	});
}
