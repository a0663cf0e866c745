import {describe, expect, it} from 'vitest';
import {commands} from '../../../source/cli/commands/help.js';
import {runCli} from '../../helpers/run-cli.js';

/** The codes named in the "Exit status:" part of a help text (up to the next blank line), in order of first mention. */
function listedCodes(help: string): number[] {
	const start = help.indexOf('Exit status:');
	if (start < 0) return [];
	const section = help.slice(start + 'Exit status:'.length).split(/\n\s*\n/)[0]!;
	// A code is a number standing alone before its words: "  74 a file…", "0 done, 2 unknown…", "validate  0 no problems".
	return [...new Set([...section.matchAll(/(?<![\w.,])(\d{1,3})(?= +[a-z(])/g)].map((match) => Number(match[1])))];
}

// What each command can return, and where that is shown (each code is provoked by a test or read from the code):
//   2    every command: a UsageError or an option parseArgs refuses (source/cli/dispatch.ts report)
//   74   a file the command writes could not be written (dispatch.ts report → machineFailure); commands that write:
//        check --sign (tests/shared/write-faults.test.ts), keys (same file), plan --record-test/--edit (same file),
//        rules init FILE and report --out FILE (write-faults.test.ts "new files a command writes"),
//        records init and sync (make the folder and write .git/info/exclude: services/records-repository.ts)
//   130  the screens left with Ctrl-C (source/ui/App.tsx quit(130)); check --setup and plan --edit open screens
//   70   an internal error (dispatch.ts report): any command; listing it is allowed, not required
const canReturn: Record<string, number[]> = {
	check: [0, 1, 2, 74, 130], // 0 clear, 1 do not energize/incomplete (check.ts runCheck)
	calc: [0, 2], // calc.ts returns 0 or 2 and writes no file
	rules: [0, 1, 2, 74], // validate/diff 1 (rules.ts), init writes a file
	keys: [0, 2, 74],
	report: [0, 2, 3, 74], // 3 integrity failure (report.ts)
	audit: [0, 1, 2, 3], // audit.ts: 1 findings, 3 integrity; it writes nothing
	plan: [0, 1, 2, 74, 130], // 1 stop findings (plan.ts)
	records: [0, 2, 3, 4, 5, 74], // 3/4/5 syncRewritten/syncOffline/syncRefused (records.ts)
};

describe('every command\'s --help has an Exit status part naming the codes the command can return', () => {
	it('the table covers every command', () => {
		expect(commands.map((command) => command.name).sort()).toEqual(Object.keys(canReturn).sort());
	});

	it.each(Object.entries(canReturn))('prelase %s --help lists exactly %j (70 allowed)', async (name, codes) => {
		const run = await runCli([name, '--help']);
		expect(run.code).toBe(0);
		expect(run.stdout).toContain('Exit status:');
		expect(listedCodes(run.stdout).filter((code) => code !== 70).sort((a, b) => a - b)).toEqual(codes);
	});

	it('prelase --help names the statuses every command shares: 2 bad usage, 70 a bug, 74 a refused write', async () => {
		const run = await runCli(['--help']);
		expect(listedCodes(run.stdout).sort((a, b) => a - b)).toEqual([0, 2, 70, 74]);
	});

	// Provoked now, to hold the table to the code: each run's status must be one its help lists.
	it.each([
		['calc', ['calc', 'nosuch'], 2],
		['calc', ['calc', 'risetime', 'bandwidth=1MHz'], 0],
		['rules', ['rules', 'validate', 'rules/default.yaml'], 0],
		['rules', ['rules', 'bogus'], 2],
		['keys', ['keys', 'forget'], 2],
		['report', ['report'], 2],
		['audit', ['audit'], 2],
		['plan', ['plan'], 2],
		['records', ['records', 'bogus'], 2],
		['check', ['check', '--answers', 'docs/examples/bench3-808nm-clear.yaml'], 0],
	] as const)('%s: prelase %j exits %i, a status its help lists', async (name, argv, expected) => {
		const run = await runCli([...argv], {PRELASE_HOME: '/nonexistent-prelase-home'});
		expect(run.code).toBe(expected);
		expect(listedCodes((await runCli([name, '--help'])).stdout)).toContain(run.code);
	});
});
