import {chmodSync, mkdirSync, mkdtempSync, readFileSync, rmSync, writeFileSync} from 'node:fs';
import {tmpdir} from 'node:os';
import {join} from 'node:path';
import {afterAll, describe, expect, it} from 'vitest';
import {analysePlan} from '../../source/interlock/analysis/analyse.js';
import {loadResultsFromText} from '../../source/interlock/functional-test/load-results.js';
import {testSheet} from '../../source/interlock/functional-test/test-sheet.js';
import {loadPlanFromText} from '../../source/interlock/plan/load-plan.js';
import {checkIntegrity, KeyCache} from '../../source/records/integrity.js';
import {keyFolder, namedKeyFromFile, publicKeyPem, readTrusted} from '../../source/records/key-files.js';
import {fingerprint, generateKeyPair, rawPublicKey} from '../../source/records/key-material.js';
import {evaluate} from '../../source/rules/evaluate/evaluate.js';
import {loadAnswersFromText} from '../../source/rules/evaluate/load-answers.js';
import {loadRulesFromText} from '../../source/rules/load.js';
import {loadSettings} from '../../source/services/settings.js';
import {growthOverLinear, growthBound} from '../helpers/growth.js';
import {testPolicy} from '../interlock/plan-fixture.js';
import {sampleRecord, sampleRules, serialise} from '../helpers/sample-record.js';

// Issue 15: a growth test for every input path. Each input is made about 1 kB (or its smallest
// valid form: the demo answers, plan and a record are 4-10 kB) and about 100 kB, in the way that
// file really grows (more inputs, devices, steps, keys, entries), and read through the code the
// CLI uses; the time ratio over the size ratio must stay within a bound of ten times linear.

const top = mkdtempSync(join(tmpdir(), 'prelase-growth-'));
afterAll(() => rmSync(top, {recursive: true, force: true}));

/** As many `unit`-sized pieces as make about `bytes`. */
const count = (bytes: number, unit: number) => Math.max(1, Math.ceil(bytes / unit));

const ruleHead = 'format: 1\nname: growth\ncaution: Test rules.\nsteps:\n  - id: only\n    title: Only step\n    inputs:\n';
const ruleInput = (index: number) => `      - id: typed_${index}\n        label: Typed current ${index}\n        dimension: current\n        range: [0 A, 10 A]\n`;
const ruleDerived = (index: number) => `  - id: doubled_${index}\n    label: Twice typed current ${index}\n    dimension: current\n    formula: typed_${index} * 2\n`;
/** A rule file of n inputs, each with a derived value that the compiler parses and lints. */
function ruleFile(bytes: number): string {
	const n = count(bytes, 210);
	return `${ruleHead}${Array.from({length: n}, (_, index) => ruleInput(index)).join('')}derived:\n${Array.from({length: n}, (_, index) => ruleDerived(index)).join('')}`;
}

const base = join(top, 'base.yaml');
writeFileSync(base, ruleFile(500));
/** A site file extending a small base, adding n policy values. */
function siteFile(bytes: number): string {
	const n = count(bytes, 103);
	const values = Array.from({length: n}, (_, index) => `  limit_${index}:\n    value: ${index} mA\n    dimension: current\n    meaning: A site limit\n    basis: site policy\n`).join('');
	return `format: 1\nextends: base.yaml\nadd_policy:\n${values}`;
}

const rules = sampleRules();
const clear = readFileSync('docs/examples/bench3-808nm-clear.yaml', 'utf8');
/** The clear demo answers with n unknown confirmations added (each refused, with its line). */
function answersFile(bytes: number): string {
	const n = count(bytes, 40);
	return `${clear}${Array.from({length: n}, (_, index) => `  unknown_confirmation_${index}: true\n`).join('')}`;
}

