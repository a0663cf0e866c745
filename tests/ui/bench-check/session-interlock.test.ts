import {copyFileSync, mkdtempSync, rmSync} from 'node:fs';
import {tmpdir} from 'node:os';
import {join} from 'node:path';
import {afterEach, beforeEach, describe, expect, it} from 'vitest';
import {cachedLinker, type LinkContext} from '../../../source/interlock/functional-test/test-link.js';
import {loadRules, shippedRulesPath} from '../../../source/rules/load.js';
import {answerConfirmation, enterInput, startSession, type Session} from '../../../source/ui/bench-check/session.js';
import {demoPlanFile} from '../../interlock/plan-fixture.js';

const loaded = loadRules(shippedRulesPath());
if (!loaded.ok) throw new Error('the shipped rules must load');
const rules = loaded.value;

let folder: string;
let contexts: number;
const context = (): LinkContext => {
	contexts += 1;
	return {base: folder, folder: join(folder, 'records'), trusted: new Set(), now: new Date('2026-12-01T12:00:00')};
};

beforeEach(() => {
	folder = mkdtempSync(join(tmpdir(), 'prelase-session-link-'));
	copyFileSync(demoPlanFile, join(folder, 'plan.yaml'));
	contexts = 0;
});
afterEach(() => rmSync(folder, {recursive: true, force: true}));

function entered(session: Session, id: string, text: string): Session {
	const result = enterInput(session, id, text);
	if (!result.ok) throw new Error(result.message);
	return result.session;
}

const status = (session: Session, id: string) => session.evaluation.confirmations.find((entry) => entry.id === id)?.status;

describe('the on-screen check and the interlock test record', () => {
	it('without a plan named, the operator answers the loop-test confirmation', () => {
		const answered = answerConfirmation(startSession(rules, {}, cachedLinker(rules, context)), 'interlock_loop_tested', 'yes');
		if (!answered.ok) throw new Error(answered.message);
		expect(answered.session.interlockTest).toBeNull();
		expect(status(answered.session, 'interlock_loop_tested')).toBe('yes');
		expect(contexts).toBe(0);
	});

	it('with a plan named and no test record, the operator\'s yes is overruled by the record: no, with the reason', () => {
		let session = startSession(rules, {}, cachedLinker(rules, context));
		const answered = answerConfirmation(session, 'interlock_loop_tested', 'yes');
		if (!answered.ok) throw new Error(answered.message);
		// the check's location, as the demo plan names it (a test answers only a check there)
		session = entered(entered(answered.session, 'location', 'Room B.112, bench 3'), 'interlock_plan', 'plan.yaml');
		expect(session.interlockTest?.status).toBe('untested');
		expect(status(session, 'interlock_loop_tested')).toBe('no');
		expect(session.answers.confirmations.get('interlock_loop_tested')?.note).toContain('no interlock test record of this plan');
		// the operator's own answer is kept in the session (and the draft), not lost
		expect(session.confirmations['interlock_loop_tested']).toEqual({answer: 'yes'});
	});

	it('works the link out once per plan while it is fresh, not at every keystroke', () => {
		let session = entered(startSession(rules, {}, cachedLinker(rules, context, 60_000)), 'interlock_plan', 'plan.yaml');
		session = entered(session, 'diode_max_current', '2.5 A');
		session = entered(session, 'current_limit', '2 A');
		expect(contexts).toBe(1);
		session = entered(startSession(rules, {}, cachedLinker(rules, context, -1)), 'interlock_plan', 'plan.yaml');
		entered(session, 'current_limit', '2 A');
		expect(contexts).toBe(3);
	});
});
