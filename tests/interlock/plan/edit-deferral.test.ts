import {describe, expect, it} from 'vitest';
import {deferringEdits} from '../../../source/interlock/plan/edit-deferral.js';
import {addItem, draftFieldProblem, moveDevice, planEditingText, removeItem, setItemField, type EditResult, type PlanEditing} from '../../../source/interlock/plan/plan-edit.js';
import {planDocumentText} from '../../../source/interlock/plan/plan-yaml.js';
import {finish} from '../../../source/shared/steps.js';
import {openDemoForEditing} from '../plan-fixture.js';

const openDemo = (): PlanEditing => openDemoForEditing('prelase-edit-deferral-');

/** What an edit result holds that a person or a file sees: the plan text, the plan, the analysis, or the refusal. */
function seen(result: EditResult) {
	return result.ok ? {text: planEditingText(result.editing), plan: result.editing.plan, analysis: result.editing.analysis, dirty: result.editing.dirty} : result;
}

// Each edit of the demo plan, applied (or refused) at once and by way of a deferral: the same result either way.
const edits: Array<{name: string; edit: (editing: PlanEditing) => EditResult}> = [
	{name: 'a field set', edit: (editing) => setItemField(editing, 'devices', 0, ['opening_time'], '12 ms')},
	{name: 'a field left out', edit: (editing) => setItemField(editing, 'devices', 0, ['positive_opening'], undefined)},
	{name: 'a field refused by the schema', edit: (editing) => setItemField(editing, 'devices', 0, ['contact'], 'sometimes')},
	{name: 'an access point added', edit: (editing) => addItem(editing, 'access_points', {id: 'rear_hatch', description: 'Rear hatch', beam_reachable: true, secured_by: 'tool'})},
	{name: 'an access point removed', edit: (editing) => removeItem(editing, 'access_points', 1)},
	{name: 'a device moved', edit: (editing) => moveDevice(editing, 1, 1)},
];

describe('edits worked out a step at a time', () => {
	it.each(edits)('$name: the deferred edit gives what the edit gives at once', ({edit}) => {
		const editing = openDemo();
		const atOnce = edit(editing);
		const first = deferringEdits(() => edit(editing));
		// Deferred: a placeholder refusal, and the steps to run.
		expect(first.pending).toBeDefined();
		expect(first.value.ok).toBe(false);
		first.pending!.settle(finish(first.pending!.steps));
		const again = deferringEdits(() => edit(editing));
		expect(again.pending).toBeUndefined();
		expect(seen(again.value)).toEqual(seen(atOnce));
	});

	it('defers only the first edit a run asks for; outside a run nothing is deferred', () => {
		const editing = openDemo();
		const run = () => [setItemField(editing, 'devices', 0, ['opening_time'], '12 ms'), setItemField(editing, 'devices', 0, ['opening_time'], '13 ms')];
		const first = deferringEdits(run);
		first.pending!.settle(finish(first.pending!.steps));
		const second = deferringEdits(run);
		expect(second.value[0]!.ok).toBe(true);
		expect(second.pending).toBeDefined();
		expect(setItemField(editing, 'devices', 0, ['opening_time'], '14 ms').ok).toBe(true);
	});

	it('a draft field check is deferred and answered the same way', () => {
		const editing = openDemo();
		const values = {id: 'x', kind: 'door_switch', contact: 'sometimes'};
		const atOnce = draftFieldProblem(editing, 'devices', values, ['contact']);
		expect(atOnce).toMatch(/contact|normally/);
		const first = deferringEdits(() => draftFieldProblem(editing, 'devices', values, ['contact']));
		first.pending!.settle(finish(first.pending!.steps));
		expect(deferringEdits(() => draftFieldProblem(editing, 'devices', values, ['contact'])).value).toBe(atOnce);
	});

	it('an edit keeps the text it wrote, which is the text its document writes', () => {
		const editing = openDemo();
		const result = setItemField(editing, 'devices', 0, ['opening_time'], '12 ms');
		if (!result.ok) throw new Error(result.message);
		expect(result.editing.written?.text).toBe(planDocumentText(result.editing.document, result.editing.original));
		expect(planEditingText(result.editing)).toBe(result.editing.written?.text);
		// A state whose document or original was replaced does not use the kept text.
		const replaced = {...result.editing, original: `${result.editing.original}\n`};
		expect(planEditingText(replaced)).toBe(planDocumentText(replaced.document, replaced.original));
	});
});
