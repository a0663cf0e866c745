import {copyFileSync, existsSync, mkdtempSync, readdirSync, readFileSync, writeFileSync} from 'node:fs';
import {tmpdir} from 'node:os';
import {dirname, join} from 'node:path';
import {cleanup} from 'ink-testing-library';
import {afterEach, describe, expect, it} from 'vitest';
import {deferral} from '../../../source/shared/deferral.js';
import {interlockTestCaution} from '../../../source/interlock/functional-test/test-record.js';
import {sha256Hex} from '../../../source/shared/sha256.js';
import {generateKeyPair} from '../../../source/records/key-material.js';
import {readRecord} from '../../../source/records/read-record.js';
import type {InterlockTestRecord} from '../../../source/records/record-schema.js';
import {runIn, unwrap} from '../../helpers/run-cli.js';
import {keys, renderApp, type AppScreen} from '../../helpers/screen-driver.js';
import {demoPlanFile} from '../../interlock/plan-fixture.js';

afterEach(() => {
	cleanup();
});

/** The demo bench setup that names its interlock plan. */
const linkedDemo = 'docs/examples/interlock/bench3-808nm-linked.yaml';

/** Stop times of the demo's steps as a tester might measure them ('' for the steps not timed). */
const times = ['9 ms', '4 ms', '6 ms', '8 ms', '16 ms', '5 ms', '2 ms', '', ''];

/** The planner on a copy of the demo plan, opened on its test. */
async function testOfDemo(): Promise<AppScreen & {file: string}> {
	const file = join(mkdtempSync(join(tmpdir(), 'prelase-record-screen-')), 'plan.yaml');
	copyFileSync(demoPlanFile, file);
	const screen = await renderApp({startPlan: file});
	await screen.press('t');
	return {...screen, file};
}

/** Marks the step in focus and takes its stop time and note. */
async function mark(screen: AppScreen, key: 'p' | 'f' | 'a', time = '', note = ''): Promise<string> {
	await screen.press(key);
	await screen.paste(`${time}\r`);
	return screen.paste(`${note}\r`);
}

/** Fills the tester's name and role and the witness (if given), takes the date as it is, and signs. */
async function signAs(screen: AppScreen, name: string, role: string, witness?: {name: string; role: string; key: string}): Promise<string> {
	for (const text of [name, role, witness?.name ?? '', witness?.role ?? '', witness?.key ?? '']) await screen.paste(`${text}\r`);
	await screen.press(keys.enter);
	expect(screen.frame()).toContain('[ Sign and write the record ]');
	return screen.press(keys.enter);
}

/** The one record in the screen's records folder, checked for integrity. */
function theRecord(screen: AppScreen): InterlockTestRecord {
	const folder = join(screen.home, 'records');
	const files = readdirSync(folder).filter((name) => !name.startsWith('.')); // the chain's .prelase-chain/ sits beside the records
	expect(files).toHaveLength(1);
	const read = readRecord(join(folder, files[0]!));
	if (!read.ok) throw new Error(read.reason);
	return read.record as InterlockTestRecord;
}

