import {describe, expect, it} from 'vitest';
import {coverageFindings} from '../../../source/interlock/analysis/coverage.js';
import {doorSwitch, makePlan} from '../plan-fixture.js';

const point = (changes: Record<string, unknown>) => ({id: 'hatch', description: 'a hatch', beam_reachable: true, secured_by: 'interlock', device: 'door_switch', ...changes});

describe('coverage of access points', () => {
	it.each([
		{name: 'interlocked by a device of the loop', point: point({}), expected: []},
		{name: 'tool-secured', point: point({secured_by: 'tool', device: undefined}), expected: []},
		{name: 'unsecured, beam not reachable', point: point({secured_by: 'none', device: undefined, beam_reachable: false}), expected: []},
		{name: 'unsecured, beam reachable', point: point({secured_by: 'none', device: undefined}), expected: [['interlock-access-unsecured', 'stop']]},
		{name: 'interlocked, no device named', point: point({device: undefined}), expected: [['interlock-access-no-device', 'stop']]},
		{name: 'interlocked by a device not in the loop', point: point({device: 'door_swich'}), expected: [['interlock-access-unknown-device', 'stop']]},
	])('$name', ({point: entry, expected}) => {
		const plan = makePlan({access_points: [{id: 'door', description: 'the door', beam_reachable: true, secured_by: 'interlock', device: 'door_switch'}, entry]});
		const found = coverageFindings(plan);
		expect(found.map((finding) => [finding.code, finding.severity])).toEqual(expected);
		for (const finding of found) expect(finding.subject).toEqual({kind: 'access_point', id: 'hatch'});
	});

	it('suggests the device meant by a misspelt name', () => {
		const [found] = coverageFindings(makePlan({access_points: [point({device: 'door_swich'})]}));
		expect(found!.data).toEqual({device: 'door_swich', hint: ' (did you mean "door_switch"?)'});
	});

	it('advises on a door or lid switch that no access point names', () => {
		const devices = [doorSwitch('door_switch'), {...doorSwitch('spare_lid'), kind: 'lid_switch'}, {...doorSwitch('estop'), kind: 'emergency_stop'}];
		const found = coverageFindings(makePlan({devices}));
		expect(found.map((finding) => [finding.code, finding.severity, finding.subject])).toEqual([['interlock-guards-nothing', 'advise', {kind: 'device', id: 'spare_lid'}]]);
	});
});
