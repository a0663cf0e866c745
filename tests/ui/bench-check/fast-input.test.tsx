import {mkdtempSync} from 'node:fs';
import {tmpdir} from 'node:os';
import {join} from 'node:path';
import {render, cleanup} from 'ink-testing-library';
import {afterEach, expect, it} from 'vitest';
import {loadRules, shippedRulesPath} from '../../../source/rules/load.js';
import {openSettings} from '../../../source/services/settings.js';
import {App} from '../../../source/ui/App.js';

afterEach(() => cleanup());

const wait = (ms: number) => new Promise((resolve) => setTimeout(resolve, ms));

it('keeps every key typed quickly', async () => {
	const rules = loadRules(shippedRulesPath());
	if (!rules.ok) throw new Error('rules');
	const env = {PRELASE_HOME: mkdtempSync(join(tmpdir(), 'prelase-ui-'))};
	const {stdin, lastFrame} = render(<App rules={rules.value} settings={openSettings(env)} env={env} startCheck={{}} onExit={() => {}} />);
	await wait(100);
	stdin.write('SN-0417\r');
	stdin.write('X\r');
	stdin.write('B.112\r');
	await wait(200);
	console.log(lastFrame());
	expect(lastFrame()).toContain('B.112');
});
