import {copyFileSync, mkdirSync, mkdtempSync} from 'node:fs';
import {tmpdir} from 'node:os';
import {join} from 'node:path';
import {cleanup} from 'ink-testing-library';
import {afterEach, describe, expect, it} from 'vitest';
import {testDraftPath} from '../../source/services/drafts/test-draft-store.js';
import {demoPlanFile} from '../interlock/plan-fixture.js';
import {renderApp} from '../helpers/screen-driver.js';

afterEach(() => cleanup());

// A write the machine refuses, made on demand even for root (which ignores file modes): a
// folder where the draft file goes, so the rename over it fails with EISDIR (POSIX rename(2)).
describe('screens go on when the machine refuses a save, and say so', () => {
	it('the draft cannot be saved: the step is shown with the reason under the header', async () => {
		const home = mkdtempSync(join(tmpdir(), 'prelase-ui-refused-'));
		mkdirSync(join(home, 'drafts', 'current.json'), {recursive: true});
		const screen = await renderApp({home, startCheck: {}});
		const frame = screen.frame().replaceAll('\n', ' ');
		expect(frame).toContain('Step 1 of 9');
		expect(frame).toMatch(/could not write .*current\.json: it is a folder, EISDIR/);
		expect(screen.exits).toEqual([]);
	});

	it('the entries of an interlock test cannot be saved: the step is marked, and the reason is shown', async () => {
		const home = mkdtempSync(join(tmpdir(), 'prelase-ui-refused-'));
		const file = join(home, 'plan.yaml');
		copyFileSync(demoPlanFile, file);
		mkdirSync(testDraftPath(home, file), {recursive: true});
		const screen = await renderApp({home, startPlan: file});
		await screen.press('t');
		await screen.press('p');
		await screen.paste('9 ms\r');
		const frame = (await screen.paste('\r')).replaceAll(/\s+/g, ' ');
		expect(frame).toContain('Step 2 of 9');
		expect(frame).toMatch(/✗ the entries could not be saved as a draft: could not write .*test-[0-9a-f]{16}\.json: it is a folder, EISDIR/);
		expect(screen.exits).toEqual([]);
	});
});
