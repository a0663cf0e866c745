import {readFileSync} from 'node:fs';
import {describe, expect, it} from 'vitest';
import {analysePlan} from '../../source/interlock/analysis/analyse.js';
import {loadResultsFromText} from '../../source/interlock/functional-test/load-results.js';
import {testSheet} from '../../source/interlock/functional-test/test-sheet.js';
import {loadPlanFromText} from '../../source/interlock/plan/load-plan.js';
import {checkIntegrity, KeyCache} from '../../source/records/integrity.js';
import {evaluate} from '../../source/rules/evaluate/evaluate.js';
import {loadAnswersFromText} from '../../source/rules/evaluate/load-answers.js';
import {loadRulesFromText, shippedRulesPath} from '../../source/rules/load.js';
import {messages} from '../../source/shared/messages.js';
import type {CodedMessage, Problem} from '../../source/shared/problems.js';
import {mutate, Random, type Mutation} from '../helpers/fuzz-mutate.js';
import {sampleRecord, sampleRules, serialise} from '../helpers/sample-record.js';
import {testPolicy} from '../interlock/plan-fixture.js';
import {fuzzRuns, fuzzSeed} from './fuzz-settings.js';

// Issue 15: the fuzz run over every input file type, in-process through the loaders the CLI
// calls. A case passes when the loader returns (never throws) and every problem it reports is
// located (the file, and a line or a field) and fully worded (every placeholder has its value).

const rules = sampleRules();
const planText = readFileSync('docs/examples/interlock/bench3-interlock-plan.yaml', 'utf8');
const plan = loadPlanFromText(planText, 'plan.yaml');
if (!plan.ok) throw new Error('the demo plan must load');
const sheet = testSheet({...plan.value, policy: testPolicy()});
const now = new Date(Date.UTC(2026, 11, 1, 12, 0, 0));
const keys = new KeyCache();

/** Problems that concern the whole file, so the file is their location. */
const wholeFile = new Set(['file-empty', 'file-binary', 'file-too-large', 'yaml-not-mapping']);

type Target = {name: string; file: string; format: 'yaml' | 'json'; valid: string; share: number; run: (text: string, file: string) => Problem[] | CodedMessage[]};

const siteText = `format: 1\nextends: shipped\nname: Fenwick Hollow bench 3 (invented site)\npolicy_changed:\n  current_margin:\n    value: 15 %\nswitched_off:\n  limit_within_driver: "not used here, decided by the invented lab's safety officer"\n`;

/** Each input type, its valid file, and its share of the cases (rule files compile: fewer, they cost more). */
const targets: Target[] = [
	{name: 'rule file', file: 'rules.yaml', format: 'yaml', valid: readFileSync(shippedRulesPath(), 'utf8'), share: 0.01, run: (text, file) => problemsOf(loadRulesFromText(text, file))},
	{name: 'site rule file', file: 'site.yaml', format: 'yaml', valid: siteText, share: 0.02, run: (text, file) => problemsOf(loadRulesFromText(text, file))},
	{
		name: 'answers',
		file: 'answers.yaml',
		format: 'yaml',
		valid: readFileSync('docs/examples/bench3-808nm-clear.yaml', 'utf8'),
		share: 0.12,
		run: (text, file) => {
			const loaded = loadAnswersFromText(text, file, rules);
			if (loaded.ok) evaluate(rules, loaded.value);
			return problemsOf(loaded);
		},
	},
	{
		name: 'plan',
		file: 'plan.yaml',
		format: 'yaml',
		valid: planText,
		share: 0.15,
		run: (text, file) => {
			const loaded = loadPlanFromText(text, file);
			if (loaded.ok) testSheet({...loaded.value, policy: testPolicy()}) && analysePlan({...loaded.value, policy: testPolicy()});
			return problemsOf(loaded);
		},
	},
	{name: 'results', file: 'results.yaml', format: 'yaml', valid: readFileSync('docs/examples/interlock/bench3-interlock-test-results.yaml', 'utf8'), share: 0.3, run: (text, file) => problemsOf(loadResultsFromText(text, file, sheet, now))},
	{name: 'record', file: 'record.json', format: 'json', valid: serialise(sampleRecord({rules})), share: 0.4, run: (text) => {
		const checked = checkIntegrity(text, keys);
		return checked.ok ? [] : [checked.finding];
	}},
];

