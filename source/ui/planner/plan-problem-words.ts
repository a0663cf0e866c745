import type {Plan} from '../../interlock/plan/plan-schema.js';
import {accessPointFields, deviceFields} from './plan-fields.js';

/** Words for the parts of a wire run, as its form names them. */
const runWords: Record<string, string> = {
	wire_to_next: 'wire run to the next device',
	'wire_to_next.awg': 'wire size',
	'wire_to_next.cross_section': 'wire size',
	'wire_to_next.length': 'length to the next device',
	'wire_to_next.conductors': 'conductors carrying the loop',
};

/** A field of an item in a technician's words: the form's label, lower case; a wire run's parts as its form names them. */
function fieldWords(list: 'devices' | 'access_points', path: string, plan: Plan | undefined): string {
	if (runWords[path]) return runWords[path];
	const known = plan ?? {devices: [], access_points: []};
	const fields = list === 'devices' ? deviceFields(known as Plan) : accessPointFields(known as Plan);
	const label = fields.find((field) => field.path.join('.') === path)?.label;
	return (label ?? path.replaceAll(/[._]/g, ' ')).toLowerCase();
}

/** An item named by its place and id: "device 4 (door_switch)"; past the end of its list, the item being added. */
function itemWords(list: 'devices' | 'access_points', index: number, plan: Plan | undefined): string {
	const noun = list === 'devices' ? 'device' : 'access point';
	if (!plan) return `${noun} ${index + 1}`;
	const item = plan[list][index];
	return item ? `${noun} ${index + 1} (${item.id})` : `the new ${noun}`;
}

/**
 * A message about a plan in the words of the planner's screens: a place in the file such as
 * `devices.3.wire_to_next.length` becomes "device 4 (door_switch): length to the next device",
 * and a schema's type wording becomes plain words. Without a plan (a file that does not load),
 * items are named by their place alone.
 */
export function planProblemWords(message: string, plan?: Plan): string {
	return message
		.replaceAll(/\b(devices|access_points)\.(\d+)((?:\.[a-z_]+)*)/g, (_, list: 'devices' | 'access_points', index: string, rest: string) => {
			const item = itemWords(list, Number(index), plan);
			return rest ? `${item}: ${fieldWords(list, rest.slice(1), plan)}` : item;
		})
		.replaceAll(/\binput\.wire_to_first(?:\.([a-z_]+))?/g, (_, part?: string) => `the run from the input to the first device${part ? `: ${part === 'length' ? 'length' : (runWords[`wire_to_next.${part}`] ?? part)}` : ''}`)
		.replaceAll(/expected number, got string ("[^"]*")/g, '$1 is not a number')
		.replaceAll(/required field missing: expected \w+/g, 'needed: this field cannot be left empty');
}
