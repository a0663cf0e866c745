import {mkdtempSync} from 'node:fs';
import {tmpdir} from 'node:os';
import {join} from 'node:path';
import {describe, expect, it} from 'vitest';
import {runIn} from '../../helpers/run-cli.js';

/**
 * `--rules shipped` names the shipped policy on every command that takes a rule file, as it
 * already did for `rules show` and `rules diff`; before, `check` refused it as a missing file.
 */
describe('--rules shipped on every command that takes a rule file', () => {
	const home = mkdtempSync(join(tmpdir(), 'prelase-rules-shipped-'));
	it.each([
		{command: 'check', argv: ['check', '--answers', 'docs/examples/bench3-808nm-clear.yaml', '--rules', 'shipped'], code: 0, says: 'Outcome: CLEAR TO ENERGIZE'},
		{command: 'audit', argv: ['audit', 'RECORD', '--rules', 'shipped'], code: 0, says: 'Current rules  prelase bench policy (shipped default)'},
		{command: 'plan', argv: ['plan', 'docs/examples/interlock/bench3-interlock-plan.yaml', '--rules', 'shipped'], code: 0, says: 'Policy from:    prelase bench policy (shipped default)'},
		{command: 'rules show', argv: ['rules', 'show', 'shipped'], code: 0, says: 'prelase bench policy (shipped default)'},
	])('$command', async ({argv, code, says}) => {
		if (argv.includes('RECORD')) {
			// A record to audit: the clear demo, signed into this home's records folder.
			const signed = await runIn(home, ['check', '--answers', 'docs/examples/bench3-808nm-clear.yaml', '--sign', 'Ada Quill', '--records', join(home, 'records')]);
			expect(signed.code).toBe(0);
			argv = argv.map((word) => (word === 'RECORD' ? join(home, 'records') : word));
		}
		const run = await runIn(home, argv);
		expect(run.stderr).not.toContain('shipped: error: cannot read the file');
		expect(`${run.stdout}${run.stderr}`).toContain(says);
		expect(run.code).toBe(code);
	});
});