describe('recording an interlock test on screen', () => {
	it('walks the sheet, shows the summary, signs, and writes the record the bench check reads', async () => {
		const screen = await testOfDemo();
		let frame = screen.frame();
		expect(frame).toContain('Record a test: Fenwick Hollow B.112 bench 3 — enclosure and room loop');
		expect(frame).toContain('Plan findings: 0 stop');
		expect(frame).toContain('Step 1 of 9: lid_switch');
		expect(frame).toContain('Expect  Emission stops within 20 ms.');
		for (const time of times.slice(0, 5)) frame = await mark(screen, 'p', time);
		expect(frame).toMatch(/ 5 chiller_flow +✓ pass +16 ms/);
		expect(frame).toContain('Step 6 of 9: key_switch');
		for (const time of times.slice(5, 8)) await mark(screen, 'p', time);
		frame = await mark(screen, 'p', '', 'key returned to the lock box');
		expect(frame).toMatch(/ 9 bypass time-out: alignment_bypass +✓ pass +key returned to the lock box/);
		expect(frame).toContain('Steps: 9 pass · 0 fail · 0 n/a');
		expect(frame).toContain('If signed now: PASSED');
		frame = await signAs(screen, 'Orla Penhaligon', 'laser technician');
		expect(frame).toMatch(/by Orla\s+Penhaligon: PASSED/);
		expect(frame.replaceAll(/\s+/g, ' ')).toContain(interlockTestCaution);
		expect(frame.replaceAll(/\s+/g, ' ')).toContain(deferral);
		const record = theRecord(screen);
		expect(frame.replaceAll('\n', '')).toContain(`Record written: ${join(screen.home, 'records', readdirSync(join(screen.home, 'records')).find((name) => !name.startsWith('.'))!)}`);
		expect(record.body.kind).toBe('interlock-test');
		expect(record.body.outcome).toBe('passed');
		expect(record.body.steps).toHaveLength(9);
		expect(record.body.steps.map((step) => step.stoppedIn?.text ?? '')).toEqual(times);
		expect(record.body.steps[8]?.note).toBe('key returned to the lock box');
		expect(record.body.tester).toEqual({name: 'Orla Penhaligon', role: 'laser technician'});
		expect(record.body.plan.sha256).toBe(sha256Hex(readFileSync(screen.file, 'utf8')));
		expect(record.signatures.map((entry) => [entry.signer.name, entry.purpose])).toEqual([['Orla Penhaligon', 'operator']]);
		// The bench check beside the plan now answers its loop-test confirmations from this record.
		const answers = join(dirname(screen.file), 'bench3.yaml');
		writeFileSync(answers, readFileSync(linkedDemo, 'utf8').replace('interlock_plan: bench3-interlock-plan.yaml', 'interlock_plan: plan.yaml'));
		const check = await runIn(screen.home, ['check', '--answers', answers]);
		expect(unwrap(check.stdout)).toMatch(/✓ Interlock test \(current\): answered from the interlock test record/);
		expect(check.stdout).toContain('Outcome: CLEAR TO ENERGIZE');
		expect(check.code).toBe(0);
		frame = await screen.press(keys.enter);
		expect(frame).toContain('✓ Recorded: ');
		expect(frame).toContain('Findings: 0 stop · 0 advise');
	});

	it('records a failed step 5 as a failed test that names it', async () => {
		const screen = await testOfDemo();
		let frame = '';
		for (const [index, time] of times.entries()) {
			frame = await mark(screen, index === 4 ? 'f' : 'p', index === 4 ? '31 ms' : time, index === 8 ? 'key returned' : '');
			if (index === 4) expect(frame).toMatch(/ 5 chiller_flow +✗ FAIL +31 ms/);
		}
		expect(frame).toContain('Steps: 8 pass · 1 fail · 0 n/a');
		expect(frame).toContain('If signed now: FAILED');
		const key = join(screen.home, 'witness.key');
		writeFileSync(key, `Name: Tobias Quenby\n${String(generateKeyPair().privateKey.export({format: 'pem', type: 'pkcs8'}))}`, {mode: 0o600});
		frame = await signAs(screen, 'Orla Penhaligon', 'laser technician', {name: 'Tobias Quenby', role: 'deputy laser safety officer', key});
		expect(frame).toContain(': FAILED');
		const record = theRecord(screen);
		expect(record.body.outcome).toBe('failed');
		expect(record.body.outcomeText).toBe('Failed: step 5 (chiller_flow) failed. Tag the loop out of service and tell the laser safety officer.');
		expect(record.signatures.map((entry) => [entry.signer.name, entry.purpose])).toEqual([['Orla Penhaligon', 'operator'], ['Tobias Quenby', 'witness']]);
		expect(record.body.steps[4]).toMatchObject({number: 5, subject: 'chiller_flow', result: 'fail', stoppedIn: {text: '31 ms'}});
	});

	it('refuses a pass slower than the policy with its message, and takes the step once marked fail', async () => {
		const screen = await testOfDemo();
		await screen.press('p');
		let frame = await screen.paste('25 ms\r');
		expect(frame).toContain("✗ Step 1 is marked pass, but emission stopped in 25 ms, above the policy's 20 ms: mark it fail");
		expect(frame).toMatch(/› Stopped in {2}25 ms▌/);
		frame = await screen.press(keys.down);
		expect(frame).toContain('Step 1 of 9: lid_switch');
		await screen.press(keys.left);
		frame = await screen.press('f');
		expect(frame).not.toContain('✗ Step 1');
		await screen.press(keys.enter);
		frame = await screen.press(keys.enter);
		expect(frame).toContain('Step 2 of 9: fibre_sense');
		expect(frame).toMatch(/ 1 lid_switch +✗ FAIL +25 ms/);
	});

	it('refuses not applicable without a note, and a stop time that is not a time', async () => {
		const screen = await testOfDemo();
		await screen.press('a');
		await screen.paste('\r');
		let frame = await screen.paste('\r');
		expect(frame).toContain('✗ Step 1 is marked not_applicable: add a note saying why (and who accepted it)');
		expect(frame).toContain('Step 1 of 9: lid_switch');
		frame = await screen.paste('no lid on this enclosure, accepted by the LSO\r');
		expect(frame).toContain('Step 2 of 9: fibre_sense');
		expect(frame).toMatch(/ 1 lid_switch +– n\/a +no lid on this enclosure/);
		await screen.press('p');
		frame = await screen.paste('8 V\r');
		expect(frame).toContain('✗ Step 2: stopped in: "8 V" is a voltage');
	});

	it('refuses to start while the plan has unsaved changes', async () => {
		const file = join(mkdtempSync(join(tmpdir(), 'prelase-record-screen-')), 'plan.yaml');
		copyFileSync(demoPlanFile, file);
		const screen = await renderApp({startPlan: file});
		await screen.press(keys.down, keys.down, keys.down, keys.down, keys.down, keys.down, keys.down);
		await screen.press(keys.enter);
		await screen.press(keys.down, keys.down, keys.down);
		expect(screen.frame()).toMatch(/› Contact/);
		await screen.press(keys.right);
		await screen.press(keys.enter);
		let frame = await screen.press(keys.escape);
		expect(frame).toContain('(not saved)');
		frame = await screen.press('t');
		expect(frame).toContain('✗ The plan has unsaved changes: save them first (s); a test records the plan as saved');
		expect(frame).not.toContain('Record a test');
		await screen.press('s');
		frame = await screen.press('t');
		expect(frame).toContain('Record a test');
		expect(frame).toMatch(/✗ The plan has 1 stop finding: this test will be recorded as FAILED/);
	});

	it('asks before leaving with entries; staying keeps them, discarding writes nothing', async () => {
		const screen = await testOfDemo();
		await mark(screen, 'p', '9 ms');
		let frame = await screen.press(keys.escape);
		expect(frame).toContain('Leave without recording? The results entered are not kept.');
		expect(frame).toContain('d discard the entries and leave · Esc stay');
		frame = await screen.press(keys.escape);
		expect(frame).toMatch(/ 1 lid_switch +✓ pass +9 ms/);
		expect(frame).toContain('Step 2 of 9: fibre_sense');
		await screen.press(keys.escape);
		frame = await screen.press('d');
		expect(frame).toContain('✓ Test discarded; nothing was recorded');
		expect(readdirSync(screen.home)).not.toContain('records');
	});
});

