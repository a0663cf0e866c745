import {mkdtempSync} from 'node:fs';
import {tmpdir} from 'node:os';
import {join} from 'node:path';
import {describe, expect, it} from 'vitest';
import {openSettings, readSettings, settingsFile} from '../../source/services/settings.js';

describe('settings', () => {
	it('reads quickly from the same file the store writes', () => {
		const env = {PRELASE_HOME: mkdtempSync(join(tmpdir(), 'prelase-settings-'))};
		expect(readSettings(env)).toEqual({});
		const store = openSettings(env);
		store.write({operator: 'Dana Whitlow', rulesFile: 'site.yaml'});
		expect(settingsFile(env)).toBe(store.path);
		expect(readSettings(env)).toEqual({operator: 'Dana Whitlow', rulesFile: 'site.yaml'});
	});
});

describe('the rule file in force', () => {
	it('is the setting when --rules is not given', async () => {
		const {main} = await import('../../source/cli/dispatch.js');
		const {fakeIo} = await import('../helpers/fake-io.js');
		const {writeFileSync} = await import('node:fs');
		const home = mkdtempSync(join(tmpdir(), 'prelase-settings-'));
		const site = join(home, 'site.yaml');
		// site policy (invented): a 5 s emission delay; the clear demo has 3 s
		writeFileSync(site, 'format: 1\nextends: shipped\nname: Site policy\npolicy_changed:\n  min_emission_delay: {value: 5 s}\n');
		openSettings({PRELASE_HOME: home}).write({rulesFile: site});
		const io = fakeIo({PRELASE_HOME: home});
		const code = await main(['check', '--answers', 'docs/examples/bench3-808nm-clear.yaml', '--json'], io);
		const json = JSON.parse(io.stdout.text) as {rules: {name: string}; checks: Array<{id: string; verdict: string}>};
		expect(json.rules.name).toBe('Site policy');
		expect(json.checks.find(({id}) => id === 'emission_delay_long_enough')?.verdict).toBe('fail');
		expect(code).toBe(1);
	});
});
