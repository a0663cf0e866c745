import {formatQuantity} from '../../quantities/format.js';
import {durationText} from '../analysis/duration-text.js';
import type {Device, Plan} from '../plan/plan-schema.js';

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

/** Devices whose opening opens an optical path or a connector: tested at reduced power, timed on the driver's current. */
const opensAPath = new Set<Device['kind']>(['fibre_presence', 'remote_connector']);

/** How to test a path or connector without exposing anyone: reduced power, the stop timed on the driver's current (common practice). */
const reducedPower = "With the driver enabled at reduced power (the procedure's alignment power), watching the driver's output current on a meter and not the opening,";

function openAction(device: Device): string {
	const name = `${device.id} (${device.description})`;
	switch (device.kind) {
		case 'door_switch':
		case 'lid_switch':
			return `open ${name}, then close it again.`;
		case 'key_switch':
			return `turn ${name} to off and remove the key; try to enable emission; then put the key back and turn it on.`;
		case 'emergency_stop':
			return `press ${name} from the operator's position, then release it.`;
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
 * within the policy's largest response time, close it; a reset is expected only of an input
 * that latches), then a broken loop wire, power interruption and each bypass's time-out.
 * A fibre or connector is opened at reduced power, the stop timed on the driver's output
 * current; a key switch's step removes the key and tries to enable emission.
 */
export function testSheet(plan: Plan): TestSheet {
	const limit = formatQuantity(plan.policy.max_response_time, 'time');
	const stops = `Emission stops within ${limit}.`;
	const currentStops = `The driver's output current falls to zero within ${limit}.`;
	const latches = plan.input.latches;
	const afterClosing = (when: string) =>
		latches ? `${when}, emission stays off until the reset is pressed.` : `The input does not latch: ${when.toLowerCase()}, emission may resume, so keep the beam path clear.`;
	const steps: Array<Omit<TestStep, 'number'>> = [];
	for (const device of plan.devices) {
		if (device.kind === 'bypass_key') continue;
		const path = opensAPath.has(device.kind);
		const action = path ? `${reducedPower} ${openAction(device)}` : `With emission on, ${openAction(device)}`;
		const when = device.kind === 'emergency_stop' ? 'After release' : device.kind === 'key_switch' ? 'After the key is turned on again' : path ? 'After reconnecting' : 'After closing';
		const keyOut = device.kind === 'key_switch' ? ' With the key out, emission cannot be enabled.' : '';
		steps.push({subject: device.id, action, expect: `${path ? currentStops : stops}${keyOut} ${afterClosing(when)}`});
	}
	steps.push({
		subject: 'loop wire break',
		action: `${reducedPower} unplug the interlock loop at the input, then plug it back in.`,
		expect: `${currentStops} ${afterClosing('After plugging in')}`,
	});
	steps.push({
		subject: 'power interruption',
		action: "With emission on, switch off the driver's mains supply for 10 s, then switch it on again.",
		expect: latches ? 'Emission stops; after power returns, emission stays off until it is enabled and reset by hand.' : 'Emission stops; after power returns, emission stays off until it is enabled by hand.',
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
