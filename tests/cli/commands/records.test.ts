import {spawn} from 'node:child_process';
import {appendFileSync, existsSync, mkdtempSync, readdirSync, renameSync, rmSync} from 'node:fs';
import {tmpdir} from 'node:os';
import {basename, join, resolve} from 'node:path';
import {afterAll, beforeAll, describe, expect, it} from 'vitest';
import {ownFingerprint} from '../../../source/records/key-files.js';
import {bareRemote, gitEnv, runGit} from '../../helpers/git-env.js';
import {runCli, unwrap} from '../../helpers/run-cli.js';

const clearDemo = resolve('docs/examples/bench3-808nm-clear.yaml');
const incompleteDemo = resolve('docs/examples/bench3-808nm-incomplete.yaml');
const bundle = resolve('dist/prelase.js');

let root: string;
let site: string;
/** A bench: its settings folder (keys), its records folder, and the environment its commands run in. */
type Bench = {home: string; records: string; env: NodeJS.ProcessEnv};
const bench: Record<'a' | 'b' | 'officer', Bench> = {} as never;

async function run(who: Bench, argv: string[], env: NodeJS.ProcessEnv = who.env) {
	const result = await runCli(argv, env);
	return {...result, stdout: unwrap(result.stdout)};
}

/** Signs a check into the bench's records folder; returns the record's path. */
async function sign(who: Bench, name: string, answers = clearDemo): Promise<{path: string; stdout: string}> {
	const made = await run(who, ['check', '--answers', answers, '--sign', name, '--role', 'test engineer', '--records', who.records]);
	const path = /Record written: (.+)/.exec(made.stdout)?.[1];
	if (!path) throw new Error(`no record written: ${made.stdout} ${made.stderr}`);
	return {path, stdout: made.stdout};
}

/** Runs `prelase records sync` in a process of its own (the bundle), as a second bench at the same moment would. */
function syncProcess(who: Bench): Promise<{code: number | null; stdout: string; stderr: string}> {
	return new Promise((done) => {
		const child = spawn(process.execPath, [bundle, 'records', 'sync', '--records', who.records], {env: who.env});
		let stdout = '';
		let stderr = '';
		child.stdout.on('data', (chunk: Buffer) => (stdout += chunk.toString()));
		child.stderr.on('data', (chunk: Buffer) => (stderr += chunk.toString()));
		child.on('close', (code) => done({code, stdout, stderr}));
	});
}

const jsonFiles = (folder: string) => readdirSync(folder).filter((name) => name.endsWith('.json')).sort();
const head = (folder: string, env: NodeJS.ProcessEnv) => runGit(folder, ['rev-parse', 'HEAD'], env).trim();

async function auditJson(who: Bench, ...extra: string[]) {
	const result = await run(who, ['audit', who.records, '--json', ...extra]);
	return {code: result.code, report: JSON.parse(result.stdout) as {totals: {records: number; integrityFailures: number}; repositories: Array<{commits: number; findings: Array<{kind: string; code: string; data: Record<string, string>; text: string}>}>}};
}

beforeAll(() => {
	root = mkdtempSync(join(tmpdir(), 'prelase-records-cli-'));
	for (const name of ['a', 'b', 'officer'] as const) {
		const home = join(root, `${name}-home`);
		bench[name] = {home, records: join(root, `${name}-records`), env: gitEnv(root, home)};
	}
	site = bareRemote(join(root, 'site.git'), bench.a.env);
});

afterAll(() => {
	rmSync(root, {recursive: true, force: true});
});

