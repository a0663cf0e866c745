import {deferral} from '../shared/deferral.js';
import type {RulesShow, ShowCheck, ShowOrigin} from '../rules/inspect/outline.js';

const at = (origin: ShowOrigin | null) => (origin ? `${origin.file}:${origin.line}` : 'unknown');

function checkLines(check: ShowCheck, indent: string): string[] {
	const lines = [
		`${indent}${check.severity === 'stop' ? 'stop  ' : 'advise'}  ${check.id}: ${check.title}`,
		`${indent}        ${check.condition}`,
		...(check.when ? [`${indent}        when ${check.when}`] : []),
		`${indent}        basis: ${check.basis}`,
		`${indent}        from ${at(check.from)}`,
	];
	if (check.severityChange) {
		const change = check.severityChange;
		lines.push(`${indent}        severity ${change.from} → ${change.to} in ${at(change.at)}: ${change.reason}`);
	}
	return lines;
}

/** The effective rules step by step, with where each part came from. */
export function showText(show: RulesShow): string {
	const lines = [`Rules   ${show.name}`, `        ${show.file} · sha256 ${show.sha256}`];
	if (show.chain.length > 1) lines.push(`        ${show.chain.map((file, index) => (index === 0 ? file : `extends ${file}`)).join(', ')}`);
	lines.push('', 'CAUTION', `  ${show.caution}`, `  ${deferral}`, '', 'Policy values');
	for (const entry of show.policy) {
		lines.push(`  ${entry.id} = ${entry.value} (${entry.dimension})  from ${at(entry.from)}`);
		if (entry.previous) lines.push(`      was ${entry.previous.value} in ${entry.previous.file}`);
		lines.push(`      ${entry.meaning}`, `      basis: ${entry.basis}`);
	}
	if (show.tables.length > 0) {
		lines.push('', 'Tables');
		for (const table of show.tables) {
			lines.push(`  ${table.id}: ${table.label} (${table.key} → ${table.value})  from ${at(table.from)}`);
			for (const [key, values] of Object.entries(table.rows)) lines.push(`      ${key}: ${values.join(', ')}`);
		}
	}
	show.steps.forEach((step, index) => {
		lines.push('', `${index + 1}. ${step.title} (${step.id})  from ${at(step.from)}`);
		if (step.inputs.length > 0) lines.push('   Inputs');
		for (const input of step.inputs) lines.push(`     ${input.id}: ${input.label} [${input.detail}]${input.when ? ` when ${input.when}` : ''}  from ${at(input.from)}`);
		if (step.confirmations.length > 0) lines.push('   Confirmations');
		for (const entry of step.confirmations) {
			lines.push(`     ${entry.id}: ${entry.statement}${entry.when ? ` (when ${entry.when})` : ''}${entry.notApplicable === 'forbidden' ? ' (not applicable refused)' : ''}  from ${at(entry.from)}`);
		}
		if (step.checks.length > 0) lines.push('   Checks');
		for (const check of step.checks) lines.push(...checkLines(check, '     '));
	});
	if (show.derived.length > 0) {
		lines.push('', 'Derived values');
		for (const entry of show.derived) lines.push(`  ${entry.id} (${entry.dimension}) = ${entry.formula}  from ${at(entry.from)}`);
	}
	lines.push('', 'Switched off (not evaluated)');
	if (show.switchedOff.length === 0) lines.push('  none');
	for (const check of show.switchedOff) lines.push(...checkLines(check, '  '), `          switched off in ${at(check.switchedOffAt)}: ${check.reason}`);
	return lines.join('\n');
}
