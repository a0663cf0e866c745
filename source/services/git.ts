import {spawnSync} from 'node:child_process';
import {problem, type Problem} from '../shared/problems.js';
import {failure, success, type Result} from '../shared/result.js';

/** What one run of git said. */
export type GitRun = {status: number; stdout: string; stderr: string};

/** Who a commit is by: a name and the e-mail form prelase gives keys (`<fingerprint prefix>@prelase.invalid`). */
export type GitIdentity = {name: string; email: string};

/** Longest a git command may take before it is stopped (a remote that does not answer). */
const timeoutMs = 120_000;

/**
 * The environment git runs in: the caller's, with git's prompts and pager off (a command must
 * never wait for a password or a pager), messages in plain English (they are shown as they
 * are), and, when given, the identity of the commit's author and committer.
 */
function gitEnvironment(env: NodeJS.ProcessEnv, identity: GitIdentity | undefined): NodeJS.ProcessEnv {
	return {
		...env,
		GIT_TERMINAL_PROMPT: '0',
		GIT_PAGER: 'cat',
		LC_ALL: 'C',
		...(identity ? {GIT_AUTHOR_NAME: identity.name, GIT_AUTHOR_EMAIL: identity.email, GIT_COMMITTER_NAME: identity.name, GIT_COMMITTER_EMAIL: identity.email} : {}),
	};
}

/**
 * Runs the system git in `folder` with an argument list (never through a shell, so no name or
 * message is ever read as shell syntax). A status other than 0 comes back as a value for the
 * caller to judge; only git missing or not answering in time is a failure.
 */
export function git(folder: string, args: readonly string[], env: NodeJS.ProcessEnv, identity?: GitIdentity): Result<GitRun, Problem> {
	const run = spawnSync('git', ['-C', folder, ...args], {env: gitEnvironment(env, identity), encoding: 'utf8', timeout: timeoutMs, maxBuffer: 512 * 1024 * 1024, stdio: ['ignore', 'pipe', 'pipe']});
	if (run.error) {
		const code = (run.error as NodeJS.ErrnoException).code;
		if (code === 'ENOENT') return failure([problem('git-missing', {folder})]);
		if (code === 'ETIMEDOUT') return failure([problem('git-timeout', {command: commandName(args), folder, seconds: timeoutMs / 1000})]);
		return failure([problem('git-failed', {command: commandName(args), folder, detail: run.error.message})]);
	}
	return success({status: run.status ?? 1, stdout: run.stdout, stderr: run.stderr});
}

/** The git command a list of arguments runs (`clone`, `rev-parse`), past any `-c name=value` before it. */
export function commandName(args: readonly string[]): string {
	let index = 0;
	while (args[index] === '-c') index += 2;
	return args[index] ?? '';
}

/** git's own words about a failed run, on one line. */
export function gitDetail(run: GitRun): string {
	const text = (run.stderr.trim() || run.stdout.trim()).replaceAll(/\s*\n\s*/g, '; ');
	return text || `exit status ${run.status}`;
}

/** Runs git and returns what it printed; a status other than 0 is a failure naming the command and git's words. */
export function gitOutput(folder: string, args: readonly string[], env: NodeJS.ProcessEnv, identity?: GitIdentity): Result<string, Problem> {
	const run = git(folder, args, env, identity);
	if (!run.ok) return run;
	if (run.value.status !== 0) return failure([problem('git-failed', {command: commandName(args), folder, detail: gitDetail(run.value)})]);
	return success(run.value.stdout);
}

/** The commit author for a signer: their name and `<first 16 hex digits of the key fingerprint>@prelase.invalid`. */
export function signerIdentity(name: string, keyFingerprint: string): GitIdentity {
	const prefix = keyFingerprint.replace(/^sha256:/, '').replaceAll(/[^0-9a-f]/gi, '').slice(0, 16).toLowerCase();
	// git refuses a name made only of characters it strips (<, >, new lines); keep a readable one.
	const cleaned = name.replaceAll(/[<>\s]+/g, ' ').trim();
	return {name: cleaned || 'prelase', email: `${prefix || 'unknown'}@prelase.invalid`};
}
