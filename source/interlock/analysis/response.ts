import {formatQuantity} from '../../quantities/format.js';
import {finding, type Finding} from './finding.js';
import {inSeriesPath} from './loop-resistance.js';
import type {Plan} from '../plan/plan-schema.js';

/** The time from actuating one device until emission has stopped, in seconds. */
export type DeviceResponse = {device: string; opening: number; total: number};

/** Each series device's response: its opening time plus the input's response plus the driver's disable and fall time. */
export function responses(plan: Plan): DeviceResponse[] {
	const common = plan.input.response_time + plan.input.disable_time;
	return plan.devices.filter(inSeriesPath).map((device) => ({device: device.id, opening: device.opening_time, total: device.opening_time + common}));
}

/** A stop finding for every device whose response is above the policy's largest response time. */
export function responseFindings(plan: Plan, found: readonly DeviceResponse[] = responses(plan)): Finding[] {
	const limit = plan.policy.max_response_time;
	return found
		// Sums of decimal times are not exact in binary; a total that equals the limit to 1e-12 is at it, not above.
		.filter((entry) => entry.total > limit * (1 + 1e-12))
		.map((entry) =>
			finding('interlock-response', 'stop', {kind: 'device', id: entry.device}, {
				opening: formatQuantity(entry.opening, 'time'),
				input: formatQuantity(plan.input.response_time, 'time'),
				disable: formatQuantity(plan.input.disable_time, 'time'),
				total: formatQuantity(entry.total, 'time'),
				limit: formatQuantity(limit, 'time'),
			}),
		);
}
