import {formatQuantity} from '../quantities/format.js';
import {durationText} from './duration-text.js';
import type {Device, Plan} from './plan-schema.js';

/** One step of the functional test: what to do and what must be seen. */
export type TestStep = {number: number; subject: string; action: string; expect: string};

/** The fixed words of every test sheet, the same in each rendering. */
export const sheetWords = {
	procedure: "Follow the laser safety officer's procedure for interlock tests (beam power, detector, eyewear, who is present). Time each stop with a detector on the beam or the driver's output current.",
	failed: 'Every step must pass. A failed step: stop, tag the loop out of service, and tell the laser safety officer.',
} as const;

/** The sheet's line on the policy: the largest response time and the test interval. */
export function policyLine(sheet: TestSheet): string {
	return `Largest response time (policy): ${sheet.limit}. Repeat this test at least every ${sheet.interval} (policy), and after any change to the loop.`;
}

/** The functional test of a plan, as data; rendered by testSheetMarkdown and testSheetHtml. */
export type TestSheet = {name: string; limit: string; /** The largest response time, s. */ limitSeconds: number; /** The test interval as text, e.g. "90 days". */ interval: string; steps: TestStep[]};

function openAction(device: Device): string {
	const name = `${device.id} (${device.description})`;
	switch (device.kind) {
		case 'door_switch':
		case 'lid_switch':
			return `open ${name}, then close it again.`;
		case 'key_switch':
			return `turn ${name} to off, then back on.`;
		case 'emergency_stop':
			return `press ${name}, then release it.`;
		case 'remote_connector':
			return device.shorting_plug ? `pull the shorting plug out of ${name}, then put it back.` : `unplug ${name}, then plug it back in.`;
		case 'fibre_presence':
			return `disconnect the fibre at ${name}, then reconnect it.`;
		case 'thermal_ok':
			return `open the contact ${name} (lift its lead at the terminal), then close it again.`;
		case 'flow_switch':
			return `stop the coolant flow through ${name}, then restore it.`;
		case 'bypass_key':
			return `engage ${name}, then release it.`;
	}
}

/**
 * The functional test sheet: one step per device in wiring order (open it, emission stops
 * within the policy's largest response time, close it, nothing restarts until reset), then
 * emergency stop, key removal, a broken loop wire, power interruption and bypass time-out.
 */
export function testSheet(plan: Plan): TestSheet {
	const limit = formatQuantity(plan.policy.max_response_time, 'time');
	const stops = `Emission stops within ${limit}.`;
	const noRestart = 'After closing, emission stays off until the reset is pressed.';
	const steps: Array<Omit<TestStep, 'number'>> = [];
	for (const device of plan.devices) {
		if (device.kind === 'bypass_key') continue;
		steps.push({subject: device.id, action: `With emission on, ${openAction(device)}`, expect: `${stops} ${noRestart}`});
	}
	const of = (kind: Device['kind']) => plan.devices.filter((device) => device.kind === kind).map((device) => device.id);
	const emergencyStops = of('emergency_stop');
	steps.push({
		subject: 'emergency stop',
		action: emergencyStops.length > 0 ? `From the operator's position, with emission on, press each emergency stop in turn (${emergencyStops.join(', ')}) and release it.` : 'The plan has no emergency stop: write n/a and the reason the laser safety officer accepted.',
		expect: `${stops} After release, emission stays off until the reset is pressed.`,
	});
	const keys = of('key_switch');
	steps.push({
		subject: 'key removal',
		action: `With emission on, turn ${keys.length > 0 ? `the key of ${keys.join(', ')}` : "the driver's key"} off and remove the key; then try to enable emission.`,
		expect: `${stops} With the key out, emission cannot be enabled.`,
	});
	steps.push({
		subject: 'loop wire break',
		action: 'With emission on, unplug the interlock loop at the input, then plug it back in.',
		expect: `${stops} After plugging in, emission stays off until the reset is pressed.`,
	});
	steps.push({
		subject: 'power interruption',
		action: "With emission on, switch off the driver's mains supply for 10 s, then switch it on again.",
		expect: 'Emission stops; after power returns, emission stays off until it is enabled and reset by hand.',
	});
	const bypasses = plan.devices.filter((device) => device.kind === 'bypass_key' || device.shorting_plug);
	for (const device of bypasses) {
		const time = device.bypass?.time_limit;
		steps.push({
			subject: `bypass time-out: ${device.id}`,
			action: `Engage the bypass ${device.id} as its owner${device.bypass?.owner ? ` (${device.bypass.owner})` : ''} would, and wait ${time === undefined ? 'its time limit (none is given: see the findings)' : durationText(time)}.`,
			expect: 'When the time limit ends the bypass is withdrawn (key returned, plug removed, or it expires), and opening the bypassed device stops emission.',
		});
	}
	if (bypasses.length === 0) steps.push({subject: 'bypass time-out', action: 'The plan has no bypass: look at the loop and its connectors for a fitted jumper or shorting plug.', expect: 'None is fitted.'});
	return {name: plan.name, limit, limitSeconds: plan.policy.max_response_time, interval: durationText(plan.policy.test_interval), steps: steps.map((step, index) => ({number: index + 1, ...step}))};
}
