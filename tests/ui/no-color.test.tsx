import chalk from 'chalk';
import {cleanup} from 'ink-testing-library';
import {afterEach, describe, expect, it} from 'vitest';
import {clearDemo, keys, prefillFromAnswers, renderApp} from '../helpers/screen-driver.js';

const level = chalk.level;
afterEach(() => {
	cleanup();
	chalk.level = level;
});

const demo = prefillFromAnswers(clearDemo);
/** The demo with a limit above the diode's ceiling and one confirmation answered no. */
const failing = {...demo, entries: {...demo.entries, current_limit: '2.4 A'}, confirmations: {...demo.confirmations, sop_present: {answer: 'no' as const}}};

/** The frames of step 1, step 3 and the summary of the failing demo, drawn at a colour level. */
async function frames(colours: 0 | 3): Promise<{raw: string[]; plain: string[]}> {
	chalk.level = colours;
	const screen = await renderApp({draft: {...failing, step: 0}});
	await screen.press(keys.enter);
	const raw = [screen.rawFrame()];
	const plain = [screen.frame()];
	await screen.press(keys.pageDown, keys.pageDown);
	raw.push(screen.rawFrame());
	plain.push(screen.frame());
	for (let step = 3; step <= 9; step += 1) await screen.press(keys.pageDown);
	raw.push(screen.rawFrame());
	plain.push(screen.frame());
	return {raw, plain};
}

// The entry sets chalk's level to 0 when NO_COLOR is set (Ink's own colouring ignores NO_COLOR).
describe('without colour', () => {
	const signals = [
		{screen: 'step 1', index: 0, words: ['✗ NO', '✓ yes']},
		{screen: 'step 3', index: 1, words: ['✗ FAIL', '✓ pass']},
		{screen: 'the summary', index: 2, words: ['✗ FAIL', '! advise', 'Outcome: DO NOT ENERGIZE']},
	];
	it.each(signals)('$screen still reads its verdicts as words and symbols', async ({index, words}) => {
		const {raw} = await frames(0);
		const frame = raw[index]!;
		expect(frame).not.toContain('\u001B[');
		for (const word of words) expect(frame).toContain(word);
	});

	it('draws the same text as with colour: colour only adds to it', async () => {
		const coloured = await frames(3);
		const plain = await frames(0);
		for (const frame of coloured.raw.slice(1)) expect(frame).toMatch(/\u001B\[31m✗ FAIL/);
		// Wrapped styled text keeps a space at the end of the line; the text is otherwise the same.
		const lines = (frame: string) => frame.split('\n').map((line) => line.trimEnd());
		expect(coloured.plain.map(lines)).toEqual(plain.raw.map(lines));
		expect(plain.raw[1]).toContain("✗ FAIL    Current limit below the diode's absolute maximum less the margin");
	});
});
