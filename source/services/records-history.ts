import type {RepositoryHistory} from '../audit/audit-repository.js';
import {describeProblem} from '../shared/problems.js';
import {git, gitOutput} from './git.js';
import {checkRemote} from './records-sync.js';

/** The log format `reviewRepository` reads: per commit id, author, e-mail, date and subject. */
const logFormat = '--format=%x1E%H%x1F%an%x1F%ae%x1F%aI%x1F%s';

/**
 * Reads the history of a records repository for the audit: every commit with the files it
 * touched, what is not committed, and (when asked) how the remote stands against what this
 * folder last took from it. The remote is fetched to a private ref only: nothing here changes
 * the folder's branch or what it has accepted from the remote.
 */
export function readRepositoryHistory(folder: string, withRemote: boolean, env: NodeJS.ProcessEnv): RepositoryHistory {
	const unreadable = (detail: string): RepositoryHistory => ({folder, log: '', status: '', unreadable: detail});
	const head = git(folder, ['rev-parse', '--verify', '--quiet', 'HEAD'], env);
	if (!head.ok) return unreadable(describeProblem(head.errors[0]!));
	const log = head.value.status === 0 ? gitOutput(folder, ['log', '--reverse', '--topo-order', '--diff-merges=first-parent', '--no-renames', '-z', '--name-status', logFormat, 'HEAD'], env) : {ok: true as const, value: '', warnings: []};
	if (!log.ok) return unreadable(describeProblem(log.errors[0]!));
	const status = gitOutput(folder, ['status', '--porcelain=v1', '-z', '--untracked-files=all', '--no-renames'], env);
	if (!status.ok) return unreadable(describeProblem(status.errors[0]!));
	if (!withRemote) return {folder, log: log.value, status: status.value};
	const remote = checkRemote(folder, 'audit', env);
	if (!remote.ok) return {folder, log: log.value, status: status.value, remote: {state: 'unreachable', remote: '(none)', detail: describeProblem(remote.errors[0]!)}};
	const state = remote.value;
	return {folder, log: log.value, status: status.value, remote: state.state === 'ok' ? {state: 'ok', remote: state.remote} : state};
}
