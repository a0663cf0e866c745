import {mkdtempSync, readFileSync, rmSync, writeFileSync} from 'node:fs';
import {tmpdir} from 'node:os';
import {join, resolve} from 'node:path';
import {afterAll, describe, expect, it} from 'vitest';
import {runIn} from '../../helpers/run-cli.js';

const root = mkdtempSync(join(tmpdir(), 'prelase-plan-words-'));
afterAll(() => rmSync(root, {recursive: true, force: true}));
const plan = readFileSync(resolve('docs/examples/interlock/bench3-interlock-plan.yaml'), 'utf8');
const results = readFileSync(resolve('docs/examples/interlock/bench3-interlock-test-results.yaml'), 'utf8');
// A list index in a dotted place (devices.3.wire_to_next.length, steps.1.stopped_in) is the file's inside, not words.
const dottedPlace = /\b\w+\.\d+\./;

let count = 0;
function write(text: string, name: string): string {
	count += 1;
	const file = join(root, `${count}-${name}`);
	writeFileSync(file, text);
	return file;
}

describe('prelase plan FILE: a bad plan\'s messages name the device and field in words, with no dotted place', () => {
	// [what is wrong, text replaced, replacement, words expected]
	it.each([
		['a wire run key twice', 'length: 1.5 m}', 'length: 262 m, awg: x}', /device 1: wire size/],
		['a time in amperes', 'opening_time: 8 ms', 'opening_time: 8 A', /device 1: opening time: "8 A" is a current/],
		['an unknown contact', 'contact: normally_closed', 'contact: sometimes', /device \d: contact: expected one of/],
		['a rating that is a list', 'rated_current: 2 A', 'rated_current: [1]', /device 1: rated current/],
		['an unknown kind of securing', 'secured_by: tool', 'secured_by: glue', /access point 2: /],
		['a wire length with no unit', 'wire_to_next: {awg: 22, length: 1.5 m}', 'wire_to_next: {awg: 22, length: 262}', /device 1: length to the next device/],
	])('%s', async (_what, before, after, words) => {
		expect(plan).toContain(before);
		const file = write(plan.replace(before, after), 'plan.yaml');
		const run = await runIn(join(root, 'home'), ['plan', file]);
		expect(run.code).toBe(2);
		expect(run.stderr).toMatch(words);
		expect(run.stderr).not.toMatch(dottedPlace);
	});
});

describe('prelase plan FILE --record-test RESULTS: a bad results file\'s messages name the step in words', () => {
	it.each([
		['a stop time in volts', 'stopped_in: 4 ms', 'stopped_in: 4 V', /step 2 of the results: stopped in: "4 V" is a voltage/],
		['an unknown result', 'result: pass, stopped_in: 6 ms', 'result: maybe', /step 3 of the results: result: expected one of/],
	])('%s', async (_what, before, after, words) => {
		expect(results).toContain(before);
		const planFile = write(plan, 'plan.yaml');
		const file = write(results.replace(before, after), 'results.yaml');
		const run = await runIn(join(root, 'home'), ['plan', planFile, '--record-test', file, '--records', join(root, 'records')]);
		expect(run.code).toBe(2);
		expect(run.stderr).toMatch(words);
		expect(run.stderr).not.toMatch(dottedPlace);
	});
});
