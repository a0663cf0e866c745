import {copyFileSync, mkdirSync, mkdtempSync, readdirSync, rmSync, utimesSync, writeFileSync} from 'node:fs';
import {tmpdir} from 'node:os';
import {join, resolve} from 'node:path';
import {afterAll, beforeAll, describe, expect, it} from 'vitest';
import {loadDraft, saveDraft, type Draft} from '../../source/services/drafts/draft-store.js';
import {caseFolder, runIn} from '../helpers/run-cli.js';

// A process killed (kill -9) between writing its temporary file and renaming or linking it
// leaves the temporary: `.NAME.PID-12HEX.tmp` beside the file it was to become.
const example = resolve('docs/examples/bench3-808nm-clear.yaml');
const minutesAgo = (minutes: number) => new Date(Date.now() - minutes * 60_000);
let root: string;
beforeAll(() => {
	root = mkdtempSync(join(tmpdir(), 'prelase-stale-'));
});
afterAll(() => rmSync(root, {recursive: true, force: true}));

/** Writes a file with the given age (modification time) and returns its name. */
function leftover(folder: string, name: string, text: string, ageMinutes: number): string {
	writeFileSync(join(folder, name), text);
	utimesSync(join(folder, name), minutesAgo(ageMinutes), minutesAgo(ageMinutes));
	return name;
}

const draft = (setup: string, savedAt: string): Draft => ({rulesFile: 'rules.yaml', rulesSha256: '0'.repeat(64), setup, entries: {}, confirmations: {}, step: 1, savedAt});

describe('stale temporaries of our own naming are removed when the folder is next written, and never read', () => {
	it('drafts: a save removes our temporaries older than 10 minutes, keeps younger ones and files of other names; a temporary is never loaded as the draft', () => {
		const home = caseFolder(root);
		const drafts = join(home, 'drafts');
		mkdirSync(drafts);
		const newer = JSON.stringify(draft('left by a killed save', '2026-12-31T00:00:00.000Z'));
		const old = leftover(drafts, '.current.json.4242-0123456789ab.tmp', newer, 20);
		const young = leftover(drafts, '.current.json.4243-0123456789ac.tmp', newer, 2);
		const foreign = [leftover(drafts, '.notes.tmp', 'x', 60), leftover(drafts, 'current.json.tmp', 'x', 60), leftover(drafts, '.current.json.42-zz.tmp', 'x', 60)];
		expect(loadDraft(home)).toBeUndefined();
		saveDraft(home, draft('bench 3', '2026-12-05T10:00:00.000Z'));
		const names = readdirSync(drafts);
		expect(names).not.toContain(old);
		expect(names.sort()).toEqual([young, ...foreign, 'current.json'].sort());
		expect(loadDraft(home)?.setup).toBe('bench 3');
	});

	it('records: signing removes a stale temporary in the records folder; a temporary holding a whole record is not audited as a record', async () => {
		const home = caseFolder(root);
		const records = join(home, 'records');
		expect((await runIn(home, ['check', '--answers', example, '--sign', 'Ada Quill', '--records', records])).code).toBe(0);
		const [record] = readdirSync(records).filter((name) => name.endsWith('.json'));
		const copy = '.record.4242-0123456789ab.tmp';
		copyFileSync(join(records, record!), join(records, copy));
		utimesSync(join(records, copy), minutesAgo(30), minutesAgo(30));
		const audit = await runIn(home, ['audit', records]);
		expect(audit.stdout).toMatch(/Totals: 1 records? · 1 authentic/);
		expect((await runIn(home, ['check', '--answers', example, '--sign', 'Ada Quill', '--records', records])).code).toBe(0);
		expect(readdirSync(records)).not.toContain(copy);
		expect(readdirSync(records).filter((name) => name.endsWith('.tmp'))).toEqual([]);
	});
});
