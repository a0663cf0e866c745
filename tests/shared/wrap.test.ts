import {describe, expect, it} from 'vitest';
import {wrap} from '../../source/shared/wrap.js';

describe('wrap keeps a value with its unit', () => {
	it.each([
		// The limit's value would fall at the end of the line and its unit on the next
		{name: 'amperes', text: 'what the diode can emit at the limit 3 A when at 5 °C; the eyewear checks', width: 20},
		{name: 'milliwatts', text: 'over the limit by 125 mW (4.99 %) and then some more words', width: 30},
		{name: 'degrees', text: 'the coldest case temperature of 5 °C is below the rated one', width: 33},
	])('$name', ({text, width}) => {
		const lines = wrap(text, width);
		for (const line of lines) expect(line).not.toMatch(/\d$/);
		expect(lines.join(' ')).toBe(text);
	});

	it('still breaks between words that are not a value and a unit', () => {
		expect(wrap('aaaa bbbb cccc dddd eeee ffff', 20)).toEqual(['aaaa bbbb cccc dddd', 'eeee ffff']);
	});
});
