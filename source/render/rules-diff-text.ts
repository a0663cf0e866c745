import {displayPath} from '../shared/display-path.js';
import {differenceCount, type RulesDiff} from '../rules/inspect/diff.js';

const fieldWords: Record<string, string> = {severity: 'severity', step: 'step', when: 'when', value: 'value', at_most: 'at most', at_least: 'at least', holds: 'holds', dimension: 'dimension'};

/** The difference between two rule files, in lines a laser safety officer reads. */
export function diffText(diff: RulesDiff): string {
	const lines = [
		`From  ${diff.from.name}  ${displayPath(diff.from.file)} · sha256 ${diff.from.sha256.slice(0, 16)}`,
		`To    ${diff.to.name}  ${displayPath(diff.to.file)} · sha256 ${diff.to.sha256.slice(0, 16)}`,
		'',
	];
	const section = (title: string, entries: string[]) => {
		if (entries.length === 0) return;
		lines.push(`${title}:`, ...entries.map((entry) => `  ${entry}`), '');
	};
	if (diff.name) section('Name changed', [`${diff.name.from} → ${diff.name.to}`]);
	if (diff.cautionChanged) section('Caution changed', ['the caution text differs']);
	section('Policy values changed', diff.policy.changed.map((entry) => `${entry.id}: ${entry.from} → ${entry.to} (${entry.dimension})`));
	section('Policy values added', diff.policy.added.map((entry) => `${entry.id}: ${entry.value} (${entry.dimension})`));
	section('Policy values removed', diff.policy.removed.map((entry) => `${entry.id}: ${entry.value} (${entry.dimension})`));
	section('Checks switched off', diff.checks.switchedOff.map((entry) => `${entry.id}: ${entry.title} — reason: ${entry.reason}`));
	section('Checks switched on again', diff.checks.switchedOn.map((entry) => `${entry.id}: ${entry.title}`));
	section('Checks added', diff.checks.added.map((entry) => `${entry.id} (${entry.severity}, step ${entry.step}): ${entry.title}`));
	section('Checks removed', diff.checks.removed.map((entry) => `${entry.id} (${entry.severity}): ${entry.title}`));
	section(
		'Checks changed',
		diff.checks.changed.flatMap((entry) => [`${entry.id}: ${entry.title}`, ...entry.changes.map((change) => `  ${fieldWords[change.field]}: ${change.from ?? '(none)'} → ${change.to ?? '(none)'}`)]),
	);
	section('Inputs added', diff.inputs.added.map((entry) => `${entry.id} (step ${entry.step}): ${entry.title}`));
	section('Inputs removed', diff.inputs.removed.map((entry) => `${entry.id} (step ${entry.step}): ${entry.title}`));
	section('Confirmations added', diff.confirmations.added.map((entry) => `${entry.id} (step ${entry.step}): ${entry.title}`));
	section('Confirmations removed', diff.confirmations.removed.map((entry) => `${entry.id} (step ${entry.step}): ${entry.title}`));
	section('Derived values added', diff.derived.added.map((entry) => `${entry.id}: ${entry.title}`));
	section('Derived values removed', diff.derived.removed.map((entry) => `${entry.id}: ${entry.title}`));
	section('Derived values changed', diff.derived.changed.map((entry) => `${entry.id}: ${entry.from} → ${entry.to}`));
	section('Tables added', diff.tables.added);
	section('Tables removed', diff.tables.removed);
	section('Tables changed', diff.tables.changed);
	section('Steps added', diff.steps.added.map((entry) => `${entry.id}: ${entry.title}`));
	section('Steps removed', diff.steps.removed.map((entry) => `${entry.id}: ${entry.title}`));
	const count = differenceCount(diff);
	lines.push(count === 0 ? 'No differences in meaning.' : `${count} difference${count === 1 ? '' : 's'} in meaning.`);
	return lines.join('\n');
}
