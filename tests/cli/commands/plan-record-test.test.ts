import {createPrivateKey} from 'node:crypto';
import {existsSync, mkdtempSync, readdirSync, readFileSync, rmSync, writeFileSync} from 'node:fs';
import {tmpdir} from 'node:os';
import {basename, dirname, join} from 'node:path';
import {afterAll, beforeAll, describe, expect, it} from 'vitest';
import {operatorPrivateKey} from '../../helpers/operator-key.js';
import {fingerprint, generateKeyPair, rawPublicKey} from '../../../source/records/key-material.js';
import {readRecord} from '../../../source/records/read-record.js';
import type {InterlockTestRecord} from '../../../source/records/record-schema.js';
import {caseFolder, runIn} from '../../helpers/run-cli.js';
import {demoPlanFile} from '../../interlock/plan-fixture.js';

const demoResults = 'docs/examples/interlock/bench3-interlock-test-results.yaml';
const demoText = readFileSync(demoResults, 'utf8');
const planName = 'Fenwick Hollow B.112 bench 3 — enclosure and room loop';

let folder: string;
let home: string;
let witnessKey: string;

const run = (...argv: string[]) => runIn(home, argv);

/** A folder of its own for one case: `results.yaml` in it (when text is given) and a `records` path not yet made. */
function newCase(text?: string): {results: string; records: string} {
	const dir = caseFolder(folder);
	const results = join(dir, 'results.yaml');
	if (text !== undefined) writeFileSync(results, text);
	return {results, records: join(dir, 'records')};
}

/** The demo results with one piece of text replaced; fails when the text is not there. */
function edited(from: string, to: string): string {
	if (!demoText.includes(from)) throw new Error(`the demo results no longer contain ${JSON.stringify(from)}`);
	return demoText.replace(from, to);
}

/** The record a run wrote, from the path it printed, checked for integrity. */
function writtenRecord(stdout: string): {path: string; record: InterlockTestRecord} {
	const path = /^Record written: (.+)$/m.exec(stdout)?.[1];
	if (!path) throw new Error(`no record path in: ${stdout}`);
	const read = readRecord(path);
	if (!read.ok) throw new Error(`the record fails its integrity check: ${read.reason}`);
	if (read.record.body.kind !== 'interlock-test') throw new Error(`a ${read.record.body.kind} record`);
	return {path, record: read.record as InterlockTestRecord};
}

beforeAll(() => {
	folder = mkdtempSync(join(tmpdir(), 'prelase-record-test-'));
	home = join(folder, 'home');
	witnessKey = join(folder, 'witness.key');
	writeFileSync(witnessKey, `Name: Tomas Reyes\n${String(generateKeyPair().privateKey.export({format: 'pem', type: 'pkcs8'}))}`, {mode: 0o600});
});

afterAll(() => {
	rmSync(folder, {recursive: true, force: true});
});

