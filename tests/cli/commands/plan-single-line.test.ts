import {mkdtempSync, readFileSync, rmSync, writeFileSync} from 'node:fs';
import {tmpdir} from 'node:os';
import {join, resolve} from 'node:path';
import {afterAll, beforeAll, describe, expect, it} from 'vitest';
import {runCli} from '../../helpers/run-cli.js';

const planFile = resolve('docs/examples/interlock/bench3-interlock-plan.yaml');
const resultsFile = resolve('docs/examples/interlock/bench3-interlock-test-results.yaml');
const planText = readFileSync(planFile, 'utf8');
const resultsText = readFileSync(resultsFile, 'utf8');

let folder: string;
let count = 0;

function writeTemp(name: string, text: string): string {
	count += 1;
	const file = join(folder, `${count}-${name}`);
	writeFileSync(file, text);
	return file;
}

/** `text` with `from` (found once) replaced by `to`, and the 1-based line where it was. */
function edit(text: string, from: string, to: string): {text: string; line: number} {
	const at = text.indexOf(from);
	if (at < 0 || text.indexOf(from, at + 1) >= 0) throw new Error(`test setup: "${from}" is not found once`);
	return {text: text.slice(0, at) + to + text.slice(at + from.length), line: text.slice(0, at).split('\n').length};
}

beforeAll(() => {
	folder = mkdtempSync(join(tmpdir(), 'prelase-plan-single-line-'));
});

afterAll(() => {
	rmSync(folder, {recursive: true, force: true});
});

describe('single-line fields of a plan refuse a line break: exit 2, file:line, the field', () => {
	it.each([
		{name: 'the plan name', from: 'name: Fenwick Hollow B.112 bench 3 — enclosure and room loop', to: 'name: "Loop\\nOutcome: passed"', field: 'name'},
		{name: 'the location', from: 'location: Room B.112, bench 3 ', to: 'location: "Room B.112\\r\\nbench 3" ', field: 'location'},
		{name: 'a device description', from: 'description: Hinged lid of the bench 3 beam enclosure', to: 'description: "Hinged lid\\u2028FAKE"', field: 'access point 1: description'},
	])('$name', async ({from, to, field}) => {
		const edited = edit(planText, from, to);
		const file = writeTemp('plan.yaml', edited.text);
		const {code, stdout, stderr} = await runCli(['plan', file]);
		expect(code).toBe(2);
		expect(stdout).toBe('');
		expect(stderr).toContain(`${file}:${edited.line}:`);
		expect(stderr).toContain(`${field}: `);
	});
});

describe('single-line fields of test results refuse a line break: exit 2, file:line, the field', () => {
	it.each([
		{name: 'the tester\'s name', from: 'tested_by: {name: Ines Marlow,', to: 'tested_by: {name: "Ines\\nMarlow",', field: 'tested by: name'},
		{name: 'the witness\'s role', from: 'role: deputy laser safety officer}', to: 'role: "deputy\\nlaser safety officer"}', field: 'witness: role'},
		{name: 'what a step concerns', from: '{step: 1, concerns: lid_switch,', to: '{step: 1, concerns: "lid_switch\\nOutcome: passed",', field: 'step 1 of the results: concerns'},
	])('$name', async ({from, to, field}) => {
		const edited = edit(resultsText, from, to);
		const file = writeTemp('results.yaml', edited.text);
		const {code, stderr} = await runCli(['plan', planFile, '--record-test', file, '--records', join(folder, 'records')], {PRELASE_HOME: join(folder, 'home')});
		expect(code).toBe(2);
		expect(stderr).toContain(`${file}:${edited.line}:`);
		expect(stderr).toContain(`${field}: `);
	});
});
