import {parseArgs} from 'node:util';
import {analysePlan} from '../../interlock/analysis/analyse.js';
import {loadPlanAndText} from '../../interlock/plan/plan-and-text.js';
import {planSchema} from '../../interlock/plan/plan-schema.js';
import {testResultsSchema} from '../../interlock/functional-test/results-schema.js';
import {rulesInForce} from '../../services/rules-in-force.js';
import {planJson, planText} from '../../render/plan-report.js';
import {testSheet} from '../../interlock/functional-test/test-sheet.js';
import {testSheetHtml} from '../../render/test-sheet-html.js';
import {testSheetMarkdown} from '../../render/test-sheet-markdown.js';
import {recordTest} from '../../services/record-functional-test.js';
import {formatProblem} from '../../shared/problems.js';
import {editorJsonSchema} from '../../shared/json-schema.js';
import {stripControl, terminalSafeJson} from '../../shared/text.js';
import {deferral} from '../../shared/deferral.js';
import {interlockTestCaution} from '../../interlock/functional-test/test-record.js';
import {UsageError, valueOrUsageError} from '../usage-error.js';
import type {Io} from '../io.js';
import {helpTexts} from './help.js';
import {editPlan} from './plan-screen.js';

const sheetWriters = {md: testSheetMarkdown, html: testSheetHtml};

/** JSON Schemas of the files the planner reads, for editors. */
const schemas = {
	plan: () => editorJsonSchema('prelase interlock plan', planSchema),
	results: () => editorJsonSchema('prelase interlock test results', testResultsSchema),
};

/**
 * `prelase plan FILE [--rules FILE] [--json | --test-sheet md|html | --record-test RESULTS]`, or
 * `prelase plan --schema plan|results`: 0 no stop finding (a test recorded as passed), 1 stop
 * findings (a test recorded as failed), 2 bad usage or input.
 */
export function runPlan(args: string[], io: Io): number | Promise<number> {
	const {values, positionals} = parseArgs({args, options: {
			json: {type: 'boolean'},
			'test-sheet': {type: 'string'},
			rules: {type: 'string'},
			edit: {type: 'boolean'},
			'record-test': {type: 'string'},
			records: {type: 'string'},
			'witness-key': {type: 'string'},
			schema: {type: 'string'},
			help: {type: 'boolean', short: 'h'},
		}, allowPositionals: true, strict: true});
	if (values.help) {
		io.stdout.write(`${helpTexts.plan}\n`);
		return 0;
	}
	if (values.schema !== undefined) {
		if (!Object.hasOwn(schemas, values.schema)) throw new UsageError(`--schema takes plan or results, not "${values.schema}"`);
		if (positionals.length > 0) throw new UsageError('--schema prints a schema and takes no FILE');
		io.stdout.write(`${JSON.stringify(schemas[values.schema as keyof typeof schemas](), null, 2)}\n`);
		return 0;
	}
	const [file, ...extra] = positionals;
	if (file === undefined) throw new UsageError('plan needs a plan FILE (prelase plan --help)');
	if (extra.length > 0) throw new UsageError(`plan takes one FILE, got also ${extra.join(' ')} (prelase plan --help)`);
	if (values.edit) return editPlan(file, values, io);
	const sheetFormat = values['test-sheet'];
	if (sheetFormat !== undefined && !Object.hasOwn(sheetWriters, sheetFormat)) throw new UsageError(`unknown test sheet format "${sheetFormat}"; use md or html (prelase plan --help)`);
	const modes = [values.json && '--json', sheetFormat !== undefined && '--test-sheet', values['record-test'] !== undefined && '--record-test'].filter(Boolean);
	if (modes.length > 1) throw new UsageError(`${modes.join(' and ')} cannot be used together`);
	for (const flag of ['records', 'witness-key'] as const) {
		if (values[flag] !== undefined && values['record-test'] === undefined) throw new UsageError(`--${flag} goes with --record-test RESULTS`);
	}
	const rules = rulesInForce(values.rules, io.env);
	if (!rules.ok) throw new UsageError('the rule file has problems', rules.errors);
	const loaded = loadPlanAndText(file, rules.value);
	if (!loaded.ok) {
		for (const found of loaded.errors) io.stderr.write(`${formatProblem(found)}\n`);
		const files = [...new Set(loaded.errors.map((found) => found.file ?? file))].join(', ');
		io.stderr.write(`prelase plan: ${loaded.errors.length} problem(s) in ${files}; nothing analysed\n`);
		return 2;
	}
	for (const found of loaded.warnings) io.stderr.write(`${formatProblem(found)}\n`);
	const {plan, text} = loaded.value;
	if (sheetFormat !== undefined) {
		io.stdout.write(sheetWriters[sheetFormat as keyof typeof sheetWriters](testSheet(plan)));
		return 0;
	}
	if (values['record-test'] !== undefined) {
		const recorded = valueOrUsageError(recordTest(plan, file, text, rules.value, {results: values['record-test'], records: values.records, witnessKey: values['witness-key']}, io.env));
		const verdict = recorded.outcome === 'passed' ? 'PASSED' : 'FAILED';
		io.stdout.write(
			[
				`Interlock test of ${stripControl(plan.name)}, ${recorded.testedOn}, by ${stripControl(recorded.tester)}: ${verdict}`,
				stripControl(recorded.outcomeText),
				...(plan.location === undefined ? ['The plan names no location: no bench check can use this test. Add location: (room and bench) to the plan and test the loop again.'] : []),
				`Record written: ${recorded.path}`,
				`Signed with key ${recorded.fingerprint}${recorded.keyCreated ? ' (a new key, created now; share it with: prelase keys export)' : ''}`,
				'',
				interlockTestCaution,
				deferral,
				'',
			].join('\n'),
		);
		return recorded.outcome === 'passed' ? 0 : 1;
	}
	const analysis = analysePlan(plan);
	const source = {name: rules.value.rules.name, file: rules.value.file, sha256: rules.value.sha256};
	io.stdout.write(values.json ? `${terminalSafeJson(planJson(plan, analysis, file, source))}\n` : planText(plan, analysis, file, source));
	return analysis.stops > 0 ? 1 : 0;
}
