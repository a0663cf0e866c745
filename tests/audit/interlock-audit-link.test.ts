import {previousRecord, rememberRecord} from '../../source/records/chain.js';
import {fingerprint, rawPublicKey} from '../../source/records/key-material.js';
import {mkdirSync, mkdtempSync, readFileSync, rmSync, writeFileSync} from 'node:fs';
import {tmpdir} from 'node:os';
import {join} from 'node:path';
import {afterAll, beforeAll, describe, expect, it} from 'vitest';
import {analysePlan} from '../../source/interlock/analysis/analyse.js';
import {loadPlanFromText} from '../../source/interlock/plan/load-plan.js';
import {loadResults, localDay} from '../../source/interlock/functional-test/load-results.js';
import {interlockPolicy} from '../../source/interlock/plan/policy.js';
import {futureAllowanceMs} from '../../source/interlock/functional-test/test-choice.js';
import {buildTestBody} from '../../source/interlock/functional-test/test-record.js';
import {testSheet} from '../../source/interlock/functional-test/test-sheet.js';
import type {AuditReport} from '../../source/audit/audit.js';
import {operatorKey} from '../../source/records/key-files.js';
import {operatorPrivateKey} from '../helpers/operator-key.js';
import type {InterlockTestBody} from '../../source/records/record-schema.js';
import {signRecord} from '../../source/records/sign.js';
import {writeRecord} from '../../source/records/store.js';
import type {CompiledRules} from '../../source/rules/compile/compiled-rules.js';
import {loadRules, loadRulesFromText, shippedRulesPath} from '../../source/rules/load.js';
import {caseFolder, runIn, unwrap} from '../helpers/run-cli.js';

const demoPlanText = readFileSync('docs/examples/interlock/bench3-interlock-plan.yaml', 'utf8');
const demoAnswers = readFileSync('docs/examples/interlock/bench3-808nm-linked.yaml', 'utf8');
const demoResults = 'docs/examples/interlock/bench3-interlock-test-results.yaml';
const shippedText = readFileSync(shippedRulesPath(), 'utf8');

const loaded = loadRules(shippedRulesPath());
if (!loaded.ok) throw new Error('the shipped rules must load');
const shipped = loaded.value;

/** A site rule file looser than the shipped one: 2 s response time, 100 h longest bypass (the shipped: 20 ms, 8 h). */
function looserRules(): CompiledRules {
	const text = shippedText
		.replace(/(interlock_max_response_time:\n\s+value:) 20 ms/, '$1 2 s')
		.replace(/(interlock_longest_bypass:\n\s+value:) 8 h/, '$1 100 h');
	if (text === shippedText || !text.includes('value: 2 s') || !text.includes('value: 100 h')) throw new Error('the shipped policy block changed; adapt this fixture');
	const rules = loadRulesFromText(text, join(folder, 'site-rules.yaml'));
	if (!rules.ok) throw new Error(JSON.stringify(rules.errors));
	return rules.value;
}

let folder: string;
let home: string;

beforeAll(() => {
	folder = mkdtempSync(join(tmpdir(), 'prelase-interlock-link-'));
	home = join(folder, 'home');
	operatorKey(home, true, 'Ines Marlow');
});
afterAll(() => rmSync(folder, {recursive: true, force: true}));

const run = async (...argv: string[]) => {
	const said = await runIn(home, argv);
	return {...said, stdout: unwrap(said.stdout)};
};

/** An ISO 8601 text of `date` as a clock at UTC offset `minutes` shows it (e.g. +09:00). */
function atOffset(date: Date, minutes: number): string {
	const shifted = new Date(date.getTime() + minutes * 60_000).toISOString().slice(0, 19);
	const sign = minutes < 0 ? '-' : '+';
	const size = Math.abs(minutes);
	return `${shifted}${sign}${String(Math.floor(size / 60)).padStart(2, '0')}:${String(size % 60).padStart(2, '0')}`;
}

type Made = {createdAt: string; testedOn: string; failStep?: number; stoppedIn?: Record<number, string>};