describe('prelase records: one store for many benches, through a site repository', () => {
	it('init --remote on a new folder makes it a clone of the site repository', async () => {
		const {code, stdout} = await run(bench.a, ['records', 'init', '--remote', site, '--records', bench.a.records]);
		expect(code).toBe(0);
		expect(stdout).toContain(`The records folder ${bench.a.records} is a clone of ${site}.`);
		expect(stdout).toContain('Every record prelase writes here is committed at once, one commit per record.');
		expect(runGit(bench.a.records, ['remote', 'get-url', 'origin'], bench.a.env).trim()).toBe(site);
	});

	it('every record written is committed at once: one commit of that file, by the signer, with the setup and the outcome', async () => {
		const {path, stdout} = await sign(bench.a, 'Ada Bench');
		const fingerprint = ownFingerprint(bench.a.home)!;
		expect(stdout).toContain(`Committed to the records repository as ${head(bench.a.records, bench.a.env).slice(0, 12)}`);
		// The e-mail form is the first 16 hex digits of the key fingerprint (sha256:<64 hex>).
		expect(runGit(bench.a.records, ['log', '-1', '--format=%an|%ae|%s'], bench.a.env).trim()).toBe(
			`Ada Bench|${fingerprint.slice('sha256:'.length, 'sha256:'.length + 16)}@prelase.invalid|Bench check of Fenwick Hollow bench 3 — FH-808-2 on LD-5L, constant current: clear to energize`,
		);
		// The record, and the rule text it names, stored once by hash with the first record that needs it.
		expect(runGit(bench.a.records, ['show', '--format=', '--name-status', 'HEAD'], bench.a.env).trim().split('\n')).toEqual([`A\t${basename(path)}`, expect.stringMatching(/^A\trules\/[0-9a-f]{64}\.yaml$/)]);
		expect(runGit(bench.a.records, ['status', '--porcelain'], bench.a.env)).toBe('');
		const incomplete = await run(bench.a, ['check', '--answers', incompleteDemo, '--sign', 'Ada Bench', '--records', bench.a.records]);
		expect(incomplete.code).toBe(1);
		expect(runGit(bench.a.records, ['log', '-1', '--format=%s'], bench.a.env).trim()).toBe('Bench check of Fenwick Hollow bench 3 — FH-808-2 on LD-5L, constant power (in progress): incomplete');
		expect(Number(runGit(bench.a.records, ['rev-list', '--count', 'HEAD'], bench.a.env))).toBe(2);
	});

	it('two benches write and sync at the same moment, and no record is lost', async () => {
		expect((await run(bench.b, ['records', 'init', '--remote', site, '--records', bench.b.records])).code).toBe(0);
		const written = [...jsonFiles(bench.a.records)];
		for (const name of ['Bo Second', 'Bo Second']) written.push(basename((await sign(bench.b, name)).path));
		written.push(basename((await sign(bench.a, 'Ada Bench')).path));
		const [first, second] = await Promise.all([syncProcess(bench.a), syncProcess(bench.b)]);
		expect([first.code, second.code, first.stderr, second.stderr]).toEqual([0, 0, '', '']);
		// Whichever pushed second took the other's commits first; one more sync brings the first bench up to date.
		expect((await run(bench.a, ['records', 'sync', '--records', bench.a.records])).code).toBe(0);
		expect((await run(bench.b, ['records', 'sync', '--records', bench.b.records])).code).toBe(0);
		expect(written).toHaveLength(5);
		expect(jsonFiles(bench.a.records)).toEqual(written.sort());
		expect(jsonFiles(bench.b.records)).toEqual(written);
		const officer = await run(bench.officer, ['records', 'init', '--remote', site, '--records', bench.officer.records]);
		expect(officer.code).toBe(0);
		expect(jsonFiles(bench.officer.records)).toEqual(written);
		expect(Number(runGit(site, ['rev-list', '--count', 'main'], bench.a.env))).toBe(5);
		const {report} = await auditJson(bench.officer);
		expect(report.totals).toMatchObject({records: 5, integrityFailures: 0});
		expect(report.repositories).toMatchObject([{commits: 5, findings: []}]);
	});

	it('offline: sync says so, keeps the commit, exits 4; the next sync pushes it', async () => {
		renameSync(site, `${site}.away`);
		const {path} = await sign(bench.a, 'Ada Bench');
		const offline = await run(bench.a, ['records', 'sync', '--records', bench.a.records]);
		expect(offline.code).toBe(4);
		expect(offline.stderr).toContain(`Offline: cannot reach ${site}`);
		expect(offline.stderr).toContain('1 commit stay here for the next prelase records sync; nothing is lost.');
		renameSync(`${site}.away`, site);
		const back = await run(bench.a, ['records', 'sync', '--records', bench.a.records]);
		expect([back.code, back.stdout]).toEqual([0, `Synced ${bench.a.records} with ${site}: took 0 commits, pushed 1 commit.\n`]);
		expect(runGit(site, ['ls-tree', '--name-only', 'main'], bench.a.env).split('\n')).toContain(basename(path));
		expect((await run(bench.officer, ['records', 'sync', '--records', bench.officer.records])).stdout).toContain('took 1 commit, pushed 0 commits');
	});

	it('a force-pushed rewrite of the site history is refused by sync (exit 3) and is an audit --remote finding naming the lost commit', async () => {
		expect((await run(bench.b, ['records', 'sync', '--records', bench.b.records])).code).toBe(0);
		const dropped = head(bench.b.records, bench.b.env);
		// Someone at bench B removes the last record from the shared history and force-pushes.
		runGit(bench.b.records, ['reset', '--quiet', '--hard', 'HEAD~1'], bench.b.env);
		runGit(bench.b.records, ['push', '--quiet', '--force', 'origin', 'HEAD:main'], bench.b.env);
		const refused = await run(bench.a, ['records', 'sync', '--records', bench.a.records]);
		expect(refused.code).toBe(3);
		expect(refused.stderr).toContain(`REFUSED: the history of ${site} was rewritten (a force-push).`);
		expect(refused.stderr).toContain(`  ${dropped.slice(0, 12)} Bench check of`);
		expect(head(bench.a.records, bench.a.env)).toBe(dropped);
		for (let time = 0; time < 2; time += 1) {
			// The audit compares without accepting: asked twice, it finds the rewrite twice.
			const {code, report} = await auditJson(bench.officer, '--remote');
			expect(code).toBe(3);
			expect(report.repositories[0]!.findings.map((found) => [found.code, found.data['commit']])).toEqual([['audit-repository-rewritten', dropped.slice(0, 12)]]);
		}
		const text = await run(bench.officer, ['audit', bench.officer.records, '--remote']);
		expect(text.stdout).toContain(`✗ [integrity] the history of the remote ${site} was rewritten: commit ${dropped.slice(0, 12)}`);
		expect(text.stdout).toContain('Result: INTEGRITY FAILURE');
		// Without --remote the officer's own folder is intact.
		expect((await auditJson(bench.officer)).report.repositories[0]!.findings).toEqual([]);
	});

	it('a record deleted and committed, or changed and committed, is a finding naming the commit (exit 3)', async () => {
		const folder = bench.officer.records;
		const [gone, altered] = jsonFiles(folder);
		runGit(folder, ['rm', '--quiet', gone!], bench.officer.env);
		runGit(folder, ['commit', '--quiet', '-m', 'tidy up'], bench.officer.env);
		const deletedBy = head(folder, bench.officer.env).slice(0, 12);
		// Whitespace outside the signed body: the signature still verifies, only the history shows the change.
		appendFileSync(join(folder, altered!), ' \n');
		runGit(folder, ['commit', '--quiet', '-am', 'reformat'], bench.officer.env);
		const changedBy = head(folder, bench.officer.env).slice(0, 12);
		const {code, report} = await auditJson(bench.officer);
		expect(code).toBe(3);
		expect(report.totals.integrityFailures).toBe(0);
		expect(report.repositories[0]!.findings.map((found) => [found.code, found.data['file'], found.data['commit'], found.data['subject']])).toEqual([
			['audit-repository-deleted', gone, deletedBy, 'tidy up'],
			['audit-repository-changed', altered, changedBy, 'reformat'],
		]);
		const text = await run(bench.officer, ['audit', folder]);
		expect(text.stdout).toContain(`the record ${gone} was deleted by commit ${deletedBy} (Test Git,`);
	});
});

