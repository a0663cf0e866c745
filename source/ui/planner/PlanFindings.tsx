import {Box} from 'ink';
import {Text} from '../Text.js';
import {planVerdict} from '../../interlock/analysis/analyse.js';
import {subjectText} from '../../interlock/analysis/finding.js';
import {describeProblem} from '../../shared/problems.js';
import type {PlanEditing} from '../../interlock/plan/plan-edit.js';
import {wrap} from '../../shared/wrap.js';
import {findingStyle} from './finding-style.js';

/** Every finding of the plan, stop first, wrapped in full; the verdict line; scrolled from `offset`. */
export function PlanFindings({editing, offset, rows, width}: {editing: PlanEditing; offset: number; rows: number; width: number}) {
	const lines = editing.analysis.findings.flatMap((found, index) => {
		const style = findingStyle[found.severity];
		const pieces = wrap(`${subjectText(found.subject)}: ${describeProblem(found)}`, Math.max(20, width - 11));
		return pieces.map((text, part) => ({key: `${index}-${part}`, text, label: part === 0 ? style.label : '', color: style.color}));
	});
	const room = Math.max(3, rows - 9);
	const start = Math.min(offset, Math.max(0, lines.length - room));
	return (
		<Box flexDirection="column">
			<Text bold>
				Findings: {editing.analysis.stops} stop · {editing.analysis.advises} advise
			</Text>
			<Box marginTop={1} flexDirection="column">
				{lines.length === 0 ? <Text>No findings.</Text> : null}
				{lines.slice(start, start + room).map((line) => (
					<Text key={line.key} wrap="truncate">
						<Text color={line.color}>{line.label.padEnd(10)}</Text>
						{line.text}
					</Text>
				))}
				{start + room < lines.length ? <Text dimColor>↓ {lines.length - start - room} more</Text> : null}
			</Box>
			<Box marginTop={1}>
				<Text wrap="wrap">{planVerdict(editing.analysis)}</Text>
			</Box>
		</Box>
	);
}
