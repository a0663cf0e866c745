import {cleanup, render} from 'ink-testing-library';
import {afterEach, describe, expect, it} from 'vitest';
import type {CheckResult} from '../../../source/rules/evaluate/evaluation.js';
import {ChecksPanel} from '../../../source/ui/bench-check/ChecksPanel.js';

afterEach(() => cleanup());

const error = 'a value it uses could not be computed: hazard-class: wavelength must be between 180 nm and 1 mm (outside that no class limits are known here; ask the laser safety officer)';
const advice: CheckResult = {
	id: 'label_class_covers_output',
	step: 'people',
	title: "Labelled class at least the indicative class of the output beam's power",
	severity: 'advise',
	explanation: 'x',
	basis: 'x',
	verdict: 'advise',
	error,
};
const skipped: CheckResult = {...advice, id: 'skipped', verdict: 'skip', error: undefined, reason: 'No class can be indicated outside 180 nm to 1 mm; ask the laser safety officer.'} as CheckResult;

/** The frame's words in order, with line breaks and indents folded into single spaces. */
const words = (frame: string) => frame.replace(/\s+/g, ' ');

describe('checks panel', () => {
	it('shows an error and a long title in full at 60 columns, never cut mid-sentence', () => {
		const {lastFrame} = render(<ChecksPanel checks={[advice]} rows={12} width={60} />);
		const frame = lastFrame()!;
		expect(words(frame)).toContain(error);
		expect(words(frame)).toContain(advice.title);
		expect(frame).not.toContain('…');
		for (const line of frame.split('\n')) expect(line.length).toBeLessThanOrEqual(60);
	});

	it('shows a skip with its reason', () => {
		const {lastFrame} = render(<ChecksPanel checks={[skipped]} rows={6} width={80} />);
		expect(words(lastFrame()!)).toContain('No class can be indicated outside 180 nm to 1 mm; ask the laser safety officer.');
	});

	it('leaves the checks that do not fit to the summary, and says how many', () => {
		const {lastFrame} = render(<ChecksPanel checks={[advice, {...advice, id: 'second'}]} rows={6} width={60} />);
		expect(lastFrame()).toContain('… 1 more in the summary');
	});
});
