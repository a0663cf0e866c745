import {execFileSync} from 'node:child_process';
import {mkdirSync} from 'node:fs';
import {join} from 'node:path';

/**
 * The environment for a test that runs git: the PATH to find it, and a HOME of its own with the
 * system configuration off, so the developer's git settings (signing, hooks, default branch,
 * identity) cannot leak into what the test sees. `PRELASE_HOME` is the bench's settings folder.
 */
export function gitEnv(root: string, prelaseHome?: string): NodeJS.ProcessEnv {
	const home = join(root, 'git-home');
	mkdirSync(home, {recursive: true});
	return {
		PATH: process.env['PATH'] ?? '/usr/bin:/bin',
		HOME: home,
		XDG_CONFIG_HOME: join(home, '.config'),
		GIT_CONFIG_NOSYSTEM: '1',
		GIT_AUTHOR_NAME: 'Test Git',
		GIT_AUTHOR_EMAIL: 'test@example.invalid',
		GIT_COMMITTER_NAME: 'Test Git',
		GIT_COMMITTER_EMAIL: 'test@example.invalid',
		...(prelaseHome === undefined ? {} : {PRELASE_HOME: prelaseHome}),
	};
}

/** Runs git in `folder` directly, as a person at the bench would; returns what it printed. */
export function runGit(folder: string, args: string[], env: NodeJS.ProcessEnv): string {
	return execFileSync('git', ['-C', folder, ...args], {env, encoding: 'utf8', stdio: ['ignore', 'pipe', 'pipe']});
}

/** A bare repository standing in for the site's shared records repository. */
export function bareRemote(path: string, env: NodeJS.ProcessEnv): string {
	mkdirSync(path, {recursive: true});
	runGit(path, ['init', '--quiet', '--bare', '--initial-branch=main'], env);
	return path;
}
