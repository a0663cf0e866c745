import {describe, expect, it} from 'vitest';
import {isoWithOffset} from '../../source/shared/iso-time.js';
import {restoreDraft} from '../../source/ui/draft-restore.js';

type Draft = {savedAt: string; value: number};
const savedAt = '2026-12-01T10:07:59.000Z';
// The saved time as the operator's clock shows it, to the minute: ISO 8601 local date and time, 'T' as a space.
const when = isoWithOffset(new Date(savedAt)).slice(0, 16).replace('T', ' ');

describe('restoring a draft', () => {
	it('gives the fresh value and no notice when there is no draft', () => {
		expect(restoreDraft<Draft, number>(undefined, 1, () => ({restored: 2, text: 'x'}))).toEqual({value: 1});
	});

	it.each([
		{name: 'current and taken: the restored value, a plain notice', state: 'current' as const, take: true, expected: {value: 42, notice: {text: `restored ${when} current`}}},
		{name: 'refused: the fresh value, an error notice', state: 'stale' as const, take: false, expected: {value: 1, notice: {text: `not restored ${when} stale`, error: true}}},
	])('$name', ({state, take, expected}) => {
		const found = {state, draft: {savedAt, value: 42}, path: '/h/drafts/x.json'};
		const outcome = restoreDraft<Draft, number>(found, 1, (seen, at) => (take ? {restored: seen.draft.value, text: `restored ${at} ${seen.state}`} : {refused: `not restored ${at} ${seen.state}`}));
		expect(outcome).toEqual(expected);
	});

	it('shows the saved time to the minute, local, as YYYY-MM-DD HH:MM', () => {
		const outcome = restoreDraft<Draft, number>({state: 'current', draft: {savedAt, value: 0}, path: ''}, 0, (_, at) => ({refused: at}));
		expect(outcome.notice?.text).toMatch(/^\d{4}-\d{2}-\d{2} \d{2}:\d{2}$/);
		// 10:07:59 UTC is minute 7 in every whole-hour zone (and :37 or :52 in the half- and quarter-hour ones).
		expect(['07', '37', '52']).toContain(outcome.notice!.text.slice(-2));
	});
});
