import {copyFileSync, mkdirSync, mkdtempSync, readdirSync, readFileSync, rmSync, writeFileSync} from 'node:fs';
import {tmpdir} from 'node:os';
import {join, resolve} from 'node:path';
import {afterAll, beforeAll, describe, expect, it} from 'vitest';
import {shippedRulesPath} from '../../source/rules/load.js';
import {gitEnv} from '../helpers/git-env.js';
import {runCli, type CliRun} from '../helpers/run-cli.js';

/*
 * Every renderer in source/render/ has a row here that feeds it, through the command that prints
 * it, text holding ESC, CSI, OSC 52, BEL, C1 controls and bidirectional overrides, and checks
 * that the text arrives with none of them. A new renderer without a row fails the first test.
 */

/** ECMA-48: ESC (0x1B), CSI and ED (ESC [2J), OSC 52 ended by BEL (clipboard, as xterm defines it), C1 CSI (0x9B), DCS (0x90); UAX #9: RLO (U+202E), LRI/PDI (U+2066, U+2069). */
const hostile = 'HOST\u001B[2J\u001B]52;c;aGk=\u0007\u009B31m\u202E\u2066\u0090\u2069ILE';
/** The hostile text once the boundary has stripped it; Markdown escapes its brackets, so they are optional here. */
const arrived = /HOST\\?\[2J\\?\]52;c;aGk=31mILE/;
/** Any C0 control but tab and line feed, DEL, any C1 control, and the bidirectional controls. */
const control = /[\u0000-\u0008\u000B-\u001F\u007F-\u009F\u061C\u200E\u200F\u202A-\u202E\u2066-\u2069]/u;

/** The text as a YAML double-quoted scalar with everything outside printable ASCII escaped (YAML 1.2 §5.7). */
function yamlQuoted(text: string): string {
	return `"${[...text].map((character) => (character >= ' ' && character <= '~' && character !== '"' && character !== '\\' ? character : `\\u${character.codePointAt(0)!.toString(16).padStart(4, '0')}`)).join('')}"`;
}

let folder: string;
let home: string;
let env: NodeJS.ProcessEnv;
const files: Record<string, string> = {};

async function cli(argv: string[]): Promise<CliRun> {
	return runCli(argv, env);
}

/** The record file a `--sign` run wrote. */
function written(run: CliRun): string {
	const path = /(?:Record written|Test record written): (.+)/.exec(run.stdout)?.[1];
	if (!path) throw new Error(`test setup: no record written\n${run.stdout}\n${run.stderr}`);
	return path;
}