/** A test record of `planText` under `rules`, signed with the operator's key, written to `records`. */
function recordTest(records: string, planPath: string, planText: string, rules: CompiledRules, made: Made): string {
	const file = loadPlanFromText(planText, planPath);
	if (!file.ok) throw new Error(JSON.stringify(file.errors));
	const policy = interlockPolicy(rules);
	if (!policy.ok) throw new Error(JSON.stringify(policy.errors));
	const plan = {...file.value, policy: policy.value};
	const sheet = testSheet(plan);
	const results = loadResults(demoResults, sheet, new Date());
	if (!results.ok) throw new Error(JSON.stringify(results.errors));
	const steps = results.value.steps.map((entry) => {
		const time = made.stoppedIn?.[entry.step];
		const stopped = time === undefined ? {} : {stopped_in: Number.parseFloat(time) / 1000};
		return {...entry, ...stopped, ...(entry.step === made.failStep ? {result: 'fail' as const} : {})};
	});
	// Without the demo's witness: only the tester signs here, and a witness named without signing is a finding of its own.
	const {witness: _named, ...tested} = results.value;
	const body: InterlockTestBody = buildTestBody({plan, planFile: planPath, planText, rules, analysis: analysePlan(plan), sheet, results: {...tested, tested_on: made.testedOn, steps}});
	body.createdAt = made.createdAt;
	// Chained to the key's previous record in the folder, as prelase writes records.
	const key = operatorPrivateKey(home);
	const chainKey = fingerprint(rawPublicKey(key));
	const path = writeRecord(records, signRecord({...body, previous: previousRecord(records, chainKey)}, [{signer: {name: 'Ines Marlow', role: 'photonics engineer', meaning: 'performed'}, key}]));
	rememberRecord(records, chainKey, path);
	return path;
}

/** A case folder: the plan (as `plan.yaml`), the bench check's answers naming it at `location`, and an empty records folder. */
function benchCase(planText: string, location: string): {dir: string; plan: string; answers: string; records: string} {
	const dir = caseFolder(folder);
	const plan = join(dir, 'plan.yaml');
	writeFileSync(plan, planText);
	const answers = join(dir, 'answers.yaml');
	const text = demoAnswers.replace('interlock_plan: bench3-interlock-plan.yaml', 'interlock_plan: plan.yaml').replace('location: Room B.112, bench 3', `location: "${location}"`);
	if (text === demoAnswers) throw new Error('the linked demo changed; adapt this fixture');
	writeFileSync(answers, text);
	const records = join(dir, 'records');
	mkdirSync(records);
	return {dir, plan, answers, records};
}

/** The bench check as a person reads it (outcome, exit status) and its interlock link as JSON. */
async function check(answers: string, records: string) {
	const said = await run('check', '--answers', answers, '--records', records);
	const json = JSON.parse((await run('check', '--answers', answers, '--records', records, '--json')).stdout) as {interlockTest?: {status: string; text: string}};
	expect(said.stdout).toContain(`Interlock test (${json.interlockTest?.status}): `);
	return {...said, status: json.interlockTest?.status, text: json.interlockTest?.text ?? ''};
}

async function audit(...paths: string[]): Promise<{code: number; report: AuditReport}> {
	const {code, stdout} = await run('audit', ...paths, '--json');
	return {code, report: JSON.parse(stdout) as AuditReport};
}

const codesOf = (report: AuditReport) => report.records.flatMap((record) => record.findings.map((found) => `${found.kind}:${found.code}`));

const bench3 = 'Room B.112, bench 3';
const today = () => localDay(new Date());
const hoursAgo = (hours: number) => new Date(Date.now() - hours * 3_600_000);

describe('a test recorded under a looser policy, checked under the stricter policy in force', () => {
	// The shipped policy (rules/default.yaml): 20 ms response time, 8 h longest bypass. A step that
	// stopped in 900 ms and a 48 h bypass pass under a site file allowing 2 s and 100 h, not under it.
	const plan48h = () => {
		const text = demoPlanText.replace('      time_limit: 4 h', '      time_limit: 48 h');
		if (text === demoPlanText) throw new Error('the demo plan changed; adapt this fixture');
		return text;
	};

	it('the test passed as recorded, but does not answer yes today; the check says why; the audit reports it (exit 1)', async () => {
		const bench = benchCase(plan48h(), bench3);
		const file = recordTest(bench.records, bench.plan, plan48h(), looserRules(), {createdAt: atOffset(hoursAgo(1), 60), testedOn: today(), stoppedIn: {5: '900 ms'}});
		expect(JSON.parse(readFileSync(file, 'utf8')).body.outcome).toBe('passed');
		const said = await check(bench.answers, bench.records);
		expect(said.status).toBe('stricter-policy');
		expect(said.stdout).toContain('Outcome: DO NOT ENERGIZE');
		expect(said.code).toBe(1);
		expect(said.text).toContain('step 5 (chiller_flow) stopped in 900 ms, above the 20 ms');
		expect(said.text).toContain('interlock-bypass-too-long');
		const audited = await audit(file);
		expect(audited.code).toBe(1);
		expect(codesOf(audited.report)).toEqual(['policy:audit-interlock-test-policy']);
		expect(audited.report.records[0]!.findings[0]!.text).toContain('step 5 (chiller_flow) stopped in 900 ms, above the 20 ms');
	});

	it('the same test with every step within 20 ms and the 4 h bypass answers yes (control)', async () => {
		const bench = benchCase(demoPlanText, bench3);
		const file = recordTest(bench.records, bench.plan, demoPlanText, looserRules(), {createdAt: atOffset(hoursAgo(1), 60), testedOn: today()});
		const said = await check(bench.answers, bench.records);
		expect(said.status).toBe('current');
		expect(said.stdout).toContain('Outcome: CLEAR TO ENERGIZE');
		expect((await audit(file)).code).toBe(0);
	});
});

