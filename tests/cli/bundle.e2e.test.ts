import {spawnSync} from 'node:child_process';
import {resolve} from 'node:path';
import {describe, expect, it} from 'vitest';

const root = resolve('.');
const bundle = resolve('dist/prelase.js');
const clearDemo = resolve('docs/examples/bench3-808nm-clear.yaml');

/** The environment of a run: no colour forcing, no CI quirks. */
function cleanEnv(): NodeJS.ProcessEnv {
	const env = {...process.env};
	for (const name of ['CI', 'CONTINUOUS_INTEGRATION', 'FORCE_COLOR', 'NO_COLOR']) delete env[name];
	return env;
}

describe('the built bundle', () => {
	it('check --answers <clear demo> --json exits 0 and prints parseable JSON', () => {
		const result = spawnSync(process.execPath, [bundle, 'check', '--answers', clearDemo, '--json'], {cwd: root, env: cleanEnv(), encoding: 'utf8'});
		expect(result.stderr).toBe('');
		expect(result.status).toBe(0);
		const json = JSON.parse(result.stdout) as {tool: {name: string}; outcome: string; rules: {file: string; sha256: string}};
		expect(json.tool.name).toBe('prelase');
		expect(json.outcome).toBe('clear_to_energize');
		// The bundle finds the shipped rule file beside itself, not through the working folder.
		expect(json.rules.file).toBe(resolve('rules/default.yaml'));
		expect(json.rules.sha256).toMatch(/^[0-9a-f]{64}$/);
	});

	it('does not crash when the reader closes the pipe early', () => {
		// `true` exits before node has started, so every write meets a closed pipe.
		const script = `"${process.execPath}" "${bundle}" check --answers "${clearDemo}" | true; echo "status=\${PIPESTATUS[0]}"`;
		const result = spawnSync('bash', ['-c', script], {cwd: root, env: cleanEnv(), encoding: 'utf8'});
		expect(result.stdout.trim()).toBe('status=0');
		expect(result.stderr).toBe('');
	});

	it('a bad answers file exits 2 with file:line and no stack trace', () => {
		const result = spawnSync(process.execPath, [bundle, 'check', '--answers', resolve('rules/default.yaml')], {cwd: root, env: cleanEnv(), encoding: 'utf8'});
		expect(result.status).toBe(2);
		expect(result.stdout).toBe('');
		// The rule file read as answers: its first key is not an answers key.
		expect(result.stderr).toMatch(new RegExp(`^${resolve('rules/default.yaml').replaceAll(/[.*+?^${}()|[\]\\]/g, '\\$&')}:\\d+:\\d+: error: format: unknown top-level key`, 'm'));
		expect(result.stderr).not.toMatch(/\n\s+at /);
	});
});
