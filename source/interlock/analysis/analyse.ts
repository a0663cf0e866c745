import {coverageFindings} from './coverage.js';
import {failSafeFindings} from './fail-safe.js';
import type {Finding} from './finding.js';
import {allowedResistance, loopFindings} from './loop-findings.js';
import {loopCurrent, loopResistance, type LoopResistance} from './loop-resistance.js';
import type {Plan} from '../plan/plan-schema.js';
import {responseFindings, responses, type DeviceResponse} from './response.js';

/** What the planner worked out from a plan: loop figures and findings, stop findings first. */
export type PlanAnalysis = {
	resistance: LoopResistance;
	/** The loop resistance allowed: the input's threshold less the policy margin, in ohms. */
	allowedResistance: number;
	/** The largest current through the contacts, in amperes. */
	current: number;
	responses: DeviceResponse[];
	/** The slowest device's response, or undefined for a loop with no series device. */
	slowest: DeviceResponse | undefined;
	findings: Finding[];
	stops: number;
	advises: number;
};

/** Analyses a validated plan. Pure: the same plan always gives the same analysis. */
export function analysePlan(plan: Plan): PlanAnalysis {
	const resistance = loopResistance(plan);
	const current = loopCurrent(plan.input);
	const timed = responses(plan);
	const all = [...loopFindings(plan, resistance, current), ...failSafeFindings(plan), ...coverageFindings(plan), ...responseFindings(plan, timed)];
	const findings = [...all.filter((entry) => entry.severity === 'stop'), ...all.filter((entry) => entry.severity === 'advise')];
	const slowest = timed.reduce<DeviceResponse | undefined>((worst, entry) => (worst === undefined || entry.total > worst.total ? entry : worst), undefined);
	const stops = findings.filter((entry) => entry.severity === 'stop').length;
	return {resistance, allowedResistance: allowedResistance(plan), current, responses: timed, slowest, findings, stops, advises: findings.length - stops};
}

/** The one-line verdict. It names the findings; it never says the loop is safe. */
export function planVerdict(analysis: PlanAnalysis): string {
	const count = (n: number, word: string) => `${n} ${word} finding${n === 1 ? '' : 's'}`;
	if (analysis.stops > 0) return `${count(analysis.stops, 'stop')}, ${count(analysis.advises, 'advise')}: resolve every stop finding before this loop is wired and relied on.`;
	return `No stop findings, ${count(analysis.advises, 'advise')}: wire the loop, then prove it with the functional test sheet.`;
}
