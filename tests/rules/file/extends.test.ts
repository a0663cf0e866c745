import {mkdirSync, mkdtempSync, readFileSync, rmSync, writeFileSync} from 'node:fs';
import {tmpdir} from 'node:os';
import {join} from 'node:path';
import {afterAll, beforeAll, describe, expect, it} from 'vitest';
import {displayPath} from '../../../source/shared/display-path.js';
import type {CompiledRules} from '../../../source/rules/compile/compiled-rules.js';
import {loadRules, loadRulesFromText, shippedRulesPath} from '../../../source/rules/load.js';

/** A small base rule file; site files in the tables extend it. */
const base = `format: 1
name: lab base
caution: Base caution.
policy:
  margin:
    value: 10 %
    dimension: ratio
    meaning: margin below the maximum
    basis: site policy
steps:
  - id: diode
    title: Diode
    inputs:
      - id: maximum
        label: Absolute maximum current
        dimension: current
        range: [0 A, 10 A]
      - id: limit
        label: Current limit
        dimension: current
        range: [0 A, 10 A]
    confirmations:
      - id: strap
        statement: The wrist strap was tested.
        basis: common practice
  - id: people
    title: People
    inputs:
      - id: laser_class
        kind: choice
        label: Class
        options: {class_3b: Class 3B, class_4: Class 4}
derived:
  - id: ceiling
    label: Ceiling
    dimension: current
    formula: maximum * (1 - margin)
checks:
  - id: limit_below
    step: diode
    title: Limit below the ceiling
    value: limit
    at_most: ceiling
    severity: stop
    explanation: The limit protects the diode.
    basis: common practice
  - id: limit_sane
    step: diode
    title: Limit above zero
    holds: limit > 0 A
    severity: advise
    explanation: A zero limit is a mistake.
    basis: common practice
`;

let folder: string;
let counter = 0;

beforeAll(() => {
	folder = mkdtempSync(join(tmpdir(), 'prelase-extends-'));
});
afterAll(() => rmSync(folder, {recursive: true, force: true}));

/** Writes files into a fresh subfolder (with base.yaml beside them) and loads the first. */
function loadSite(files: Record<string, string>) {
	counter += 1;
	const dir = join(folder, `case-${counter}`);
	writeFiles(dir, {'base.yaml': base, ...files});
	const first = Object.keys(files)[0]!;
	return {dir, file: join(dir, first), loaded: loadRules(join(dir, first))};
}

function writeFiles(dir: string, files: Record<string, string>) {
	mkdirSync(dir, {recursive: true});
	for (const [name, text] of Object.entries(files)) writeFileSync(join(dir, name), text);
}

function lineOf(text: string, needle: string): number {
	const index = text.split('\n').findIndex((line) => line.includes(needle));
	if (index < 0) throw new Error(`fixture has no line with ${needle}`);
	return index + 1;
}

const head = 'format: 1\nextends: base.yaml\n';

type Valid = {name: string; site: string; expect: (rules: CompiledRules, file: string) => void};