const planText = readFileSync('docs/examples/interlock/bench3-interlock-plan.yaml', 'utf8');
const device = /\n {2}- id: lid_switch\n(?: {4}.*\n)+/.exec(planText)![0];
/** The demo plan with n more devices wired in the loop (each one more step of the test sheet). */
function planFile(bytes: number): string {
	const n = count(bytes, device.length);
	const extra = Array.from({length: n}, (_, index) => device.replace('id: lid_switch', `id: extra_switch_${index}`)).join('');
	return planText.replace('\ndevices:', `\ndevices:${extra}`).replace(/\ndevices:( +#.*)?\n/, '\ndevices:\n');
}
function loadAndAnalyse(text: string): unknown {
	const loaded = loadPlanFromText(text, 'plan.yaml');
	if (!loaded.ok) throw new Error(`the grown plan must load: ${loaded.errors[0]?.code}`);
	return analysePlan({...loaded.value, policy: testPolicy()});
}

/** A results file for the sheet of a plan of about `bytes`, with every step passed; the sheet is made outside the timing. */
const sheets = new Map<string, ReturnType<typeof testSheet>>();
function resultsFile(bytes: number): string {
	const loaded = loadPlanFromText(planFile(bytes * 4.5), 'plan.yaml');
	if (!loaded.ok) throw new Error('the grown plan must load');
	const sheet = testSheet({...loaded.value, policy: testPolicy()});
	const steps = sheet.steps.map((step) => `  - {step: ${step.number}, concerns: ${JSON.stringify(step.subject)}, result: pass, stopped_in: 9 ms}\n`).join('');
	const text = `format: 1\ntested_on: 2026-11-30\ntested_by: {name: Ines Marlow, role: photonics engineer}\nsteps:\n${steps}`;
	sheets.set(text, sheet);
	return text;
}

const record = sampleRecord({rules});
/** A signed record whose body has n extra names (the schema refuses them; JSON, the duplicate-name scan and the schema all see every one). */
function recordFile(bytes: number): string {
	// Three times the names, so that the large record is 30 times the small one (a record has 9 kB of its own); still under the 1 MiB cap.
	const n = count(bytes * 3, 30);
	const body = {...record.body, ...Object.fromEntries(Array.from({length: n}, (_, index) => [`extra_name_${index}`, index]))};
	return serialise({...record, body});
}

const keys = generateKeyPair();
const publicKey = rawPublicKey(keys.publicKey).toString('base64');
/** A trust list of n colleagues (one key under many names: the shape is what is read). */
function trustList(bytes: number): string {
	const n = count(bytes, 190);
	const entry = (index: number) => ({name: `Colleague ${index}`, publicKey, fingerprint: fingerprint(rawPublicKey(keys.publicKey)), addedAt: '2026-11-30T09:00:00Z'});
	return JSON.stringify(Array.from({length: n}, (_, index) => entry(index)), null, 2);
}

const pem = String(keys.privateKey.export({format: 'pem', type: 'pkcs8'}));
/** An operator key file with n comment lines above the key (a name line is looked for there). */
function keyFile(bytes: number): string {
	return `${'# notes kept with the key by the invented lab\n'.repeat(count(bytes, 45))}${pem}`;
}

/** A settings file with n names prelase does not use (they are dropped). */
function settingsFile(bytes: number): string {
	return JSON.stringify({operator: 'Dana Whitlow', ...Object.fromEntries(Array.from({length: count(bytes, 20)}, (_, index) => [`unused_${index}`, index]))});
}

/** Writes text to a file of its own and returns a reader that reads it through `read`. */
function onDisk(name: string, read: (path: string) => unknown, mode = 0o644): (text: string) => () => unknown {
	let written = 0;
	return (text) => {
		written += 1;
		const folder = join(top, `${name}-${written}`);
		mkdirSync(keyFolder(folder), {recursive: true});
		const path = name === 'trusted' ? join(keyFolder(folder), 'trusted.json') : name === 'settings' ? join(folder, 'config.json') : join(folder, name);
		writeFileSync(path, text);
		chmodSync(path, mode);
		return () => read(name === 'settings' || name === 'trusted' ? folder : path);
	};
}

describe('time grows linearly with the size of every input file', () => {
	it.each([
		{path: 'a rule file (inputs and derived values)', make: ruleFile, run: (text: string) => loadRulesFromText(text, 'rules.yaml')},
		{path: 'a site rule file (policy values added to a base)', make: siteFile, run: (text: string) => loadRulesFromText(text, base.replace('base.yaml', 'site.yaml'))},
		{path: 'an answers file (unknown confirmations), then its evaluation', make: answersFile, run: (text: string) => {
			const loaded = loadAnswersFromText(text, 'answers.yaml', rules);
			return loaded.ok ? evaluate(rules, loaded.value) : loaded;
		}},
		{path: 'an interlock plan (devices), loaded and analysed', make: planFile, run: loadAndAnalyse},
		{path: 'test results (one step per device) against their sheet', make: resultsFile, run: (text: string) => loadResultsFromText(text, 'results.yaml', sheets.get(text)!, new Date(Date.UTC(2026, 11, 1)))},
		{path: 'a record file (names in its body), integrity checked', make: recordFile, run: (text: string) => checkIntegrity(text, new KeyCache())},
	])('$path', ({path, make, run}) => {
		const {factor, timeRatio, sizeRatio} = growthOverLinear(make, run);
		console.log(`growth ${path}: time x${timeRatio.toFixed(0)} for size x${sizeRatio.toFixed(0)}, ${factor.toFixed(2)} times linear`);
		expect(factor).toBeLessThan(growthBound);
	});

	it.each([
		{path: 'the trust list (colleagues)', make: trustList, reader: onDisk('trusted', readTrusted)},
		{path: 'an operator key file (comment lines above the key)', make: keyFile, reader: onDisk('operator.key', namedKeyFromFile, 0o600)},
		{path: 'the settings file (unused names)', make: settingsFile, reader: onDisk('settings', (folder) => loadSettings({PRELASE_HOME: folder}))},
	])('$path', ({path, make, reader}) => {
		// The file is written once per size, outside the timing; each timed run reads it.
		const readers = new Map<string, () => unknown>();
		const {factor, timeRatio, sizeRatio} = growthOverLinear(make, (text) => (readers.get(text) ?? readers.set(text, reader(text)).get(text)!)());
		console.log(`growth ${path}: time x${timeRatio.toFixed(0)} for size x${sizeRatio.toFixed(0)}, ${factor.toFixed(2)} times linear`);
		expect(factor).toBeLessThan(growthBound);
	});

	it('the grown inputs are what they claim: valid where meant, about 1-10 kB and 100 kB', () => {
		const codes = (result: {ok: true} | {ok: false; errors: Array<{code: string}>}) => (result.ok ? [] : result.errors.map((found) => found.code));
		expect(codes(loadRulesFromText(ruleFile(100_000), 'rules.yaml'))).toEqual([]);
		expect(codes(loadRulesFromText(siteFile(100_000), base.replace('base.yaml', 'site.yaml')))).toEqual([]);
		const big = resultsFile(100_000);
		expect(codes(loadResultsFromText(big, 'results.yaml', sheets.get(big)!, new Date(Date.UTC(2026, 11, 1))))).toEqual([]);
		expect(readTrusted(join(top, 'trusted-x'))).toEqual([]);
		const sizes = [ruleFile, siteFile, answersFile, planFile, resultsFile, recordFile, trustList, keyFile, settingsFile].map((make) => [make.name, make(1_000).length, make(100_000).length] as const);
		expect(sizes.filter(([, small, large]) => small < 500 || small > 12_000 || large < 85_000 || large > 400_000 || large / small < 15)).toEqual([]);
		expect(publicKeyPem(keys.privateKey)).toContain('BEGIN PUBLIC KEY');
	});
});
