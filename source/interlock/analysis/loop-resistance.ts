import {copperCoefficient20, copperResistivity20, wire} from '../../calculations/wire.js';
import type {Plan, WireRun} from '../plan/plan-schema.js';

/** The resistance of one wire run, all its loop conductors together, in ohms. */
export function wireRunResistance(run: WireRun, temperature: number): number {
	const conductor =
		run.awg !== undefined
			? wire.compute({awg: run.awg, length: run.length, temperature})['resistance']!
			: (copperResistivity20 * (1 + copperCoefficient20 * (temperature - 293.15)) * run.length) / run.cross_section!;
	return conductor * run.conductors;
}

/** One named part of the loop resistance. */
export type ResistancePart = {from: string; what: 'contact' | 'wire'; ohms: number};

/** The loop resistance, part by part: the contact of every series device and every wire run. */
export type LoopResistance = {total: number; contacts: number; wires: number; parts: ResistancePart[]};

/**
 * Adds up the loop. Parallel devices and bypass keys are not in the series path, so their
 * contacts are left out; every wire run given is counted (a parallel device's run too,
 * which errs towards a higher resistance).
 */
export function loopResistance(plan: Plan): LoopResistance {
	const parts: ResistancePart[] = [];
	if (plan.input.wire_to_first) parts.push({from: 'input', what: 'wire', ohms: wireRunResistance(plan.input.wire_to_first, plan.wire_temperature)});
	for (const device of plan.devices) {
		if (inSeriesPath(device)) parts.push({from: device.id, what: 'contact', ohms: device.contact_resistance});
		if (device.wire_to_next) parts.push({from: device.id, what: 'wire', ohms: wireRunResistance(device.wire_to_next, plan.wire_temperature)});
	}
	const sum = (what: ResistancePart['what']) => parts.filter((part) => part.what === what).reduce((total, part) => total + part.ohms, 0);
	const contacts = sum('contact');
	const wires = sum('wire');
	return {total: contacts + wires, contacts, wires, parts};
}

/** True for a device that carries the loop current in the series path. */
export function inSeriesPath(device: Plan['devices'][number]): boolean {
	return device.wiring === 'series' && device.kind !== 'bypass_key';
}

/**
 * The largest current the loop can carry: the input's sense current, or else its loop
 * voltage over its source resistance with the loop shorted (the worst case for a contact).
 */
export function loopCurrent(input: Plan['input']): number {
	return input.sense_current ?? input.loop_voltage / input.source_resistance!;
}
