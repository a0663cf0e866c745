import {planSchema, type Plan} from '../../source/interlock/plan/plan-schema.js';
import {loadPlan} from '../../source/interlock/plan/load-plan.js';
import {interlockPolicy, type InterlockPolicy} from '../../source/interlock/plan/policy.js';
import {loadRules, shippedRulesPath} from '../../source/rules/load.js';
import {openPlanForEditing, type PlanEditing} from '../../source/interlock/plan/plan-edit.js';
import {copyFileSync, mkdtempSync} from 'node:fs';
import {tmpdir} from 'node:os';
import {join} from 'node:path';

/** The demo plan of the invented Fenwick Hollow lab. */
export const demoPlanFile = 'docs/examples/interlock/bench3-interlock-plan.yaml';

/** The interlock policy of the shipped rule file. */
export function shippedPolicy(): InterlockPolicy {
	const rules = loadRules(shippedRulesPath());
	if (!rules.ok) throw new Error(JSON.stringify(rules.errors));
	const policy = interlockPolicy(rules.value);
	if (!policy.ok) throw new Error(JSON.stringify(policy.errors));
	return policy.value;
}

/** A plan file loaded under the shipped policy (the demo plan by default). */
export function loadPlanUnderShippedPolicy(file = demoPlanFile): Plan {
	const loaded = loadPlan(file);
	if (!loaded.ok) throw new Error(JSON.stringify(loaded.errors));
	return {...loaded.value, policy: shippedPolicy()};
}

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
		access_points: [{id: 'door', description: 'the door', beam_reachable: true, secured_by: 'interlock', device: 'door_switch'}],
		devices: [doorSwitch('door_switch'), {...doorSwitch('estop'), kind: 'emergency_stop'}],
		...changes,
	};
}

/** The interlock policy the tests assume unless they study it: 20 ms, 20 %, 180 days, 8 h. */
export function testPolicy(changes: Partial<InterlockPolicy> = {}): InterlockPolicy {
	return {max_response_time: 0.02, resistance_margin: 0.2, test_interval: 180 * 86_400, longest_bypass: 8 * 3600, ...changes};
}

/** Validates a plan entry and gives it a policy; throws when a test wrote an invalid one, since that is the test's mistake. */
export function makePlan(changes: Record<string, unknown> = {}, policy: Partial<InterlockPolicy> = {}): Plan {
	return {...planSchema.parse(planEntry(changes)), policy: testPolicy(policy)};
}

/** The demo plan copied to a fresh folder and opened for editing under the shipped policy. */
export function openDemoForEditing(prefix = 'prelase-plan-edit-'): PlanEditing {
	const file = join(mkdtempSync(join(tmpdir(), prefix)), 'plan.yaml');
	copyFileSync(demoPlanFile, file);
	const rules = loadRules(shippedRulesPath());
	if (!rules.ok) throw new Error(JSON.stringify(rules.errors));
	const opened = openPlanForEditing(file, rules.value);
	if (!opened.ok) throw new Error(JSON.stringify(opened.errors));
	return opened.value;
}
