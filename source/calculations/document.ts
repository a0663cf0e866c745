import {dimensions} from '../quantities/dimensions.js';
import {formatQuantity} from '../quantities/format.js';
import {formulaName, rangeShortText} from './calculation.js';
import {calculations} from './registry.js';

const escape = (text: string) => text.replaceAll('|', '\\|');

/**
 * docs/calculations.md, generated from the registry so the page and the code cannot
 * disagree (a test compares them; `npm run docs` rewrites the page).
 */
export function calculationsMarkdown(): string {
	const out: string[] = [
		'# Calculations',
		'',
		'<!-- Generated from source/calculations by `npm run docs`; edit the modules, not this page. -->',
		'',
		'Every calculation works on SI values and is the same code whether it runs from',
		'`prelase calc NAME key=value ...`, from a rule formula (`NAME` with `-` written as `_`, the',
		'inputs in the order below, returning the main output), or in a record. A value outside an',
		"input's range is refused, naming the key and the range (exit 2 from `calc`; in a rule formula the",
		'check fails, or advises, with that reason): never guessed.',
		'',
		'| Calculation | Summary |',
		'|---|---|',
		...calculations.map((calculation) => `| [${calculation.name}](#${calculation.name}) | ${escape(calculation.summary)} |`),
	];
	for (const calculation of calculations) {
		out.push('', `## ${calculation.name}`, '', calculation.summary + '.', '', `Formula: ${calculation.formula}`, '');
		out.push(`In rule formulas: \`${formulaName(calculation)}(${Object.keys(calculation.inputs).join(', ')})\` gives \`${calculation.main}\`.`, '');
		out.push('| Input | Dimension (SI unit) | Description | Range | Default |', '|---|---|---|---|---|');
		for (const [key, input] of Object.entries(calculation.inputs)) {
			const unit = dimensions[input.dimension].si || '1';
			const fallback = input.default !== undefined ? formatQuantity(input.default, input.dimension) : input.optional ? 'optional' : '—';
			out.push(`| \`${key}\` | ${input.dimension} (${unit}) | ${escape(input.description)} | ${rangeShortText(input.range, input.dimension)} | ${fallback} |`);
		}
		for (const condition of calculation.conditions ?? []) out.push('', `Refused unless \`${condition.keys[0]}\` is ${condition.description}.`);
		out.push('', '| Output | Dimension (SI unit) | Description |', '|---|---|---|');
		for (const [key, output] of Object.entries(calculation.outputs)) {
			out.push(`| \`${key}\`${key === calculation.main ? ' (main)' : ''} | ${output.dimension} (${dimensions[output.dimension].si || '1'}) | ${escape(output.description)} |`);
		}
		out.push('', 'Basis:', '', ...calculation.basis.map((source) => `- ${source}`));
		if (calculation.caution) out.push('', `> **Caution.** ${calculation.caution}`);
	}
	return `${out.join('\n')}\n`;
}