describe('the entries of a test in progress survive the program ending', () => {
	const testDrafts = (home: string) => (existsSync(join(home, 'drafts')) ? readdirSync(join(home, 'drafts')).filter((name) => name.startsWith('test-')) : []);

	/** Steps 1 to 3 marked on a copy of the demo, each with a time or a note; then the program ends. */
	async function threeStepsThenEnd(): Promise<{file: string; home: string}> {
		const screen = await testOfDemo();
		await mark(screen, 'p', '9 ms', 'lid opened by hand');
		await mark(screen, 'f', '31 ms', 'relay slow to drop');
		const frame = await mark(screen, 'a', '', 'no chiller on this bench, accepted by the LSO');
		expect(frame).toContain('Step 4 of 9');
		expect(testDrafts(screen.home)).toHaveLength(1);
		// the program ends mid-test (Ctrl-C, a closed terminal, a crash)
		cleanup();
		return {file: screen.file, home: screen.home};
	}

	it('pressing t on the same plan brings the entries back with a notice, and signing removes the draft', async () => {
		const first = await threeStepsThenEnd();
		const again = await renderApp({startPlan: first.file, home: first.home});
		let frame = await again.press('t');
		expect(frame).toMatch(/✓ Test entries from \d{4}-\d{2}-\d{2} \d{2}:\d{2} restored; carry on from the first step without a result/);
		expect(frame).toMatch(/ 1 lid_switch +✓ pass +9 ms · lid opened by hand/);
		expect(frame).toMatch(/ 2 fibre_sense +✗ FAIL +31 ms · relay slow to drop/);
		expect(frame).toMatch(/ 3 \S+ +– n\/a +no chiller on this bench/);
		expect(frame).toContain('Step 4 of 9');
		for (const time of times.slice(3)) frame = await mark(again, 'p', time);
		expect(frame).not.toContain('restored');
		expect(frame).toContain('Steps: 7 pass · 1 fail · 1 n/a');
		expect(testDrafts(first.home)).toHaveLength(1);
		frame = await signAs(again, 'Orla Penhaligon', 'laser technician');
		expect(frame).toContain(': FAILED');
		expect(testDrafts(first.home)).toEqual([]);
		const record = theRecord(again);
		expect(record.body.steps.slice(0, 3)).toMatchObject([
			{number: 1, result: 'pass', stoppedIn: {text: '9 ms'}, note: 'lid opened by hand'},
			{number: 2, result: 'fail', stoppedIn: {text: '31 ms'}, note: 'relay slow to drop'},
			{number: 3, result: 'not_applicable', note: 'no chiller on this bench, accepted by the LSO'},
		]);
	});

	it('a plan changed on disk since is not resumed, and the earlier entries are kept aside and said so', async () => {
		const first = await threeStepsThenEnd();
		writeFileSync(first.file, `${readFileSync(first.file, 'utf8')}# rewired meanwhile\n`);
		const again = await renderApp({startPlan: first.file, home: first.home});
		const frame = (await again.press('t')).replaceAll(/\s+/g, ' ');
		expect(frame).toContain('✗ Test entries from');
		expect(frame).toContain('were not restored: the plan changed since, and a test is of the plan as wired; they are kept in');
		expect(frame).toContain('Step 1 of 9: lid_switch');
		expect(frame).not.toContain('✓ pass');
		const kept = testDrafts(first.home);
		expect(kept).toEqual([expect.stringMatching(/^test-[0-9a-f]{16}\.\d{8}T\d{9}Z\.json$/)]);
		expect(frame).toContain(kept[0]);
		const earlier = JSON.parse(readFileSync(join(first.home, 'drafts', kept[0]!), 'utf8')) as {steps: unknown[]};
		expect(earlier.steps.slice(0, 4)).toEqual([
			{result: 'pass', stoppedIn: '9 ms', note: 'lid opened by hand'},
			{result: 'fail', stoppedIn: '31 ms', note: 'relay slow to drop'},
			{result: 'not_applicable', stoppedIn: '', note: 'no chiller on this bench, accepted by the LSO'},
			{stoppedIn: '', note: ''},
		]);
		// The new test keeps its own draft beside the one set aside.
		await mark(again, 'p', '7 ms');
		expect(testDrafts(first.home)).toHaveLength(2);
	});

	it('discarding the entries on leaving removes the draft', async () => {
		const screen = await testOfDemo();
		await mark(screen, 'p', '9 ms');
		expect(testDrafts(screen.home)).toHaveLength(1);
		await screen.press(keys.escape);
		const frame = await screen.press('d');
		expect(frame).toContain('✓ Test discarded; nothing was recorded');
		expect(testDrafts(screen.home)).toEqual([]);
		await screen.press('t');
		expect(screen.frame()).not.toContain('restored');
		expect(screen.frame()).not.toContain('✓ pass');
	});
});