describe('the latest test is the latest instant, whatever the UTC offset it was written with', () => {
	// Hand arithmetic: the pass at T written at +09:00 reads 9 h later as text than the failure at
	// T + 2 s written at −05:00, so comparing the text puts the pass last; the instants put the failure last.
	it('a pass at +09:00 and a failure two seconds later at -05:00: the failure is the latest', async () => {
		const bench = benchCase(demoPlanText, bench3);
		const t = hoursAgo(2);
		const pass = recordTest(bench.records, bench.plan, demoPlanText, shipped, {createdAt: atOffset(t, 540), testedOn: today()});
		const fail = recordTest(bench.records, bench.plan, demoPlanText, shipped, {createdAt: atOffset(new Date(t.getTime() + 2000), -300), testedOn: today(), failStep: 3});
		expect(atOffset(t, 540) > atOffset(new Date(t.getTime() + 2000), -300)).toBe(true);
		const said = await check(bench.answers, bench.records);
		expect(said.status).toBe('failed');
		expect(said.text).toContain(fail.split('/').at(-1)!);
		expect(said.stdout).toContain('Outcome: DO NOT ENERGIZE');
		expect(pass).not.toBe(fail);
	});

	it('the audit reports a bench check that used a pass when a later failure was already recorded', async () => {
		const bench = benchCase(demoPlanText, bench3);
		const t = hoursAgo(2);
		recordTest(bench.records, bench.plan, demoPlanText, shipped, {createdAt: atOffset(t, 540), testedOn: today()});
		const signed = await run('check', '--answers', bench.answers, '--records', bench.records, '--sign', 'Ines Marlow', '--role', 'photonics engineer');
		expect(signed.stdout).toContain('Outcome: CLEAR TO ENERGIZE');
		// the failure, two seconds after the pass, reaches the folder only after the check (a late copy)
		recordTest(bench.records, bench.plan, demoPlanText, shipped, {createdAt: atOffset(new Date(t.getTime() + 2000), -300), testedOn: today(), failStep: 3});
		const audited = await audit(bench.records);
		expect(audited.code).toBe(1);
		// The same key wrote the failure after the check, dated before it: the chain also shows the clock went back.
		expect(codesOf(audited.report)).toEqual(['history:audit-chain-clock-backwards', 'consistency:audit-interlock-not-latest']);
	});
});

describe('a record dated after now answers nothing', () => {
	it(`the allowance for a fast clock is 5 minutes`, () => {
		expect(futureAllowanceMs).toBe(5 * 60_000);
	});

	it('a pass dated five years ahead does not hide today\'s failure; the check names it; the audit reports it', async () => {
		const bench = benchCase(demoPlanText, bench3);
		const ahead = new Date(Date.now() + 5 * 365 * 86_400_000);
		const future = recordTest(bench.records, bench.plan, demoPlanText, shipped, {createdAt: atOffset(ahead, 0), testedOn: localDay(ahead)});
		recordTest(bench.records, bench.plan, demoPlanText, shipped, {createdAt: atOffset(hoursAgo(1), 0), testedOn: today(), failStep: 2});
		const said = await check(bench.answers, bench.records);
		expect(said.status).toBe('failed');
		expect(said.stdout).toContain('Outcome: DO NOT ENERGIZE');
		expect(said.text).toContain('dated after now, set aside: ');
		expect(said.text).toContain(`${future.split('/').at(-1)!} (recorded ${atOffset(ahead, 0)})`);
		const audited = await audit(future);
		expect(audited.code).toBe(1);
		expect(codesOf(audited.report)).toEqual(['history:audit-record-from-future']);
	});

	it.each([
		// the allowance is 5 min: 4 min ahead still counts, 6 min ahead does not
		{name: '4 minutes ahead', minutes: 4, status: 'current'},
		{name: '6 minutes ahead', minutes: 6, status: 'untested'},
	])('a pass alone, $name: $status', async ({minutes, status}) => {
		const bench = benchCase(demoPlanText, bench3);
		const at = new Date(Date.now() + minutes * 60_000);
		recordTest(bench.records, bench.plan, demoPlanText, shipped, {createdAt: atOffset(at, 0), testedOn: localDay(at) > today() ? today() : localDay(at)});
		const said = await check(bench.answers, bench.records);
		expect(said.status).toBe(status);
	});
});

