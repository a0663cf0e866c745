import {finding, type Finding} from '../records/findings.js';

/**
 * The history of a records folder that is a git repository, as git printed it. The command
 * gathers it through services/ (the one place git runs) and the audit reads it here: audit/ lies
 * below services/, so it takes git's output as text and stays pure, testable with text alone.
 */
export type RepositoryHistory = {
	/** The records folder (the repository's top folder). */
	folder: string;
	/**
	 * `git log --reverse --topo-order --diff-merges=first-parent --no-renames -z --name-status --format=%x1e%H%x1f%an%x1f%ae%x1f%aI%x1f%s`:
	 * per commit a header, then status and path pairs, all separated by NUL.
	 */
	log: string;
	/** `git status --porcelain=v1 -z --untracked-files=all --no-renames`: changes not committed. */
	status: string;
	/** Compared with the remote (audit --remote); absent when not asked. */
	remote?: RemoteState;
	/** Why the history could not be read (git missing, a broken repository); then nothing else is known. */
	unreadable?: string;
};

/** A commit named to a person: its id and first line. */
export type NamedCommit = {commit: string; subject: string};

/** How the remote stands against what this folder had seen of it. */
export type RemoteState =
	| {state: 'unreachable'; remote: string; detail: string}
	/** Commits this folder had from the remote that the remote no longer has (oldest first). */
	| {state: 'rewritten'; remote: string; lost: NamedCommit[]}
	| {state: 'ok'; remote: string};

/** One commit of the log, with the files it touched. */
export type LoggedCommit = {commit: string; author: string; email: string; date: string; subject: string; changes: Array<{status: string; path: string}>};

/** What the audit found in a repository's history. */
export type RepositoryReview = {commits: number; findings: Finding[]};

/** Reads git's log output (the format of `RepositoryHistory.log`). */
export function parseLog(text: string): LoggedCommit[] {
	return text
		.split('\u001E')
		.slice(1)
		.map((chunk) => {
			const end = chunk.indexOf('\0');
			const [commit = '', author = '', email = '', date = '', subject = ''] = (end === -1 ? chunk : chunk.slice(0, end)).split('\u001F');
			const fields = end === -1 ? [] : chunk.slice(end + 1).replace(/^\n/, '').split('\0');
			const changes: LoggedCommit['changes'] = [];
			for (let index = 0; index + 1 < fields.length; index += 2) changes.push({status: fields[index]!.charAt(0), path: fields[index + 1]!});
			return {commit, author, email, date, subject, changes};
		});
}

/** Reads git's short status (the format of `RepositoryHistory.status`): the two status letters and the path. */
export function parseStatus(text: string): Array<{code: string; path: string}> {
	return text
		.split('\0')
		.filter((entry) => entry.length > 3)
		.map((entry) => ({code: entry.slice(0, 2), path: entry.slice(3)}));
}

/**
 * Files prelase writes once and never changes: records (`*.json`) and the rule texts stored
 * beside them (`rules/…`), outside dot-folders. Anything else in the folder is not judged.
 */
export function writtenOnce(path: string): boolean {
	if (path.split('/').some((part) => part.startsWith('.'))) return false;
	return path.endsWith('.json') || path.startsWith('rules/');
}

const short = (commit: string) => commit.slice(0, 12);

function described(commit: LoggedCommit): Finding['data'] {
	return {commit: short(commit.commit), author: commit.author, date: commit.date, subject: commit.subject};
}

/**
 * What the history of a records repository shows: a record changed or deleted by a commit after
 * the commit that added it (naming both); a record changed, missing or never committed in the
 * folder as it is now (naming its last commit); and, when compared with the remote, commits this
 * folder had from it that the remote no longer has (its history was rewritten).
 */
export function reviewRepository(history: RepositoryHistory): RepositoryReview {
	if (history.unreadable !== undefined) return {commits: 0, findings: [finding('history', 'audit-repository-not-read', {folder: history.folder, detail: history.unreadable})]};
	const commits = parseLog(history.log);
	const findings: Finding[] = [];
	const addedBy = new Map<string, string>();
	const lastBy = new Map<string, string>();
	for (const commit of commits) {
		for (const {status, path} of commit.changes) {
			if (!writtenOnce(path)) continue;
			lastBy.set(path, commit.commit);
			if (status === 'A') {
				addedBy.set(path, commit.commit);
				continue;
			}
			const added = addedBy.get(path);
			const data = {file: path, ...described(commit), added: added ? short(added) : 'an earlier commit'};
			if (status === 'D') {
				findings.push(finding('integrity', 'audit-repository-deleted', data));
				addedBy.delete(path);
			} else {
				findings.push(finding('integrity', 'audit-repository-changed', data));
			}
		}
	}
	for (const {code, path} of parseStatus(history.status)) {
		if (!writtenOnce(path)) continue;
		const last = lastBy.get(path);
		if (code === '??' || code.startsWith('A')) findings.push(finding('history', 'audit-repository-not-committed', {file: path}));
		else if (code.includes('D')) findings.push(finding('integrity', 'audit-repository-missing', {file: path, commit: last ? short(last) : 'an earlier commit'}));
		else findings.push(finding('integrity', 'audit-repository-modified', {file: path, commit: last ? short(last) : 'an earlier commit'}));
	}
	const remote = history.remote;
	if (remote?.state === 'unreachable') findings.push(finding('history', 'audit-repository-remote-unreachable', {remote: remote.remote, detail: remote.detail}));
	if (remote?.state === 'rewritten') {
		for (const lost of remote.lost) findings.push(finding('integrity', 'audit-repository-rewritten', {remote: remote.remote, commit: short(lost.commit), subject: lost.subject}));
	}
	return {commits: commits.length, findings};
}
