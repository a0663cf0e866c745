import {auditBothWays} from '../helpers/audit-both-ways.js';
import {createHash} from 'node:crypto';
import {mkdtempSync, readFileSync, rmSync, writeFileSync} from 'node:fs';
import {tmpdir} from 'node:os';
import {join} from 'node:path';
import {afterAll, beforeAll, describe, expect, it} from 'vitest';
import {type AuditReport} from '../../source/audit/audit.js';
import {ownFingerprint} from '../../source/records/key-files.js';
import {sampleRules} from '../helpers/sample-record.js';
import {operatorPrivateKey} from '../helpers/operator-key.js';
import {generateKeyPair} from '../../source/records/key-material.js';
import type {InterlockTestBody, InterlockTestRecord} from '../../source/records/record-schema.js';
import {signRecord} from '../../source/records/sign.js';
import {runIn, unwrap, writeCaseFile} from '../helpers/run-cli.js';

const demoPlan = 'docs/examples/interlock/bench3-interlock-plan.yaml';
const demoResults = 'docs/examples/interlock/bench3-interlock-test-results.yaml';

let folder: string;
let home: string;
let witnessKey: string;
let freshPath: string;
let fresh: InterlockTestRecord;
let unwitnessed: string;

const run = async (...argv: string[]) => {
	const said = await runIn(home, argv);
	return {...said, stdout: unwrap(said.stdout)};
};
const writeRecordFile = (content: string | InterlockTestRecord) => writeCaseFile(folder, content);

/** The fresh record's body changed by `change` and signed again by the tester with the same valid key. */
function resigned(change: (body: InterlockTestBody) => void): InterlockTestRecord {
	const body = structuredClone(fresh.body);
	change(body);
	return signRecord(body, [{signer: {name: 'Ines Marlow', role: 'photonics engineer', meaning: 'performed'}, key: operatorPrivateKey(home)}]);
}

/** The audit of one record file, as JSON. */
async function auditJson(path: string): Promise<{code: number; report: AuditReport}> {
	const {code, stdout} = await run('audit', path, '--json');
	return {code, report: JSON.parse(stdout) as AuditReport};
}

const sha256 = (text: string) => createHash('sha256').update(text).digest('hex');

beforeAll(async () => {
	folder = mkdtempSync(join(tmpdir(), 'prelase-interlock-audit-'));
	home = join(folder, 'home');
	witnessKey = join(folder, 'witness.key');
	writeFileSync(witnessKey, `Name: Tomas Reyes\n${String(generateKeyPair().privateKey.export({format: 'pem', type: 'pkcs8'}))}`, {mode: 0o600});
	// The fresh record names no witness: a witness named without signing is a finding of its own (tested below).
	unwitnessed = join(folder, 'results-without-witness.yaml');
	writeFileSync(unwitnessed, readFileSync(demoResults, 'utf8').replace(/^witness: .*\n/m, ''));
	const made = await run('plan', demoPlan, '--record-test', unwitnessed, '--records', join(folder, 'fresh'));
	if (made.code !== 0) throw new Error(`recording the demo test failed (${made.code}): ${made.stderr}`);
	freshPath = /Record written: (.+)/.exec(made.stdout)![1]!;
	fresh = JSON.parse(readFileSync(freshPath, 'utf8')) as InterlockTestRecord;
});

afterAll(() => {
	rmSync(folder, {recursive: true, force: true});
});

