import {readdirSync, readFileSync} from 'node:fs';
import {join, relative} from 'node:path';
import {cleanup, render} from 'ink-testing-library';
import chalk from 'chalk';
import {Fragment} from 'react';
import {afterEach, describe, expect, it} from 'vitest';
import {Text} from '../../source/ui/Text.js';

const level = chalk.level;
afterEach(() => {
	cleanup();
	chalk.level = level;
});

/** Draws a tree with colour off, so Ink adds no sequence of its own to the frame. */
function drawn(tree: React.ReactElement): string {
	chalk.level = 0;
	return render(tree).lastFrame() ?? '';
}

// ECMA-48 for the sequences (OSC 52 ended by BEL, ED, SGR 8 conceal, C1 CSI 0x9B), UAX #9 for RLO, LRI and PDI.
const cases = [
	{name: 'a string child', tree: <Text>{'a\u001B]52;c;aGk=\u0007b'}</Text>, frame: 'a]52;c;aGk=b'},
	{name: 'clear screen and conceal', tree: <Text>{'a\u001B[2J\u001B[8mb'}</Text>, frame: 'a[2J[8mb'},
	{name: 'C1 CSI, NUL and DEL', tree: <Text>{'a\u009B31m\u0000\u007Fb'}</Text>, frame: 'a31mb'},
	{name: 'bidirectional overrides and isolates', tree: <Text>{'a\u202Eb\u2066c\u2069d\u200Fe'}</Text>, frame: 'abcde'},
	{name: 'several children beside literal text', tree: <Text>Plan: {'x\u001B[2J'} of {3} · {'\u202Ey'}</Text>, frame: 'Plan: x[2J of 3 · y'},
	{name: 'children in an array', tree: <Text>{['a\u0007', 'b\u001B', 7]}</Text>, frame: 'ab7'},
	{name: 'a fragment inside a Text', tree: <Text>a<Fragment>{'\u001B[2Jb'}</Fragment></Text>, frame: 'a[2Jb'},
	{name: 'a Text inside a Text', tree: <Text>a<Text bold>{'\u001B[8mb'}</Text></Text>, frame: 'a[8mb'},
	{name: 'a line break in a single-line text', tree: <Text>{'Bench\nOutcome: CLEAR'}</Text>, frame: 'Bench ⏎ Outcome: CLEAR'},
	{name: 'CR, VT, FF, NEL and the Unicode separators', tree: <Text>{'a\rb\vc\fd\u0085e\u2028f\u2029g'}</Text>, frame: 'a ⏎ b ⏎ c ⏎ d ⏎ e ⏎ f ⏎ g'},
	{name: 'line breaks kept where the text has lines of its own', tree: <Text lines>{'one\ntwo\u001B[2J'}</Text>, frame: 'one\ntwo[2J'},
	{name: 'plain text unchanged', tree: <Text>{'  3 A ≤ 2.5 A  ✓ pass'}</Text>, frame: '  3 A ≤ 2.5 A  ✓ pass'},
];

describe('the screens\' Text', () => {
	it.each(cases)('$name', ({tree, frame}) => {
		expect(drawn(tree)).toBe(frame);
	});
});

const uiFolder = join(import.meta.dirname, '..', '..', 'source', 'ui');
const uiFiles = (readdirSync(uiFolder, {recursive: true}) as string[]).filter((file) => /\.tsx?$/.test(file)).map((file) => join(uiFolder, file));

describe('the one boundary of the screens', () => {
	// Only Text.tsx may reach Ink's Text (or Transform, which rewrites text after it is drawn).
	const inkText = /import\s*\{[^}]*\b(?:Text|Transform)\b[^}]*\}\s*from\s*'ink'/;
	it.each(uiFiles.filter((file) => !file.endsWith(join('ui', 'Text.tsx'))).map((file) => ({file: relative(uiFolder, file)})))('source/ui/$file draws text only through ui/Text.tsx and strips nothing itself', ({file}) => {
		const source = readFileSync(join(uiFolder, file), 'utf8');
		expect(source).not.toMatch(inkText);
		expect(source).not.toMatch(/\bstripControl\b|\bterminalText\b/);
	});

	it('finds the files it guards', () => {
		expect(uiFiles.length).toBeGreaterThan(30);
		expect(uiFiles.some((file) => file.endsWith(join('ui', 'Text.tsx')))).toBe(true);
	});
});
