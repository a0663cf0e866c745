import {deferral} from '../shared/deferral.js';
import {formatQuantity} from '../quantities/format.js';
import type {Dimension} from '../quantities/dimensions.js';
import {planVerdict, type PlanAnalysis} from '../interlock/analysis/analyse.js';
import {durationText} from '../interlock/analysis/duration-text.js';
import {subjectText} from '../interlock/analysis/finding.js';
import {describeProblem} from '../shared/problems.js';
import type {Plan} from '../interlock/plan/plan-schema.js';

const figure = (si: number, dimension: Dimension) => ({si, text: formatQuantity(si, dimension)});

/** The rule file the interlock policy came from. */
export type PolicySource = {name: string; file: string; sha256: string};

/** The analysis as the `--json` contract: loop figures, findings with subject and message, the verdict. */
export function planJson(plan: Plan, analysis: PlanAnalysis, file: string, policySource: PolicySource) {
	return {
		plan: {name: plan.name, file, location: plan.location ?? null},
		policy: {
			rules: policySource,
			max_response_time: figure(plan.policy.max_response_time, 'time'),
			resistance_margin: figure(plan.policy.resistance_margin, 'ratio'),
			test_interval: {si: plan.policy.test_interval, text: durationText(plan.policy.test_interval)},
			longest_bypass: {si: plan.policy.longest_bypass, text: durationText(plan.policy.longest_bypass)},
		},
		loop: {
			resistance: figure(analysis.resistance.total, 'resistance'),
			contacts: figure(analysis.resistance.contacts, 'resistance'),
			wires: figure(analysis.resistance.wires, 'resistance'),
			allowed: figure(analysis.allowedResistance, 'resistance'),
			threshold: figure(plan.input.closed_below, 'resistance'),
			current: figure(analysis.current, 'current'),
			parts: analysis.resistance.parts.map((part) => ({from: part.from, what: part.what, ...figure(part.ohms, 'resistance')})),
		},
		response: {
			limit: figure(plan.policy.max_response_time, 'time'),
			devices: analysis.responses.map((entry) => ({device: entry.device, ...figure(entry.total, 'time')})),
		},
		findings: analysis.findings.map((entry) => ({severity: entry.severity, code: entry.code, subject: entry.subject, message: describeProblem(entry), data: entry.data})),
		verdict: {stops: analysis.stops, advises: analysis.advises, text: planVerdict(analysis)},
		deferral,
	};
}

/** The analysis as text for a terminal. */
export function planText(plan: Plan, analysis: PlanAnalysis, file: string, policySource: PolicySource): string {
	const r = analysis.resistance;
	const margin = formatQuantity(plan.policy.resistance_margin, 'ratio');
	const current = plan.input.sense_current === undefined ? 'loop voltage over source resistance, loop shorted' : 'sense current';
	const lines = [
		`Interlock plan: ${plan.name} (${file})`,
		`Location:       ${plan.location === undefined ? 'none given: add location (room and bench, as the bench check gives it), or no bench check can use a test of this plan' : plan.location}`,
		`Policy from:    ${policySource.name} (${policySource.file})`,
		'',
		'Loop',
		`  resistance  ${formatQuantity(r.total, 'resistance')} (contacts ${formatQuantity(r.contacts, 'resistance')} + wire ${formatQuantity(r.wires, 'resistance')} at ${formatQuantity(plan.wire_temperature, 'temperature')})`,
		`  allowed     ${formatQuantity(analysis.allowedResistance, 'resistance')} (input reads ${formatQuantity(plan.input.closed_below, 'resistance')} as closed, less ${margin})`,
		`  current     ${formatQuantity(analysis.current, 'current')} (${current})`,
		analysis.slowest
			? `  response    ${formatQuantity(analysis.slowest.total, 'time')} at the slowest, ${analysis.slowest.device}; policy allows ${formatQuantity(plan.policy.max_response_time, 'time')}`
			: '  response    no series device',
		'',
		`Findings (${analysis.findings.length})`,
		...(analysis.findings.length === 0 ? ['  none'] : analysis.findings.map((entry) => `  ${entry.severity === 'stop' ? 'STOP  ' : 'ADVISE'}  ${subjectText(entry.subject)}: ${describeProblem(entry)}`)),
		'',
		`Verdict: ${planVerdict(analysis)}`,
		'',
		deferral,
	];
	return `${lines.join('\n')}\n`;
}
