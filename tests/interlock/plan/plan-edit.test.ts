import {readdirSync, readFileSync} from 'node:fs';
import {join} from 'node:path';
import {describe, expect, it} from 'vitest';
import {loadPlan} from '../../../source/interlock/plan/load-plan.js';
import {addItem, moveDevice, planEditingText, removeItem, setItemField, type EditResult, type PlanEditing} from '../../../source/interlock/plan/plan-edit.js';
import {savePlanEditing} from '../../../source/interlock/plan/save-plan.js';
import {demoPlanFile, openDemoForEditing} from '../plan-fixture.js';

const demoText = readFileSync(demoPlanFile, 'utf8');

const openDemo = (): PlanEditing => openDemoForEditing('prelase-plan-edit-');

function applied(result: EditResult): PlanEditing {
	if (!result.ok) throw new Error(`refused: ${result.message}`);
	return result.editing;
}

const findings = (editing: PlanEditing) => editing.analysis.findings.map((found) => [found.severity, found.code, 'id' in found.subject ? found.subject.id : found.subject.kind]);

describe('editing a plan', () => {
	it('opens the demo with no findings, and writes it back byte for byte when nothing changed', () => {
		const editing = openDemo();
		expect(editing.analysis.stops).toBe(0);
		expect(editing.dirty).toBe(false);
		expect(planEditingText(editing)).toBe(demoText);
	});

	it('applies a field and analyses again: a normally-open emergency stop is a stop finding', () => {
		const editing = applied(setItemField(openDemo(), 'devices', 2, ['contact'], 'normally_open'));
		expect(editing.dirty).toBe(true);
		expect(editing.plan.devices[2]!.contact).toBe('normally_open');
		expect(findings(editing)).toEqual([['stop', 'interlock-normally-open', 'estop_bench']]);
	});

	const refused = [
		{name: 'a voltage for an opening time', path: ['opening_time'], value: '8 V', message: '"8 V" is a voltage, but this field is a time, for example "3 s"'},
		{name: 'an id already used', path: ['id'], value: 'lid_switch', message: 'the id "lid_switch" is already used by devices.0; device and access point ids must be unique'},
		{name: 'a value with no unit', path: ['rated_current'], value: '2', message: '"2" has no unit'},
		{name: 'an empty description', path: ['description'], value: '', message: 'this text cannot be empty'},
	];
	it.each(refused)('refuses $name, with the message, and changes nothing', ({path, value, message}) => {
		const editing = openDemo();
		const result = setItemField(editing, 'devices', 2, path, value);
		expect(result.ok).toBe(false);
		if (result.ok) return;
		expect(result.message).toContain(message);
		expect(planEditingText(editing)).toBe(demoText);
	});

	it('removes an optional field, and a nested map it leaves empty', () => {
		const editing = openDemo();
		// A run with neither awg nor cross_section is refused; the whole run can go.
		expect(setItemField(editing, 'devices', 0, ['wire_to_next', 'awg'], undefined)).toMatchObject({ok: false, message: 'devices.0.wire_to_next: give the copper size as either awg or cross_section (not both, not neither)'});
		const dropped = applied(setItemField(editing, 'devices', 0, ['wire_to_next'], undefined));
		expect(dropped.plan.devices[0]!.wire_to_next).toBeUndefined();
		expect(planEditingText(dropped)).not.toContain('wire_to_next: {awg: 22, length: 1.5 m}');
		expect(findings(dropped)).toEqual([['advise', 'interlock-run-missing', 'lid_switch']]);
	});

	it('adds an unsecured access point a beam can be reached through: a coverage stop finding', () => {
		const editing = applied(addItem(openDemo(), 'access_points', {id: 'rear_hatch', description: 'Rear service hatch', beam_reachable: true, secured_by: 'none'}));
		expect(editing.plan.access_points.map((point) => point.id)).toEqual(['enclosure_lid', 'side_panel', 'fibre_port', 'room_door', 'cable_gland', 'rear_hatch']);
		expect(findings(editing)).toEqual([['stop', 'interlock-access-unsecured', 'rear_hatch']]);
	});

	it('refuses a new item the schema refuses, naming the field', () => {
		const result = addItem(openDemo(), 'access_points', {id: 'rear_hatch', beam_reachable: true, secured_by: 'none'});
		expect(result).toMatchObject({ok: false, field: 'access_points.5.description'});
	});

	it('moves a device in the wiring order, its comment with it', () => {
		const editing = applied(moveDevice(openDemo(), 0, 1));
		expect(editing.plan.devices.slice(0, 2).map((device) => device.id)).toEqual(['fibre_sense', 'lid_switch']);
		expect(planEditingText(editing)).toContain('devices:                         # in wiring order, from the input and back to it\n  - id: fibre_sense');
		expect(moveDevice(editing, 0, -1)).toEqual({ok: false, message: 'already first in the wiring order'});
	});

	it('removes an item, but never the last device', () => {
		let editing = applied(removeItem(openDemo(), 'access_points', 4));
		expect(editing.plan.access_points.map((point) => point.id)).not.toContain('cable_gland');
		for (let left = editing.plan.devices.length; left > 1; left -= 1) editing = applied(removeItem(editing, 'devices', 0));
		expect(editing.plan.devices.map((device) => device.id)).toEqual(['alignment_bypass']);
		const last = removeItem(editing, 'devices', 0);
		expect(last).toMatchObject({ok: false, message: 'the loop needs at least one device'});
	});

	it('saves atomically: the file loads as the edited plan, keeps its comments, and no temporary file is left', () => {
		const edited = applied(addItem(applied(setItemField(openDemo(), 'devices', 2, ['contact'], 'normally_open')), 'access_points', {id: 'rear_hatch', description: 'Rear service hatch', beam_reachable: true, secured_by: 'none'}));
		const saved = savePlanEditing(edited);
		if (!saved.ok) throw new Error(saved.message);
		expect(saved.editing.dirty).toBe(false);
		const reloaded = loadPlan(edited.file);
		if (!reloaded.ok) throw new Error(JSON.stringify(reloaded.errors));
		const {policy, ...plan} = edited.plan;
		expect(policy.max_response_time).toBeCloseTo(0.02, 12);
		expect(reloaded.value).toEqual(plan);
		const text = readFileSync(edited.file, 'utf8');
		for (const comment of ['# Invented demo: Fenwick Hollow Photonics Lab', '30 degC        # warmest the cable tray gets', '# in wiring order, from the input and back to it']) expect(text).toContain(comment);
		expect(readdirSync(join(edited.file, '..'))).toEqual(['plan.yaml']);
		// Only the edited lines differ from the original.
		const expected = demoText
			.replace('    secured_by: none\n\ndevices:', '    secured_by: none\n  - id: rear_hatch\n    description: Rear service hatch\n    beam_reachable: true\n    secured_by: none\n\ndevices:')
			.replace('emergency stop on the bench front\n    contact: normally_closed', 'emergency stop on the bench front\n    contact: normally_open');
		expect(text).toBe(expected);
	});
});
