import {parseArgs} from 'node:util';
import {paintFor} from '../../shared/paint.js';
import {formatProblem} from '../../shared/problems.js';
import {evaluate} from '../../rules/evaluate/evaluate.js';
import {evaluationToJson} from '../../rules/evaluate/evaluation-json.js';
import {loadAnswers} from '../../rules/evaluate/load-answers.js';
import {rulesInForce} from '../../services/rules-in-force.js';
import {interlockPlanInput} from '../../interlock/plan/plan-input.js';
import type {InterlockLink} from '../../interlock/functional-test/test-link.js';
import type {Answers} from '../../rules/evaluate/answers.js';
import type {CompiledRules} from '../../rules/compile/compiled-rules.js';
import {recordsFolder, trustedFingerprints} from '../../services/records-folder.js';
import {dirname} from 'node:path';
import {UsageError, valueOrUsageError} from '../usage-error.js';
import {checkText} from '../../render/check-text.js';
import {commandHelp, helpOption, parseOptions, type Command, type Io} from '../command.js';
import {signAndWrite} from '../../services/sign-check.js';
import {terminalSafeJson} from '../../shared/text.js';
import {isInteractive, startScreens} from '../screens.js';
import {commitNote} from '../../render/record-commit-text.js';
import {openSettings} from '../../services/settings.js';
import {listSetups, loadSetup} from '../../services/drafts/setup-store.js';
import {analyseWhatIf} from '../../rules/evaluate/what-if.js';
import {whatIfLines} from '../../render/what-if-text.js';
import {whatIfToJson} from '../../render/what-if-json.js';

export type {Io} from '../command.js';

const options = {
	answers: {type: 'string', value: 'FILE', summary: 'Answers file: setup, inputs (id: value with unit), confirmations (id: yes/no/not applicable, or {answer, note}); see docs/examples/'},
	rules: {type: 'string', value: 'FILE', summary: 'Rule file to use; `shipped` for the shipped policy (default: the settings\' rule file, else the shipped rules/default.yaml)'},
	json: {type: 'boolean', summary: 'Print the evaluation as JSON instead of text'},
	sign: {type: 'string', value: 'NAME', summary: 'Write a signed record of this check (in every outcome) as NAME; the operator\'s key is created on first use (see prelase keys)'},
	role: {type: 'string', value: 'ROLE', summary: 'The signer\'s role (default: the role in settings)'},
	records: {type: 'string', value: 'DIR', summary: 'Records folder: where the record is written and interlock test records are looked for (default: settings, else the settings folder\'s records/)'},
	amends: {type: 'string', value: 'RECORD', summary: 'This record corrects RECORD (never edited); needs --reason TEXT'},
	reason: {type: 'string', value: 'TEXT', summary: 'Why the record amends RECORD (with --amends)'},
	cosign: {type: 'string', value: 'NAME', summary: 'A second signer (verifier or laser safety officer) signing with their own private key file --cosign-key FILE'},
	'cosign-key': {type: 'string', value: 'FILE', summary: 'The second signer\'s private key file (with --cosign)'},
	'cosign-role': {type: 'string', value: 'ROLE', summary: 'The second signer\'s role (with --cosign)'},
	'cosign-meaning': {type: 'string', value: 'witness|approval', summary: 'What the second signature is for: witness (default) or approval (verified and approved are read as these)'},
	setup: {type: 'string', value: 'NAME', summary: 'Without --answers, on a terminal: open the on-screen check on the setup NAME'},
	'what-if': {type: 'boolean', summary: 'Also show what would flip each verdict: for each check and input, the value where the verdict changes, the closest calls, the changes that clear each fail, and a tornado chart; with --sign the record keeps the flip points (its sensitivity section)'},
	help: helpOption,
} as const;

