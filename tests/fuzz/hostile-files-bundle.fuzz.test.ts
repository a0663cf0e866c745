import {spawn} from 'node:child_process';
import {mkdirSync, mkdtempSync, readFileSync, rmSync, writeFileSync} from 'node:fs';
import {tmpdir} from 'node:os';
import {join, resolve} from 'node:path';
import {afterAll, describe, expect, it} from 'vitest';
import type {RecordBody} from '../../source/records/record-schema.js';
import {signRecord} from '../../source/records/sign.js';
import {shippedRulesPath} from '../../source/rules/load.js';
import {editData, mutate, Random} from '../helpers/fuzz-mutate.js';
import {sampleRecord, sampleRules, serialise, signerWith} from '../helpers/sample-record.js';
import {bundleRuns, fuzzSeed} from './fuzz-settings.js';

// The fuzz run through the bundle, as a person runs prelase: mutated files on disk, the exit
// status checked. No case may end in an internal error (exit 70, "internal error" on stderr) or
// by a signal. rules validate and audit take many files, so most cases share one process.

const bundle = resolve('dist/prelase.js');
const top = mkdtempSync(join(tmpdir(), 'prelase-fuzz-bundle-'));
const home = join(top, 'home');
afterAll(() => rmSync(top, {recursive: true, force: true}));

type Run = {code: number | null; signal: NodeJS.Signals | null; stderr: string};

function run(argv: string[]): Promise<Run> {
	return new Promise((done) => {
		const child = spawn(process.execPath, [bundle, ...argv], {cwd: top, env: {PATH: process.env['PATH'], PRELASE_HOME: home}, stdio: ['ignore', 'ignore', 'pipe']});
		let stderr = '';
		child.stderr.setEncoding('utf8').on('data', (chunk: string) => (stderr += chunk));
		child.on('close', (code, signal) => done({code, signal, stderr}));
	});
}

/** Runs the argument lists two at a time (two cores). */
async function runAll(argvs: string[][]): Promise<Array<{argv: string[]} & Run>> {
	const results: Array<{argv: string[]} & Run> = [];
	let next = 0;
	const worker = async () => {
		while (next < argvs.length) {
			const argv = argvs[next++]!;
			results.push({argv, ...(await run(argv))});
		}
	};
	await Promise.all([worker(), worker()]);
	return results;
}

const internal = (result: Run) => result.code === 70 || result.code === null || /internal error/.test(result.stderr);

/** Writes `count` mutations of a valid file into a folder of their own; returns their paths. */
function mutatedFiles(name: string, valid: string, format: 'yaml' | 'json', count: number, random: Random): string[] {
	const folder = join(top, name);
	mkdirSync(folder, {recursive: true});
	return Array.from({length: count}, (_, index) => {
		const path = join(folder, `${name}-${index}.${format}`);
		writeFileSync(path, mutate(valid, format, random).bytes);
		return path;
	});
}

const random = new Random(fuzzSeed ^ 0x5eed);
const few = Math.max(4, Math.round(bundleRuns * 0.024));
const many = Math.max(10, Math.round(bundleRuns * 0.35));

describe(`the fuzz run through the bundle (seed ${fuzzSeed}, about ${bundleRuns} cases)`, () => {
	it(`rules validate: ${many} mutated rule and site files in one run end without an internal error`, {timeout: 120_000}, async () => {
		const site = 'format: 1\nextends: shipped\npolicy_changed:\n  current_margin:\n    value: 15 %\n';
		const files = [...mutatedFiles('rules', readFileSync(shippedRulesPath(), 'utf8'), 'yaml', Math.round(many / 2), random), ...mutatedFiles('site', site, 'yaml', Math.round(many / 2), random)];
		const result = await run(['rules', 'validate', ...files]);
		expect({code: result.code, internal: internal(result)}).toEqual({code: 1, internal: false}); // 1: problems found (rules --help: validate 0 no problems, 1 problems found)
	});

	it(`audit: ${many} mutated and re-signed records in one run end in exit 3 (integrity), never an internal error`, {timeout: 120_000}, async () => {
		const rules = sampleRules();
		const record = sampleRecord({rules});
		const files = mutatedFiles('records', serialise(record), 'json', Math.round(many / 2), random);
		// Re-signed: the body edited, then signed again, so the audit goes past integrity into its consistency checks.
		const signer = signerWith('Fuzz Operator', 'performed');
		for (let index = 0; index < Math.round(many / 2); index += 1) {
			const body = editData(record.body, random) as RecordBody;
			let text: string;
			try {
				text = serialise(signRecord(body, [signer]));
			} catch {
				continue; // the body is no longer plain data that can be signed: the mutated copies above cover such files
			}
			const path = join(top, 'records', `resigned-${index}.json`);
			writeFileSync(path, text);
			files.push(path);
		}
		const result = await run(['audit', join(top, 'records')]);
		expect({code: result.code, internal: internal(result)}).toEqual({code: 3, internal: false});
	});

	it(`check, plan and plan --record-test: ${3 * few} runs of one mutated file each end without an internal error`, {timeout: 120_000}, async () => {
		const answers = mutatedFiles('answers', readFileSync('docs/examples/bench3-808nm-clear.yaml', 'utf8'), 'yaml', few, random);
		const plans = mutatedFiles('plans', readFileSync('docs/examples/interlock/bench3-interlock-plan.yaml', 'utf8'), 'yaml', few, random);
		const results = mutatedFiles('results', readFileSync('docs/examples/interlock/bench3-interlock-test-results.yaml', 'utf8'), 'yaml', few, random);
		const demoPlan = resolve('docs/examples/interlock/bench3-interlock-plan.yaml');
		const runs = await runAll([
			...answers.map((file) => ['check', '--answers', file]),
			...plans.map((file) => ['plan', file]),
			...results.map((file) => ['plan', demoPlan, '--record-test', file, '--records', join(top, 'test-records')]),
		]);
		expect(runs.filter(internal).map(({argv, code, stderr}) => ({argv, code, stderr: stderr.slice(0, 400)}))).toEqual([]);
		expect(runs).toHaveLength(3 * few);
	});
});
