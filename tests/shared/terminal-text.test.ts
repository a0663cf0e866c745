import chalk from 'chalk';
import {describe, expect, it} from 'vitest';
import {ownControl, terminalText} from '../../source/shared/terminal-text.js';
import {paintFor} from '../../source/shared/paint.js';

// Code points: ECMA-48 (C0 and C1 control sets, CSI, OSC, ST), Unicode UAX #9 (bidirectional controls).
const hostile = [
	{name: 'ESC and CSI (ED: clear the screen)', text: 'a\u001B[2Jb', left: 'a[2Jb'},
	{name: 'OSC 52 ended by BEL (set the clipboard)', text: 'a\u001B]52;c;aGk=\u0007b', left: 'a]52;c;aGk=b'},
	{name: 'OSC ended by ST (ESC \\)', text: 'a\u001B]0;title\u001B\\b', left: 'a]0;title\\b'},
	{name: 'SGR 8 (conceal)', text: 'a\u001B[8mb', left: 'a[8mb'},
	{name: 'C1 CSI (U+009B)', text: 'a\u009B2Jb', left: 'a2Jb'},
	{name: 'C1 OSC and ST (U+009D, U+009C)', text: 'a\u009D0;t\u009Cb', left: 'a0;tb'},
	{name: 'NEL (U+0085) and DEL', text: 'a\u0085\u007Fb', left: 'ab'},
	{name: 'carriage return (overwrites the line)', text: 'ok\rFAIL', left: 'okFAIL'},
	{name: 'backspace', text: 'FAIL\b\b\b\bPASS', left: 'FAILPASS'},
	{name: 'RLO and PDF (U+202E, U+202C)', text: 'a\u202Eb\u202Cc', left: 'abc'},
	{name: 'isolates (U+2066-U+2069)', text: 'a\u2066\u2067\u2068b\u2069', left: 'ab'},
	{name: 'marks (U+200E, U+200F, U+061C)', text: 'a\u200E\u200F\u061Cb', left: 'ab'},
	{name: 'NUL', text: 'a\u0000b', left: 'ab'},
];

describe('terminalText', () => {
	it.each(hostile)('removes $name', ({text, left}) => {
		expect(terminalText(text)).toBe(left);
	});

	it('keeps tabs, line feeds and every printable character', () => {
		const text = 'Outcome:\tDO NOT ENERGIZE\n≤ 2.5 W · µA · Ω · ⏎ · 日本';
		expect(terminalText(text)).toBe(text);
	});

	it('keeps prelase\'s own sequences, and only them', () => {
		expect(terminalText(`${ownControl('\r\u001B[2K')}done ${ownControl('\u001B[32m')}ok${ownControl('\u001B[39m')}\u001B[2J`)).toBe('\r\u001B[2Kdone \u001B[32mok\u001B[39m[2J');
	});

	it('a marker forged without the key of this run is not taken for one of prelase\'s own', () => {
		// The opening and closing characters are private-use code points; the key between them is random per run.
		const forged = '\uE000000000000000000000000000:1b5b324a\uE001';
		expect(terminalText(forged)).toBe(forged);
		expect(terminalText(forged)).not.toContain('\u001B');
	});

	it('colours from paint reach a terminal, around stripped text', () => {
		const level = chalk.level;
		chalk.level = 1;
		const paint = paintFor({isTTY: true} as NodeJS.WriteStream, {});
		const shown = terminalText(paint.fail(`bad\u001B[8m`));
		chalk.level = level;
		// SGR 31 red, 1 bold, 22 normal intensity, 39 default colour: ECMA-48 §8.3.117.
		expect(shown).toMatch(/^\u001B\[31m\u001B\[1mbad\[8m\u001B\[22m\u001B\[39m$/);
	});
});