describe('audit of a fresh interlock test record', () => {
	it('is authentic and consistent, exit 0, and says which plan was tested and that it passed', async () => {
		const {code, stdout, stderr} = await run('audit', freshPath);
		expect(stderr).toBe('');
		expect(code).toBe(0);
		expect(stdout).toContain(`Plan tested    interlock test of Fenwick Hollow B.112 bench 3 — enclosure and room loop · plan sha256 ${sha256(readFileSync(demoPlan, 'utf8')).slice(0, 16)}`);
		expect(stdout).toContain('Location       Room B.112, bench 3\n');
		expect(stdout).toContain('Tested         2026-11-30 by Ines Marlow, photonics engineer\n');
		expect(stdout).toContain('Outcome        Passed: every step of the functional test passed, and the plan has no stop finding. (as recorded)');
		expect(stdout).toMatch(/Signature 1 {4}✓ authentic Ines Marlow \(photonics engineer\), operator, .* · your own key/);
		expect(stdout).toContain('Integrity      ✓ authentic: every signature verifies over the body');
		expect(stdout).toContain("Consistency    ✓ the plan's findings, the test steps and the outcome follow from the embedded plan under the recorded policy");
		expect(stdout).toContain('Findings       none');
		expect(stdout).toContain('Result: every record is authentic and its conclusions follow from its numbers.');
		expect(stdout).toContain('laser safety officer');
	});

	it('as JSON: the interlock test summary, no bench-check summary, consistent with no finding', async () => {
		const {code, report} = await auditJson(freshPath);
		expect(code).toBe(0);
		expect(report.status).toBe('authentic_and_consistent');
		const [audit] = report.records;
		expect(audit!.authentic).toBe(true);
		expect(audit!.record).toBeNull();
		expect(audit!.interlockTest).toMatchObject({testedOn: '2026-11-30', outcome: 'passed', exceptions: [], plan: {name: 'Fenwick Hollow B.112 bench 3 — enclosure and room loop', file: demoPlan}});
		expect(audit!.consistency).toEqual({reevaluated: true, consistent: true, rulesSha256: fresh.body.policy.rules.sha256});
		expect(audit!.findings).toEqual([]);
	});

	it('the same record re-signed unchanged is still consistent (the re-signing in the cases below changes only what they change)', async () => {
		const {code, report} = await auditJson(writeRecordFile(resigned(() => {})));
		expect(code).toBe(0);
		expect(report.records[0]!.findings).toEqual([]);
	});
});

const recordedStops = (stops: number) => `${stops} stop finding${stops === 1 ? '' : 's'}`;

