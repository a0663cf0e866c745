import {describe, expect, it} from 'vitest';
import {planProblemWords} from '../../../source/ui/planner/plan-problem-words.js';
import {loadPlanUnderShippedPolicy} from '../../interlock/plan-fixture.js';

const plan = loadPlanUnderShippedPolicy();

// The demo plan's devices in wiring order: lid_switch, fibre_sense, estop_bench, door_switch, … alignment_bypass (7th).
describe('plan problems in the words of the planner', () => {
	it.each([
		{message: 'devices.3.wire_to_next.length: expected a length with its unit', words: 'device 4 (door_switch): length to the next device: expected a length with its unit'},
		{message: 'devices.6.wire_to_next.awg: expected number, got string "262 m"', words: 'device 7 (alignment_bypass): wire size: "262 m" is not a number'},
		{message: 'devices.0.opening_time: "8 V" is a voltage', words: 'device 1 (lid_switch): opening time: "8 V" is a voltage'},
		{message: 'the id "lid_switch" is already used by devices.0; ids must be unique', words: 'the id "lid_switch" is already used by device 1 (lid_switch); ids must be unique'},
		{message: 'access_points.1.secured_by: expected one of', words: 'access point 2 (side_panel): secured by: expected one of'},
		{message: 'devices.7.contact: required field missing: expected string', words: 'the new device: contact: needed: this field cannot be left empty'},
		{message: 'input.wire_to_first.length: "3" has no unit', words: 'the run from the input to the first device: length: "3" has no unit'},
	])('$message', ({message, words}) => {
		expect(planProblemWords(message, plan)).toBe(words);
	});

	it.each([
		{message: 'plan.yaml:61:32: error: devices.3.wire_to_next.length: "12" has no unit', words: 'plan.yaml:61:32: error: device 4: length to the next device: "12" has no unit'},
		{message: 'plan.yaml:20:5: error: access_points.0.beam_reachable: expected boolean', words: 'plan.yaml:20:5: error: access point 1: beam reachable: expected boolean'},
	])('names items by their place alone for a plan that does not load: $message', ({message, words}) => {
		expect(planProblemWords(message)).toBe(words);
	});
});
