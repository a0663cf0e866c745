import {commandHelp, type Command} from '../command.js';
import {definitionRow} from '../../shared/wrap.js';
import {auditCommand} from './audit.js';
import {calcCommand} from './calc.js';
import {checkCommand} from './check.js';
import {keysCommand} from './keys.js';
import {planCommand} from './plan.js';
import {recordsCommand} from './records.js';
import {reportCommand} from './report.js';
import {rulesCommand} from './rules.js';

/** Every command, in the order the main help lists them. */
export const commands: readonly Command[] = [checkCommand, calcCommand, rulesCommand, keysCommand, reportCommand, auditCommand, planCommand, recordsCommand];

/** The main help: usage lines and the command list come from the commands' declarations. */
export function mainHelp(list: readonly Command[] = commands): string {
	const nameWidth = Math.max(...list.map((command) => command.name.length)) + 1;
	return `prelase — pre-energize bench check for laser diodes on drivers

Usage:
${list.map((command) => `  ${command.usage}`).join('\n')}
  prelase --help | --version

Commands:
${list.flatMap((command) => definitionRow(command.name, command.summary, nameWidth, 100)).join('\n')}

Every command takes --help. NO_COLOR turns colour off.

Exit status:
  0  done (each command's --help lists what it returns)
  2  bad usage or bad input (the message says what and where)
  70 an internal error (a bug in prelase, not in your input)
  74 a file could not be written (disk full, file size limit, read-only or denied folder)
The shipped bench policy is rules/default.yaml; --rules FILE uses a site policy instead.

prelase says which checks held; it never says a setup is safe. The laser safety officer and
the codes in force (IEC 60825 series, ANSI Z136 series, local law) have the final word.`;
}

/** The help text of the program (main) and of each command, as `--help` prints them. */
export const helpTexts: {readonly main: string} & Readonly<Record<string, string>> = {
	main: mainHelp(),
	...Object.fromEntries(commands.map((command) => [command.name, commandHelp(command)])),
};
