import {mkdirSync, mkdtempSync, rmSync, writeFileSync} from 'node:fs';
import {tmpdir} from 'node:os';
import {join} from 'node:path';
import {afterAll, beforeAll, describe, expect, it} from 'vitest';
import type {CompiledRules} from '../../../source/rules/compile/compiled-rules.js';
import {diffRules, type RulesDiff} from '../../../source/rules/inspect/diff.js';
import {loadRules, shippedRulesPath} from '../../../source/rules/load.js';

let folder: string;
let shipped: CompiledRules;
let counter = 0;

beforeAll(() => {
	folder = mkdtempSync(join(tmpdir(), 'prelase-diff-'));
	mkdirSync(folder, {recursive: true});
	const loaded = loadRules(shippedRulesPath());
	if (!loaded.ok) throw new Error('shipped rules do not load');
	shipped = loaded.value;
});
afterAll(() => rmSync(folder, {recursive: true, force: true}));

/** Loads a site file that extends the shipped policy. */
function site(body: string): CompiledRules {
	counter += 1;
	const file = join(folder, `site-${counter}.yaml`);
	writeFileSync(file, `format: 1\nextends: shipped\n${body}`);
	const loaded = loadRules(file);
	if (!loaded.ok) throw new Error(loaded.errors.map((found) => `${found.code} ${found.line}`).join('; '));
	return loaded.value;
}

type Case = {name: string; body: string; check: (diff: RulesDiff) => void};

const cases: Case[] = [
	{
		name: 'a policy value changed, old → new with units',
		body: 'policy_changed:\n  headroom_margin:\n    value: 800 mV\n',
		check: (diff) => expect(diff.policy.changed).toEqual([{id: 'headroom_margin', dimension: 'voltage', from: '0.5 V', to: '800 mV', fromSi: 0.5, toSi: 0.8}]),
	},
	{
		name: 'the same value written differently is no change',
		body: 'policy_changed:\n  min_soft_start:\n    value: 0.01 s\n',
		check: (diff) => expect(diff.equal).toBe(true),
	},
	{
		name: 'a check switched off',
		body: 'switched_off:\n  reverse_protection_fitted: fitted in every driver of the family\n',
		check: (diff) => expect(diff.checks.switchedOff).toEqual([{id: 'reverse_protection_fitted', title: 'Reverse-voltage protection across the laser diode', reason: 'fitted in every driver of the family'}]),
	},
	{
		name: 'a check whose severity changed',
		body: 'checks_changed:\n  beam1_hazard_distance:\n    severity: stop\n    reason: no hazard distance may reach an uncontrolled position\n',
		check: (diff) => expect(diff.checks.changed).toEqual([{id: 'beam1_hazard_distance', title: expect.any(String), changes: [{field: 'severity', from: 'advise', to: 'stop'}]}]),
	},
	{
		name: 'a check added, with an input and a confirmation',
		body: 'add_to_steps:\n  supply:\n    inputs:\n      - id: supply_ripple\n        label: Supply ripple\n        dimension: voltage\n        range: [0 V, 5 V]\n    confirmations:\n      - id: supply_fused\n        statement: The supply is fused.\n        basis: site policy\nadd_checks:\n  - id: ripple_small\n    step: supply\n    title: Ripple at most 50 mV\n    value: supply_ripple\n    at_most: 50 mV\n    severity: advise\n    explanation: Ripple modulates the diode.\n    basis: site policy\n',
		check: (diff) => {
			expect(diff.checks.added).toEqual([{id: 'ripple_small', title: 'Ripple at most 50 mV', severity: 'advise', step: 'supply'}]);
			expect(diff.inputs.added).toEqual([{id: 'supply_ripple', title: 'Supply ripple', step: 'supply'}]);
			expect(diff.confirmations.added).toEqual([{id: 'supply_fused', title: 'The supply is fused.', step: 'supply'}]);
			expect(diff.checks.removed).toEqual([]);
		},
	},
];

describe('diffRules', () => {
	it('finds no difference between a file and itself', () => {
		const diff = diffRules(shipped, shipped);
		expect(diff.equal).toBe(true);
		expect(diff.policy.changed).toEqual([]);
	});

	it.each(cases)('$name', ({body, check}) => check(diffRules(shipped, site(body))));

	it('sees the other direction as removals and a check switched on again', () => {
		const changed = site('switched_off:\n  reverse_protection_fitted: why\nadd_to_steps:\n  supply:\n    confirmations:\n      - id: supply_fused\n        statement: The supply is fused.\n        basis: site policy\n');
		const diff = diffRules(changed, shipped);
		expect(diff.checks.switchedOn).toEqual([{id: 'reverse_protection_fitted', title: 'Reverse-voltage protection across the laser diode'}]);
		expect(diff.confirmations.removed.map((entry) => entry.id)).toEqual(['supply_fused']);
		expect(diff.equal).toBe(false);
	});

	it('reports a changed formula of a check and of a derived value', () => {
		const base = join(folder, 'formula-base.yaml');
		const text = `format: 1\nname: f\ncaution: c\nsteps:\n  - id: s\n    title: S\n    inputs:\n      - id: a\n        label: A\n        dimension: current\n        range: [0 A, 9 A]\nderived:\n  - id: twice\n    label: Twice\n    dimension: current\n    formula: a * 2\nchecks:\n  - id: small\n    step: s\n    title: Small\n    value: twice\n    at_most: 5 A\n    severity: stop\n    explanation: e\n    basis: b\n`;
		writeFileSync(base, text);
		const other = join(folder, 'formula-other.yaml');
		writeFileSync(other, text.replace('formula: a * 2', 'formula: a * 3').replace('at_most: 5 A', 'at_most: 4 A'));
		const [a, b] = [loadRules(base), loadRules(other)];
		if (!a.ok || !b.ok) throw new Error('fixtures do not load');
		const diff = diffRules(a.value, b.value);
		expect(diff.derived.changed).toEqual([{id: 'twice', title: 'Twice', from: 'a * 2', to: 'a * 3'}]);
		expect(diff.checks.changed).toEqual([{id: 'small', title: 'Small', changes: [{field: 'at_most', from: '5 A', to: '4 A'}]}]);
	});
});
