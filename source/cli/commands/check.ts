import {parseArgs} from 'node:util';
import {paintFor} from '../../shared/paint.js';
import {formatProblem} from '../../shared/problems.js';
import {evaluate} from '../../rules/evaluate.js';
import {evaluationToJson} from '../../rules/evaluation-json.js';
import {loadAnswers} from '../../rules/load-answers.js';
import {rulesInForce} from '../../services/rules-in-force.js';
import {interlockPlanInput} from '../../interlock/plan/plan-input.js';
import type {InterlockLink} from '../../interlock/functional-test/test-link.js';
import type {Answers} from '../../rules/answers.js';
import type {CompiledRules} from '../../rules/compiled-rules.js';
import {recordsFolder, trustedFingerprints} from '../../services/records-folder.js';
import {dirname} from 'node:path';
import {UsageError, valueOrUsageError} from '../usage-error.js';
import {checkText} from '../../render/check-text.js';
import {helpTexts} from './help.js';
import {signAndWrite} from '../../services/sign-check.js';
import {terminalSafeJson} from '../../shared/text.js';
import {isInteractive, startScreens} from '../screens.js';
import type {Io} from '../io.js';

/** `prelase check --answers FILE [--rules FILE] [--json]`: returns the exit status. */
export function runCheck(args: string[], io: Io): number | Promise<number> {
	const {values} = parseArgs({
		args,
		options: {
			answers: {type: 'string'},
			rules: {type: 'string'},
			json: {type: 'boolean'},
			sign: {type: 'string'},
			role: {type: 'string'},
			records: {type: 'string'},
			amends: {type: 'string'},
			reason: {type: 'string'},
			cosign: {type: 'string'},
			'cosign-role': {type: 'string'},
			'cosign-key': {type: 'string'},
			'cosign-meaning': {type: 'string'},
			setup: {type: 'string'},
			help: {type: 'boolean', short: 'h'},
		},
		allowPositionals: false,
		strict: true,
	});
	if (values.help) {
		io.stdout.write(`${helpTexts.check}\n`);
		return 0;
	}
	if (!values.answers) {
		if (isInteractive(io)) return startScreens(io, {...(values.rules ? {rules: values.rules} : {}), startCheck: values.setup ? {setup: values.setup} : {}});
		throw new UsageError('the on-screen check needs a terminal (stdin and stdout), so prelase does not prompt here. Give the setup as a file: prelase check --answers FILE (see docs/examples/).');
	}
	if (values.setup !== undefined) throw new UsageError('--setup NAME is for the on-screen check; with --answers FILE the file names the setup');
	const rules = rulesInForce(values.rules, io.env);
	if (!rules.ok) throw new UsageError('the rule file has problems', rules.errors);
	const answers = loadAnswers(values.answers, rules.value);
	if (!answers.ok) throw new UsageError('the answers file has problems', answers.errors);
	for (const found of [...rules.warnings, ...answers.warnings]) io.stderr.write(`${formatProblem(found)}\n`);

	for (const flag of ['role', 'amends', 'reason', 'cosign'] as const) {
		if (values[flag] !== undefined && values.sign === undefined) throw new UsageError(`--${flag} goes with --sign NAME (a record is written only when someone signs)`);
	}
	if ((values['cosign-key'] !== undefined || values['cosign-role'] !== undefined || values['cosign-meaning'] !== undefined) && values.cosign === undefined) throw new UsageError('--cosign-key, --cosign-role and --cosign-meaning go with --cosign NAME');
	if (values.cosign !== undefined && values['cosign-key'] === undefined) throw new UsageError('--cosign NAME needs --cosign-key FILE (the second signer\'s private key)');

	// Confirmations the rule file answers by the interlock test come from the latest test record of
	// the named plan. The planner's modules are loaded only then: start-up time is a feature.
	const compiled = rules.value;
	if (!answers.value.inputs.has(interlockPlanInput)) return finishCheck(compiled, {answers: answers.value, link: null}, values, io);
	const base = dirname(values.answers);
	return import('../../interlock/functional-test/test-link.js').then(({answerFromInterlockTest}) =>
		finishCheck(compiled, answerFromInterlockTest(compiled, answers.value, {base, folder: recordsFolder(io.env, values.records), trusted: trustedFingerprints(io.env), now: new Date()}), values, io),
	);
}

/** The options of `check --answers` that decide what happens after the answers are read. */
type FinishOptions = {json?: boolean | undefined; sign?: string | undefined; role?: string | undefined; records?: string | undefined; amends?: string | undefined; reason?: string | undefined; cosign?: string | undefined; 'cosign-role'?: string | undefined; 'cosign-key'?: string | undefined; 'cosign-meaning'?: string | undefined};

/** Evaluates the (linked) answers, signs and writes a record when asked, prints the result; returns the exit status. */
function finishCheck(rules: CompiledRules, linked: {answers: Answers; link: InterlockLink | null}, values: FinishOptions, io: Io): number {
	const evaluation = evaluate(rules, linked.answers);
	const written =
		values.sign === undefined
			? undefined
			: valueOrUsageError(
					signAndWrite(
						rules,
						linked.answers,
						evaluation,
						{
							name: values.sign,
							...(values.role === undefined ? {} : {role: values.role}),
							...(values.records === undefined ? {} : {records: values.records}),
							...(values.amends === undefined ? {} : {amends: values.amends}),
							...(values.reason === undefined ? {} : {reason: values.reason}),
							...(values.cosign === undefined
								? {}
								: {cosign: {name: values.cosign, key: values['cosign-key']!, meaning: values['cosign-meaning'] ?? 'verified', ...(values['cosign-role'] === undefined ? {} : {role: values['cosign-role']})}}),
						},
						io.env,
						linked.link,
					),
				);
	if (values.json) {
		const json = {...evaluationToJson(rules, linked.answers, evaluation), ...(linked.link ? {interlockTest: linked.link} : {}), ...(written ? {record: {path: written.path, fingerprint: written.fingerprint}} : {})};
		io.stdout.write(`${terminalSafeJson(json)}\n`);
	} else {
		io.stdout.write(`${checkText(rules, linked.answers, evaluation, paintFor(io.stdout, io.env), io.stdout.columns ?? 100, linked.link)}\n`);
		if (written) io.stdout.write(`\nRecord written: ${written.path}\nSigned with key ${written.fingerprint}${written.keyCreated ? ' (a new key, created now; share it with: prelase keys export)' : ''}\n`);
	}
	return evaluation.outcome === 'clear_to_energize' ? 0 : 1;
}