describe('a test answers only the bench check of its own location', () => {
	it('bench 4, with a copy of bench 3\'s plan, does not take bench 3\'s test; the check says why', async () => {
		const bench = benchCase(demoPlanText, 'Room B.112, bench 4');
		recordTest(bench.records, bench.plan, demoPlanText, shipped, {createdAt: atOffset(hoursAgo(1), 0), testedOn: today()});
		const said = await check(bench.answers, bench.records);
		expect(said.status).toBe('other-location');
		expect(said.text).toContain('the plan is for "Room B.112, bench 3", but this check is at "Room B.112, bench 4"');
		expect(said.stdout).toContain('Outcome: DO NOT ENERGIZE');
	});

	it.each([
		{name: 'as written', location: bench3},
		{name: 'other case and spacing', location: '  room b.112,   BENCH 3 '},
	])('the same location $name answers', async ({location}) => {
		const bench = benchCase(demoPlanText, location);
		recordTest(bench.records, bench.plan, demoPlanText, shipped, {createdAt: atOffset(hoursAgo(1), 0), testedOn: today()});
		const said = await check(bench.answers, bench.records);
		expect(said.status).toBe('current');
		expect(said.stdout).toContain('Outcome: CLEAR TO ENERGIZE');
	});

	it('a plan that names no location answers nothing, and says to add one', async () => {
		const text = demoPlanText.replace(/^location: .*\n/m, '');
		const bench = benchCase(text, bench3);
		recordTest(bench.records, bench.plan, text, shipped, {createdAt: atOffset(hoursAgo(1), 0), testedOn: today()});
		const said = await check(bench.answers, bench.records);
		expect(said.status).toBe('other-location');
		expect(said.text).toContain('the plan names no location');
	});

	it('the audit reports a test record whose location is not its plan\'s', async () => {
		const bench = benchCase(demoPlanText, bench3);
		const file = recordTest(bench.records, bench.plan, demoPlanText, shipped, {createdAt: atOffset(hoursAgo(1), 0), testedOn: today()});
		const record = JSON.parse(readFileSync(file, 'utf8'));
		record.body.location = 'Room B.112, bench 4';
		const forged = join(bench.dir, 'forged');
		mkdirSync(forged);
		const path = writeRecord(forged, signRecord(record.body, [{signer: {name: 'Ines Marlow', role: 'photonics engineer', meaning: 'performed'}, key: operatorPrivateKey(home)}]));
		const audited = await audit(path);
		expect(audited.code).toBe(1);
		expect(codesOf(audited.report)).toEqual(['consistency:audit-interlock-location-mismatch']);
		const said = await check(bench.answers, forged);
		expect(said.status).toBe('untested');
	});

	it('the audit reports a bench check at another location that used the test', async () => {
		const bench = benchCase(demoPlanText, bench3);
		recordTest(bench.records, bench.plan, demoPlanText, shipped, {createdAt: atOffset(hoursAgo(1), 0), testedOn: today()});
		const signed = await run('check', '--answers', bench.answers, '--records', bench.records, '--sign', 'Ines Marlow', '--role', 'photonics engineer');
		expect(signed.stdout).toContain('Outcome: CLEAR TO ENERGIZE');
		const path = /Record written: (.+)/.exec(signed.stdout)?.[1];
		if (!path) throw new Error(`no record written: ${signed.stdout}`);
		// the bench record said to be of bench 4, signed again (as a check made before tests were bound to a bench could be)
		const record = JSON.parse(readFileSync(path, 'utf8'));
		expect(record.body.inputs.location).toBe('Room B.112, bench 3');
		record.body.inputs.location = 'Room B.112, bench 4';
		rmSync(path);
		writeRecord(bench.records, signRecord(record.body, [{signer: {name: 'Ines Marlow', role: 'photonics engineer', meaning: 'performed'}, key: operatorPrivateKey(home)}]));
		const audited = await audit(bench.records);
		expect(audited.code).toBe(1);
		expect(codesOf(audited.report)).toContain('consistency:audit-interlock-bench-location');
	});
});
