import {mkdtempSync} from 'node:fs';
import {tmpdir} from 'node:os';
import {dirname, join} from 'node:path';
import {describe, expect, it} from 'vitest';
import {saveSetup} from '../../../source/services/drafts/setup-store.js';
import {settingsFile} from '../../../source/services/settings.js';
import {runIn} from '../../helpers/run-cli.js';

/** `check --setup NAME` opens a saved setup; a name that is none used to start an empty check under that name. */
describe('check --setup NAME', () => {
	const home = mkdtempSync(join(tmpdir(), 'prelase-check-setup-'));

	it('refuses a name that is not a saved setup, and lists the saved ones', async () => {
		const none = await runIn(home, ['check', '--setup', 'nope']);
		expect(none.code).toBe(2);
		expect(none.stderr).toContain('there is no saved setup named "nope" (saved setups: none yet)');
		saveSetup(dirname(settingsFile({PRELASE_HOME: home})), {name: 'Bench 3', entries: {location: 'Room B.112, bench 3'}, savedAt: '2026-12-01T09:00:00+00:00'});
		const other = await runIn(home, ['check', '--setup', 'nope']);
		expect(other.stderr).toContain('(saved setups: Bench 3)');
	});

	it('takes a saved setup (here it then asks for a terminal, which a test has not)', async () => {
		const run = await runIn(home, ['check', '--setup', 'Bench 3']);
		expect(run.code).toBe(2);
		expect(run.stderr).toContain('the on-screen check needs a terminal');
	});
});
