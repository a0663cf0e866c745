import {describe, expect, it} from 'vitest';
import {analysePlan} from '../../../source/interlock/analysis/analyse.js';
import {deviceFailSafeFindings, failSafeFindings} from '../../../source/interlock/analysis/fail-safe.js';
import {deviceKinds} from '../../../source/interlock/plan/plan-schema.js';
import {deviceSchema} from '../../../source/interlock/plan/plan-schema.js';
import {doorSwitch, makePlan} from '../plan-fixture.js';

const complete = {owner: 'bench owner', reason: 'alignment', time_limit: '1 h'};

// Expected fail-safe findings of each kind, in series and positive-opening, per contact form.
// A bypass key is normally open across another device by design: it is judged by its bypass record.
const table = deviceKinds.flatMap((kind) =>
	(['normally_closed', 'normally_open'] as const).map((contact) => ({
		name: `${kind} ${contact}`,
		kind,
		contact,
		codes: kind === 'bypass_key' || contact === 'normally_closed' ? [] : ['interlock-normally-open'],
	})),
);

describe('fail-safe table: each device kind and contact form', () => {
	it.each(table)('$name', ({kind, contact, codes}) => {
		const device = deviceSchema.parse({...doorSwitch('device'), kind, contact, ...(kind === 'bypass_key' ? {bypass: complete, wiring: 'parallel'} : {})});
		const found = deviceFailSafeFindings(device, makePlan());
		expect(found.map((entry) => entry.code)).toEqual(codes);
		for (const entry of found) expect(entry).toMatchObject({severity: 'stop', subject: {kind: 'device', id: 'device'}});
	});

	it.each(deviceKinds.filter((kind) => kind !== 'bypass_key'))('%s wired in parallel is a stop finding', (kind) => {
		const device = deviceSchema.parse({...doorSwitch('device'), kind, wiring: 'parallel'});
		expect(deviceFailSafeFindings(device, makePlan()).map((entry) => [entry.code, entry.severity])).toEqual([['interlock-parallel', 'stop']]);
	});

	it.each([
		{kind: 'emergency_stop', expected: [['interlock-not-positive-opening', 'stop']]},
		{kind: 'door_switch', expected: [['interlock-not-positive-opening', 'advise']]},
		{kind: 'lid_switch', expected: [['interlock-not-positive-opening', 'advise']]},
		{kind: 'thermal_ok', expected: []},
		{kind: 'flow_switch', expected: []},
	])('$kind that is not positive-opening', ({kind, expected}) => {
		const device = deviceSchema.parse({...doorSwitch('device'), kind, positive_opening: false});
		expect(deviceFailSafeFindings(device, makePlan()).map((entry) => [entry.code, entry.severity])).toEqual(expected);
	});
});

describe('bypasses and shorting plugs', () => {
	const plug = (bypass?: Record<string, string | undefined>) => deviceSchema.parse({...doorSwitch('remote'), kind: 'remote_connector', shorting_plug: true, ...(bypass ? {bypass} : {})});

	it.each([
		{name: 'a complete record', bypass: complete, expected: []},
		{name: 'no record', bypass: undefined, expected: [['interlock-bypass-incomplete', 'owner, reason, time limit']]},
		{name: 'no owner', bypass: {reason: 'alignment', time_limit: '1 h'}, expected: [['interlock-bypass-incomplete', 'owner']]},
		{name: 'no time limit', bypass: {owner: 'x', reason: 'alignment'}, expected: [['interlock-bypass-incomplete', 'time limit']]},
		{name: 'a time limit past the policy 8 h', bypass: {...complete, time_limit: '9 h'}, expected: [['interlock-bypass-too-long', undefined]]},
	])('shorting plug with $name', ({bypass, expected}) => {
		const found = deviceFailSafeFindings(plug(bypass), makePlan());
		expect(found.map((entry) => [entry.code, entry.data['missing']])).toEqual(expected);
		for (const entry of found) expect(entry.severity).toBe('stop');
	});

	it('a bypass time limit past the policy says both times', () => {
		const [found] = deviceFailSafeFindings(plug({...complete, time_limit: '9 h'}), makePlan());
		expect(found!.data).toEqual({limit: '9 h', longest: '8 h'});
	});

	it('a bypass where the policy allows none (longest bypass 0 s) is a stop finding, record or not', () => {
		const found = deviceFailSafeFindings(plug(complete), makePlan({}, {longest_bypass: 0}));
		expect(found.map((entry) => [entry.code, entry.data['what']])).toEqual([['interlock-bypass-not-allowed', 'shorting plug']]);
	});

	it('a bypass key that names a device not in the loop', () => {
		const key = deviceSchema.parse({...doorSwitch('key'), kind: 'bypass_key', contact: 'normally_open', wiring: 'parallel', bypasses: 'lid_switc', bypass: complete});
		expect(deviceFailSafeFindings(key, makePlan()).map((entry) => [entry.code, entry.data['target']])).toEqual([['interlock-bypass-target-unknown', 'lid_switc']]);
	});
});

describe('manual reset and emergency stop', () => {
	const input = (latches: boolean) => ({description: 'in', loop_voltage: '24 V', sense_current: '10 mA', closed_below: '100 ohm', response_time: '1 ms', disable_time: '1 ms', latches});

	it.each([
		// IEC 60825-1: a class 4 laser needs a manual reset to resume emission after the remote interlock opens
		{name: 'class 4, input does not latch', laser_class: 'class_4', latches: false, stop: true},
		{name: 'class 4, input latches', laser_class: 'class_4', latches: true, stop: false},
		{name: 'class 3B, input does not latch', laser_class: 'class_3b', latches: false, stop: false},
	])('$name', ({laser_class, latches, stop}) => {
		const plan = makePlan({laser_class, input: input(latches)});
		const found = failSafeFindings(plan).filter((entry) => entry.code === 'interlock-manual-reset');
		expect(found).toEqual(stop ? [{code: 'interlock-manual-reset', severity: 'stop', subject: {kind: 'input'}, data: {}}] : []);
	});

	it('advises when the loop has no emergency stop', () => {
		const analysis = analysePlan(makePlan({devices: [doorSwitch('door_switch')]}));
		expect(analysis.findings.filter((entry) => entry.code === 'interlock-no-emergency-stop').map((entry) => [entry.severity, entry.subject])).toEqual([['advise', {kind: 'loop'}]]);
		expect(analysis.stops).toBe(0);
		expect(analysePlan(makePlan()).findings.filter((entry) => entry.code === 'interlock-no-emergency-stop')).toEqual([]);
	});
});
