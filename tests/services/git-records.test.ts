import {spawn} from 'node:child_process';
import {appendFileSync, mkdirSync, mkdtempSync, rmSync, writeFileSync} from 'node:fs';
import {tmpdir} from 'node:os';
import {join} from 'node:path';
import {afterAll, beforeAll, describe, expect, it} from 'vitest';
import {commitWritten, initRecords} from '../../source/services/records-repository.js';
import {syncRecords} from '../../source/services/records-sync.js';
import {readRepositoryHistory} from '../../source/services/records-history.js';
import {reviewRepository} from '../../source/audit/audit-repository.js';
import {bareRemote, gitEnv, runGit} from '../helpers/git-env.js';

let root: string;
let env: NodeJS.ProcessEnv;
let site: string;
const author = {name: 'Ines Marlow', email: '0123456789abcdef@prelase.invalid'};

beforeAll(() => {
	root = mkdtempSync(join(tmpdir(), 'prelase-git-records-'));
	env = gitEnv(root);
	site = bareRemote(join(root, 'site.git'), env);
});

afterAll(() => {
	rmSync(root, {recursive: true, force: true});
});

/** A new records repository (a clone of the site's) with a file of its own, the name unique to the test. */
function folderWith(name: string): string {
	const folder = join(root, name);
	const made = initRecords(folder, site, author, env);
	if (!made.ok) throw new Error(made.errors[0]!.code);
	return folder;
}

const committedFiles = (folder: string) => runGit(folder, ['show', '--format=', '--name-only', 'HEAD'], env).trim().split('\n');

describe('committing what a write made', () => {
	it('commits the record and the new rule texts beside it, and leaves anything else (even staged) out', () => {
		const folder = folderWith('rule-texts');
		mkdirSync(join(folder, 'rules'));
		writeFileSync(join(folder, 'rules', 'a1b2.yaml'), 'name: stored rule text\n');
		writeFileSync(join(folder, 'record-1.json'), '{}\n');
		writeFileSync(join(folder, 'notes.txt'), 'kept out\n');
		runGit(folder, ['add', 'notes.txt'], env);
		const made = commitWritten(folder, [join(folder, 'record-1.json')], 'Bench check of Bench 3: clear to energize', author, env);
		expect(made.ok).toBe(true);
		expect(committedFiles(folder)).toEqual(['record-1.json', 'rules/a1b2.yaml']);
		// The staged note is still staged, not committed.
		expect(runGit(folder, ['status', '--porcelain'], env)).toBe('A  notes.txt\n');
		// A rule text already committed is not committed again with the next record.
		writeFileSync(join(folder, 'record-2.json'), '{}\n');
		commitWritten(folder, [join(folder, 'record-2.json')], 'second', author, env);
		expect(committedFiles(folder)).toEqual(['record-2.json']);
	});

	it('waits for another process holding the index lock instead of failing', async () => {
		const folder = folderWith('locked');
		const lock = join(folder, '.git', 'index.lock');
		writeFileSync(lock, '');
		const releaser = spawn('sh', ['-c', `sleep 0.4; rm -f '${lock}'`]);
		const released = new Promise((done) => releaser.on('close', done));
		writeFileSync(join(folder, 'record-3.json'), '{}\n');
		const made = commitWritten(folder, [join(folder, 'record-3.json')], 'third', author, env);
		await released;
		expect(made.ok).toBe(true);
		expect(committedFiles(folder)).toEqual(['record-3.json']);
	});

	it('a plain folder is left alone: nothing committed, no repository made', () => {
		const plain = join(root, 'plain');
		mkdirSync(plain);
		expect(commitWritten(plain, [join(plain, 'x.json')], 'x', author, {...env, PATH: join(root, 'no-bin')})).toEqual({ok: true, value: null, warnings: []});
	});
});

