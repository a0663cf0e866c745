import {describe, expect, it} from 'vitest';
import {parseOptions} from '../../source/cli/command.js';
import {commands} from '../../source/cli/commands/help.js';
import {runCliNow} from '../helpers/run-cli.js';

/**
 * The options each command takes, with the placeholder of its value (undefined: a flag). This
 * table is the specification the code is held to: an option the parser accepts but the help does
 * not list (or the other way round) fails below. The list is the project's own CLI design.
 */
const table: Array<{command: string; options: Record<string, string | undefined>}> = [
	{command: 'check', options: {answers: 'FILE', rules: 'FILE', json: undefined, sign: 'NAME', role: 'ROLE', records: 'DIR', amends: 'RECORD', reason: 'TEXT', cosign: 'NAME', 'cosign-key': 'FILE', 'cosign-role': 'ROLE', 'cosign-meaning': 'witness|approval', setup: 'NAME', 'what-if': undefined, help: undefined}},
	{command: 'calc', options: {json: undefined, help: undefined}},
	{command: 'rules', options: {json: undefined, site: undefined, help: undefined}},
	{command: 'keys', options: {name: 'NAME', role: 'ROLE', from: 'DATE', 'revoked-from': 'DATE', help: undefined}},
	{command: 'report', options: {format: 'md|html', out: 'FILE', help: undefined}},
	{command: 'audit', options: {rules: 'FILE', json: undefined, all: undefined, remote: undefined, jobs: 'N', help: undefined}},
	{command: 'plan', options: {rules: 'FILE', json: undefined, 'test-sheet': 'md|html', 'record-test': 'RESULTS', records: 'DIR', 'witness-key': 'FILE', edit: undefined, schema: 'plan|results', help: undefined}},
	{command: 'records', options: {records: 'DIR', remote: 'URL', help: undefined}},
];

function run(...argv: string[]) {
	return runCliNow(argv);
}

/** The rows of the Options part of a command's --help: option name → value placeholder. */
function helpOptions(command: string): Map<string, string | undefined> {
	const help = run(command, '--help').stdout;
	const section = help.split('\nOptions:\n')[1]?.split('\n\n')[0] ?? '';
	const rows = new Map<string, string | undefined>();
	for (const line of section.split('\n')) {
		const row = /^ {2}(?:-[a-z], )?--([a-z][a-z-]*)(?: (\S+))?/.exec(line);
		if (row) rows.set(row[1]!, row[2]);
	}
	return rows;
}

const everyOption = table.flatMap(({command, options}) => Object.entries(options).map(([name, value]) => ({command, name, value})));

describe('every option a command parses is in its help, and every option in its help is parsed', () => {
	it.each(table)('prelase $command --help lists exactly its options, with their values', ({command, options}) => {
		// Pairs, not objects: toEqual would take a missing flag for one whose value is undefined.
		const byName = (pairs: Array<[string, string | undefined]>) => pairs.sort(([a], [b]) => a.localeCompare(b));
		expect(byName([...helpOptions(command)])).toEqual(byName(Object.entries(options)));
	});

	it.each(everyOption)('prelase $command accepts --$name', ({command, name, value}) => {
		const given = value === undefined ? `--${name}` : `--${name}=x`;
		const {code, stdout, stderr} = run(command, given, '--help');
		expect(stderr).toBe('');
		expect(code).toBe(0);
		expect(stdout.startsWith(`prelase ${command}`)).toBe(true);
	});

	it.each(commands.map((command) => ({command: command.name, declared: command})))('the parser config of $command has exactly the options its help lists', ({command, declared}) => {
		const parsed = parseOptions(declared.options) as Record<string, {type: string; short?: string}>;
		expect(Object.keys(parsed).sort()).toEqual([...helpOptions(command).keys()].sort());
		expect(Object.keys(parsed).sort()).toEqual(Object.keys(table.find((entry) => entry.command === command)?.options ?? {}).sort());
	});

	it.each(table)('prelase $command refuses an option it does not declare', ({command}) => {
		const {code, stderr} = run(command, '--no-such-option', '--help');
		expect(code).toBe(2);
		expect(stderr).toContain(`unknown option --no-such-option for prelase ${command}`);
	});
});

describe('did-you-mean comes from the declared commands and options', () => {
	it.each([
		{argv: ['plna'], says: 'unknown command "plna" (did you mean "plan"?)'},
		{argv: ['reprot'], says: 'unknown command "reprot" (did you mean "report"?)'},
		{argv: ['check', '--cosign-kye', 'k.pem'], says: 'unknown option --cosign-kye (did you mean "--cosign-key"?) for prelase check'},
		{argv: ['check', '--stup', 'bench'], says: 'unknown option --stup (did you mean "--setup"?) for prelase check'},
		{argv: ['keys', 'trust', 'k.pem', '--nmae', 'Ada'], says: 'unknown option --nmae (did you mean "--name"?) for prelase keys'},
		{argv: ['rules', 'schema', '--stie'], says: 'unknown option --stie (did you mean "--site"?) for prelase rules'},
		{argv: ['plan', 'x.yaml', '--witnes-key', 'k.pem'], says: 'unknown option --witnes-key (did you mean "--witness-key"?) for prelase plan'},
	])('$argv', ({argv, says}) => {
		const {code, stderr} = run(...argv);
		expect(code).toBe(2);
		expect(stderr).toContain(says);
	});

	it('offers no guess for an unknown short letter (any letter is one edit from -h)', () => {
		const {code, stderr} = run('check', '-x');
		expect(code).toBe(2);
		expect(stderr).toContain('unknown option -x for prelase check');
		expect(stderr).not.toContain('did you mean');
	});
});

describe('the main help lists every command with its usage', () => {
	const mainHelp = run('--help').stdout;
	it.each(table)('$command is under Commands: and has a usage line', ({command}) => {
		const commandsPart = mainHelp.split('\nCommands:\n')[1]?.split('\n\n')[0] ?? '';
		expect(commandsPart).toMatch(new RegExp(`^ {2}${command} +\\S`, 'm'));
		expect(mainHelp).toMatch(new RegExp(`^ {2}prelase ${command}\\b`, 'm'));
	});

	it('lists no command the table does not have', () => {
		const commandsPart = mainHelp.split('\nCommands:\n')[1]?.split('\n\n')[0] ?? '';
		const listed = commandsPart.split('\n').map((line) => /^ {2}([a-z]+) /.exec(line)?.[1]).filter(Boolean);
		expect(listed.sort()).toEqual(table.map(({command}) => command).sort());
	});
});
