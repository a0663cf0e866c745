import {planSchema, type Plan} from '../../source/interlock/plan-schema.js';

/** A device as written in a plan file (values with units). */
export type DeviceEntry = Record<string, unknown>;

/** A normally-closed, series, positive-opening door switch with a short run; tests change what they study. */
export function doorSwitch(id: string, changes: DeviceEntry = {}): DeviceEntry {
	return {
		id,
		kind: 'door_switch',
		description: `door switch ${id}`,
		contact: 'normally_closed',
		contact_resistance: '0 ohm',
		rated_current: '1 A',
		rated_voltage: '30 V',
		positive_opening: true,
		opening_time: '5 ms',
		...changes,
	};
}

/** The plan as written in a file, before validation: one door switch guarding one door. */
export function planEntry(changes: Record<string, unknown> = {}): Record<string, unknown> {
	return {
		format: 1,
		name: 'test loop',
		laser_class: 'class_4',
		wire_temperature: '20 degC',
		input: {description: 'test input', loop_voltage: '24 V', sense_current: '10 mA', closed_below: '100 ohm', response_time: '1 ms', disable_time: '1 ms', latches: true},
		policy: {max_response_time: '20 ms', resistance_margin: '20 %', manual_reset_for_class_4: true, test_interval_days: 180, bypasses_allowed: true, longest_bypass: '8 h'},
		access_points: [{id: 'door', description: 'the door', beam_reachable: true, secured_by: 'interlock', device: 'door_switch'}],
		devices: [doorSwitch('door_switch'), {...doorSwitch('estop'), kind: 'emergency_stop'}],
		...changes,
	};
}

/** Validates a plan entry; throws when a test wrote an invalid one, since that is the test's mistake. */
export function makePlan(changes: Record<string, unknown> = {}): Plan {
	return planSchema.parse(planEntry(changes));
}
