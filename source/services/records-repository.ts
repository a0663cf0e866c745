import {appendFileSync, existsSync, mkdirSync, readdirSync, readFileSync, realpathSync, statSync} from 'node:fs';
import {basename, dirname, join, relative, sep} from 'node:path';
import {chainFolderName} from '../records/chain.js';
import type {AnyRecord} from '../records/record-schema.js';
import {outcomeWords} from '../rules/evaluate/evaluation.js';
import {problem, type Problem} from '../shared/problems.js';
import {failure, success, type Result} from '../shared/result.js';
import {stripControl} from '../shared/text.js';
import {git, gitOutput, signerIdentity, type GitIdentity} from './git.js';

/** The branch a new records repository starts on. */
export const recordsBranch = 'main';

/**
 * Whether the records folder is a git repository of its own (its top folder holds `.git`). Only
 * this is checked, without running git, so a plain folder works as before even where git is
 * missing, and a folder that merely lies inside some other repository is never committed to.
 */
export function isRecordsRepository(folder: string): boolean {
	return existsSync(join(folder, '.git'));
}

/**
 * Keeps this machine's own files out of the shared history: the chain's head files
 * (.prelase-chain/) say which record this machine wrote last, which is true only here. They go
 * in the repository's local exclude list (.git/info/exclude), never in a shared .gitignore.
 */
export function excludeMachineLocal(folder: string): void {
	const exclude = join(folder, '.git', 'info', 'exclude');
	try {
		const text = existsSync(exclude) ? readFileSync(exclude, 'utf8') : '';
		if (text.split('\n').includes(`/${chainFolderName}/`)) return;
		mkdirSync(dirname(exclude), {recursive: true});
		appendFileSync(exclude, `${text === '' || text.endsWith('\n') ? '' : '\n'}/${chainFolderName}/\n`);
	} catch {
		// A .git that is a file (a worktree) or cannot be written: git status then lists the folder, nothing worse.
	}
}

/** A path in the repository as git takes it: relative to the top folder, with forward slashes. */
export function repositoryPath(folder: string, path: string): string {
	return relative(folder, path).split(sep).join('/');
}

/** The first line of a record's commit: what was checked and how it came out. */
export function recordCommitMessage(record: AnyRecord, file: string): string {
	const body = record.body;
	const subject =
		body.kind === 'interlock-test'
			? `Interlock test of ${stripControl(body.plan.name)}: ${body.outcome}`
			: `Bench check of ${stripControl(body.setup.name ?? '(no setup name)')}: ${outcomeWords[body.outcome]}`;
	const signers = record.signatures.map((signature) => `${stripControl(signature.signer.name)}${signature.signer.role ? ` (${stripControl(signature.signer.role)})` : ''}`).join(', ');
	return `${subject.replaceAll(/\s+/g, ' ').slice(0, 200)}\n\nRecord: ${basename(file)}\nCreated: ${body.createdAt}\nSigned by: ${signers}\n`;
}

/** Tries of a git command that found the index locked by another prelase committing at the same moment. */
const lockTries = 40;

/** Runs a git command, waiting a little and trying again while another process holds the index lock. */
function outputWhenUnlocked(folder: string, args: readonly string[], env: NodeJS.ProcessEnv, identity?: GitIdentity): Result<string, Problem> {
	let run = gitOutput(folder, args, env, identity);
	for (let attempt = 1; attempt < lockTries && !run.ok && String(run.errors[0]!.data['detail'] ?? '').includes('index.lock'); attempt += 1) {
		Atomics.wait(new Int32Array(new SharedArrayBuffer(4)), 0, 0, 50);
		run = gitOutput(folder, args, env, identity);
	}
	return run;
}

/**
 * Rule texts stored in the folder (`rules/…`, written once under their hash) that no commit holds
 * yet: the ones the write of a record has just added go into that record's commit.
 */
function newRuleTexts(folder: string, env: NodeJS.ProcessEnv): string[] {
	const listed = gitOutput(folder, ['ls-files', '--others', '--exclude-standard', '-z', '--', 'rules/'], env);
	return listed.ok ? listed.value.split('\0').filter(Boolean) : [];
}

/**
 * Commits the files prelase has just written into a records repository, and nothing else: one
 * commit, by `author`, of exactly these paths and any new rule texts (other changes in the
 * folder, staged or not, stay out of it). Returns the commit's id; `null` for a plain folder.
 */
export function commitWritten(folder: string, paths: readonly string[], message: string, author: GitIdentity, env: NodeJS.ProcessEnv): Result<string | null, Problem> {
	if (!isRecordsRepository(folder)) return success(null);
	const files = [...new Set([...paths.map((path) => repositoryPath(folder, path)), ...newRuleTexts(folder, env)])];
	const added = outputWhenUnlocked(folder, ['add', '--', ...files], env);
	if (!added.ok) return added;
	const committed = outputWhenUnlocked(folder, ['commit', '--quiet', '--no-edit', '-m', message, '--only', '--', ...files], env, author);
	if (!committed.ok) return committed;
	const head = gitOutput(folder, ['rev-parse', 'HEAD'], env);
	return head.ok ? success(head.value.trim()) : head;
}

