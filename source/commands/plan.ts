import {parseArgs} from 'node:util';
import {analysePlan} from '../interlock/analyse.js';
import {loadPlanInForce} from '../interlock/plan-in-force.js';
import {rulesInForce} from '../rules/in-force.js';
import {planJson, planText} from '../interlock/plan-report.js';
import {testSheet} from '../interlock/test-sheet.js';
import {testSheetMarkdown} from '../interlock/test-sheet-markdown.js';
import {formatProblem} from '../problems.js';
import {terminalSafeJson} from '../text.js';
import {UsageError} from '../usage-error.js';
import type {Io} from './check.js';
import {helpTexts} from './help.js';

/** `prelase plan FILE [--rules FILE] [--json] [--test-sheet md]`: 0 no stop finding, 1 stop findings, 2 bad usage or input. */
export function runPlan(args: string[], io: Io): number {
	const {values, positionals} = parseArgs({args, options: {json: {type: 'boolean'}, 'test-sheet': {type: 'string'}, rules: {type: 'string'}, help: {type: 'boolean', short: 'h'}}, allowPositionals: true, strict: true});
	if (values.help) {
		io.stdout.write(`${helpTexts.plan}\n`);
		return 0;
	}
	const [file, ...extra] = positionals;
	if (file === undefined) throw new UsageError('plan needs a plan FILE (prelase plan --help)');
	if (extra.length > 0) throw new UsageError(`plan takes one FILE, got also ${extra.join(' ')} (prelase plan --help)`);
	const sheetFormat = values['test-sheet'];
	if (sheetFormat !== undefined && sheetFormat !== 'md') throw new UsageError(`unknown test sheet format "${sheetFormat}"; this version writes md (prelase plan --help)`);
	if (sheetFormat !== undefined && values.json) throw new UsageError('--test-sheet and --json cannot be used together');
	const rules = rulesInForce(values.rules, io.env);
	if (!rules.ok) throw new UsageError('the rule file has problems', rules.errors);
	const loaded = loadPlanInForce(file, rules.value);
	if (!loaded.ok) {
		for (const found of loaded.errors) io.stderr.write(`${formatProblem(found)}\n`);
		io.stderr.write(`prelase plan: ${loaded.errors.length} problem(s) in ${file}; nothing analysed\n`);
		return 2;
	}
	for (const found of loaded.warnings) io.stderr.write(`${formatProblem(found)}\n`);
	const plan = loaded.value;
	if (sheetFormat !== undefined) {
		io.stdout.write(testSheetMarkdown(testSheet(plan)));
		return 0;
	}
	const analysis = analysePlan(plan);
	const source = {name: rules.value.rules.name, file: rules.value.file, sha256: rules.value.sha256};
	io.stdout.write(values.json ? `${terminalSafeJson(planJson(plan, analysis, file, source))}\n` : planText(plan, analysis, file, source));
	return analysis.stops > 0 ? 1 : 0;
}
