import {existsSync, readFileSync} from 'node:fs';
import {join} from 'node:path';
import {describe, expect, it} from 'vitest';
import {calculationsMarkdown} from '../../source/calculations/document.js';
import {calculations} from '../../source/calculations/registry.js';

/** A comment that names where a check value comes from. */
const sourced = /\/\/.*(\(\d{4}\)|ed\.|§|Table|Handbook|IEC|ANSI|NEC|NBS|ASTM|RFC|Horowitz|Pozar|Sedra|Coldren|Saleh|Johnson|Motchenbacher|worked example|glossary|textbook exercise|booklet|guide|\(seen\)|common practice|from memory)/;

describe('every calculation in the registry', () => {
	it.each(calculations.map(({name}) => ({name})))('$name has a reference test with at least three sourced values', ({name}) => {
		const file = join('tests', 'calculations', `${name}.reference.test.ts`);
		expect(existsSync(file), file).toBe(true);
		const lines = readFileSync(file, 'utf8').split('\n').filter((line) => sourced.test(line));
		expect(lines.length, `${file}: lines naming a source`).toBeGreaterThanOrEqual(3);
	});

	it.each(calculations.map(({name}) => ({name})))('$name has a section in docs/calculations.md', ({name}) => {
		expect(readFileSync('docs/calculations.md', 'utf8')).toContain(`## ${name}\n`);
	});

	it.each(calculations)('$name describes itself fully', (calculation) => {
		expect(calculation.summary.length).toBeGreaterThan(10);
		expect(calculation.basis.length).toBeGreaterThan(0);
		expect(Object.keys(calculation.outputs)).toContain(calculation.main);
		expect(calculation.name).toMatch(/^[a-z]+(-[a-z]+)*$/);
	});

	it.each(calculations.map(({name}) => ({name})))('$name declares a range on every input', ({name}) => {
		const calculation = calculations.find((entry) => entry.name === name)!;
		const lacking = Object.entries(calculation.inputs).filter(([, input]) => input.range === undefined).map(([key]) => key);
		expect(lacking).toEqual([]);
	});

	it.each(calculations.map(({name}) => ({name})))('$name shows each input range in docs/calculations.md', ({name}) => {
		const section = readFileSync('docs/calculations.md', 'utf8').split(`## ${name}\n`)[1]!.split('\n## ')[0]!;
		expect(section).toContain('| Input | Dimension (SI unit) | Description | Range | Default |');
	});

	it('has names that are unique', () => {
		expect(new Set(calculations.map(({name}) => name)).size).toBe(calculations.length);
	});

	it('matches docs/calculations.md exactly (run npm run docs after changing a calculation)', () => {
		expect(readFileSync('docs/calculations.md', 'utf8')).toBe(calculationsMarkdown());
	});
});
