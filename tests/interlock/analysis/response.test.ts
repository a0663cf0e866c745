import {describe, expect, it} from 'vitest';
import {analysePlan} from '../../../source/interlock/analysis/analyse.js';
import {responseFindings, responses} from '../../../source/interlock/analysis/response.js';
import {doorSwitch, makePlan} from '../plan-fixture.js';

describe('response budget', () => {
	it('adds each device opening time to the input response and the driver disable and fall', () => {
		const devices = [doorSwitch('door_switch', {opening_time: '12 ms'}), {...doorSwitch('estop', {opening_time: '3 ms'}), kind: 'emergency_stop'}];
		const timed = responses(makePlan({devices}));
		// hand arithmetic: 12 ms + 1 ms + 1 ms = 14 ms; 3 ms + 1 ms + 1 ms = 5 ms
		expect(timed.map((entry) => entry.device)).toEqual(['door_switch', 'estop']);
		expect(timed[0]!.total).toBeCloseTo(0.014, 12);
		expect(timed[1]!.total).toBeCloseTo(0.005, 12);
		expect(analysePlan(makePlan({devices})).slowest?.device).toBe('door_switch');
	});

	it.each([
		// hand arithmetic: the policy allows 20 ms; input 1 ms and disable 1 ms leave 18 ms for the device
		{name: 'under the limit', opening: '17 ms', stop: false},
		{name: 'exactly at the limit', opening: '18 ms', stop: false},
		{name: 'over the limit', opening: '18.5 ms', stop: true},
	])('$name', ({opening, stop}) => {
		const plan = makePlan({devices: [doorSwitch('door_switch', {opening_time: opening}), {...doorSwitch('estop'), kind: 'emergency_stop'}]});
		const found = responseFindings(plan);
		expect(found.length).toBe(stop ? 1 : 0);
		if (stop) {
			expect(found[0]).toMatchObject({code: 'interlock-response', severity: 'stop', subject: {kind: 'device', id: 'door_switch'}});
			expect(found[0]!.data).toEqual({opening: '18.5 ms', input: '1 ms', disable: '1 ms', total: '20.5 ms', limit: '20 ms'});
		}
	});

	it('leaves out a bypass key, which is not in the series path', () => {
		const key = {...doorSwitch('bypass', {opening_time: '1 s'}), kind: 'bypass_key', contact: 'normally_open', wiring: 'parallel', bypass: {owner: 'a', reason: 'b', time_limit: '1 h'}};
		const plan = makePlan({devices: [doorSwitch('door_switch'), {...doorSwitch('estop'), kind: 'emergency_stop'}, key]});
		expect(responses(plan).map((entry) => entry.device)).toEqual(['door_switch', 'estop']);
		expect(responseFindings(plan)).toEqual([]);
	});
});