describe('git missing, and the plain folder', () => {
	const noGit = () => ({...bench.a.env, PATH: join(root, 'no-bin')});

	it('a record signed into a repository folder without git is written, and says plainly it was not committed', async () => {
		const made = await run(bench.a, ['check', '--answers', clearDemo, '--sign', 'Ada Bench', '--records', bench.a.records], noGit());
		expect(made.code).toBe(0);
		const path = /Record written: (.+)/.exec(made.stdout)![1]!;
		expect(existsSync(path)).toBe(true);
		expect(made.stdout).toContain('NOT committed to the records repository: the program git is needed for the records repository');
		expect(made.stdout).toContain('install git (Debian or Ubuntu: sudo apt-get install git)');
		const {report} = await auditJson(bench.a);
		expect(report.repositories[0]!.findings.map((found) => [found.code, found.data['file']])).toEqual([['audit-repository-not-committed', basename(path)]]);
	});

	it('sync shares the commits and warns of a record left out of them, which stays unshared', async () => {
		const made = await run(bench.b, ['check', '--answers', clearDemo, '--sign', 'Bo Second', '--records', bench.b.records], {...bench.b.env, PATH: join(root, 'no-bin')});
		const path = /Record written: (.+)/.exec(made.stdout)![1]!;
		const sync = await run(bench.b, ['records', 'sync', '--records', bench.b.records]);
		expect(sync.code).toBe(0);
		expect(sync.stderr).toBe(`Not shared: 1 record file in ${bench.b.records} is in no commit: ${basename(path)}. Check it (prelase audit ${bench.b.records}), then commit it with git and sync again.\n`);
		expect(runGit(site, ['ls-tree', '--name-only', 'main'], bench.a.env).split('\n')).not.toContain(basename(path));
	});

	it('check --json names the commit in its record part; a record not committed is said on stderr', async () => {
		const made = await run(bench.a, ['check', '--answers', clearDemo, '--json', '--sign', 'Ada Bench', '--records', bench.a.records]);
		expect(made.code).toBe(0);
		expect((JSON.parse(made.stdout) as {record: {commit: string}}).record.commit).toBe(head(bench.a.records, bench.a.env));
		const missing = await run(bench.a, ['check', '--answers', clearDemo, '--json', '--sign', 'Ada Bench', '--records', bench.a.records], noGit());
		expect(missing.code).toBe(0);
		expect(JSON.parse(missing.stdout)).not.toHaveProperty('record.commit');
		expect(missing.stderr).toContain('NOT committed to the records repository: the program git is needed');
		runGit(bench.a.records, ['add', '--all'], bench.a.env);
		runGit(bench.a.records, ['commit', '--quiet', '-m', 'commit the records written without git'], bench.a.env);
	});

	it.each([
		{argv: ['records', 'sync'], folder: 'a'},
		{argv: ['records', 'init'], folder: 'fresh'},
	])('prelase $argv without git: exit 2 and what to install', async ({argv, folder}) => {
		const {code, stderr} = await run(bench.a, [...argv, '--records', folder === 'a' ? bench.a.records : join(root, folder)], noGit());
		expect(code).toBe(2);
		expect(stderr).toContain('the program git is needed for the records repository');
		expect(stderr).toContain('install git');
	});

	it('a plain folder works as before without git: no commit, no repository', async () => {
		const plain = join(root, 'plain');
		const made = await run(bench.a, ['check', '--answers', clearDemo, '--sign', 'Ada Bench', '--records', plain], noGit());
		expect(made.code).toBe(0);
		expect(made.stdout).not.toContain('committed');
		expect(existsSync(join(plain, '.git'))).toBe(false);
		const sync = await run(bench.a, ['records', 'sync', '--records', plain]);
		expect([sync.code, sync.stderr]).toEqual([2, `prelase: the records folder ${plain} is a plain folder, not a repository; make it one with: prelase records init [--remote URL]\n`]);
		const audit = await run(bench.a, ['audit', plain, '--remote']);
		expect(audit.code).toBe(2);
	});

	it('init on a folder that already holds records makes them the first commit, and the first sync shares them', async () => {
		const plain = join(root, 'plain');
		const {code, stdout} = await run(bench.a, ['records', 'init', '--records', plain, '--remote', site]);
		expect(code).toBe(0);
		expect(stdout).toContain(`The records folder ${plain} is now a git repository; the 2 files already in it are its first commit.`);
		const synced = await run(bench.a, ['records', 'sync', '--records', plain]);
		expect(synced.code).toBe(0);
		expect(synced.stdout).toMatch(/took \d+ commits, pushed 1 commit\./);
		expect(runGit(site, ['ls-tree', '--name-only', 'main'], bench.a.env).split('\n')).toEqual(expect.arrayContaining(jsonFiles(plain)));
	});
});

