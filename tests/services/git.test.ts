import {existsSync, mkdtempSync, readdirSync, rmSync} from 'node:fs';
import {tmpdir} from 'node:os';
import {join} from 'node:path';
import {afterAll, beforeAll, describe, expect, it} from 'vitest';
import {git, gitOutput, signerIdentity} from '../../source/services/git.js';
import {describeProblem} from '../../source/shared/problems.js';
import {gitEnv, runGit} from '../helpers/git-env.js';

let root: string;
let env: NodeJS.ProcessEnv;

beforeAll(() => {
	root = mkdtempSync(join(tmpdir(), 'prelase-git-'));
	env = gitEnv(root);
});

afterAll(() => {
	rmSync(root, {recursive: true, force: true});
});

describe('the one module that runs git', () => {
	it('git absent from PATH is a clear failure naming what to install, never a crash', () => {
		const run = git(root, ['status'], {...env, PATH: join(root, 'no-such-bin')});
		expect(run.ok).toBe(false);
		if (run.ok) return;
		expect(run.errors[0]).toMatchObject({code: 'git-missing', data: {folder: root}});
		expect(describeProblem(run.errors[0]!)).toContain('install git (Debian or Ubuntu: sudo apt-get install git)');
	});

	it('passes arguments as a list: shell syntax in a message is kept as text and never run', () => {
		const folder = join(root, 'literal');
		runGit(root, ['init', '--quiet', '--initial-branch=main', folder], env);
		const message = 'Bench check of $(touch pwned) `touch pwned2`; touch pwned3 | "quoted"';
		const made = gitOutput(folder, ['commit', '--quiet', '--allow-empty', '-m', message], env, {name: 'Ines Marlow', email: '0123456789abcdef@prelase.invalid'});
		expect(made.ok).toBe(true);
		expect(runGit(folder, ['log', '-1', '--format=%s|%an|%ae|%cn'], env).trim()).toBe(`${message}|Ines Marlow|0123456789abcdef@prelase.invalid|Ines Marlow`);
		expect(readdirSync(folder).filter((name) => name.startsWith('pwned'))).toEqual([]);
		expect(existsSync(join(root, 'pwned'))).toBe(false);
	});

	it('a failed command comes back with git\'s own words', () => {
		const run = gitOutput(root, ['rev-parse', '--verify', 'no-such-ref'], env);
		expect(run.ok).toBe(false);
		if (run.ok) return;
		expect(run.errors[0]!.code).toBe('git-failed');
		// git-rev-parse(1): outside a repository git says "not a git repository".
		expect(String(run.errors[0]!.data['detail'])).toContain('not a git repository');
	});

	it.each([
		// A fingerprint is "sha256:" and 64 hex digits (records/key-material.ts); the e-mail keeps the first 16, lower case.
		{name: 'Ines Marlow', fingerprint: `sha256:${'0123456789ABCDEF'.repeat(4)}`, identity: {name: 'Ines Marlow', email: '0123456789abcdef@prelase.invalid'}},
		{name: 'Ada <admin@x>', fingerprint: `sha256:${'a'.repeat(64)}`, identity: {name: 'Ada admin@x', email: 'aaaaaaaaaaaaaaaa@prelase.invalid'}},
		{name: '<>', fingerprint: '', identity: {name: 'prelase', email: 'unknown@prelase.invalid'}},
	])('the commit author for $name', ({name, fingerprint, identity}) => {
		expect(signerIdentity(name, fingerprint)).toEqual(identity);
	});
});