describe('audit of re-signed, altered interlock test records: authentic, with consistency findings', () => {
	it.each([
		{
			name: 'a step passed although its stop time is above the recorded limit',
			change: (body: InterlockTestBody) => {
				body.steps[0]!.stoppedIn = {si: 0.05, unit: 's', text: '50 ms'};
			},
			findings: [['audit-test-step-too-slow', {step: 1, measured: '50 ms', limit: '20 ms'}]],
		},
		{
			name: 'the outcome changed to failed',
			change: (body: InterlockTestBody) => {
				body.outcome = 'failed';
			},
			findings: [['audit-test-outcome-mismatch', {recorded: 'failed', computed: 'passed'}]],
		},
		{
			name: 'a step changed to fail, the outcome left passed',
			change: (body: InterlockTestBody) => {
				body.steps[4]!.result = 'fail';
			},
			findings: [['audit-test-outcome-mismatch', {recorded: 'passed', computed: 'failed'}]],
		},
		{
			name: 'the plan\'s stop findings raised, outcome and text changed to match',
			change: (body: InterlockTestBody) => {
				body.planFindings.stops = 1;
				body.outcome = 'failed';
				body.outcomeText = 'Failed: the plan has 1 stop finding.';
			},
			findings: [['audit-plan-findings-mismatch', {recorded: recordedStops(1), computed: recordedStops(0)}]],
		},
		{
			// The recorded outcome no longer follows from the recorded stop findings either.
			name: 'the plan\'s stop findings raised alone',
			change: (body: InterlockTestBody) => {
				body.planFindings.stops = 2;
			},
			findings: [
				['audit-plan-findings-mismatch', {recorded: recordedStops(2), computed: recordedStops(0)}],
				['audit-test-outcome-mismatch', {recorded: 'passed', computed: 'failed'}],
			],
		},
		{
			name: 'the plan text changed (a comment), its sha256 not',
			change: (body: InterlockTestBody) => {
				body.plan.text = body.plan.text.replace('# warmest the cable tray gets', '# warmest the cable tray got in August');
			},
			findings: [['audit-plan-hash-mismatch', {stated: sha256(readFileSync(demoPlan, 'utf8')), actual: sha256(readFileSync(demoPlan, 'utf8').replace('# warmest the cable tray gets', '# warmest the cable tray got in August'))}]],
		},
		{
			// The emergency stop wired normally open is a stop finding the record does not have.
			name: 'the plan text changed to a faulty loop, its sha256 changed to match',
			change: (body: InterlockTestBody) => {
				body.plan.text = body.plan.text.replace('FH-ES1 mushroom emergency stop on the bench front\n    contact: normally_closed', 'FH-ES1 mushroom emergency stop on the bench front\n    contact: normally_open');
				body.plan.sha256 = sha256(body.plan.text);
			},
			findings: [['audit-plan-findings-mismatch', {recorded: recordedStops(0), computed: recordedStops(1)}]],
		},
		{
			// hand arithmetic: opening time + 1 ms input + 0.5 ms disable is above 10 ms for door_switch
			// (10 + 1.5 = 11.5 ms) and chiller_flow (15 + 1.5 = 16.5 ms) only; the rest open in 8 ms or less.
			name: 'the recorded largest response time lowered to 10 ms',
			change: (body: InterlockTestBody) => {
				body.policy.maxResponseTime = {si: 0.01, unit: 's', text: '10 ms'};
			},
			// the demo's step 5 (chiller_flow) stopped in 16 ms: a pass above the lowered limit
			findings: [
				['audit-plan-findings-mismatch', {recorded: recordedStops(0), computed: recordedStops(2)}],
				['audit-test-step-too-slow', {step: 5, measured: '16 ms', limit: '10 ms'}],
			],
		},
		{
			name: 'a step dropped',
			change: (body: InterlockTestBody) => {
				body.steps.splice(7, 1);
			},
			findings: [['audit-test-steps-mismatch', {detail: 'step 8: the sheet has "8 power interruption", the record "9 bypass time-out: alignment_bypass"'}]],
		},
		{
			name: 'the last step dropped',
			change: (body: InterlockTestBody) => {
				body.steps.pop();
			},
			findings: [['audit-test-steps-mismatch', {detail: 'step 9: the sheet has "9 bypass time-out: alignment_bypass", the record "(no step)"'}]],
		},
		{
			name: 'a step added',
			change: (body: InterlockTestBody) => {
				body.steps.push({...body.steps[0]!, number: 10, subject: 'extra'});
			},
			findings: [['audit-test-steps-mismatch', {detail: 'step 10: the sheet has "(no step)", the record "10 extra"'}]],
		},
	])('$name', async ({change, findings}) => {
		const {code, report} = await auditJson(writeRecordFile(resigned(change)));
		expect(code).toBe(1);
		expect(report.status).toBe('authentic_with_findings');
		const [audit] = report.records;
		expect(audit!.authentic).toBe(true);
		expect(audit!.consistency).toMatchObject({reevaluated: true, consistent: false});
		expect(audit!.findings.map((found) => [found.code, found.data])).toEqual(findings);
		expect(audit!.findings.every((found) => found.kind === 'consistency')).toBe(true);
	});

	it('shows the altered record\'s findings and failed steps in the text', async () => {
		const {code, stdout} = await run(
			'audit',
			writeRecordFile(
				resigned((body) => {
					body.steps[4]!.result = 'fail';
				}),
			),
		);
		expect(code).toBe(1);
		expect(stdout).toContain("Consistency    ✗ the record's conclusions do not follow from its embedded plan and steps");
		expect(stdout).toContain('Steps          ✗ fail: step 5 (chiller_flow)');
		expect(stdout).toContain('[consistency] the record says the test passed, but its steps and plan findings give failed');
		expect(stdout).toContain('Result: authentic, with findings');
	});

	it('an embedded plan that no longer loads is a finding, not a crash', async () => {
		const {code, report} = await auditJson(
			writeRecordFile(
				resigned((body) => {
					body.plan.text = body.plan.text.replace('loop_voltage: 12 V', 'loop_voltage: twelve');
					body.plan.sha256 = sha256(body.plan.text);
				}),
			),
		);
		expect(code).toBe(1);
		expect(report.records[0]!.consistency).toMatchObject({reevaluated: false, consistent: false});
		expect(report.records[0]!.findings.map((found) => found.code)).toEqual(['audit-plan-does-not-load']);
	});
});