/** The files of a plain records folder that become the first commit: every file but dotfiles and writes in progress. */
function filesToAdopt(folder: string): string[] {
	const found: string[] = [];
	const walk = (dir: string) => {
		for (const name of readdirSync(dir).sort()) {
			if (name.startsWith('.') || name.endsWith('.tmp')) continue;
			const path = join(dir, name);
			if (statSync(path).isDirectory()) walk(path);
			else found.push(path);
		}
	};
	walk(folder);
	return found;
}

/** What `records init` did. */
export type InitOutcome = {folder: string; action: 'created' | 'adopted' | 'cloned'; remote: string | null; committed: number};

/** The remote a records repository syncs with, or null when it has none. */
export function remoteUrl(folder: string, env: NodeJS.ProcessEnv): Result<string | null, Problem> {
	const run = git(folder, ['remote', 'get-url', 'origin'], env);
	if (!run.ok) return run;
	return success(run.value.status === 0 ? run.value.stdout.trim() : null);
}

/** Adopts a folder that already is a repository: checks it is one, and adds the remote when it has none. */
function adopt(folder: string, remote: string | undefined, env: NodeJS.ProcessEnv): Result<InitOutcome, Problem> {
	const top = gitOutput(folder, ['rev-parse', '--show-toplevel'], env);
	if (!top.ok) return top;
	if (realpathSync(top.value.trim()) !== realpathSync(folder)) return failure([problem('records-not-top', {folder, top: top.value.trim()})]);
	const current = remoteUrl(folder, env);
	if (!current.ok) return current;
	if (remote !== undefined && current.value !== null && current.value !== remote) return failure([problem('records-remote-differs', {folder, current: current.value, asked: remote})]);
	if (remote !== undefined && current.value === null) {
		const added = gitOutput(folder, ['remote', 'add', 'origin', remote], env);
		if (!added.ok) return added;
	}
	return success({folder, action: 'adopted', remote: remote ?? current.value, committed: 0});
}

/**
 * Makes the records folder a git repository, or adopts the one it already is. An empty (or new)
 * folder with a remote becomes a clone of it, so a new bench or the laser safety officer starts
 * with every record already pushed. A folder that already holds records gets a repository whose
 * first commit, by `identity`, holds them; its remote is added and the first sync shares them.
 */
export function initRecords(folder: string, remote: string | undefined, identity: GitIdentity, env: NodeJS.ProcessEnv): Result<InitOutcome, Problem> {
	mkdirSync(folder, {recursive: true});
	if (isRecordsRepository(folder)) return adopt(folder, remote, env);
	const present = filesToAdopt(folder);
	if (remote !== undefined && readdirSync(folder).length === 0) {
		const cloned = gitOutput(folder, ['-c', `init.defaultBranch=${recordsBranch}`, 'clone', '--quiet', '--origin', 'origin', '--', remote, '.'], env);
		if (!cloned.ok) return cloned;
		excludeMachineLocal(folder);
		return success({folder, action: 'cloned', remote, committed: 0});
	}
	const made = gitOutput(folder, ['-c', `init.defaultBranch=${recordsBranch}`, 'init', '--quiet'], env);
	if (!made.ok) return made;
	excludeMachineLocal(folder);
	if (present.length > 0) {
		const message = `Records kept in this folder before it became a repository (${present.length} files)\n`;
		const files = present.map((path) => repositoryPath(folder, path));
		const added = gitOutput(folder, ['add', '--', ...files], env);
		if (!added.ok) return added;
		const committed = gitOutput(folder, ['commit', '--quiet', '-m', message, '--', ...files], env, identity);
		if (!committed.ok) return committed;
	}
	if (remote !== undefined) {
		const added = gitOutput(folder, ['remote', 'add', 'origin', remote], env);
		if (!added.ok) return added;
	}
	return success({folder, action: 'created', remote: remote ?? null, committed: present.length});
}

/**
 * Commits a record just written (with the other files that write made, such as a stored rule
 * text) when the records folder is a repository: one commit, its message the setup and the
 * outcome, its author the signer's key. Returns `{commit}` with the commit's id, or the problem
 * that kept it from being committed (the record stays written; the audit reports it uncommitted
 * until it is), or nothing for a plain folder.
 */
export function commitRecord(folder: string, paths: readonly string[], record: AnyRecord, signer: string, keyFingerprint: string, env: NodeJS.ProcessEnv): {commit?: string | Problem} {
	if (!isRecordsRepository(folder)) return {};
	excludeMachineLocal(folder);
	const committed = commitWritten(folder, paths, recordCommitMessage(record, paths[0] ?? ''), signerIdentity(signer, keyFingerprint), env);
	if (!committed.ok) return {commit: committed.errors[0]!};
	return committed.value === null ? {} : {commit: committed.value};
}
