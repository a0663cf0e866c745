import {durationText} from './duration-text.js';
import {finding, type Finding} from './finding.js';
import type {Device, Plan} from '../plan/plan-schema.js';

const words: Record<Device['kind'], string> = {
	door_switch: 'door switch',
	lid_switch: 'lid switch',
	key_switch: 'key switch',
	emergency_stop: 'emergency stop',
	remote_connector: 'remote interlock connector',
	fibre_presence: 'fibre-presence contact',
	thermal_ok: 'thermal-OK contact',
	flow_switch: 'flow switch',
	bypass_key: 'bypass key',
};

/** A device kind in words. */
export function kindText(kind: Device['kind']): string {
	return words[kind];
}

/**
 * Fail-safe findings of one device: opening it, a broken wire or an unplugged connector must
 * stop emission, so it is normally closed and in series. A bypass key is normally open and
 * across another device by design; it and a shorting plug are judged by their bypass record.
 */
export function deviceFailSafeFindings(device: Device, plan: Plan): Finding[] {
	const subject = {kind: 'device' as const, id: device.id};
	const found: Finding[] = [];
	if (device.kind === 'bypass_key') return [...bypassFindings(device, plan, 'bypass key'), ...bypassTarget(device, plan)];
	if (device.contact === 'normally_open') found.push(finding('interlock-normally-open', 'stop', subject));
	if (device.wiring === 'parallel') found.push(finding('interlock-parallel', 'stop', subject));
	if (!device.positive_opening && (device.kind === 'emergency_stop' || device.kind === 'door_switch' || device.kind === 'lid_switch')) {
		// An emergency stop must open whatever happens to its contact; a door or lid switch is advised.
		found.push(finding('interlock-not-positive-opening', device.kind === 'emergency_stop' ? 'stop' : 'advise', subject, {kind: kindText(device.kind)}));
	}
	if (device.shorting_plug) found.push(...bypassFindings(device, plan, 'shorting plug'));
	return found;
}

/** A bypass (key or shorting plug) must be allowed by policy and have an owner, a reason and a time limit within the policy. */
function bypassFindings(device: Device, plan: Plan, what: string): Finding[] {
	const subject = {kind: 'device' as const, id: device.id};
	if (plan.policy.longest_bypass <= 0) return [finding('interlock-bypass-not-allowed', 'stop', subject, {what})];
	const record = device.bypass ?? {};
	const missing = (['owner', 'reason', 'time_limit'] as const).filter((field) => record[field] === undefined);
	const found: Finding[] = [];
	if (missing.length > 0) found.push(finding('interlock-bypass-incomplete', 'stop', subject, {what, missing: missing.map((field) => field.replace('_', ' ')).join(', ')}));
	const longest = plan.policy.longest_bypass;
	if (record.time_limit !== undefined && record.time_limit > longest) {
		found.push(finding('interlock-bypass-too-long', 'stop', subject, {limit: durationText(record.time_limit), longest: durationText(longest)}));
	}
	return found;
}

function bypassTarget(device: Device, plan: Plan): Finding[] {
	if (device.bypasses === undefined || plan.devices.some((other) => other.id === device.bypasses)) return [];
	return [finding('interlock-bypass-target-unknown', 'stop', {kind: 'device', id: device.id}, {target: device.bypasses})];
}

/** Fail-safe findings of the whole loop: every device's, a manual reset for class 4, and an emergency stop. */
export function failSafeFindings(plan: Plan): Finding[] {
	const found = plan.devices.flatMap((device) => deviceFailSafeFindings(device, plan));
	if (plan.laser_class === 'class_4' && !plan.input.latches) found.push(finding('interlock-manual-reset', 'stop', {kind: 'input'}));
	if (!plan.devices.some((device) => device.kind === 'emergency_stop' && device.wiring === 'series')) found.push(finding('interlock-no-emergency-stop', 'advise', {kind: 'loop'}));
	return found;
}