describe('prelase plan FILE --record-test RESULTS', () => {
	it('records the demo test: PASSED, exit 0, one signed interlock-test record in the folder asked for', async () => {
		const {records} = newCase();
		const {code, stdout, stderr} = await run('plan', demoPlanFile, '--record-test', demoResults, '--records', records);
		expect(stderr).toBe('');
		expect(code).toBe(0);
		expect(stdout).toContain(`Interlock test of ${planName}, 2026-11-30, by Ines Marlow: PASSED\n`);
		expect(stdout).toContain('Passed: every step of the functional test passed, and the plan has no stop finding.');
		expect(stdout).toContain('(a new key, created now; share it with: prelase keys export)');
		expect(stdout).toContain('laser safety officer');
		const {path, record} = writtenRecord(stdout);
		expect(dirname(path)).toBe(records);
		expect(readdirSync(records)).toEqual(['.prelase-chain', basename(path)]); // the record, and the chain's head file beside it
		expect(basename(path)).toMatch(/^\d{4}-\d{2}-\d{2}-\d{6}-interlock-test-fenwick-hollow-b-112-bench-3-enclosure-a-[0-9a-f]{8}\.json$/);
		expect(record.body.kind).toBe('interlock-test');
		expect(record.body.outcome).toBe('passed');
		expect(record.body.plan.file).toBe(demoPlanFile);
		expect(record.body.steps).toHaveLength(9);
		expect(record.signatures.map((signature) => [signature.signer.name, signature.signer.role, signature.purpose])).toEqual([['Ines Marlow', 'photonics engineer', 'operator']]);
		expect(record.signatures[0]!.fingerprint).toBe(fingerprint(rawPublicKey(operatorPrivateKey(home))));
	});

	it('writes to the records folder beside the settings when none is asked for, with the key made before', async () => {
		const {code, stdout} = await run('plan', demoPlanFile, '--record-test', demoResults);
		expect(code).toBe(0);
		expect(stdout).not.toContain('a new key');
		expect(dirname(writtenRecord(stdout).path)).toBe(join(home, 'records'));
	});

	it('records a failed step: FAILED, exit 1, and a record whose outcome is failed naming step 5', async () => {
		const {results, records} = newCase(edited('{step: 5, concerns: chiller_flow, result: pass, stopped_in: 16 ms}', '{step: 5, concerns: chiller_flow, result: fail, stopped_in: 31 ms}'));
		const {code, stdout, stderr} = await run('plan', demoPlanFile, '--record-test', results, '--records', records);
		expect(stderr).toBe('');
		expect(code).toBe(1);
		expect(stdout).toContain(`by Ines Marlow: FAILED\n`);
		expect(stdout).toContain('Failed: step 5 (chiller_flow) failed. Tag the loop out of service and tell the laser safety officer.');
		const {record} = writtenRecord(stdout);
		expect(record.body.outcome).toBe('failed');
		expect(record.body.outcomeText).toContain('step 5 (chiller_flow) failed');
		expect(record.body.steps.filter((step) => step.result !== 'pass').map((step) => [step.number, step.result, step.stoppedIn?.text])).toEqual([[5, 'fail', '31 ms']]);
	});

	it('records a test of a plan with a stop finding as failed, exit 1, though every step passed', async () => {
		const {records} = newCase();
		const planFile = join(dirname(records), 'plan.yaml');
		writeFileSync(planFile, readFileSync(demoPlanFile, 'utf8').replace('FH-ES1 mushroom emergency stop on the bench front\n    contact: normally_closed', 'FH-ES1 mushroom emergency stop on the bench front\n    contact: normally_open'));
		const {code, stdout} = await run('plan', planFile, '--record-test', demoResults, '--records', records);
		expect(code).toBe(1);
		expect(stdout).toContain('Failed: the plan has 1 stop finding. Tag the loop out of service');
		const {record} = writtenRecord(stdout);
		expect(record.body.outcome).toBe('failed');
		expect(record.body.planFindings).toEqual({stops: 1, advises: 0, codes: ['interlock-normally-open']});
		expect(record.body.steps.every((step) => step.result === 'pass')).toBe(true);
	});

	it.each([
		{name: 'a plan with its location', text: (plan: string) => plan, location: 'Room B.112, bench 3', warned: false},
		{name: 'a plan without a location', text: (plan: string) => plan.replace(/^location: .*\n/m, ''), location: undefined, warned: true},
	])('records $name: the record carries it; without one the output says no bench check can use the test', async ({text, location, warned}) => {
		const {records} = newCase();
		const planFile = join(dirname(records), 'plan.yaml');
		writeFileSync(planFile, text(readFileSync(demoPlanFile, 'utf8')));
		const {code, stdout} = await run('plan', planFile, '--record-test', demoResults, '--records', records);
		expect(code).toBe(0);
		expect(writtenRecord(stdout).record.body.location).toBe(location);
		expect(stdout.includes('The plan names no location: no bench check can use this test. Add location: (room and bench) to the plan and test the loop again.\n')).toBe(warned);
	});

	it('refuses results with problems: exit 2, each problem with file:line, and no record', async () => {
		const text = edited('{step: 4, concerns: door_switch,', '{step: 4, concerns: room_door,').replace('stopped_in: 16 ms', 'stopped_in: 25 ms');
		const {results, records} = newCase(text);
		const {code, stdout, stderr} = await run('plan', demoPlanFile, '--record-test', results, '--records', records);
		expect(code).toBe(2);
		expect(stdout).toBe('');
		const lineOf = (needle: string) => text.slice(0, text.indexOf(needle)).split('\n').length;
		expect(stderr.split('\n').filter(Boolean).map((line) => line.replace(/^(.+?:\d+):\d+: error: (step \d+ of the results: [a-z ]+?): .*$/, '$1 $2'))).toEqual([
			`${results}:${lineOf('room_door')} step 4 of the results: concerns`,
			`${results}:${lineOf('25 ms')} step 5 of the results: stopped in`,
			'prelase: the results file has problems; no record was written',
		]);
		expect(existsSync(records)).toBe(false);
	});

	it('refuses a results file that is not there: exit 2, no record', async () => {
		const {results, records} = newCase();
		const {code, stderr} = await run('plan', demoPlanFile, '--record-test', results, '--records', records);
		expect(code).toBe(2);
		expect(stderr).toContain(`${results}: error: cannot read the file (no such file)`);
		expect(existsSync(records)).toBe(false);
	});

	it('with --witness-key, the witness signs second, for the purpose witness, with their own key', async () => {
		const {records} = newCase();
		const {code, stdout} = await run('plan', demoPlanFile, '--record-test', demoResults, '--records', records, '--witness-key', witnessKey);
		expect(code).toBe(0);
		const {record} = writtenRecord(stdout);
		expect(record.signatures.map((signature) => [signature.signer.name, signature.signer.role, signature.purpose])).toEqual([
			['Ines Marlow', 'photonics engineer', 'operator'],
			['Tomas Reyes', 'deputy laser safety officer', 'witness'],
		]);
		expect(record.body.witness).toEqual({name: 'Tomas Reyes', role: 'deputy laser safety officer', signed: true});
		const witness = rawPublicKey(createPrivateKey(readFileSync(witnessKey)));
		expect(record.signatures[1]!.publicKey).toBe(witness.toString('base64'));
		expect(record.signatures[1]!.fingerprint).toBe(fingerprint(witness));
		expect(record.signatures[0]!.publicKey).not.toBe(record.signatures[1]!.publicKey);
	});

	it.each([
		{name: '--witness-key with no witness in the results', text: edited('witness: {name: Tomas Reyes, role: deputy laser safety officer}\n', ''), key: () => witnessKey, says: () => 'prelase: --witness-key needs a witness in the results file (witness: {name, role})'},
		// the first test made the operator key in home/keys; a witness signing with it would prove nothing
		{name: '--witness-key that is the tester\'s own key', text: demoText, key: () => join(home, 'keys', 'operator.key'), says: () => "prelase: --witness-key is the tester's own key; the witness signs with a key of their own"},
		{name: '--witness-key naming no key file', text: demoText, key: () => join(folder, 'no-such.key'), says: () => `prelase: no key file at ${join(folder, 'no-such.key')}`},
	])('refuses $name: exit 2, no record', async ({text, key, says}) => {
		const {results, records} = newCase(text);
		const {code, stdout, stderr} = await run('plan', demoPlanFile, '--record-test', results, '--records', records, '--witness-key', key());
		expect(code).toBe(2);
		expect(stdout).toBe('');
		expect(stderr.trim()).toBe(says());
		expect(existsSync(records)).toBe(false);
	});
});

