import {mkdtempSync, readFileSync, writeFileSync} from 'node:fs';
import {tmpdir} from 'node:os';
import {join} from 'node:path';
import {cleanup} from 'ink-testing-library';
import {afterEach, describe, expect, it} from 'vitest';
import {renderApp} from '../../helpers/screen-driver.js';
import {demoPlanFile} from '../../interlock/plan-fixture.js';

afterEach(() => cleanup());

/** The demo plan with `count` more invented door switches: an edit then takes a good part of a second. */
function largePlan(count: number): string {
	const text = readFileSync(demoPlanFile, 'utf8');
	const more = Array.from({length: count}, (_, index) => `  - {id: extra_${index}, kind: door_switch, description: Invented door switch ${index}, contact: normally_closed, contact_resistance: 1 mohm, rated_current: 2 A, rated_voltage: 30 V, positive_opening: true, opening_time: 8 ms, wire_to_next: {awg: 22, length: 0.01 m}}\n`);
	return `${text.trimEnd()}\n${more.join('')}`;
}

const sleep = (ms: number) => new Promise((resolve) => setTimeout(resolve, ms));

describe('the planner while an edit is worked out', () => {
	it('says it is checking, and the keys pressed meanwhile are taken in order once it is done', {timeout: 60_000}, async () => {
		const file = join(mkdtempSync(join(tmpdir(), 'prelase-planner-slices-')), 'plan.yaml');
		writeFileSync(file, largePlan(800));
		const screen = await renderApp({startPlan: file});
		// A plan this large (over 128 kB) is opened after the first frame, which says so.
		expect(screen.frames()[0]).toContain('Opening');
		for (const deadline = Date.now() + 30_000; !screen.frame().includes('Access points (5)') && Date.now() < deadline; ) await sleep(50);
		expect(screen.frame()).toContain('Access points (5)');
		await sleep(100);
		await screen.press('x');
		expect(screen.frame()).toContain('Remove the access point enclosure_lid');
		await screen.pressStill('y');
		// x and y again while the first removal is still being worked out: they wait their turn.
		await screen.pressStill('x');
		await screen.pressStill('y');
		expect(screen.frames().some((frame) => frame.includes('Checking the plan…'))).toBe(true);
		for (const deadline = Date.now() + 30_000; !screen.frame().includes('Access points (3)') && Date.now() < deadline; ) await sleep(50);
		const frame = screen.frame();
		expect(frame).toContain('Access points (3)');
		// The first and then the second access point of the demo are gone, in that order.
		expect(frame).toContain('Removed the access point side_panel');
		expect(frame).not.toMatch(/^\W*enclosure_lid /m);
		expect(frame).toMatch(/^\W*fibre_port /m);
	});
});
