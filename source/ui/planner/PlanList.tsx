import {Box} from 'ink';
import {Text} from '../Text.js';
import type {ReactNode} from 'react';
import {kindText} from '../../interlock/analysis/fail-safe.js';
import {subjectText, type Finding} from '../../interlock/analysis/finding.js';
import {describeProblem} from '../../shared/problems.js';
import type {PlanEditing} from '../../interlock/plan/plan-edit.js';
import type {AccessPoint, Device} from '../../interlock/plan/plan-schema.js';
import {formatQuantity} from '../../quantities/format.js';
import {findingStyle} from './finding-style.js';
import {itemRefs, type ItemRef} from './planner-state.js';

/** The worst severity among the findings about one item, if any. */
export function worstFinding(findings: readonly Finding[], list: ItemRef['list'], id: string): Finding['severity'] | undefined {
	const own = findings.filter(({subject}) => subject.kind === (list === 'devices' ? 'device' : 'access_point') && 'id' in subject && subject.id === id);
	return own.some((entry) => entry.severity === 'stop') ? 'stop' : own.length > 0 ? 'advise' : undefined;
}

/** An access point's key facts: can a beam be reached through it, and what secures it. */
export function accessPointFacts(point: AccessPoint): string {
	const secured = point.secured_by === 'interlock' ? `interlock → ${point.device ?? '(no device named)'}` : point.secured_by === 'tool' ? 'tool-secured' : 'not secured';
	return `${point.beam_reachable ? 'beam reachable' : 'no beam'} · ${secured}`;
}

/** A device's key facts: kind, contact form (N/C, N/O), wiring, contact resistance and opening time. */
export function deviceFacts(device: Device): string {
	const across = device.bypasses ? ` · across ${device.bypasses}` : '';
	const plug = device.shorting_plug ? ' · shorting plug' : '';
	return `${kindText(device.kind)} · ${device.contact === 'normally_closed' ? 'N/C' : 'N/O'} · ${device.wiring} · ${formatQuantity(device.contact_resistance, 'resistance')} · opens ${formatQuantity(device.opening_time, 'time')}${across}${plug}`;
}

/** The loop figures, two lines: resistance against the allowed, current; slowest response against the policy. */
export function loopFigures(editing: PlanEditing): [string, string] {
	const {analysis, plan} = editing;
	const limit = formatQuantity(plan.policy.max_response_time, 'time');
	return [
		`Loop      ${formatQuantity(analysis.resistance.total, 'resistance')} of ${formatQuantity(analysis.allowedResistance, 'resistance')} allowed · current ${formatQuantity(analysis.current, 'current')}`,
		analysis.slowest ? `Response  ${formatQuantity(analysis.slowest.total, 'time')} at the slowest (${analysis.slowest.device}) · policy limit ${limit}` : `Response  no series device · policy limit ${limit}`,
	];
}

/** One finding as a line: severity word, what it concerns, the message. */
export function FindingLine({found, subject = true}: {found: Finding; subject?: boolean}) {
	const style = findingStyle[found.severity];
	return (
		<Text wrap="truncate">
			<Text color={style.color}>{style.label.padEnd(10)}</Text>
			{subject ? `${subjectText(found.subject)}: ` : ''}
			{describeProblem(found)}
		</Text>
	);
}

type Row = {key: string; text?: string; ref?: ItemRef; severity?: Finding['severity']; heading?: boolean};

/** The worst finding on each device and access point, by `list:id`: one pass, as worstFinding gives for each. */
function worstFindings(findings: readonly Finding[]): Map<string, Finding['severity']> {
	const worst = new Map<string, Finding['severity']>();
	for (const {subject, severity} of findings) {
		if ((subject.kind !== 'device' && subject.kind !== 'access_point') || !('id' in subject)) continue;
		const key = `${subject.kind === 'device' ? 'devices' : 'access_points'}:${subject.id}`;
		if (severity === 'stop' || !worst.has(key)) worst.set(key, severity);
	}
	return worst;
}

/** The planner's main view: the plan, its loop figures, its findings (stop first) and every item, one selected. */
export function PlanList({editing, rulesName, selected, rows, width, prompt}: {editing: PlanEditing; rulesName: string; selected: number; rows: number; width: number; prompt: ReactNode}) {
	const {plan, analysis} = editing;
	const [loop, response] = loopFigures(editing);
	const shownFindings = analysis.findings.slice(0, rows < 30 ? 3 : 6);
	const moreFindings = analysis.findings.length - shownFindings.length;
	const list: Row[] = [{key: 'h-access', text: `Access points (${plan.access_points.length})`, heading: true}];
	const refs = itemRefs(editing);
	for (const ref of refs) {
		if (ref.list === 'devices' && ref.index === 0) list.push({key: 'h-devices', text: `Devices in wiring order (${plan.devices.length})`, heading: true});
		list.push({key: `${ref.list}-${ref.index}`, ref});
	}
	// Only the rows in view are worded: a plan near the size limit has thousands of items, and this is drawn after every key.
	const worst = worstFindings(analysis.findings);
	const worded = (row: Row): Row => {
		if (!row.ref) return row;
		const item = row.ref.list === 'devices' ? plan.devices[row.ref.index]! : plan.access_points[row.ref.index]!;
		const facts = row.ref.list === 'devices' ? deviceFacts(item as Device) : accessPointFacts(item as AccessPoint);
		const severity = worst.get(`${row.ref.list}:${item.id}`);
		return {...row, text: `${item.id.padEnd(18)} ${facts}`, ...(severity ? {severity} : {})};
	};
	// The caution is one line under the list, drawn by the App (in full on the home screen).
	const room = Math.max(3, rows - 9 - shownFindings.length - (moreFindings > 0 ? 1 : 0));
	const at = list.findIndex((row) => row.ref && refs[selected] && row.ref.list === refs[selected]!.list && row.ref.index === refs[selected]!.index);
	const start = Math.max(0, Math.min(at - Math.floor(room / 2), list.length - room));
	return (
		<Box flexDirection="column">
			<Text bold wrap="truncate">
				Plan: {plan.name}
				{editing.dirty ? ' (not saved)' : ''}
			</Text>
			<Text dimColor wrap="truncate">
				{editing.file} · policy from {rulesName}
			</Text>
			<Text wrap="truncate">{loop}</Text>
			<Text wrap="truncate">{response}</Text>
			<Text bold>
				Findings: {analysis.stops} stop · {analysis.advises} advise
			</Text>
			{shownFindings.map((found, index) => (
				<FindingLine key={index} found={found} />
			))}
			{moreFindings > 0 ? <Text dimColor>… {moreFindings} more: f lists every finding</Text> : null}
			<Box marginTop={1} flexDirection="column">
				{list.slice(start, start + room).map(worded).map((row) => {
					if (row.heading) return <Text key={row.key} bold>{row.text}</Text>;
					const style = row.severity ? findingStyle[row.severity] : undefined;
					const chosen = row.key === list[at]?.key;
					return (
						<Text key={row.key} wrap="truncate" inverse={chosen}>
							{chosen ? '› ' : '  '}
							<Text {...(style ? {color: style.color} : {})}>{style ? style.label.slice(0, 1) : ' '}</Text> {row.text}
						</Text>
					);
				})}
			</Box>
			{prompt}
		</Box>
	);
}
