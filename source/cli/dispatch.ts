import {optionSpellings, type Command, type Io} from './command.js';
import {commands, mainHelp} from './commands/help.js';
import {formatProblem} from '../shared/problems.js';
import {isInteractive, startScreens} from './screens.js';
import {didYouMean} from '../shared/did-you-mean.js';
import {UsageError} from './usage-error.js';
import {ProblemError} from '../shared/problem-error.js';
import {version} from '../shared/version.js';
import {terminalIo} from './terminal-io.js';
import {machineFailure} from '../shared/machine-failure.js';

const byName = new Map(commands.map((command) => [command.name, command]));

/** Runs the program with its arguments; returns the exit status. Never throws. */
export function main(argv: string[], given: Io): number | Promise<number> {
	const io = terminalIo(given);
	try {
		const [first, ...rest] = argv;
		if (first === undefined && isInteractive(io)) return startScreens(io, {});
		if (first === undefined || first === '--help' || first === '-h' || first === 'help') {
			io.stdout.write(`${mainHelp()}\n`);
			if (first === undefined) io.stderr.write('prelase: the home screen needs a terminal; for scripts use prelase check --answers FILE\n');
			return first === undefined ? 2 : 0;
		}
		if (first === '--version' || first === '-v') {
			io.stdout.write(`${version}\n`);
			return 0;
		}
		if (first.startsWith('-')) throw new UsageError(`unknown option ${first}; options go after a command (prelase --help)`);
		const command = byName.get(first);
		if (!command) throw new UsageError(`unknown command "${first}"${didYouMean(first, [...byName.keys()])}; commands are ${[...byName.keys()].join(', ')} (prelase --help)`);
		try {
			const result = command.run(rest, io);
			return typeof result === 'number' ? result : result.catch((error: unknown) => report(isArgumentError(error) ? new UsageError(argumentMessage(error, command)) : error, io));
		} catch (error) {
			if (isArgumentError(error)) throw new UsageError(argumentMessage(error, command));
			throw error;
		}
	} catch (error) {
		return report(error, io);
	}
}

/** Node's parseArgs message, shortened, with a "did you mean" from the command's declared options. */
function argumentMessage(error: Error & {code: string}, command: Command): string {
	const unknown = /Unknown option '([^']+)'/.exec(error.message)?.[1];
	if (error.code === 'ERR_PARSE_ARGS_UNKNOWN_OPTION' && unknown) {
		return `unknown option ${unknown}${didYouMean(unknown, optionSpellings(command.options))} for prelase ${command.name} (prelase ${command.name} --help)`;
	}
	return `${error.message.split('. To specify')[0]} (prelase ${command.name} --help)`;
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
	const refused = machineFailure(error);
	if (refused !== undefined) {
		io.stderr.write(`prelase: ${refused}\n`);
		return 74;
	}
	const detail = error instanceof Error ? (error.stack ?? error.message) : String(error);
	io.stderr.write(`prelase ${version}: internal error — this is a bug in prelase, not in your input.\nPlease report it with the command you ran and this text:\n${detail}\n`);
	return 70;
}

