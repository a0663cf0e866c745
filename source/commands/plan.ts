import {parseArgs} from 'node:util';
import {analysePlan} from '../interlock/analyse.js';
import {loadPlan} from '../interlock/load-plan.js';
import {planJson, planText} from '../interlock/plan-report.js';
import {testSheet} from '../interlock/test-sheet.js';
import {testSheetMarkdown} from '../interlock/test-sheet-markdown.js';
import {formatProblem} from '../problems.js';
import {terminalSafeJson} from '../text.js';
import {UsageError} from '../usage-error.js';
import type {Io} from './check.js';
import {helpTexts} from './help.js';

/** `prelase plan FILE [--json] [--test-sheet md]`: 0 no stop finding, 1 stop findings, 2 bad usage or input. */
export function runPlan(args: string[], io: Io): number {
	const {values, positionals} = parseArgs({args, options: {json: {type: 'boolean'}, 'test-sheet': {type: 'string'}, help: {type: 'boolean', short: 'h'}}, allowPositionals: true, strict: true});
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
	const loaded = loadPlan(file);
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
	io.stdout.write(values.json ? `${terminalSafeJson(planJson(plan, analysis, file))}\n` : planText(plan, analysis, file));
	return analysis.stops > 0 ? 1 : 0;
}
