import {readFileSync} from 'node:fs';
import {afterEach, describe, expect, it, vi} from 'vitest';
import {parseDocument} from 'yaml';
import {createHash} from 'node:crypto';

const path = 'rules/default.yaml';
const text = readFileSync(path, 'utf8');

afterEach(() => {
	delete (globalThis as Record<string, unknown>)['PRELASE_SHIPPED_RULES'];
	vi.resetModules();
});

async function load() {
	const {loadRulesFromText} = await import('../../source/rules/load.js');
	return loadRulesFromText(text, path);
}

describe('the shipped policy', () => {
	it('loads with no problems and no warnings', async () => {
		const loaded = await load();
		expect(loaded.ok ? loaded.warnings : loaded.errors).toEqual([]);
	});

	it('loads the same from the data embedded at build time as from its YAML', async () => {
		const fromYaml = await load();
		vi.resetModules();
		const data = parseDocument(text).toJS() as unknown;
		(globalThis as Record<string, unknown>)['PRELASE_SHIPPED_RULES'] = JSON.stringify({sha256: createHash('sha256').update(text).digest('hex'), data});
		const fromData = await load();
		expect(fromYaml.ok && fromData.ok).toBe(true);
		if (!fromYaml.ok || !fromData.ok) return;
		expect(fromData.value.rules).toEqual(fromYaml.value.rules);
		expect(fromData.value.sha256).toBe(fromYaml.value.sha256);
		expect([...fromData.value.inputs.keys()]).toEqual([...fromYaml.value.inputs.keys()]);
	});

	it('ignores embedded data whose hash does not match the text', async () => {
		(globalThis as Record<string, unknown>)['PRELASE_SHIPPED_RULES'] = JSON.stringify({sha256: '0'.repeat(64), data: {format: 1}});
		const loaded = await load();
		expect(loaded.ok).toBe(true);
	});
});
