import {didYouMean} from '../../shared/did-you-mean.js';
import {kindText} from './fail-safe.js';
import {finding, type Finding} from './finding.js';
import type {Plan} from '../plan/plan-schema.js';

/**
 * Every access point through which a beam can be reached is interlocked or tool-secured, and
 * an interlocked one names a device of the loop; a door or lid switch that no access point
 * names is advised, since nobody can tell what it guards.
 */
export function coverageFindings(plan: Plan): Finding[] {
	const ids = plan.devices.map((device) => device.id);
	const found: Finding[] = [];
	for (const point of plan.access_points) {
		const subject = {kind: 'access_point' as const, id: point.id};
		if (point.secured_by === 'interlock') {
			if (point.device === undefined) found.push(finding('interlock-access-no-device', 'stop', subject));
			else if (!ids.includes(point.device)) found.push(finding('interlock-access-unknown-device', 'stop', subject, {device: point.device, hint: didYouMean(point.device, ids)}));
		} else if (point.secured_by === 'none' && point.beam_reachable) {
			found.push(finding('interlock-access-unsecured', 'stop', subject));
		}
	}
	const named = new Set(plan.access_points.flatMap((point) => (point.secured_by === 'interlock' && point.device ? [point.device] : [])));
	for (const device of plan.devices) {
		if ((device.kind === 'door_switch' || device.kind === 'lid_switch') && !named.has(device.id)) found.push(finding('interlock-guards-nothing', 'advise', {kind: 'device', id: device.id}, {kind: kindText(device.kind)}));
	}
	return found;
}
