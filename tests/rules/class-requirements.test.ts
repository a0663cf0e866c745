import {mkdtempSync, rmSync, writeFileSync} from 'node:fs';
import {tmpdir} from 'node:os';
import {join} from 'node:path';
import {afterAll, describe, expect, it} from 'vitest';
import type {CompiledRules} from '../../source/rules/compile/compiled-rules.js';
import {loadRules, loadRulesFromText} from '../../source/rules/load.js';
import {checkResult, evaluateDocument, readDemo, shippedRules, withChanges} from './bench-answers.js';

// Class-specific requirements apply to the classes a policy value lists. The emission delay
// and the manual reset are product requirements for Class 3B and Class 4 (US 21 CFR
// 1040.10(f), from memory: an emission indicator giving a warning before emission, and a
// manual reset, for Class IIIb and IV); the duration of the delay is site policy.
const rules = shippedRules();
const clear = readDemo('bench3-808nm-clear.yaml');
const noDelay = (laserClass: string) => withChanges(clear, {laser_class: laserClass, emission_delay: '0 s'}, {manual_reset_after_interruption: null});

describe('class-specific requirements in the shipped policy', () => {
	it.each([
		{laserClass: 'class_1', verdict: 'skip'}, // 21 CFR 1040.10(f) (from memory): no emission delay for Class I
		{laserClass: 'class_2', verdict: 'skip'}, // 21 CFR 1040.10(f) (from memory): no emission delay for Class II
		{laserClass: 'class_3r', verdict: 'skip'}, // 21 CFR 1040.10(f) (from memory): the warning before emission is for Class IIIb and IV
		{laserClass: 'class_3b', verdict: 'fail'}, // 21 CFR 1040.10(f) (from memory): Class IIIb warns before emission
		{laserClass: 'class_4', verdict: 'fail'}, // 21 CFR 1040.10(f) (from memory): Class IV warns before emission
	])('$laserClass with no emission delay and no manual reset answer: $verdict', ({laserClass, verdict}) => {
		const evaluation = evaluateDocument(rules, noDelay(laserClass));
		expect(checkResult(evaluation, 'emission_delay_long_enough').verdict).toBe(verdict);
		const reset = evaluation.confirmations.find(({id}) => id === 'manual_reset_after_interruption')!;
		expect(reset.status).toBe(verdict === 'skip' ? 'skip' : 'unanswered');
		expect(evaluation.outcome).toBe(verdict === 'skip' ? 'clear_to_energize' : 'do_not_energize');
	});

	it('names the classes as a policy value of laser_class options, defaulting to Class 3B and Class 4', () => {
		// 21 CFR 1040.10(f) (from memory): Class IIIb and IV
		expect(rules.rules.policy['emission_delay_classes']).toMatchObject({options_of: 'laser_class', value: ['class_3b', 'class_4']});
		expect(rules.rules.policy['manual_reset_classes']).toMatchObject({options_of: 'laser_class', value: ['class_3b', 'class_4']});
	});

	it('says in the basis that the warning is the product requirement and the duration is site policy', () => {
		const basis = rules.rules.checks.find(({id}) => id === 'emission_delay_long_enough')!.basis;
		expect(basis).toMatch(/21 CFR 1040\.10/);
		expect(basis).toMatch(/site policy/);
	});
});

describe('a site that changes the classes', () => {
	const folder = mkdtempSync(join(tmpdir(), 'prelase-classes-'));
	afterAll(() => rmSync(folder, {recursive: true, force: true}));
	const site = (value: string): CompiledRules => {
		const file = join(folder, `site-${value.replace(/\W/g, '')}.yaml`);
		writeFileSync(file, `format: 1\nextends: shipped\npolicy_changed:\n  emission_delay_classes:\n    value: ${value}\n    basis: site policy, stricter than the product requirement\n`);
		const loaded = loadRules(file);
		if (!loaded.ok) throw new Error(loaded.errors.map((found) => `${found.code} ${JSON.stringify(found.data)}`).join(', '));
		return loaded.value;
	};

	it('stops a Class 3R setup with no delay when the site lists Class 3R too', () => {
		// site policy stricter than 21 CFR 1040.10(f) (from memory: Class IIIb and IV only)
		const evaluation = evaluateDocument(site('[class_3r, class_3b, class_4]'), noDelay('class_3r'));
		expect(checkResult(evaluation, 'emission_delay_long_enough').verdict).toBe('fail');
	});

	it('refuses a class that is not an option of laser_class, at its line', () => {
		const file = join(folder, 'wrong.yaml');
		writeFileSync(file, 'format: 1\nextends: shipped\npolicy_changed:\n  emission_delay_classes:\n    value: [class_3b, class_5]\n');
		const loaded = loadRules(file);
		expect(loaded.ok).toBe(false);
		if (loaded.ok) return;
		const found = loaded.errors.find(({data}) => JSON.stringify(data).includes('class_5'));
		expect(found, JSON.stringify(loaded.errors)).toBeDefined();
		expect(found!.line).toBe(5);
	});
});

const fixture = (policy: string, when: string) => `format: 1
name: class fixture
caution: Test fixture only.
policy:
${policy}
steps:
  - id: start
    title: Start
    inputs:
      - id: laser_class
        kind: choice
        label: Class
        options: {class_2: Class 2, class_3b: Class 3B, class_4: Class 4}
      - id: control_mode
        kind: choice
        label: Mode
        options: {constant_current: CC, constant_power: CP}
      - id: delay
        label: Delay
        dimension: time
        range: [0 s, 60 s]
checks:
  - id: delay_long_enough
    step: start
    title: Delay
    when: ${when}
    value: delay
    at_least: 3 s
    severity: stop
    explanation: fixture
    basis: site policy
`;
const classes = `  delay_classes:
    options_of: laser_class
    value: [class_3b, class_4]
    meaning: Classes that need a delay
    basis: site policy`;

describe('a policy value that lists options of a choice', () => {
	it('loads and tests membership with one_of', () => {
		const loaded = loadRulesFromText(fixture(classes, 'one_of(laser_class, delay_classes)'), 'fixture.yaml');
		expect(loaded.ok, loaded.ok ? '' : JSON.stringify(loaded.errors)).toBe(true);
	});

	it.each([
		{name: 'an option the choice does not have', policy: classes.replace('class_4]', 'class_9]'), when: 'one_of(laser_class, delay_classes)', has: 'class_9'},
		{name: 'a choice that does not exist', policy: classes.replace('options_of: laser_class', 'options_of: laser_klass'), when: 'delay >= 0 s', has: 'laser_klass'},
		{name: 'both a dimension and options_of', policy: classes.replace('    meaning:', '    dimension: time\n    meaning:'), when: 'delay >= 0 s', has: 'dimension'},
		{name: 'the list tested against another choice', policy: classes, when: 'one_of(control_mode, delay_classes)', has: 'control_mode'},
		{name: 'the list used as a number', policy: classes, when: 'delay_classes', has: 'delay_classes'},
	])('refuses $name', ({policy, when, has}) => {
		const loaded = loadRulesFromText(fixture(policy, when), 'fixture.yaml');
		expect(loaded.ok).toBe(false);
		if (!loaded.ok) expect(JSON.stringify(loaded.errors)).toContain(has);
	});
});