describe('sync when another bench pushes in between', () => {
	it('a push rejected because the remote moved is tried again on top of the other bench\'s commit; both records reach the remote', () => {
		const here = folderWith('race-here');
		const there = folderWith('race-there');
		expect(syncRecords(here, author, env)).toMatchObject({ok: true});
		expect(syncRecords(there, author, env)).toMatchObject({ok: true});
		writeFileSync(join(there, 'there-race.json'), '{}\n');
		commitWritten(there, [join(there, 'there-race.json')], 'there race', author, env);
		writeFileSync(join(here, 'here-race.json'), '{}\n');
		commitWritten(here, [join(here, 'here-race.json')], 'here race', author, env);
		// git-push(1) runs the pre-push hook after this bench fetched and rebased, just before it sends:
		// the hook makes the other bench push first, once, so this push is rejected as not a fast-forward.
		const flag = join(root, 'raced');
		const hook = join(here, '.git', 'hooks', 'pre-push');
		writeFileSync(hook, `#!/bin/sh\nif [ ! -e '${flag}' ]; then touch '${flag}'; unset GIT_DIR GIT_WORK_TREE GIT_INDEX_FILE; git -C '${there}' push --quiet origin HEAD:main >/dev/null 2>&1; fi\nexit 0\n`, {mode: 0o755});
		const sync = syncRecords(here, author, env);
		expect(sync).toMatchObject({ok: true, value: {state: 'synced', pushed: 1}});
		expect(runGit(site, ['ls-tree', '--name-only', 'main'], env).split('\n')).toEqual(expect.arrayContaining(['here-race.json', 'there-race.json']));
		expect(runGit(site, ['log', '-2', '--format=%s', 'main'], env).trim().split('\n')).toEqual(['here race', 'there race']);
	});
});

describe('sync when git refuses', () => {
	it('a record changed in the folder stops the rebase: "refused", the commits stay, nothing is forced', () => {
		const here = folderWith('bench-here');
		const there = folderWith('bench-there');
		writeFileSync(join(here, 'here-1.json'), '{}\n');
		commitWritten(here, [join(here, 'here-1.json')], 'here 1', author, env);
		expect(syncRecords(here, author, env)).toMatchObject({ok: true, value: {state: 'synced'}});
		expect(syncRecords(there, author, env)).toMatchObject({ok: true, value: {state: 'synced'}});
		writeFileSync(join(there, 'there-1.json'), '{}\n');
		commitWritten(there, [join(there, 'there-1.json')], 'there 1', author, env);
		expect(syncRecords(there, author, env)).toMatchObject({ok: true, value: {state: 'synced', pushed: 1}});
		writeFileSync(join(here, 'here-2.json'), '{}\n');
		commitWritten(here, [join(here, 'here-2.json')], 'here 2', author, env);
		appendFileSync(join(here, 'here-1.json'), ' ');
		const sync = syncRecords(here, author, env);
		expect(sync).toMatchObject({ok: true, value: {state: 'refused', unpushed: 1}});
		if (sync.ok && sync.value.state === 'refused') expect(sync.value.detail).toContain('unstaged changes');
		expect(runGit(here, ['log', '-1', '--format=%s'], env).trim()).toBe('here 2');
	});
});

describe('the history the audit reads', () => {
	it('a record deleted inside a merge commit is named with that merge', () => {
		const folder = folderWith('merged');
		writeFileSync(join(folder, 'kept.json'), '{}\n');
		commitWritten(folder, [join(folder, 'kept.json')], 'kept', author, env);
		runGit(folder, ['switch', '--quiet', '-c', 'side'], env);
		writeFileSync(join(folder, 'side.json'), '{}\n');
		commitWritten(folder, [join(folder, 'side.json')], 'side', author, env);
		runGit(folder, ['switch', '--quiet', 'main'], env);
		runGit(folder, ['merge', '--quiet', '--no-ff', '--no-commit', 'side'], env);
		runGit(folder, ['rm', '--quiet', 'kept.json'], env);
		runGit(folder, ['commit', '--quiet', '-m', 'merge side'], env);
		const merge = runGit(folder, ['rev-parse', 'HEAD'], env).trim().slice(0, 12);
		const review = reviewRepository(readRepositoryHistory(folder, false, env));
		expect(review.findings.map((found) => [found.code, found.data['file'], found.data['commit']])).toEqual([['audit-repository-deleted', 'kept.json', merge]]);
	});
});
