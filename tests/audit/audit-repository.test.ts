import {describe, expect, it} from 'vitest';
import {parseLog, parseStatus, reviewRepository, writtenOnce} from '../../source/audit/audit-repository.js';

/**
 * git's output as the audit receives it, written out by hand in the formats git documents:
 * git-log(1) "--format" with %H %an %ae %aI %s and "--name-status -z" (status letter, NUL, path,
 * NUL), and git-status(1) "--porcelain=v1 -z" (two status letters, a space, the path, NUL).
 */
const logged = (id: string, subject: string, ...changes: Array<[string, string]>) =>
	`\u001E${id.padEnd(40, '0')}\u001FAda Bench\u001F0123456789abcdef@prelase.invalid\u001F2026-12-05T10:00:00+00:00\u001F${subject}\0\n${changes.map(([status, path]) => `${status}\0${path}\0`).join('')}`;

const log = [
	logged('aaaa', 'Bench check of Bench 3: clear to energize', ['A', '2026-12-05-100000-bench-3-11111111.json']),
	logged('bbbb', 'Bench check of Bench 4: do not energize', ['A', 'b.json'], ['A', 'rules/0f.yaml'], ['A', 'notes.txt']),
	logged('cccc', 'tidy', ['M', '2026-12-05-100000-bench-3-11111111.json'], ['M', 'notes.txt']),
	logged('dddd', 'remove old', ['D', 'b.json'], ['D', 'rules/0f.yaml']),
	logged('eeee', 'Bench check of Bench 5: incomplete', ['A', 'e.json'], ['A', 'c.json']),
].join('');

describe('reading git output', () => {
	it('parses every commit of the log with its changes, in order', () => {
		const commits = parseLog(log);
		expect(commits.map((found) => [found.commit.slice(0, 4), found.subject, found.changes.length])).toEqual([
			['aaaa', 'Bench check of Bench 3: clear to energize', 1],
			['bbbb', 'Bench check of Bench 4: do not energize', 3],
			['cccc', 'tidy', 2],
			['dddd', 'remove old', 2],
			['eeee', 'Bench check of Bench 5: incomplete', 2],
		]);
		expect(commits[0]).toMatchObject({author: 'Ada Bench', email: '0123456789abcdef@prelase.invalid', date: '2026-12-05T10:00:00+00:00'});
	});

	it('parses the short status, names with spaces included', () => {
		expect(parseStatus(' M c.json\0?? new record.json\0 D e.json\0')).toEqual([
			{code: ' M', path: 'c.json'},
			{code: '??', path: 'new record.json'},
			{code: ' D', path: 'e.json'},
		]);
	});

	it.each([
		{path: '2026-12-05-100000-bench-3-11111111.json', once: true},
		{path: 'site/a.json', once: true},
		{path: 'rules/0f.yaml', once: true},
		{path: 'notes.txt', once: false},
		{path: '.git/config', once: false},
		{path: '.hidden/a.json', once: false},
	])('$path is written once: $once', ({path, once}) => {
		expect(writtenOnce(path)).toBe(once);
	});
});

describe('what a repository history shows', () => {
	it('names the commit that changed or deleted a record after the commit that added it, and leaves other files alone', () => {
		const review = reviewRepository({folder: '/site', log, status: ''});
		expect(review.commits).toBe(5);
		expect(review.findings.map((found) => [found.kind, found.code, found.data['file'], found.data['commit'], found.data['added']])).toEqual([
			['integrity', 'audit-repository-changed', '2026-12-05-100000-bench-3-11111111.json', 'cccc00000000', 'aaaa00000000'],
			['integrity', 'audit-repository-deleted', 'b.json', 'dddd00000000', 'bbbb00000000'],
			['integrity', 'audit-repository-deleted', 'rules/0f.yaml', 'dddd00000000', 'bbbb00000000'],
		]);
		expect(review.findings[1]!.data).toMatchObject({author: 'Ada Bench', subject: 'remove old', date: '2026-12-05T10:00:00+00:00'});
	});

	it.each([
		{status: ' M c.json\0', code: 'audit-repository-modified', kind: 'integrity', commit: 'eeee00000000'},
		{status: 'M  c.json\0', code: 'audit-repository-modified', kind: 'integrity', commit: 'eeee00000000'},
		{status: ' D e.json\0', code: 'audit-repository-missing', kind: 'integrity', commit: 'eeee00000000'},
		{status: 'D  e.json\0', code: 'audit-repository-missing', kind: 'integrity', commit: 'eeee00000000'},
		{status: '?? f.json\0', code: 'audit-repository-not-committed', kind: 'history', commit: undefined},
		{status: 'A  f.json\0', code: 'audit-repository-not-committed', kind: 'history', commit: undefined},
	])('a file in the folder with status "$status" → $code', ({status, code, kind, commit}) => {
		const added = logged('eeee', 'Bench check of Bench 5: incomplete', ['A', 'e.json'], ['A', 'c.json']);
		const {findings} = reviewRepository({folder: '/site', log: added, status});
		expect(findings.map((found) => [found.kind, found.code, found.data['commit']])).toEqual([[kind, code, commit]]);
	});

	it('says nothing of files prelase does not write once (notes, dot-files)', () => {
		expect(reviewRepository({folder: '/site', log: logged('aaaa', 'x', ['A', 'notes.txt']), status: ' M notes.txt\0?? .tmp.json\0'}).findings).toEqual([]);
	});

	it('a remote that lost commits this folder had is one finding per lost commit; an unreachable one is a finding too', () => {
		const lost = reviewRepository({folder: '/site', log: '', status: '', remote: {state: 'rewritten', remote: '/srv/site.git', lost: [{commit: 'f'.repeat(40), subject: 'Bench check of Bench 3: clear to energize'}]}});
		expect(lost.findings).toEqual([{kind: 'integrity', code: 'audit-repository-rewritten', data: {remote: '/srv/site.git', commit: 'ffffffffffff', subject: 'Bench check of Bench 3: clear to energize'}}]);
		const away = reviewRepository({folder: '/site', log: '', status: '', remote: {state: 'unreachable', remote: '/srv/site.git', detail: 'no such repository'}});
		expect(away.findings.map((found) => [found.kind, found.code])).toEqual([['history', 'audit-repository-remote-unreachable']]);
		expect(reviewRepository({folder: '/site', log: '', status: '', remote: {state: 'ok', remote: '/srv/site.git'}}).findings).toEqual([]);
	});

	it('a history that could not be read is a finding, never a clean result', () => {
		expect(reviewRepository({folder: '/site', log: '', status: '', unreadable: 'git is missing'}).findings.map((found) => found.code)).toEqual(['audit-repository-not-read']);
	});
});
