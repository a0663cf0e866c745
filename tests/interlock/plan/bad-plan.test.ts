import {readFileSync} from 'node:fs';
import {describe, expect, it} from 'vitest';
import {loadPlanFromText} from '../../../source/interlock/plan/load-plan.js';
import {describeProblem} from '../../../source/shared/problems.js';

const demo = readFileSync('docs/examples/interlock/bench3-interlock-plan.yaml', 'utf8');

/** The demo with one text replaced; fails the test if the text is not there. */
function edited(from: string, to: string): string {
	if (!demo.includes(from)) throw new Error(`the demo has no "${from}"`);
	return demo.replace(from, to);
}

/** The 1-based line of the first occurrence of a text in the demo. */
function lineOf(text: string): number {
	return demo.slice(0, demo.indexOf(text)).split('\n').length;
}

describe('bad plan files', () => {
	const invalid = [
		{name: 'a resistance without a unit', text: edited('closed_below: 100 ohm', 'closed_below: 100'), field: 'input.closed_below', line: lineOf('closed_below: 100 ohm'), says: 'has no unit'},
		{name: 'a time in volts', text: edited('opening_time: 8 ms', 'opening_time: 8 V'), field: 'devices.0.opening_time', line: lineOf('opening_time: 8 ms'), says: 'is a voltage'},
		{name: 'a negative contact resistance', text: edited('contact_resistance: 80 mohm', 'contact_resistance: -80 mohm'), field: 'devices.0.contact_resistance', line: lineOf('contact_resistance: 80 mohm'), says: 'zero or more'},
		{name: 'an unknown device kind', text: edited('kind: lid_switch', 'kind: lid_sensor'), field: 'devices.0.kind', line: lineOf('kind: lid_switch'), says: 'expected one of'},
		{name: 'an unknown field', text: edited('    positive_opening: true\n    opening_time: 8 ms', '    positive_opening: true\n    debounce: 2 ms\n    opening_time: 8 ms'), field: 'devices.0', line: lineOf('    opening_time: 8 ms'), says: 'unknown field "debounce"'},
		{name: 'a wire run with both awg and cross-section', text: edited('wire_to_next: {awg: 22, length: 1.5 m}', 'wire_to_next: {awg: 22, cross_section: 1 mm^2, length: 1.5 m}'), field: 'devices.0.wire_to_next', line: lineOf('wire_to_next: {awg: 22, length: 1.5 m}'), says: 'either awg or cross_section'},
		{name: 'an input without sense current or source resistance', text: edited('  sense_current: 10 mA\n', ''), field: 'input', line: lineOf('  description: LD-5L'), says: 'sense_current or source_resistance'},
		{name: 'a policy section (the policy is in the rule file)', text: edited('access_points:\n', 'policy:\n  max_response_time: 20 ms\naccess_points:\n'), field: 'policy', line: lineOf('access_points:\n') + 1, says: 'read from the rule file, not the plan'},
		{name: 'a duplicate id', text: edited('  - id: fibre_sense\n', '  - id: lid_switch\n'), field: 'devices.1.id', line: lineOf('  - id: fibre_sense'), says: 'already used by devices.0'},
		{name: 'an id shared by an access point and a device', text: edited('  - id: side_panel\n', '  - id: key_switch\n'), field: 'devices.5.id', line: lineOf('  - id: key_switch'), says: 'already used by access_points.1'},
	];

	it.each(invalid)('$name: file:line and field', ({text, field, line, says}) => {
		const result = loadPlanFromText(text, 'plan.yaml');
		expect(result.ok).toBe(false);
		if (result.ok) return;
		expect(result.errors).toHaveLength(1);
		const [found] = result.errors;
		expect(found).toMatchObject({file: 'plan.yaml', field, line});
		expect(found!.column).toBeGreaterThan(0);
		expect(describeProblem(found!)).toContain(says);
	});

	it.each([
		{name: 'YAML syntax', text: 'format: 1\nname: [unclosed\n', code: 'yaml-syntax'},
		{name: 'a duplicate key', text: 'format: 1\nformat: 1\n', code: 'yaml-duplicate-key'},
		{name: 'a list at the top', text: '- one\n- two\n', code: 'yaml-not-mapping'},
		{name: 'an empty file', text: '   \n', code: 'file-empty'},
	])('$name is refused with code $code', ({text, code}) => {
		const result = loadPlanFromText(text, 'plan.yaml');
		expect(result.ok).toBe(false);
		if (!result.ok) expect(result.errors.map((entry) => [entry.code, entry.file])).toEqual([[code, 'plan.yaml']]);
	});

	it('the demo itself loads', () => {
		expect(loadPlanFromText(demo, 'plan.yaml').ok).toBe(true);
	});
});
