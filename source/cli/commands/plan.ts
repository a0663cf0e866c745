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
import {planProblemWords} from '../../ui/planner/plan-problem-words.js';
import {withResultsWords} from './plan-problem-text.js';
import {editorJsonSchema} from '../../shared/json-schema.js';
import {terminalSafeJson} from '../../shared/text.js';
import {deferral} from '../../shared/deferral.js';
import {interlockTestCaution} from '../../interlock/functional-test/test-record.js';
import {UsageError, valueOrUsageError} from '../usage-error.js';
import {commandHelp, helpOption, parseOptions, type Command, type Io} from '../command.js';
import {editPlan} from './plan-screen.js';
import {commitNote} from '../../render/record-commit-text.js';

const sheetWriters = {md: testSheetMarkdown, html: testSheetHtml};

/** JSON Schemas of the files the planner reads, for editors. */
const schemas = {
	plan: () => editorJsonSchema('prelase interlock plan', planSchema),
	results: () => editorJsonSchema('prelase interlock test results', testResultsSchema),
};

const options = {
	rules: {type: 'string', value: 'FILE', summary: 'The rule file whose interlock policy applies; `shipped` for the shipped policy (default: the settings\' rule file, else the shipped policy)'},
	json: {type: 'boolean', summary: 'Print the figures, findings and verdict as JSON'},
	'test-sheet': {type: 'string', value: 'md|html', summary: 'Print the functional test sheet (Markdown, or a page to print) with blanks for the result, initials and date of every step'},
	'record-test': {type: 'string', value: 'RESULTS', summary: 'Hold a filled-in test (YAML: tested_on, tested_by, witness, one result per step) against the plan\'s sheet, then write a signed interlock test record with the plan\'s text and hash. A bench check whose setup names the plan (input interlock_plan) answers its loop-test confirmations from the latest such record within the policy\'s test interval'},
	records: {type: 'string', value: 'DIR', summary: 'Where to write the record (default: the settings\' records folder)'},
	'witness-key': {type: 'string', value: 'FILE', summary: 'The witness\'s private key: the witness signs too, as verified'},
	edit: {type: 'boolean', summary: 'Open the planner screen on FILE (needs a terminal): edit, add, remove and reorder access points and devices, the findings following each change; saving keeps the file\'s comments and key order; t records a functional test of the plan as saved, step by step'},
	schema: {type: 'string', value: 'plan|results', summary: 'Print the JSON Schema of plan files or of results files'},
	help: helpOption,
} as const;

/**
 * `prelase plan FILE [--rules FILE] [--json | --test-sheet md|html | --record-test RESULTS]`, or
 * `prelase plan --schema plan|results`: 0 no stop finding (a test recorded as passed), 1 stop
 * findings (a test recorded as failed), 2 bad usage or input.
 */
export function runPlan(args: string[], io: Io): number | Promise<number> {
	const {values, positionals} = parseArgs({args, options: parseOptions(options), allowPositionals: true, strict: true});
	if (values.help) {
		io.stdout.write(`${commandHelp(planCommand)}\n`);
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
		for (const found of loaded.errors) io.stderr.write(`${planProblemWords(formatProblem(found))}\n`);
		const files = [...new Set(loaded.errors.map((found) => found.file ?? file))].join(', ');
		io.stderr.write(`prelase plan: ${loaded.errors.length} problem(s) in ${files}; nothing analysed\n`);
		return 2;
	}
	const {plan, text} = loaded.value;
	for (const found of loaded.warnings) io.stderr.write(`${planProblemWords(formatProblem(found), plan)}\n`);
	if (sheetFormat !== undefined) {
		io.stdout.write(sheetWriters[sheetFormat as keyof typeof sheetWriters](testSheet(plan)));
		return 0;
	}
	if (values['record-test'] !== undefined) {
		const recorded = valueOrUsageError(withResultsWords(recordTest(plan, file, text, rules.value, {results: values['record-test'], records: values.records, witnessKey: values['witness-key']}, io.env)));
		const verdict = recorded.outcome === 'passed' ? 'PASSED' : 'FAILED';
		io.stdout.write(
			[
				`Interlock test of ${plan.name}, ${recorded.testedOn}, by ${recorded.tester}: ${verdict}`,
				recorded.outcomeText,
				...(recorded.witness ? [`Witness: ${recorded.witness.name}, ${recorded.witness.signed ? 'signed' : 'named, not signed (a witness who did not sign is not a witness; sign with --witness-key FILE)'}`] : []),
				...(plan.location === undefined ? ['The plan names no location: no bench check can use this test. Add location: (room and bench) to the plan and test the loop again.'] : []),
				`Record written: ${recorded.path}`,
				`Signed with key ${recorded.fingerprint}${recorded.keyCreated ? ' (a new key, created now; share it with: prelase keys export)' : ''}`,
				...(commitNote(recorded) ? [commitNote(recorded).trimEnd()] : []),
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

export const planCommand: Command = {
	name: 'plan',
	summary: 'Analyse an interlock loop plan, print its test sheet, record a test, edit it',
	usage: 'prelase plan FILE [--json | --test-sheet md|html | --record-test RESULTS | --edit]',
	options,
	help: {
		intro: `prelase plan — the interlock planner

Usage:
  prelase plan FILE [--rules FILE] [--json]
  prelase plan FILE --test-sheet md|html
  prelase plan FILE --record-test RESULTS [--records DIR] [--witness-key FILE]
  prelase plan FILE --edit
  prelase plan --schema plan|results

Reads an interlock plan (YAML: the driver's interlock input, the access points and the devices
of the loop in wiring order; see docs/interlock.md) under the interlock policy of the rule file
in force (interlock_* policy values), and prints the loop figures and every finding with its
severity and the device or access point it concerns:
  loop        contacts plus every wire run (copper at the stated temperature) against the
              input's closed threshold less the policy margin; loop current and voltage
              against every contact's rating
  fail-safe   every device normally closed and in series; emergency stops positive-opening;
              a bypass key or shorting plug allowed by policy, with owner, reason and time limit
  coverage    every access point a beam can be reached through is interlocked or tool-secured,
              by a device that exists
  response    each device's opening time + input response + driver disable and fall time
              within the policy's largest response time; manual reset for class 4`,
		notes: `Exit status:
  0  no stop finding (or the test sheet or schema was printed; or the test recorded passed)
  1  one or more stop findings (or the test recorded failed: the record is written anyway)
  2  bad usage, a bad plan or results file (the message names the file, line and field);
     nothing is recorded
  74 a file could not be written (disk full, file size limit, read-only or denied folder);
     nothing was written and the file there before is unchanged
  130 with --edit: the planner was left with Ctrl-C (the unsaved plan is kept as a draft)

The planner says which findings it has; it never says a loop is safe. The laser safety
officer and the codes in force (IEC 60825 series, ANSI Z136 series, local law) decide.`,
	},
	run: runPlan,
};