describe('audit of an interlock test record changed without signing again', () => {
	it('is an integrity failure, exit 3', async () => {
		const text = readFileSync(freshPath, 'utf8');
		expect(text).toContain('"outcome": "passed"');
		const {code, stdout} = await run('audit', writeRecordFile(text.replace('"outcome": "passed"', '"outcome": "failed"')));
		expect(code).toBe(3);
		expect(stdout).toContain('Integrity      ✗ NOT AUTHENTIC: signature 1 (Ines Marlow): the signature does not match the content');
		expect(stdout).toContain('Result: INTEGRITY FAILURE');
		expect(stdout).toContain('(as recorded, unverified)');
	});

	it('a changed step time is an integrity failure too, as JSON', async () => {
		const text = readFileSync(freshPath, 'utf8');
		expect(text).toContain('"text":"16 ms"');
		const {code, report} = await auditJson(writeRecordFile(text.replace('"text":"16 ms"', '"text":"12 ms"')));
		expect(code).toBe(3);
		expect(report.status).toBe('integrity_failure');
		expect(report.records[0]!.authentic).toBe(false);
		expect(report.records[0]!.consistency).toBeNull();
		expect(report.records[0]!.findings.map((found) => [found.kind, found.code])).toEqual([['integrity', 'audit-signature-invalid']]);
	});
});

describe('audit of a witnessed interlock test record', () => {
	it('shows both signatures; the witness key is not trusted until the auditor says so', async () => {
		const made = await run('plan', demoPlan, '--record-test', demoResults, '--records', join(folder, 'witnessed'), '--witness-key', witnessKey);
		expect(made.code).toBe(0);
		const path = /Record written: (.+)/.exec(made.stdout)![1]!;
		const {code, stdout} = await run('audit', path);
		expect(code).toBe(1);
		expect(stdout).toMatch(/Signature 1 {4}✓ authentic Ines Marlow \(photonics engineer\), operator, .* · your own key/);
		expect(stdout).toMatch(/Signature 2 {4}! intact Tomas Reyes \(deputy laser safety officer\), witness, .* · ! NOT a key you trust: intact, signer unknown/);
		expect(stdout).toContain('witnessed by Tomas Reyes, deputy laser safety officer ·'.replace(' ·', ''));
		expect(stdout).not.toContain('named, not signed');
		expect(stdout).toContain('[trust] signature 2 (Tomas Reyes) was made with a key you do not trust');
		expect(stdout).toContain("Consistency    ✓ the plan's findings");
	});

	it('a witness named without a key is recorded as named, not signed: in the body, the plan output and the audit, with a finding', async () => {
		const made = await run('plan', demoPlan, '--record-test', demoResults, '--records', join(folder, 'named-only'));
		expect(made.code).toBe(0);
		expect(made.stdout).toContain('Witness: Tomas Reyes, named, not signed (a witness who did not sign is not a witness; sign with --witness-key FILE)');
		const path = /Record written: (.+)/.exec(made.stdout)![1]!;
		expect((JSON.parse(readFileSync(path, 'utf8')) as InterlockTestRecord).body.witness).toEqual({name: 'Tomas Reyes', role: 'deputy laser safety officer', signed: false});
		const {code, stdout} = await run('audit', path);
		expect(code).toBe(1);
		expect(stdout).toContain('witnessed by Tomas Reyes, deputy laser safety officer (named, not signed)');
		expect(stdout).toContain('[trust] the witness Tomas Reyes is named, not signed: no signature with the purpose witness; a witness who did not sign is not a witness');
	});
});

describe('a policy that requires a signed witness for interlock functional tests', () => {
	it('an interlock test record without a witness signature is a policy finding; without the policy it is not', () => {
		const rules = sampleRules();
		const trust = {own: ownFingerprint(home), trusted: []};
		const strict = {...rules, rules: {...rules.rules, signing: {signed_witness_for_interlock_tests: true}}};
		const found = (current: typeof rules) => auditBothWays([freshPath], {current, trust}).records[0]!.findings.map((entry) => [entry.code, entry.text]);
		expect(found(strict)).toEqual([['audit-witness-signature-required', 'the policy requires a signed witness for an interlock functional test, and this record has no witness signature by a trusted key']]);
		expect(found(rules)).toEqual([]);
	});
});