describe('prelase records: usage', () => {
	it('init --remote with a remote that cannot be reached: exit 2, naming git\'s command and its words', async () => {
		const away = join(root, 'no-such-site.git');
		const {code, stderr} = await run(bench.a, ['records', 'init', '--remote', away, '--records', join(root, 'never')]);
		expect(code).toBe(2);
		expect(stderr).toContain(`prelase: git clone failed in ${join(root, 'never')}: fatal: repository '${away}' does not exist`);
	});


	it.each([
		{argv: ['records'], says: 'say what to do: prelase records init [--remote URL] or prelase records sync'},
		{argv: ['records', 'push'], says: 'unknown records action "push"; use init or sync'},
		{argv: ['records', 'sync', '--remote', 'x'], says: '--remote goes with records init'},
	])('$argv exits 2', async ({argv, says}) => {
		const {code, stderr} = await runCli(argv, bench.a.env);
		expect(code).toBe(2);
		expect(stderr).toContain(says);
	});

	it('--help lists the actions and every exit status', async () => {
		const {code, stdout} = await runCli(['records', '--help'], {});
		expect(code).toBe(0);
		for (const line of ['prelase records init [--remote URL]', 'prelase records sync', '--records DIR', '--remote URL', '3  sync refused', '4  sync: the remote cannot be reached', '5  sync: git refused']) expect(stdout).toContain(line);
	});
});