/** `prelase check --answers FILE [--rules FILE] [--json]`: returns the exit status. */
export function runCheck(args: string[], io: Io): number | Promise<number> {
	const {values} = parseArgs({args, options: parseOptions(options), allowPositionals: false, strict: true});
	if (values.help) {
		io.stdout.write(`${commandHelp(checkCommand)}\n`);
		return 0;
	}
	if (!values.answers) {
		if (values['what-if']) throw new UsageError('--what-if goes with --answers FILE; on screen, press w on the summary');
		if (values.setup !== undefined) {
			// A name that is not a saved setup would start an empty check under that name.
			const folder = openSettings(io.env).folder;
			if (!loadSetup(folder, values.setup)) {
				const known = listSetups(folder);
				throw new UsageError(`there is no saved setup named "${values.setup}" (saved setups: ${known.length > 0 ? known.join(', ') : 'none yet'}); save one from the on-screen check, or start without --setup`);
			}
		}
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
type FinishOptions = {json?: boolean | undefined; 'what-if'?: boolean | undefined; sign?: string | undefined; role?: string | undefined; records?: string | undefined; amends?: string | undefined; reason?: string | undefined; cosign?: string | undefined; 'cosign-role'?: string | undefined; 'cosign-key'?: string | undefined; 'cosign-meaning'?: string | undefined};

/** Evaluates the (linked) answers, signs and writes a record when asked, prints the result; returns the exit status. */
function finishCheck(rules: CompiledRules, linked: {answers: Answers; link: InterlockLink | null}, values: FinishOptions, io: Io): number {
	const evaluation = evaluate(rules, linked.answers);
	const whatIf = values['what-if'] ? analyseWhatIf(rules, linked.answers, evaluation) : undefined;
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
							...(whatIf ? {whatIf} : {}),
							...(values.cosign === undefined
								? {}
								: {cosign: {name: values.cosign, key: values['cosign-key']!, meaning: values['cosign-meaning'] ?? 'witness', ...(values['cosign-role'] === undefined ? {} : {role: values['cosign-role']})}}),
						},
						io.env,
						linked.link,
					),
				);
	if (values.json) {
		const json = {...evaluationToJson(rules, linked.answers, evaluation), ...(whatIf ? {whatIf: whatIfToJson(whatIf)} : {}), ...(linked.link ? {interlockTest: linked.link} : {}), ...(written ? {record: {path: written.path, fingerprint: written.fingerprint, ...(typeof written.commit === 'string' ? {commit: written.commit} : {})}} : {})};
		io.stdout.write(`${terminalSafeJson(json)}\n`);
		if (written && typeof written.commit === 'object') io.stderr.write(commitNote(written));
	} else {
		io.stdout.write(`${checkText(rules, linked.answers, evaluation, paintFor(io.stdout, io.env), io.stdout.columns ?? 100, linked.link)}\n`);
		if (whatIf) io.stdout.write(`${whatIfLines(whatIf, io.stdout.columns ?? 100, evaluation.checks).join('\n')}\n`);
		if (written) io.stdout.write(`\nRecord written: ${written.path}\nSigned with key ${written.fingerprint}${written.keyCreated ? ' (a new key, created now; share it with: prelase keys export)' : ''}\n${commitNote(written)}`);
	}
	return evaluation.outcome === 'clear_to_energize' ? 0 : 1;
}

export const checkCommand: Command = {
	name: 'check',
	summary: 'Run the bench check over the rule file and report each check\'s verdict and margin',
	usage: 'prelase check --answers FILE [--rules FILE] [--json]',
	options,
	help: {
		intro: `prelase check — the bench check

Usage:
  prelase check --answers FILE [--rules FILE] [--json] [--what-if] [--records DIR]
                [--sign NAME [--role ROLE] [--amends RECORD --reason TEXT]
                 [--cosign NAME --cosign-key FILE [--cosign-role ROLE] [--cosign-meaning verified|approved]]]
  prelase check [--setup NAME] [--rules FILE]
                on a terminal: the bench check on screen, step by step (--setup NAME starts it
                on a saved setup), with the same checks and the same record

Reads the setup's numbers and confirmations from an answers file (YAML), evaluates every
check of the rule file, and prints each verdict with its value, limit and margin, failures
first in the summary, then the outcome: clear to energize, do not energize, or incomplete.
When the setup names its interlock plan (input interlock_plan, a path relative to the answers
file), the loop-test confirmations are answered from the latest trusted interlock test record
of that plan in the records folder: yes within the policy's test interval, otherwise no.`,
		notes: `Without --sign nothing is written.

Exit status:
  0  clear to energize
  1  do not energize, or incomplete
  2  bad usage or bad input (the message names the file, line and field)
  74 a file could not be written (disk full, file size limit, read-only or denied folder);
     nothing was written and the file there before is unchanged
  130 on screen: the check was left with Ctrl-C (the draft is kept)

Without --answers, on a terminal, the check runs on screen (--setup NAME starts it on that
setup); elsewhere give --answers FILE.`,
	},
	run: runCheck,
};
