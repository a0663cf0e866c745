import {describe, expect, it} from 'vitest';
import {testSheet} from '../../../source/interlock/functional-test/test-sheet.js';
import {doorSwitch, makePlan} from '../plan-fixture.js';

/** A plan's input with `latches` set, the rest as the fixture has it. */
const input = (latches: boolean) => ({description: 'test input', loop_voltage: '24 V', sense_current: '10 mA', closed_below: '100 ohm', response_time: '1 ms', disable_time: '1 ms', latches});
const device = (id: string, kind: string, changes: Record<string, unknown> = {}) => doorSwitch(id, {kind, ...changes});

/** The wording of a step that expects a manual reset. */
const resetWords = /reset/i;

describe('the test sheet follows its plan', () => {
	// A reset is only expected of an input that latches (the plan's `latches`); IEC 60825-1 asks a
	// manual reset of class 4 after an interruption (from memory), which the analysis already
	// requires; the sheet must not expect a reset the plan says is not there (common practice:
	// a test sheet tests the loop as planned).
	it.each([
		{latches: true, laser_class: 'class_4', expectReset: true},
		{latches: false, laser_class: 'class_3r', expectReset: false},
		{latches: false, laser_class: 'class_4', expectReset: false},
	])('latches: $latches ($laser_class): a reset is expected on a step: $expectReset', ({latches, laser_class, expectReset}) => {
		const sheet = testSheet(makePlan({laser_class, input: input(latches)}));
		const withReset = sheet.steps.filter((step) => resetWords.test(`${step.action} ${step.expect}`));
		if (expectReset) {
			// every device step, the wire break and the power interruption expect it
			expect(withReset.map((step) => step.subject)).toEqual(['door_switch', 'estop', 'loop wire break', 'power interruption']);
		} else {
			expect(withReset).toEqual([]);
		}
	});

	// common practice: a key-removal step only where the loop has a key switch
	it.each([
		{name: 'no key switch', devices: [doorSwitch('door_switch'), device('estop', 'emergency_stop')], keySteps: [] as string[]},
		{name: 'one key switch', devices: [doorSwitch('door_switch'), device('shelf_key', 'key_switch')], keySteps: ['shelf_key']},
	])('$name: steps about a key: $keySteps', ({devices, keySteps}) => {
		const sheet = testSheet(makePlan({devices}));
		expect(sheet.steps.filter((step) => /\bkey\b/i.test(`${step.subject} ${step.action} ${step.expect}`)).map((step) => step.subject)).toEqual(keySteps);
	});

	it('the key switch step removes the key and tries to enable emission (one step for the device)', () => {
		const sheet = testSheet(makePlan({devices: [doorSwitch('door_switch'), device('shelf_key', 'key_switch')]}));
		const step = sheet.steps.find((entry) => entry.subject === 'shelf_key')!;
		expect(step.action).toContain('remove the key');
		expect(step.expect).toContain('With the key out, emission cannot be enabled.');
	});

	// common practice: one step per device; each emergency stop is pressed once
	it.each([
		{name: 'one emergency stop', stops: ['estop']},
		{name: 'two emergency stops', stops: ['estop_bench', 'estop_door']},
		{name: 'none', stops: [] as string[]},
	])('$name: each device named by exactly one step', ({stops}) => {
		const devices = [doorSwitch('door_switch'), ...stops.map((id) => device(id, 'emergency_stop'))];
		const sheet = testSheet(makePlan({devices}));
		for (const id of ['door_switch', ...stops]) {
			expect(sheet.steps.filter((step) => new RegExp(`\\b${id}\\b`).test(`${step.subject} ${step.action}`)).map((step) => step.subject)).toEqual([id]);
		}
		expect(sheet.steps.filter((step) => /emergency stop/i.test(step.subject))).toEqual([]);
		expect(sheet.steps.map((step) => step.subject)).toEqual(['door_switch', ...stops, 'loop wire break', 'power interruption', 'bypass time-out']);
	});

	// common practice: a fibre or connector is never opened with full emission on; do it at reduced
	// power, or time the stop on the driver's output current
	it.each([
		{name: 'a fibre-presence contact', devices: [doorSwitch('door_switch'), device('fibre_sense', 'fibre_presence')], subject: 'fibre_sense'},
		{name: 'a remote connector', devices: [doorSwitch('door_switch'), device('remote_plug', 'remote_connector')], subject: 'remote_plug'},
		{name: 'a shorting plug', devices: [doorSwitch('door_switch'), device('remote_plug', 'remote_connector', {shorting_plug: true, bypass: {owner: 'bench owner', reason: 'no remote door', time_limit: '1 h'}})], subject: 'remote_plug'},
		{name: 'the loop unplugged at the input', devices: [doorSwitch('door_switch')], subject: 'loop wire break'},
	])('$name: done at reduced power, watching the driver current', ({devices, subject}) => {
		const step = testSheet(makePlan({devices})).steps.find((entry) => entry.subject === subject)!;
		expect(step.action).not.toMatch(/with emission on/i);
		expect(step.action).toContain('reduced power');
		expect(step.action).toContain("driver's output current");
	});

	it('a switch that does not open an optical path keeps "with emission on"', () => {
		const step = testSheet(makePlan()).steps[0]!;
		expect(step.action).toBe('With emission on, open door_switch (door switch door_switch), then close it again.');
	});
});
