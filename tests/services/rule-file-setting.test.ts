import {copyFileSync, mkdtempSync, writeFileSync} from 'node:fs';
import {tmpdir} from 'node:os';
import {join, resolve} from 'node:path';
import {describe, expect, it} from 'vitest';
import {checkRuleFileSetting, rulesForScreens} from '../../source/services/rule-file-setting.js';
import {openSettings} from '../../source/services/settings.js';

const work = mkdtempSync(join(tmpdir(), 'prelase-rule-setting-'));
copyFileSync('rules/default.yaml', join(work, 'site.yaml'));
// A flow sequence opened on line 2 and never closed: the YAML parser stops at line 3, column 1.
writeFileSync(join(work, 'broken.yaml'), 'name: Site policy\nsteps: [\n');

describe('a rule file typed into the settings', () => {
	it.each([
		{name: 'a relative path, made absolute against the working folder', typed: 'site.yaml', file: join(work, 'site.yaml')},
		{name: 'an absolute path, kept', typed: join(work, 'site.yaml'), file: join(work, 'site.yaml')},
		{name: 'spaces around it, trimmed', typed: '  site.yaml ', file: join(work, 'site.yaml')},
		{name: 'empty: the shipped policy', typed: '', file: ''},
	])('accepts $name', ({typed, file}) => {
		const checked = checkRuleFileSetting(typed, work);
		expect(checked.ok).toBe(true);
		if (checked.ok) expect(checked.value.file).toBe(file);
	});

	it.each([
		{name: 'a file with a YAML error', typed: 'broken.yaml', line: 3},
		{name: 'a file that is not there', typed: 'nowhere.yaml', line: undefined},
	])('refuses $name, naming the absolute file', ({typed, line}) => {
		const checked = checkRuleFileSetting(typed, work);
		expect(checked.ok).toBe(false);
		if (!checked.ok) {
			expect(checked.errors[0]!.file).toBe(resolve(work, typed));
			expect(checked.errors[0]!.line).toBe(line);
		}
	});
});

describe('the rules the screens start with', () => {
	const settingsWith = (rulesFile?: string) => {
		const settings = openSettings({PRELASE_HOME: mkdtempSync(join(tmpdir(), 'prelase-rule-setting-home-'))});
		if (rulesFile) settings.write({rulesFile});
		return settings;
	};

	it('reports a broken file named in the settings, with the settings file, and loads the shipped policy in its place', () => {
		const settings = settingsWith(join(work, 'broken.yaml'));
		const result = rulesForScreens(undefined, settings);
		expect(result.ok).toBe(true);
		if (!result.ok) return;
		expect(result.value.broken?.file).toBe(join(work, 'broken.yaml'));
		expect(result.value.broken?.settingsPath).toBe(settings.path);
		expect(result.value.broken?.problems[0]?.line).toBe(3);
		expect(result.value.rules.rules.name).toBe('prelase bench policy (shipped default)');
	});

	it('refuses a broken file asked for on the command line', () => {
		expect(rulesForScreens(join(work, 'broken.yaml'), settingsWith()).ok).toBe(false);
	});

	it('uses a good file named in the settings, with nothing broken', () => {
		const result = rulesForScreens(undefined, settingsWith(join(work, 'site.yaml')));
		expect(result.ok && result.value.broken).toBe(undefined);
		expect(result.ok && result.value.file).toBe(join(work, 'site.yaml'));
	});
});