beforeAll(async () => {
	folder = mkdtempSync(join(tmpdir(), 'prelase-every-renderer-'));
	home = join(folder, 'home');
	env = gitEnv(folder, home);
	const q = yamlQuoted(hostile);
	files['rules'] = join(folder, 'site.yaml');
	writeFileSync(files['rules'], readFileSync(shippedRulesPath(), 'utf8').replace('name: prelase bench policy (shipped default)', `name: ${q}`).replaceAll(/(\n\s+title: )([^\n"]+)/g, `$1${q}`).replace('value: 3 s', 'value: 5 s'));
	files['answers'] = join(folder, 'answers.yaml');
	writeFileSync(files['answers'], readFileSync(resolve('docs/examples/bench3-808nm-clear.yaml'), 'utf8').replace(/^setup: .*$/m, `setup: ${q}`).replace(/diode_serial: .*$/m, `diode_serial: ${q}`));
	files['plan'] = join(folder, 'plan.yaml');
	writeFileSync(files['plan'], readFileSync(resolve('docs/examples/interlock/bench3-interlock-plan.yaml'), 'utf8').replace('name: Fenwick Hollow B.112 bench 3 — enclosure and room loop', `name: ${q}`).replace('description: Hinged lid of the bench 3 beam enclosure', `description: ${q}`));
	files['results'] = join(folder, 'results.yaml');
	writeFileSync(files['results'], readFileSync(resolve('docs/examples/interlock/bench3-interlock-test-results.yaml'), 'utf8').replace('tested_by: {name: Ines Marlow,', `tested_by: {name: ${q},`));

	const plain = join(folder, 'records');
	files['record'] = written(await cli(['check', '--answers', files['answers'], '--sign', hostile, '--role', hostile, '--records', plain]));
	files['whatIfRecord'] = written(await cli(['check', '--answers', files['answers'], '--rules', files['rules'], '--what-if', '--sign', hostile, '--records', join(folder, 'what-if')]));
	files['testRecord'] = written(await cli(['plan', files['plan'], '--record-test', files['results'], '--records', join(folder, 'tests')]));

	// More records than an audit lists in full: each copy has a hostile file name and a finding.
	files['many'] = join(folder, 'many');
	mkdirSync(files['many']);
	for (let index = 0; index < 21; index += 1) copyFileSync(files['record'], join(files['many'], `${String(index).padStart(2, '0')}-${hostile}.json`));

	files['repository'] = join(folder, 'repository');
	const init = await cli(['records', 'init', '--records', files['repository']]);
	if (init.code !== 0) throw new Error(`test setup: records init failed\n${init.stderr}`);
	files['repositorySign'] = JSON.stringify(await cli(['check', '--answers', files['answers'], '--sign', hostile, '--records', files['repository']]));
	copyFileSync(files['record'], join(files['repository'], `${hostile}.json`));
}, 120_000);

afterAll(() => {
	rmSync(folder, {recursive: true, force: true});
});

/** `arrives`: what the hostile text looks like when it arrives (JSON writes control characters as inert \\u escapes). */
type Row = {via: string; run: () => Promise<CliRun>; arrives?: RegExp};

/** How each renderer's output reaches a person; `partOf` names the row whose output holds it. */
const renderers: Record<string, Row | {partOf: string}> = {
	'check-text.ts': {via: 'check under a site rule file with hostile titles and name, answers with a hostile setup and serial', run: () => cli(['check', '--answers', files['answers']!, '--rules', files['rules']!])},
	'audit-text.ts': {via: 'audit of a record with a hostile setup, signer and role, under the current rules', run: () => cli(['audit', files['record']!, '--rules', files['rules']!])},
	'audit-summary-text.ts': {via: 'audit of 21 records with hostile file names (summarised)', run: () => cli(['audit', files['many']!])},
	'audit-json.ts': {via: 'audit --json of 21 records with hostile file names (summarised)', run: () => cli(['audit', files['many']!, '--json']), arrives: /HOST\\u001b\[2J\\u001b\]52;c;aGk=\\u0007\\u009b31m\\u202e\\u2066\\u0090\\u2069ILE/},
	'audit-repository-text.ts': {via: 'audit of a records repository with an uncommitted hostile file', run: () => cli(['audit', files['repository']!])},
	'record-commit-text.ts': {via: 'check --sign into a records repository', run: async () => JSON.parse(files['repositorySign']!) as CliRun},
	'plan-report.ts': {via: 'plan with a hostile name and description', run: () => cli(['plan', files['plan']!])},
	'test-sheet-markdown.ts': {via: 'plan --test-sheet md', run: () => cli(['plan', files['plan']!, '--test-sheet', 'md'])},
	'test-sheet-html.ts': {via: 'plan --test-sheet html', run: () => cli(['plan', files['plan']!, '--test-sheet', 'html'])},
	'interlock-report.ts': {via: 'report --format md of an interlock test record with a hostile plan name and tester', run: () => cli(['report', files['testRecord']!, '--format', 'md'])},
	'report-markdown.ts': {via: 'report --format md of a bench check record', run: () => cli(['report', files['record']!, '--format', 'md'])},
	'report-html.ts': {via: 'report --format html of a bench check record', run: () => cli(['report', files['record']!, '--format', 'html'])},
	'report-model.ts': {partOf: 'report-markdown.ts'},
	'report-rule-outline.ts': {partOf: 'report-markdown.ts'},
	'report-style.ts': {partOf: 'report-html.ts'},
	'rules-show-text.ts': {via: 'rules show of a site rule file with hostile titles', run: () => cli(['rules', 'show', files['rules']!])},
	'what-if-text.ts': {via: 'check --what-if under a site rule file with hostile titles', run: () => cli(['check', '--answers', files['answers']!, '--rules', files['rules']!, '--what-if'])},
	'what-if-json.ts': {via: 'check --what-if --json under a site rule file with hostile titles', run: () => cli(['check', '--answers', files['answers']!, '--rules', files['rules']!, '--what-if', '--json']), arrives: /HOST\\u001b\[2J\\u001b\]52;c;aGk=\\u0007\\u009b31m\\u202e\\u2066\\u0090\\u2069ILE/},
	'margin-chart.ts': {partOf: 'what-if-text.ts'},
	'report-charts-html.ts': {via: 'report --format html of a record signed with --what-if under hostile titles (the charts and flip points)', run: () => cli(['report', files['whatIfRecord']!, '--format', 'html'])},
	'chart-svg.ts': {partOf: 'report-charts-html.ts'},
	'report-sensitivity.ts': {partOf: 'report-charts-html.ts'},
	'report-sensitivity-markdown.ts': {via: 'report --format md of a record signed with --what-if under hostile titles (the flip points)', run: () => cli(['report', files['whatIfRecord']!, '--format', 'md'])},
	'rules-diff-text.ts': {via: 'rules diff from the shipped policy to a hostile site rule file', run: () => cli(['rules', 'diff', shippedRulesPath(), files['rules']!])},
};

describe('every renderer writes through the terminal boundary', () => {
	it('every file in source/render/ has a row here', () => {
		const present = readdirSync(resolve('source/render')).filter((name) => name.endsWith('.ts')).sort();
		expect(Object.keys(renderers).sort()).toEqual(present);
	});

	const rows = Object.entries(renderers).flatMap(([file, row]) => ('run' in row ? [{file, ...row}] : []));

	it.each(rows)('$file ($via): the hostile text arrives, stripped', async ({run, arrives}) => {
		const {stdout, stderr} = await run();
		expect(`${stdout}\n${stderr}`).toMatch(arrives ?? arrived);
		expect(stdout).not.toMatch(control);
		expect(stderr).not.toMatch(control);
	});

	it.each(Object.entries(renderers).flatMap(([file, row]) => ('partOf' in row ? [{file, partOf: row.partOf}] : [])))('$file is part of $partOf, which has a row', ({partOf}) => {
		expect(renderers[partOf]).toHaveProperty('run');
	});

	it('a report written to a file (--out) passes the same boundary', async () => {
		const out = join(folder, 'report.md');
		const {code} = await cli(['report', files['record']!, '--format', 'md', '--out', out]);
		expect(code).toBe(0);
		const page = readFileSync(out, 'utf8');
		expect(page).toMatch(arrived);
		expect(page).not.toMatch(control);
	});
});

describe('no command reaches the terminal except through the boundary', () => {
	/** Every source file, as text. */
	function sources(dir: string): Array<{file: string; text: string}> {
		return readdirSync(dir, {withFileTypes: true, recursive: true})
			.filter((entry) => entry.isFile() && /\.tsx?$/.test(entry.name))
			.map((entry) => ({file: join(entry.parentPath, entry.name), text: readFileSync(join(entry.parentPath, entry.name), 'utf8')}));
	}

	it('only main.ts names process.stdout or process.stderr for writing; commands write to the io dispatch wraps', () => {
		const writers = sources(resolve('source')).filter(({text}) => /process\.(?:stdout|stderr)\.write|process\.(?:stdout|stderr)\s*[,)]/.test(text)).map(({file}) => file.replace(`${resolve('source')}/`, ''));
		expect(writers).toEqual(['main.ts']);
	});

	it('no renderer or command strips control characters on its own: the boundary is the one place', () => {
		const strippers = [...sources(resolve('source/render')), ...sources(resolve('source/cli'))].filter(({text}) => /\bstripControl\b/.test(text)).map(({file}) => file.replace(`${resolve('source')}/`, ''));
		expect(strippers).toEqual([]);
	});
});
