import {cleanup} from 'ink-testing-library';
import {afterEach, expect, it} from 'vitest';
import {clearDemo, focusOn, keys, prefillFromAnswers, renderApp} from '../../helpers/screen-driver.js';

afterEach(() => cleanup());

const demo = prefillFromAnswers(clearDemo);

// A refusal under a field wraps by words, each later line hanging under the first's text after
// "✗ ", and none starts with the space it was broken at (seen at 80 columns: "   ma); Supply
// voltage, nominal …" under the supply field).
it.each(['12 V .13 V', '12 V ma', 'twelve volts', '12 V .. 11 V', '5 V ± 200 %', '1.5 kV .. 2 kV'])('a refusal of %j wraps without a stray space', async (typed) => {
	const screen = await renderApp({draft: {...demo, step: 3}});
	await screen.press(keys.enter);
	await focusOn(screen, 'Supply voltage, nominal');
	await screen.press(...Array.from({length: 20}, () => keys.backspace));
	await screen.type(typed);
	const lines = (await screen.press(keys.enter)).split('\n');
	const first = lines.findIndex((line) => line.startsWith('  ✗ '));
	expect(first).toBeGreaterThan(0);
	const end = lines.findIndex((line, index) => index > first && /^ {2}(Cable|›)|^$/.test(line));
	const continued = lines.slice(first + 1, end);
	expect(continued.length).toBeGreaterThan(0);
	for (const line of continued) expect(line, `${typed}: ${JSON.stringify(continued)}`).toMatch(/^ {4}\S/);
});
