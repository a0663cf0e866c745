import {mkdtempSync, readFileSync, writeFileSync} from 'node:fs';
import {tmpdir} from 'node:os';
import {join} from 'node:path';
import {describe, expect, it} from 'vitest';
import {runCli} from '../../helpers/run-cli.js';

/** The line (1-based) of the first line of `text` that contains `needle`, after `from`. */
function lineOf(text: string, needle: string, from = 0): number {
	const index = text.indexOf(needle, from);
	if (index < 0) throw new Error(`no "${needle}" in the file`);
	return text.slice(0, index).split('\n').length;
}

const shipped = readFileSync('rules/default.yaml', 'utf8');
const firstCheck = shipped.indexOf('  - id: limit_below_diode_maximum');

/**
 * The shipped policy with six independent mistakes, each in a different stage of loading: a
 * duplicate key (YAML), a misspelt field (schema), a check in a step that does not exist
 * (reference), an unknown name in a formula (formula), amperes compared with volts (units),
 * and two derived values that need each other (cycle).
 */
const broken =
	shipped
		.replace('name: prelase bench policy (shipped default)\n', 'name: prelase bench policy (shipped default)\nname: Fenwick Hollow site policy\n')
		.replace('  - id: limit_within_driver\n    step: driver\n', '  - id: limit_within_driver\n    step: drivr\n') +
	`  - id: typo_in_field
    step: driver
    title: A check with a misspelt field
    value: current_limit
    at_most: driver_max_current
    severity: stop
    explanaton: misspelt
    basis: common practice
  - id: unknown_name
    step: driver
    title: A check naming an input that does not exist
    value: curent_limit
    at_most: driver_max_current
    severity: stop
    explanation: the name is misspelt
    basis: common practice
  - id: amperes_against_volts
    step: driver
    title: A check comparing a current with a voltage
    value: current_limit
    at_most: supply_nominal
    severity: stop
    explanation: unlike quantities
    basis: common practice
`;
const withCycle = broken.replace('derived:\n', `derived:
  - id: loop_a
    label: One half of a loop
    dimension: voltage
    formula: loop_b * 2
  - id: loop_b
    label: The other half
    dimension: voltage
    formula: loop_a / 2
`);

describe('prelase rules validate reports every problem in one run', () => {
	it('reports problems of six stages together, each at its file:line', async () => {
		const folder = mkdtempSync(join(tmpdir(), 'prelase-validate-'));
		const file = join(folder, 'site.yaml');
		writeFileSync(file, withCycle);
		const {code, stdout} = await runCli(['rules', 'validate', file]);
		expect(firstCheck).toBeGreaterThan(0);
		const expected = [
			{stage: 'YAML: duplicate key', at: lineOf(withCycle, 'name: Fenwick Hollow site policy'), words: /"name"/},
			{stage: 'schema: misspelt field', at: lineOf(withCycle, 'explanaton: misspelt'), words: /unknown field "explanaton"/},
			{stage: 'reference: missing step', at: lineOf(withCycle, 'step: drivr'), words: /drivr/},
			{stage: 'formula: unknown name', at: lineOf(withCycle, 'value: curent_limit'), words: /unknown name "curent_limit"/},
			{stage: 'units: a current against a voltage', at: lineOf(withCycle, 'at_most: supply_nominal'), words: /./},
			{stage: 'cycle', at: lineOf(withCycle, 'formula: loop_b * 2'), words: /loop_a → loop_b → loop_a/},
		];
		for (const {stage, at, words} of expected) {
			const line = stdout.split('\n').find((text) => text.startsWith(`${file}:${at}:`));
			expect(line, `${stage} at line ${at} in:\n${stdout}`).toBeDefined();
			expect(line, stage).toMatch(words);
		}
		// Exit status 1: problems found (0 clean, 2 bad usage), as `rules validate --help` says.
		expect(code).toBe(1);
	});
});