const valid: Valid[] = [
	{
		name: 'a policy value overridden',
		site: `${head}policy_changed:\n  margin:\n    value: 20 %\n`,
		expect: (rules, file) => {
			expect(rules.policy.get('margin')?.si).toBeCloseTo(0.2, 12);
			expect(rules.provenance.where('policy.margin.value')).toEqual({file, line: 5, column: 12});
			expect(rules.provenance.previousPolicy.get('margin')?.value).toBe('10 %');
			expect(rules.rules.policy['margin']?.meaning).toBe('margin below the maximum');
		},
	},
	{
		name: 'a confirmation added to an existing step',
		site: `${head}add_to_steps:\n  people:\n    confirmations:\n      - id: second_person\n        statement: A second person is present.\n        when: laser_class == "class_4"\n        basis: site policy\n`,
		expect: (rules, file) => {
			expect(rules.confirmations.get('second_person')?.step.id).toBe('people');
			expect(rules.rules.steps[1]!.confirmations.map((entry) => entry.id)).toEqual(['second_person']);
			expect(rules.provenance.where('confirmation.second_person')).toMatchObject({file, line: 6});
			expect(rules.provenance.where('confirmation.strap')?.file).toMatch(/base\.yaml$/);
		},
	},
	{
		name: 'a step, a derived value and a check added',
		site: `${head}add_steps:\n  - id: supply\n    title: Supply\n    inputs:\n      - id: supply_voltage\n        label: Supply\n        dimension: voltage\n        range: [0 V, 50 V]\nadd_derived:\n  - id: half_supply\n    label: Half\n    dimension: voltage\n    formula: supply_voltage / 2\nadd_checks:\n  - id: supply_low\n    step: supply\n    title: Supply at most 24 V\n    value: supply_voltage\n    at_most: 24 V\n    severity: stop\n    explanation: Site rule.\n    basis: site policy\n`,
		expect: (rules) => {
			expect(rules.rules.steps.map((step) => step.id)).toEqual(['diode', 'people', 'supply']);
			expect(rules.checks.map(({check}) => check.id)).toEqual(['limit_below', 'limit_sane', 'supply_low']);
			expect(rules.derived.map(({derived}) => derived.id)).toEqual(['ceiling', 'half_supply']);
		},
	},
	{
		name: 'a check switched off with a reason',
		site: `${head}switched_off:\n  limit_sane: Covered by the driver's own check (laser safety officer, 2025).\n`,
		expect: (rules, file) => {
			expect(rules.checks.map(({check}) => check.id)).toEqual(['limit_below']);
			expect(rules.switchedOff.map(({check}) => [check.id, check.switched_off])).toEqual([['limit_sane', "Covered by the driver's own check (laser safety officer, 2025)."]]);
			expect(rules.provenance.where('check.limit_sane.switched_off')).toMatchObject({file, line: 4});
		},
	},
	{
		name: 'a check severity changed with a reason',
		site: `${head}checks_changed:\n  limit_sane:\n    severity: stop\n    reason: A zero limit has hidden miswiring here.\n`,
		expect: (rules) => {
			expect(rules.checks.find(({check}) => check.id === 'limit_sane')?.check.severity).toBe('stop');
			expect(rules.provenance.severityChanges.get('limit_sane')).toEqual({from: 'advise', to: 'stop', reason: 'A zero limit has hidden miswiring here.'});
		},
	},
	{
		name: 'name and caution inherited when absent',
		site: head,
		expect: (rules) => {
			expect(rules.rules.name).toBe('lab base');
			expect(rules.rules.caution).toBe('Base caution.');
		},
	},
	{
		name: 'name and caution set by the site',
		site: `${head}name: Site policy\ncaution: Site caution.\n`,
		expect: (rules, file) => {
			expect([rules.rules.name, rules.rules.caution]).toEqual(['Site policy', 'Site caution.']);
			expect(rules.provenance.where('name')).toMatchObject({file, line: 3});
		},
	},
];

describe('extends: valid site files', () => {
	it.each(valid)('$name', ({site, expect: check}) => {
		const {file, loaded} = loadSite({'site.yaml': site});
		if (!loaded.ok) throw new Error(loaded.errors.map((found) => `${found.code} ${found.line}`).join('; '));
		expect(loaded.value.provenance.chain).toEqual([file, join(file, '..', 'base.yaml')]);
		check(loaded.value, file);
	});

	it('resolves a chain of three files, the nearest change winning', () => {
		const {file, loaded} = loadSite({
			'top.yaml': 'format: 1\nextends: middle.yaml\npolicy_changed:\n  margin:\n    value: 25 %\n',
			'middle.yaml': `${head}name: Middle\npolicy_changed:\n  margin:\n    value: 20 %\nswitched_off:\n  limit_sane: not used here\n`,
		});
		if (!loaded.ok) throw new Error(loaded.errors.map((found) => found.code).join(', '));
		expect(loaded.value.policy.get('margin')?.si).toBeCloseTo(0.25, 12);
		expect(loaded.value.rules.name).toBe('Middle');
		expect(loaded.value.switchedOff.map(({check}) => check.id)).toEqual(['limit_sane']);
		expect(loaded.value.provenance.chain.map((entry) => entry.split('/').at(-1))).toEqual(['top.yaml', 'middle.yaml', 'base.yaml']);
		expect(loaded.value.provenance.where('policy.margin.value')).toMatchObject({file, line: 5});
		expect(loaded.value.provenance.previousPolicy.get('margin')?.value).toBe('20 %');
	});

	it('extends the shipped policy by the name "shipped"', () => {
		const {loaded} = loadSite({'site.yaml': 'format: 1\nextends: shipped\npolicy_changed:\n  current_margin:\n    value: 20 %\n'});
		if (!loaded.ok) throw new Error(loaded.errors.map((found) => found.code).join(', '));
		expect(loaded.value.policy.get('current_margin')?.si).toBeCloseTo(0.2, 12);
		expect(loaded.value.provenance.chain[1]).toBe(displayPath(shippedRulesPath()));
		expect(loaded.value.rules.name).toBe('prelase bench policy (shipped default)');
	});
});

