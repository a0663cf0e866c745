import {cpSync, mkdirSync, mkdtempSync, readFileSync, rmSync, writeFileSync} from 'node:fs';
import {tmpdir} from 'node:os';
import {join, resolve} from 'node:path';
import {afterAll, beforeAll, describe, expect, it} from 'vitest';
import {main} from '../../source/cli/dispatch.js';
import {fakeIo} from '../helpers/fake-io.js';

/** One fenced block of the tutorial, in page order. */
type Block = {language: string; body: string};

const page = readFileSync(resolve('docs/rule-file.md'), 'utf8');
const tutorial = page.slice(page.indexOf('## Tutorial'));
const blocks: Block[] = [...tutorial.matchAll(/^```(\w+)\n([\s\S]*?)^```$/gm)].map((match) => ({language: match[1]!, body: match[2]!}));

/** A step of the tutorial: write a file, or run a command and compare with the output shown under it. */
type Step = {kind: 'file'; name: string; text: string} | {kind: 'command'; line: string; shown?: string};

const steps: Step[] = [];
for (const block of blocks) {
	const fileName = /^# ([\w.-]+\.yaml)\n/.exec(block.body)?.[1];
	if (block.language === 'yaml' && fileName) steps.push({kind: 'file', name: fileName, text: block.body});
	else if (block.language === 'sh') for (const line of block.body.split('\n').filter((entry) => entry.startsWith('prelase '))) steps.push({kind: 'command', line});
	else if (block.language === 'text') {
		const last = steps.at(-1);
		if (last?.kind === 'command') last.shown = block.body;
	}
}

/** What each command of the page must end with, and the values it must show, worked out by hand. */
const expected: Record<string, {code: number; says?: RegExp[]}> = {
	'prelase rules init site-policy.yaml': {code: 0},
	'prelase rules validate site-policy.yaml': {code: 0},
	'prelase rules validate typo.yaml': {code: 1},
	'prelase rules diff shipped site-policy.yaml': {code: 1, says: [/current_margin: 10 % → 20 % \(ratio\)/]},
	'prelase rules show site-policy.yaml': {code: 0},
	// 2.5 A × (1 − 0.2) = 2 A: the 2 A limit passes at the boundary with nothing to spare.
	'prelase check --answers docs/examples/bench3-808nm-clear.yaml --rules site-policy.yaml': {code: 1, says: [/2 A ≤ 2 A · margin 0 A \(0 %\)/, /Outcome: INCOMPLETE/]},
	// 2.5 A × (1 − 0.1) = 2.25 A under the shipped policy: 2.2 A passes with 50 mA to spare.
	'prelase check --answers what-if.yaml': {code: 1, says: [/2\.2 A ≤ 2\.25 A · margin 50 mA/]},
	// Under the site policy the ceiling is 2 A: 2.2 A is 200 mA over it, so do not energize.
	'prelase check --answers what-if.yaml --rules site-policy.yaml': {code: 1, says: [/✗ FAIL {7}Current limit below the diode's absolute maximum less the margin/, /over the limit by 200 mA/, /Outcome: DO NOT ENERGIZE/]},
};

/** Splits a command line as a shell would for these simple commands (no quotes on the page). */
const words = (line: string) => line.split(/\s+/).filter(Boolean).slice(1);

let folder: string;
let home: string;
let previous: string;

beforeAll(() => {
	folder = mkdtempSync(join(tmpdir(), 'prelase-tutorial-'));
	home = join(folder, '.home');
	mkdirSync(join(folder, 'docs'), {recursive: true});
	cpSync(resolve('docs/examples'), join(folder, 'docs', 'examples'), {recursive: true});
	previous = process.cwd();
	process.chdir(folder);
});
afterAll(() => {
	process.chdir(previous);
	rmSync(folder, {recursive: true, force: true});
});

describe('the rule-file tutorial, run as written', () => {
	it('has the three changes, the files and the commands it promises', () => {
		expect(steps.filter((step) => step.kind === 'file').map((step) => step.kind === 'file' && step.name)).toEqual(['site-policy.yaml', 'typo.yaml', 'what-if.yaml']);
		expect(steps.filter((step) => step.kind === 'command').map((step) => step.kind === 'command' && step.line)).toEqual(Object.keys(expected));
		const site = steps.find((step) => step.kind === 'file' && step.name === 'site-policy.yaml');
		expect(site?.kind === 'file' && site.text).toMatch(/current_margin:\n {4}value: 20 %/);
		expect(site?.kind === 'file' && site.text).toMatch(/- id: second_person_present/);
		expect(site?.kind === 'file' && site.text).toMatch(/switched_off:\n {2}pin_configuration_supported: >-/);
	});

	it('runs every step in order, each giving the output the page shows', async () => {
		for (const step of steps) {
			if (step.kind === 'file') {
				writeFileSync(step.name, step.text);
				continue;
			}
			const io = fakeIo({PRELASE_HOME: home});
			const code = await main(words(step.line), io);
			const output = io.stdout.text;
			const want = expected[step.line];
			expect(code, `${step.line}\n${io.stderr.text}`).toBe(want?.code);
			for (const pattern of want?.says ?? []) expect(output, step.line).toMatch(pattern);
			for (const line of (step.shown ?? '').split('\n').filter((entry) => entry.trim() !== '')) {
				expect(output, `${step.line} should show: ${line}`).toContain(line.trimEnd());
			}
		}
	});

	it('leaves init refusing to overwrite the file it wrote', async () => {
		const io = fakeIo({PRELASE_HOME: home});
		expect(await main(['rules', 'init', 'site-policy.yaml'], io)).toBe(2);
		expect(io.stderr.text).toContain('already exists');
	});
});
