import {cleanup, render} from 'ink-testing-library';
import {afterEach, describe, expect, it} from 'vitest';
import {ChecksPanel} from '../../../source/ui/bench-check/ChecksPanel.js';
import {enterInput, startSession, type Session} from '../../../source/ui/bench-check/session.js';
import {readDemo, shippedRules} from '../../rules/bench-answers.js';

afterEach(() => cleanup());

const rules = shippedRules();
const demo = readDemo('bench3-808nm-clear.yaml');
const entries = Object.fromEntries(Object.entries(demo.inputs).map(([id, value]) => [id, typeof value === 'boolean' ? (value ? 'yes' : 'no') : String(value)]));
const words = (frame: string) => frame.replace(/\s+/g, ' ');
const check = (session: Session, id: string) => session.evaluation.checks.find((entry) => entry.id === id)!;

describe('a range typed in a check field', () => {
	it('is accepted and the check list shows the corner each check was judged at', () => {
		const typed = enterInput(startSession(rules, {entries}), 'diode_knee_voltage', '1.6 V ± 0.1 V');
		expect(typed.ok).toBe(true);
		if (!typed.ok) return;
		expect(typed.session.entries['diode_knee_voltage']).toBe('1.6 V ± 0.1 V');
		// hand arithmetic: the knee's high end 1.6 + 0.1 = 1.7 V is worst for headroom; 1.7 + 0.15 × 2 + 0.5 = 2.5 V needed
		const headroom = check(typed.session, 'compliance_headroom');
		expect(headroom.limit?.si).toBeCloseTo(2.5, 12); // hand arithmetic in the comment above
		const {lastFrame} = render(<ChecksPanel checks={[headroom]} rows={12} width={80} />);
		expect(words(lastFrame()!)).toContain('judged at diode_knee_voltage 1.7 V (high end), supply_nominal 4.75 V (low end)');
	});

	it.each([
		{name: 'a reversed range', id: 'diode_knee_voltage', text: '1.7 V .. 1.5 V', says: 'reversed range'},
		{name: 'ends of two dimensions', id: 'diode_knee_voltage', text: '1.5 V .. 1.7 A', says: 'not the same kind of quantity'},
		{name: 'a range on a choice', id: 'laser_class', text: '3 .. 4', says: 'only numbers with units take a range'},
		{name: 'a range the rules refuse', id: 'diode_max_current', text: '2.4 A .. 2.6 A', says: 'take one value only'},
	])('$name is refused in place, the session unchanged', ({id, text, says}) => {
		const session = startSession(rules, {entries});
		const typed = enterInput(session, id, text);
		expect(typed.ok).toBe(false);
		if (typed.ok) return;
		expect(typed.message).toContain(says);
	});

	it('a saved setup from before ranges with a supply tolerance of its own opens with the supply as a range', () => {
		const session = startSession(rules, {entries: {...entries, supply_tolerance: '3 %'}});
		expect(session.entries['supply_nominal']).toBe('5 V ± 3 %');
		expect(session.entries).not.toHaveProperty('supply_tolerance');
		// hand arithmetic: 5 × (1 − 0.03) − 2 × 0.15 − 0.8 = 4.85 − 0.3 − 0.8 = 3.75 V
		expect(check(session, 'compliance_headroom').value?.si).toBeCloseTo(3.75, 12); // hand arithmetic in the comment above
	});
});
