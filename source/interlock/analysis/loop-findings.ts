import {formatQuantity} from '../../quantities/format.js';
import {finding, type Finding} from './finding.js';
import {inSeriesPath, type LoopResistance} from './loop-resistance.js';
import type {Plan} from '../plan/plan-schema.js';

/** The resistance the loop may have: the input's closed threshold less the policy margin. */
export function allowedResistance(plan: Plan): number {
	return plan.input.closed_below * (1 - plan.policy.resistance_margin);
}

/** The loop resistance against the input's threshold, and the loop current and voltage against every contact's rating. */
export function loopFindings(plan: Plan, resistance: LoopResistance, current: number): Finding[] {
	const found: Finding[] = [];
	const allowed = allowedResistance(plan);
	if (resistance.total > allowed) {
		found.push(
			finding('interlock-loop-resistance', 'stop', {kind: 'loop'}, {
				resistance: formatQuantity(resistance.total, 'resistance'),
				allowed: formatQuantity(allowed, 'resistance'),
				threshold: formatQuantity(plan.input.closed_below, 'resistance'),
				margin: formatQuantity(plan.policy.resistance_margin, 'ratio'),
			}),
		);
	}
	// A test answers only a bench check at its plan's location: without one, no check can use it.
	if (plan.location === undefined) found.push(finding('interlock-plan-no-location', 'advise', {kind: 'loop'}));
	if (!plan.input.wire_to_first) found.push(finding('interlock-run-missing', 'advise', {kind: 'input'}, {where: 'from the input to the first device', field: 'input.wire_to_first'}));
	for (const device of plan.devices) {
		if (inSeriesPath(device) && !device.wire_to_next) found.push(finding('interlock-run-missing', 'advise', {kind: 'device', id: device.id}, {where: 'from this device to the next', field: 'wire_to_next'}));
	}
	for (const device of plan.devices) {
		if (!inSeriesPath(device) && device.kind !== 'bypass_key') continue;
		const subject = {kind: 'device' as const, id: device.id};
		if (current > device.rated_current) found.push(finding('interlock-contact-current', 'stop', subject, {current: formatQuantity(current, 'current'), rating: formatQuantity(device.rated_current, 'current')}));
		if (plan.input.loop_voltage > device.rated_voltage) found.push(finding('interlock-contact-voltage', 'stop', subject, {voltage: formatQuantity(plan.input.loop_voltage, 'voltage'), rating: formatQuantity(device.rated_voltage, 'voltage')}));
	}
	return found;
}