function problemsOf(result: {ok: true; warnings: Problem[]} | {ok: false; errors: Problem[]}): Problem[] {
	return result.ok ? result.warnings : result.errors;
}

/** Why a reported problem is not a located, fully worded message; undefined when it is. */
function defect(found: Problem | CodedMessage, file: string): string | undefined {
	const text = (messages as Record<string, string>)[found.code];
	if (text === undefined) return `unknown message code ${found.code}`;
	const missing = [...text.matchAll(/\{\{(\w+)\}\}/g)].map((match) => match[1]!).filter((name) => !Object.hasOwn(found.data, name));
	if (missing.length > 0) return `${found.code} leaves {{${missing.join('}}, {{')}}} unfilled`;
	// An audit finding is located by the record file it is reported under.
	if (!('severity' in found)) return undefined;
	if (found.file !== file) return `${found.code} names the file ${String(found.file)}, not ${file}`;
	if (found.line === undefined && found.field === undefined && !wholeFile.has(found.code)) return `${found.code} has neither a line nor a field`;
	return undefined;
}

let mutateTime = 0;
/** One case: the mutated bytes read as the CLI reads them (UTF-8), run through the target; what went wrong, if anything. */
function runCase(target: Target, random: Random): {mutation: Mutation; failure?: string; text: string} {
	const mutateStart = performance.now();
	const {bytes, mutation} = mutate(target.valid, target.format, random);
	mutateTime += performance.now() - mutateStart;
	const text = bytes.toString('utf8');
	try {
		const problems = target.run(text, target.file);
		const bad = problems.map((found) => defect(found, target.file)).find((why) => why !== undefined);
		return bad ? {mutation, failure: bad, text} : {mutation, text};
	} catch (error) {
		return {mutation, failure: `threw ${(error as Error).stack ?? String(error)}`, text};
	}
}

describe(`the fuzz run (seed ${fuzzSeed}, ${fuzzRuns} cases; PRELASE_FUZZ_SEED and PRELASE_FUZZ_RUNS vary it)`, () => {
	it('each valid file loads, so the mutations start from a file that is accepted', () => {
		for (const target of targets) expect([target.name, target.run(target.valid, target.file).filter((found) => 'severity' in found && found.severity === 'error')]).toEqual([target.name, []]);
	});

	it.each([
		{name: 'a problem with neither line nor field', found: {code: 'schema', data: {detail: 'x'}, severity: 'error', file: 'a.yaml'}, says: /neither a line nor a field/},
		{name: 'a problem in another file', found: {code: 'schema', data: {detail: 'x'}, severity: 'error', file: 'b.yaml', line: 1}, says: /names the file b.yaml/},
		{name: 'a placeholder left unfilled', found: {code: 'schema', data: {}, severity: 'error', file: 'a.yaml', line: 1}, says: /leaves \{\{detail\}\} unfilled/},
		{name: 'a finding of an unknown code', found: {code: 'audit-made-up', data: {}}, says: /unknown message code/},
	] as Array<{name: string; found: Problem; says: RegExp}>)('the check of each case has teeth: $name is a defect', ({found, says}) => {
		expect(defect(found, 'a.yaml')).toMatch(says);
		expect(defect({...found, code: 'file-empty', data: {expected: 'x'}, ...('severity' in found ? {file: 'a.yaml'} : {})}, 'a.yaml')).toBeUndefined();
	});

	it.each(targets)('$name: every mutated file gives a located message or loads; nothing throws', {timeout: 120_000}, (target) => {
		const random = new Random(fuzzSeed ^ [...target.name].reduce((sum, char) => (sum * 31 + char.charCodeAt(0)) >>> 0, 0));
		const runs = Math.max(1, Math.round(fuzzRuns * target.share));
		const failures: string[] = [];
		const started = performance.now();
		for (let index = 0; index < runs; index += 1) {
			const result = runCase(target, random);
			if (result.failure && failures.length < 5) failures.push(`case ${index} (${result.mutation}): ${result.failure}\n--- input (first 400 characters) ---\n${JSON.stringify(result.text.slice(0, 400))}`);
		}
		const seconds = (performance.now() - started) / 1000;
		console.log(`fuzz ${target.name}: ${runs} cases in ${seconds.toFixed(2)} s (${Math.round(runs / seconds)} cases/s), mutating ${(mutateTime / 1000).toFixed(2)} s`);
		mutateTime = 0;
		expect(failures).toEqual([]);
	});
});