type Invalid = {name: string; files: Record<string, string>; code: string; inFile: string; lineHas: string; data?: Record<string, unknown>};

const invalid: Invalid[] = [
	{name: 'an unknown policy override', files: {'site.yaml': `${head}policy_changed:\n  margn:\n    value: 20 %\n`}, code: 'extends-unknown-policy', inFile: 'site.yaml', lineHas: 'margn:', data: {id: 'margn', hint: ' (did you mean "margin"?)'}},
	{name: 'an unknown check switched off', files: {'site.yaml': `${head}switched_off:\n  limit_below_x: reason\n`}, code: 'extends-unknown-check', inFile: 'site.yaml', lineHas: 'limit_below_x', data: {id: 'limit_below_x', section: 'switched_off'}},
	{name: 'an unknown check changed', files: {'site.yaml': `${head}checks_changed:\n  nothing:\n    severity: stop\n    reason: why\n`}, code: 'extends-unknown-check', inFile: 'site.yaml', lineHas: 'nothing:', data: {id: 'nothing', section: 'checks_changed'}},
	{name: 'a check switched off without a reason', files: {'site.yaml': `${head}switched_off:\n  limit_sane:\n`}, code: 'extends-switch-off-reason', inFile: 'site.yaml', lineHas: 'limit_sane:', data: {id: 'limit_sane'}},
	{name: 'a check switched off with an empty reason', files: {'site.yaml': `${head}switched_off:\n  limit_sane: "  "\n`}, code: 'extends-switch-off-reason', inFile: 'site.yaml', lineHas: 'limit_sane:'},
	{name: 'a severity change without a reason', files: {'site.yaml': `${head}checks_changed:\n  limit_sane:\n    severity: stop\n`}, code: 'schema', inFile: 'site.yaml', lineHas: 'severity: stop'},
	{name: 'a dimension change refused', files: {'site.yaml': `${head}policy_changed:\n  margin:\n    value: 1 A\n    dimension: current\n`}, code: 'extends-dimension-change', inFile: 'site.yaml', lineHas: 'dimension: current', data: {id: 'margin', dimension: 'ratio', given: 'current'}},
	{name: 'a value of another dimension', files: {'site.yaml': `${head}policy_changed:\n  margin:\n    value: 1 A\n`}, code: 'policy-value', inFile: 'site.yaml', lineHas: 'value: 1 A', data: {id: 'margin'}},
	{name: 'an unknown step to add to', files: {'site.yaml': `${head}add_to_steps:\n  diodes:\n    confirmations: []\n`}, code: 'extends-unknown-step', inFile: 'site.yaml', lineHas: 'diodes:', data: {id: 'diodes'}},
	{name: 'an added input that reuses a base id', files: {'site.yaml': `${head}add_to_steps:\n  diode:\n    inputs:\n      - id: laser_class\n        kind: yes_no\n        label: Again\n`}, code: 'duplicate-id', inFile: 'site.yaml', lineHas: 'id: laser_class', data: {id: 'laser_class'}},
	{name: 'an added check with an unknown name', files: {'site.yaml': `${head}add_checks:\n  - id: extra\n    step: diode\n    title: Extra\n    holds: limt > 1 A\n    severity: stop\n    explanation: x\n    basis: site policy\n`}, code: 'unknown-name', inFile: 'site.yaml', lineHas: 'holds: limt', data: {name: 'limt'}},
	{name: 'an added check in a missing step', files: {'site.yaml': `${head}add_checks:\n  - id: extra\n    step: laser\n    title: Extra\n    holds: limit > 1 A\n    severity: stop\n    explanation: x\n    basis: site policy\n`}, code: 'missing-step', inFile: 'site.yaml', lineHas: 'step: laser', data: {step: 'laser'}},
	{name: 'an unknown section', files: {'site.yaml': `${head}polcy_changed:\n  margin:\n    value: 20 %\n`}, code: 'schema', inFile: 'site.yaml', lineHas: 'margin:'},
	{name: 'a missing base', files: {'site.yaml': 'format: 1\nextends: nowhere.yaml\n'}, code: 'extends-missing', inFile: 'site.yaml', lineHas: 'extends:', data: {base: 'nowhere.yaml', reason: 'no such file'}},
	{name: 'a file that extends itself', files: {'site.yaml': 'format: 1\nextends: site.yaml\n'}, code: 'extends-cycle', inFile: 'site.yaml', lineHas: 'extends:'},
	{name: 'two files that extend each other', files: {'a.yaml': 'format: 1\nextends: b.yaml\n', 'b.yaml': '# b\nformat: 1\nextends: a.yaml\n'}, code: 'extends-cycle', inFile: 'b.yaml', lineHas: 'extends: a.yaml'},
	{name: 'a base with a problem of its own', files: {'site.yaml': 'format: 1\nextends: broken.yaml\n', 'broken.yaml': base.replace('at_most: ceiling', 'at_most: cieling')}, code: 'unknown-name', inFile: 'broken.yaml', lineHas: 'cieling'},
];

