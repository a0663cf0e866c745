import {problem, type Problem} from '../shared/problems.js';
import {failure, success, type Result} from '../shared/result.js';
import {git, gitDetail, gitOutput, type GitIdentity} from './git.js';
import {isRecordsRepository, remoteUrl} from './records-repository.js';
import {parseStatus, writtenOnce, type NamedCommit} from '../audit/audit-repository.js';

/** What the remote holds, fetched to a private ref so the remote-tracking branch keeps what was seen before. */
export type RemoteCheck =
	| {state: 'unreachable'; remote: string; detail: string}
	/** Commits this folder had from the remote that the remote no longer has (oldest first). */
	| {state: 'rewritten'; remote: string; lost: NamedCommit[]}
	| {state: 'ok'; remote: string; seen: string | null; head: string | null};

/** What `records sync` came to. */
export type SyncOutcome =
	/** `uncommitted`: records (and rule texts) in the folder that no commit holds, so no sync shares them. */
	| {state: 'synced'; remote: string; pulled: number; pushed: number; uncommitted: string[]}
	| {state: 'offline'; remote: string; detail: string; unpushed: number}
	| {state: 'rewritten'; remote: string; lost: NamedCommit[]}
	| {state: 'refused'; remote: string; detail: string; unpushed: number};

/** Tries of pull-then-push when another bench pushes in between. */
const tries = 5;

/** The commit a ref names, or null when there is no such ref. */
function resolve(folder: string, ref: string, env: NodeJS.ProcessEnv): Result<string | null, Problem> {
	const run = git(folder, ['rev-parse', '--verify', '--quiet', `${ref}^{commit}`], env);
	if (!run.ok) return run;
	return success(run.value.status === 0 ? run.value.stdout.trim() : null);
}

/** The branch the records folder is on. */
function currentBranch(folder: string, env: NodeJS.ProcessEnv): Result<string, Problem> {
	const run = git(folder, ['symbolic-ref', '--quiet', '--short', 'HEAD'], env);
	if (!run.ok) return run;
	if (run.value.status !== 0) return failure([problem('records-detached', {folder})]);
	return success(run.value.stdout.trim());
}

function named(folder: string, commits: string[], env: NodeJS.ProcessEnv): NamedCommit[] {
	return commits.map((commit) => {
		const subject = gitOutput(folder, ['log', '-1', '--format=%s', commit], env);
		return {commit, subject: subject.ok ? subject.value.trim() : ''};
	});
}

/**
 * Fetches the remote's branch to `refs/prelase/<space>/` (never to the remote-tracking branch,
 * which keeps the last head this folder accepted) and says whether every commit of that last head
 * is still in the remote's: a remote whose history was rewritten (a force-push) has lost some.
 */
export function checkRemote(folder: string, space: string, env: NodeJS.ProcessEnv): Result<RemoteCheck, Problem> {
	const url = remoteUrl(folder, env);
	if (!url.ok) return url;
	if (url.value === null) return failure([problem('records-no-remote', {folder})]);
	const remote = url.value;
	const branch = currentBranch(folder, env);
	if (!branch.ok) return branch;
	const fetched = git(folder, ['fetch', '--quiet', '--prune', '--no-tags', '--refmap=', 'origin', `+refs/heads/*:refs/prelase/${space}/*`], env);
	if (!fetched.ok) return fetched;
	if (fetched.value.status !== 0) return success({state: 'unreachable', remote, detail: gitDetail(fetched.value)});
	const seen = resolve(folder, `refs/remotes/origin/${branch.value}`, env);
	if (!seen.ok) return seen;
	const head = resolve(folder, `refs/prelase/${space}/${branch.value}`, env);
	if (!head.ok) return head;
	if (seen.value !== null) {
		const lost = gitOutput(folder, ['rev-list', '--reverse', seen.value, ...(head.value === null ? [] : [`^${head.value}`])], env);
		if (!lost.ok) return lost;
		const commits = lost.value.split('\n').filter(Boolean);
		if (commits.length > 0) return success({state: 'rewritten', remote, lost: named(folder, commits, env)});
	}
	return success({state: 'ok', remote, seen: seen.value, head: head.value});
}

