import {runAudit} from './commands/audit.js';
import {runCalc} from './commands/calc.js';
import {runCheck} from './commands/check.js';
import type {Io} from './io.js';
import {helpTexts} from './commands/help.js';
import {runKeys} from './commands/keys.js';
import {runPlan} from './commands/plan.js';
import {runReport} from './commands/report.js';
import {runRules} from './commands/rules.js';
import {formatProblem} from '../shared/problems.js';
import {isInteractive, startScreens} from './screens.js';
import {didYouMean} from '../shared/did-you-mean.js';
import {UsageError} from './usage-error.js';
import {ProblemError} from '../shared/problem-error.js';
import {version} from '../shared/version.js';

const commands: Record<string, (args: string[], io: Io) => number | Promise<number>> = {check: runCheck, calc: runCalc, rules: runRules, keys: runKeys, report: runReport, audit: runAudit, plan: runPlan};

/** Runs the program with its arguments; returns the exit status. Never throws. */
export function main(argv: string[], io: Io): number | Promise<number> {
	try {
		const [first, ...rest] = argv;
		if (first === undefined && isInteractive(io)) return startScreens(io, {});
		if (first === undefined || first === '--help' || first === '-h' || first === 'help') {
			io.stdout.write(`${helpTexts.main}\n`);
			if (first === undefined) io.stderr.write('prelase: the home screen needs a terminal; for scripts use prelase check --answers FILE\n');
			return first === undefined ? 2 : 0;
		}
		if (first === '--version' || first === '-v') {
			io.stdout.write(`${version}\n`);
			return 0;
		}
		if (first.startsWith('-')) throw new UsageError(`unknown option ${first}; options go after a command (prelase --help)`);
		const command = Object.hasOwn(commands, first) ? commands[first] : undefined;
		if (!command) throw new UsageError(`unknown command "${first}"${didYouMean(first, Object.keys(commands))}; commands are ${Object.keys(commands).join(', ')} (prelase --help)`);
		try {
			const result = command(rest, io);
			return typeof result === 'number' ? result : result.catch((error: unknown) => report(error, io));
		} catch (error) {
			if (isArgumentError(error)) throw new UsageError(argumentMessage(error, first));
			throw error;
		}
	} catch (error) {
		return report(error, io);
	}
}

/** Node's parseArgs message, shortened, with a "did you mean" from the command's own help text. */
function argumentMessage(error: Error & {code: string}, command: string): string {
	const help = (helpTexts as Record<string, string>)[command] ?? '';
	const unknown = /Unknown option '([^']+)'/.exec(error.message)?.[1];
	if (error.code === 'ERR_PARSE_ARGS_UNKNOWN_OPTION' && unknown) {
		const known = [...new Set(help.match(/--[a-z][a-z-]*/g) ?? [])];
		return `unknown option ${unknown}${didYouMean(unknown, known)} for prelase ${command} (prelase ${command} --help)`;
	}
	return `${error.message.split('. To specify')[0]} (prelase ${command} --help)`;
}

function isArgumentError(error: unknown): error is Error & {code: string} {
	const code = (error as {code?: unknown} | null)?.code;
	return error instanceof Error && typeof code === 'string' && code.startsWith('ERR_PARSE_ARGS');
}

function report(error: unknown, io: Io): number {
	if (error instanceof UsageError) {
		for (const found of error.problems) io.stderr.write(`${formatProblem(found)}\n`);
		io.stderr.write(`prelase: ${error.message}\n`);
		return 2;
	}
	if (error instanceof ProblemError) {
		io.stderr.write(`prelase: ${error.message}\n`);
		return 2;
	}
	if (isArgumentError(error)) {
		io.stderr.write(`prelase: ${error.message} (see --help)\n`);
		return 2;
	}
	const detail = error instanceof Error ? (error.stack ?? error.message) : String(error);
	io.stderr.write(`prelase ${version}: internal error — this is a bug in prelase, not in your input.\nPlease report it with the command you ran and this text:\n${detail}\n`);
	return 70;
}

