import {parseArgs} from 'node:util';
import {paintFor} from '../paint.js';
import {formatProblem} from '../problems.js';
import {evaluate} from '../rules/evaluate.js';
import {evaluationToJson} from '../rules/evaluation-json.js';
import {loadAnswers} from '../rules/load-answers.js';
import {loadRules, shippedRulesPath} from '../rules/load.js';
import {UsageError} from '../usage-error.js';
import {checkText} from './check-text.js';
import {helpTexts} from './help.js';

/** Where a command writes; tests pass their own. */
export type Io = {stdout: NodeJS.WriteStream; stderr: NodeJS.WriteStream; env: NodeJS.ProcessEnv};

/** `prelase check --answers FILE [--rules FILE] [--json]`: returns the exit status. */
export function runCheck(args: string[], io: Io): number {
	const {values} = parseArgs({
		args,
		options: {answers: {type: 'string'}, rules: {type: 'string'}, json: {type: 'boolean'}, help: {type: 'boolean', short: 'h'}},
		allowPositionals: false,
		strict: true,
	});
	if (values.help) {
		io.stdout.write(`${helpTexts.check}\n`);
		return 0;
	}
	if (!values.answers) {
		const where = io.stdout.isTTY && process.stdin.isTTY ? 'The on-screen bench check is not in this version.' : 'stdin is not a terminal, so prelase does not prompt.';
		throw new UsageError(`${where} Give the setup as a file: prelase check --answers FILE (see docs/examples/).`);
	}
	const rules = loadRules(values.rules ?? shippedRulesPath());
	if (!rules.ok) throw new UsageError('the rule file has problems', rules.errors);
	const answers = loadAnswers(values.answers, rules.value);
	if (!answers.ok) throw new UsageError('the answers file has problems', answers.errors);
	for (const found of [...rules.warnings, ...answers.warnings]) io.stderr.write(`${formatProblem(found)}\n`);

	const evaluation = evaluate(rules.value, answers.value);
	if (values.json) io.stdout.write(`${JSON.stringify(evaluationToJson(rules.value, answers.value, evaluation), null, 2)}\n`);
	else io.stdout.write(`${checkText(rules.value, answers.value, evaluation, paintFor(io.stdout, io.env), io.stdout.columns ?? 100)}\n`);
	return evaluation.outcome === 'clear_to_energize' ? 0 : 1;
}