describe('prelase plan: options that go with --record-test, the sheet and the schemas', () => {
	it.each([
		{name: '--records without --record-test', argv: ['plan', demoPlanFile, '--records', 'somewhere'], says: '--records goes with --record-test RESULTS'},
		{name: '--witness-key without --record-test', argv: ['plan', demoPlanFile, '--witness-key', 'witness.key'], says: '--witness-key goes with --record-test RESULTS'},
		{name: '--record-test with --json', argv: ['plan', demoPlanFile, '--json', '--record-test', demoResults], says: '--json and --record-test cannot be used together'},
		{name: 'an unknown schema', argv: ['plan', '--schema', 'nope'], says: '--schema takes plan or results, not "nope"'},
		{name: 'a schema with a FILE', argv: ['plan', '--schema', 'plan', demoPlanFile], says: '--schema prints a schema and takes no FILE'},
	])('refuses $name: exit 2', async ({argv, says}) => {
		const {code, stdout, stderr} = await run(...argv);
		expect(code).toBe(2);
		expect(stdout).toBe('');
		expect(stderr).toBe(`prelase: ${says}\n`);
	});

	it('prints the test sheet as an HTML page, exit 0', async () => {
		const {code, stdout} = await run('plan', demoPlanFile, '--test-sheet', 'html');
		expect(code).toBe(0);
		expect(stdout).toMatch(/^<!doctype html>/i);
		expect(stdout).toContain('Fenwick Hollow B.112 bench 3');
		expect(stdout.match(/<tr>/g)?.length).toBeGreaterThanOrEqual(9);
	});

	it.each([
		{which: 'plan', title: 'prelase interlock plan', fields: ['format', 'name', 'laser_class', 'input', 'access_points', 'devices']},
		{which: 'results', title: 'prelase interlock test results', fields: ['format', 'tested_on', 'tested_by', 'witness', 'steps']},
	])('prints the JSON Schema of the $which file, exit 0', async ({which, title, fields}) => {
		const {code, stdout} = await run('plan', '--schema', which);
		expect(code).toBe(0);
		const schema = JSON.parse(stdout) as {title: string; type: string; properties: Record<string, unknown>; additionalProperties: boolean};
		expect(schema.title).toBe(title);
		expect(schema.type).toBe('object');
		expect(Object.keys(schema.properties)).toEqual(expect.arrayContaining(fields));
		expect(schema.additionalProperties).toBe(false);
	});

	it('gives a value with a unit as text or a number, with what it must be, so an editor does not flag "12 V"', async () => {
		const schema = JSON.parse((await run('plan', '--schema', 'plan')).stdout) as {properties: {input: {properties: Record<string, {type?: unknown; description?: string}>}}};
		const {loop_voltage, closed_below} = schema.properties.input.properties;
		expect(loop_voltage).toEqual({type: ['string', 'number'], description: 'a voltage with its unit, for example "2.1 V"'});
		expect(closed_below).toEqual({type: ['string', 'number'], description: 'The largest loop resistance the input still reads as closed'});
	});
});
