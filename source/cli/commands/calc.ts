import {parseArgs} from 'node:util';
import {formulaName, rangeShortText, type Calculation} from '../../calculations/calculation.js';
import {calculations, findCalculation} from '../../calculations/registry.js';
import {describeCalcProblem, runCalculation} from '../../calculations/run-calculation.js';
import {dimensions} from '../../quantities/dimensions.js';
import {formatQuantity} from '../../quantities/format.js';
import {compactExample} from '../../quantities/field-example.js';
import {problem} from '../../shared/problems.js';
import {didYouMean} from '../../shared/did-you-mean.js';
import {UsageError} from '../usage-error.js';
import {terminalSafeJson} from '../../shared/text.js';
import {definitionRow, wrap} from '../../shared/wrap.js';
import {commandHelp, helpOption, parseOptions, type Command, type Io} from '../command.js';

/** The list printed by `prelase calc` alone. */
export function calculationList(): string {
	const width = Math.max(...calculations.map((calculation) => calculation.name.length));
	return [
		'Calculations (prelase calc NAME --help for inputs, outputs and sources):',
		...calculations.map((calculation) => `  ${calculation.name.padEnd(width)}  ${calculation.summary}`),
	].join('\n');
}

/** The help of one calculation: inputs with dimension, description and default; outputs; formula; basis. */
export function calculationHelp(calculation: Calculation, width = 100): string {
	const keyWidth = Math.max(...[...Object.keys(calculation.inputs), ...Object.keys(calculation.outputs)].map((key) => key.length));
	const lines = [`prelase calc ${calculation.name} — ${calculation.summary}`, '', 'Inputs (key=value with units):'];
	for (const [key, input] of Object.entries(calculation.inputs)) {
		const info = dimensions[input.dimension];
		const extra = input.default !== undefined ? ` (default ${formatQuantity(input.default, input.dimension)})` : input.optional ? ' (optional)' : '';
		const range = `; ${rangeShortText(input.range, input.dimension)}`;
		const example = compactExample({dimension: input.dimension, range: input.range, ...(input.default === undefined ? {} : {default: input.default})});
		lines.push(...definitionRow(key, `${input.description}; ${info.noun}, e.g. ${key}=${example}${range}${extra}`, keyWidth, width));
	}
	for (const condition of calculation.conditions ?? []) lines.push(...wrap(`Refused unless ${condition.keys[0]} is ${condition.description}.`, width));
	lines.push('', 'Outputs:');
	for (const [key, output] of Object.entries(calculation.outputs)) lines.push(...definitionRow(key, output.description, keyWidth, width));
	lines.push('', ...wrap(`Formula: ${calculation.formula}`, width), '', 'Basis:');
	for (const source of calculation.basis) lines.push(...wrap(`- ${source}`, width, '  '));
	if (calculation.caution) lines.push('', ...wrap(`CAUTION: ${calculation.caution}`, width));
	lines.push('', `In rule formulas: ${formulaName(calculation)}(${Object.keys(calculation.inputs).join(', ')}) gives ${calculation.main}.`);
	return lines.join('\n');
}

const options = {
	json: {type: 'boolean', summary: 'Print the calculation\'s inputs, outputs, notes and basis as JSON'},
	help: {...helpOption, summary: 'Show this help; after NAME, the inputs, outputs and basis of that calculation'},
} as const;

/** `prelase calc [NAME key=value ... [--json]]`: returns the exit status. */
export function runCalc(args: string[], io: Io): number {
	const {values, positionals} = parseArgs({args, options: parseOptions(options), allowPositionals: true, strict: true});
	const [name, ...entries] = positionals;
	if (name === undefined) {
		io.stdout.write(`${values.help ? `${commandHelp(calcCommand)}\n\n` : ''}${calculationList()}\n`);
		return 0;
	}
	const calculation = findCalculation(name);
	if (!calculation) {
		const found = problem('calc-unknown', {name, hint: didYouMean(name, calculations.map((entry) => entry.name))});
		throw new UsageError(describeCalcProblem(found));
	}
	if (values.help) {
		io.stdout.write(`${calculationHelp(calculation, io.stdout.columns ?? 100)}\n`);
		return 0;
	}
	const run = runCalculation(calculation, entries);
	if (!run.ok) {
		for (const found of run.errors) io.stderr.write(`prelase calc ${calculation.name}: ${describeCalcProblem(found)}\n`);
		io.stderr.write(`See: prelase calc ${calculation.name} --help\n`);
		return 2;
	}
	const result = run.value;
	if (values.json) {
		io.stdout.write(`${terminalSafeJson(result)}\n`);
		return 0;
	}
	const keyWidth = Math.max(...[...Object.keys(result.inputs), ...Object.keys(result.outputs)].map((key) => key.length));
	const lines = [`${calculation.name} — ${calculation.summary}`];
	for (const [key, input] of Object.entries(result.inputs)) lines.push(`  ${key.padEnd(keyWidth)}  ${input.text}${input.entered === undefined ? ' (default)' : ''}`);
	lines.push('  →');
	for (const [key, output] of Object.entries(result.outputs)) lines.push(`  ${key.padEnd(keyWidth)}  ${output.text}`);
	for (const note of result.notes) lines.push(...wrap(`Note: ${note}`, 100, '  '));
	lines.push(...wrap(`Basis: ${result.basis.join('; ')}`, io.stdout.columns ?? 100));
	if (result.caution) lines.push('', ...wrap(`CAUTION: ${result.caution}`, io.stdout.columns ?? 100));
	io.stdout.write(`${lines.join('\n')}\n`);
	return 0;
}

export const calcCommand: Command = {
	name: 'calc',
	summary: 'Run one bench calculation (dissipation, headroom, wire, ...) on values with units',
	usage: 'prelase calc [NAME key=value ... [--json]]',
	options,
	help: {
		intro: `prelase calc — bench calculations

Usage:
  prelase calc                            List the calculations
  prelase calc NAME --help                Inputs (dimension, description, default), outputs, basis
  prelase calc NAME key=value ... [--json]

Values carry units: prelase calc dissipation supply=28V knee=2V series_resistance=0ohm limit=1A
Temperatures in degC; percentages as 5%. Rule formulas call the same calculations.`,
		notes: `--json prints {"calc", "inputs", "outputs": {KEY: {"si", "unit", "text"}}, "notes", "basis"}
and, for mpe, nohd, od and hazard-class, "caution": these are for planning and do not replace
the laser safety officer's hazard evaluation or the standards in force.
Exit status: 0 done, 2 unknown name or key, wrong dimension, missing input, or a value
outside the calculation's validity.`,
	},
	run: runCalc,
};