/** Files prelase writes once that are in the folder but in no commit (written where git was missing). */
function uncommitted(folder: string, env: NodeJS.ProcessEnv): string[] {
	const status = gitOutput(folder, ['status', '--porcelain=v1', '-z', '--untracked-files=all', '--no-renames'], env);
	if (!status.ok) return [];
	return parseStatus(status.value)
		.filter(({code, path}) => (code === '??' || code.startsWith('A')) && writtenOnce(path))
		.map(({path}) => path);
}

/** Commits on this folder's branch that the remote does not have yet. */
function unpushed(folder: string, remoteHead: string | null, env: NodeJS.ProcessEnv): number {
	const count = git(folder, ['rev-list', '--count', 'HEAD', ...(remoteHead ? [`^${remoteHead}`] : [])], env);
	return count.ok && count.value.status === 0 ? Number(count.value.stdout.trim()) : 0;
}

/**
 * Shares the records: takes the remote's new commits and puts this folder's own on top of them
 * (as `git pull --rebase` does, but on the fetch just checked), then pushes; again if another
 * bench pushed in between. Record names are unique, so two benches never change the same file.
 * It never force-pushes, and it takes nothing from a remote whose history was rewritten. With
 * the remote out of reach the commits stay here for the next sync.
 */
export function syncRecords(folder: string, identity: GitIdentity, env: NodeJS.ProcessEnv): Result<SyncOutcome, Problem> {
	if (!isRecordsRepository(folder)) return failure([problem('records-not-repository', {folder})]);
	const branch = currentBranch(folder, env);
	if (!branch.ok) return branch;
	const tracking = `refs/remotes/origin/${branch.value}`;
	const commitOf = (ref: string) => {
		const found = resolve(folder, ref, env);
		return found.ok ? found.value : null;
	};
	let pulled = 0;
	let detail = '';
	let remoteName = '';
	for (let attempt = 0; attempt < tries; attempt += 1) {
		const checked = checkRemote(folder, 'incoming', env);
		if (!checked.ok) return checked;
		const remote = checked.value;
		remoteName = remote.remote;
		if (remote.state === 'unreachable') return success({state: 'offline', remote: remote.remote, detail: remote.detail, unpushed: unpushed(folder, commitOf(tracking), env)});
		if (remote.state === 'rewritten') return success({state: 'rewritten', remote: remote.remote, lost: remote.lost});
		const local = commitOf('HEAD');
		if (remote.head !== null) {
			const updated = gitOutput(folder, ['update-ref', tracking, remote.head], env);
			if (!updated.ok) return updated;
			const taken = gitOutput(folder, ['rev-list', '--count', remote.head, ...(local === null ? [] : [`^${local}`])], env);
			if (taken.ok) pulled += Number(taken.value.trim());
			// An unborn branch (a clone of an empty remote, nothing written yet) takes the remote's as it is.
			const args = local === null ? ['merge', '--quiet', '--ff-only', remote.head] : ['rebase', '--quiet', remote.head];
			const rebased = git(folder, args, env, identity);
			if (!rebased.ok) return rebased;
			if (rebased.value.status !== 0) {
				if (local !== null) git(folder, ['rebase', '--abort'], env);
				return success({state: 'refused', remote: remote.remote, detail: gitDetail(rebased.value), unpushed: unpushed(folder, remote.head, env)});
			}
		}
		const toPush = commitOf('HEAD') === null ? 0 : unpushed(folder, remote.head, env);
		if (toPush === 0) return success({state: 'synced', remote: remote.remote, pulled, pushed: 0, uncommitted: uncommitted(folder, env)});
		const pushed = git(folder, ['push', '--quiet', 'origin', `HEAD:refs/heads/${branch.value}`], env);
		if (!pushed.ok) return pushed;
		if (pushed.value.status === 0) {
			const head = commitOf('HEAD');
			if (head !== null) gitOutput(folder, ['update-ref', tracking, head], env);
			return success({state: 'synced', remote: remote.remote, pulled, pushed: toPush, uncommitted: uncommitted(folder, env)});
		}
		detail = gitDetail(pushed.value);
	}
	return success({state: 'refused', remote: remoteName, detail, unpushed: unpushed(folder, commitOf(tracking), env)});
}
