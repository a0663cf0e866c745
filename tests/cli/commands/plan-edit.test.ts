import {describe, expect, it} from 'vitest';
import {demoPlanFile} from '../../interlock/plan-fixture.js';
import {runCliNow} from '../../helpers/run-cli.js';

/** Without a terminal, plan --edit answers at once. */
function run(...argv: string[]) {
	return runCliNow(argv);
}

describe('prelase plan FILE --edit', () => {
	it('needs a terminal: without one it says so and exits 2, opening nothing', () => {
		const {code, stdout, stderr} = run('plan', demoPlanFile, '--edit');
		expect(code).toBe(2);
		expect(stdout).toBe('');
		expect(stderr).toContain('the planner screen needs a terminal (stdin and stdout)');
		expect(stderr).toContain('Without --edit, prelase plan FILE prints the loop figures and findings');
	});

	it.each([
		{name: '--json', argv: ['--json'], flag: '--json'},
		{name: '--test-sheet', argv: ['--test-sheet', 'md'], flag: '--test-sheet'},
	])('refuses --edit with $name, exit 2', ({argv, flag}) => {
		const {code, stderr} = run('plan', demoPlanFile, '--edit', ...argv);
		expect(code).toBe(2);
		expect(stderr).toContain(`--edit opens the planner screen and cannot be used with ${flag}`);
	});

	it('lists --edit in the help', () => {
		expect(run('plan', '--help').stdout).toContain('--edit                 Open the planner screen on FILE (needs a terminal)');
	});
});