describe('extends: invalid site files', () => {
	it.each(invalid)('$name → $code', ({files, code, inFile, lineHas, data}) => {
		const {dir, loaded} = loadSite(files);
		expect(loaded.ok).toBe(false);
		if (loaded.ok) return;
		const found = loaded.errors.find((entry) => entry.code === code);
		expect(found, `codes: ${loaded.errors.map((entry) => entry.code).join(', ')}`).toBeDefined();
		expect(found!.file).toBe(join(dir, inFile));
		expect(found!.line).toBe(lineOf(files[inFile] ?? base, lineHas));
		if (data) expect(found!.data).toMatchObject(data);
	});

	it('reports every problem of a site file at once', () => {
		const {loaded} = loadSite({'site.yaml': `${head}policy_changed:\n  margn:\n    value: 20 %\nswitched_off:\n  limit_sane:\n  nothing: reason\n`});
		expect(loaded.ok ? [] : loaded.errors.map((entry) => [entry.code, entry.line])).toEqual([
			['extends-unknown-policy', 4],
			['extends-switch-off-reason', 7],
			['extends-unknown-check', 8],
		]);
	});

	it('names the site file where a base that does not validate is extended', () => {
		const {dir, loaded} = loadSite({'site.yaml': 'format: 1\nextends: broken.yaml\n', 'broken.yaml': base.replace('severity: stop', 'severity: fatal')});
		expect(loaded.ok ? undefined : loaded.errors.find((entry) => entry.code === 'schema')).toMatchObject({file: join(dir, 'broken.yaml'), line: lineOf(base, 'severity: stop')});
		const found = loaded.ok ? undefined : loaded.errors.find((entry) => entry.code === 'extends-base-invalid');
		expect(found).toMatchObject({file: join(dir, 'site.yaml'), line: 2, data: {base: 'broken.yaml', count: 1}});
	});
});

describe('the resolved text', () => {
	it('loads on its own to the same rules, with the switched-off check and its reason', () => {
		const {file, loaded} = loadSite({'site.yaml': `${head}name: Site\npolicy_changed:\n  margin:\n    value: 20 %\nswitched_off:\n  limit_sane: not here\n`});
		if (!loaded.ok) throw new Error('site did not load');
		expect(loaded.value.text).not.toMatch(/^extends:/m);
		expect(loaded.value.text).toMatch(/^#   extends lab base \(sha256 [0-9a-f]{64}\)$/m);
		const again = loadRulesFromText(loaded.value.text, file);
		if (!again.ok) throw new Error(again.errors.map((found) => found.code).join(', '));
		expect(again.value.sha256).toBe(loaded.value.sha256);
		expect(again.value.rules).toEqual(loaded.value.rules);
		expect(again.value.policy.get('margin')?.si).toBeCloseTo(0.2, 12);
		expect(again.value.switchedOff.map(({check}) => check.switched_off)).toEqual(['not here']);
	});

	it('does not depend on where the files are', () => {
		const site = `${head}policy_changed:\n  margin:\n    value: 20 %\n`;
		const first = loadSite({'site.yaml': site});
		const second = loadSite({'other-name.yaml': site});
		expect(first.loaded.ok && second.loaded.ok).toBe(true);
		if (first.loaded.ok && second.loaded.ok) expect(first.loaded.value.sha256).toBe(second.loaded.value.sha256);
	});

	it('leaves a file with no base as it was: the text and hash are the file itself', () => {
		const text = readFileSync(shippedRulesPath(), 'utf8');
		const loaded = loadRulesFromText(text, shippedRulesPath());
		expect(loaded.ok && loaded.value.text).toBe(text);
		expect(loaded.ok && loaded.value.switchedOff).toEqual([]);
	});
});
