import {describe, expect, it} from 'vitest';
import {analysePlan} from '../../../source/interlock/analysis/analyse.js';
import {loopCurrent, loopResistance, wireRunResistance} from '../../../source/interlock/analysis/loop-resistance.js';
import {doorSwitch, makePlan} from '../plan-fixture.js';

const at75 = 348.15;
const at20 = 293.15;
const kiloFoot = 304.8;

// NFPA 70 (NEC) Chapter 9 Table 8, uncoated solid copper at 75 °C, Ω/kft; the table rounds
// to three figures, so ±0.5 % is allowed. A run of half a kilofoot with both conductors in the
// loop is one kilofoot of conductor.
const necRuns = [
	{awg: 18, ohms: 7.77}, // NEC Chapter 9 Table 8: 18 AWG solid 7.77 Ω/kft at 75 °C
	{awg: 14, ohms: 3.07}, // NEC Chapter 9 Table 8: 14 AWG solid 3.07 Ω/kft at 75 °C
	{awg: 10, ohms: 1.21}, // NEC Chapter 9 Table 8: 10 AWG solid 1.21 Ω/kft at 75 °C
];

describe('wire runs against copper tables', () => {
	it.each(necRuns)('$awg AWG, half a kilofoot out and back, at 75 °C is $ohms Ω', ({awg, ohms}) => {
		const resistance = wireRunResistance({awg, length: kiloFoot / 2, conductors: 2}, at75);
		expect(Math.abs(resistance / ohms - 1)).toBeLessThan(0.005);
	});

	it('counts each conductor of the run', () => {
		const one = wireRunResistance({awg: 14, length: kiloFoot, conductors: 1}, at75);
		// NEC Chapter 9 Table 8: 14 AWG solid 3.07 Ω/kft at 75 °C; four conductors carry four times that
		expect(wireRunResistance({awg: 14, length: kiloFoot, conductors: 4}, at75) / 4).toBeCloseTo(one, 12);
		expect(one).toBeCloseTo(3.07, 1);
	});

	it('uses ρ·L/A for a cross-section in mm²', () => {
		// hand arithmetic: 1 mm², 100 m out and back at 20 °C: 2 × (1/58 Ω·mm²/m) × 100 m / 1 mm² = 3.4483 Ω
		expect(wireRunResistance({cross_section: 1e-6, length: 100, conductors: 2}, at20)).toBeCloseTo(3.4483, 4);
		// hand arithmetic: the same at 75 °C is × (1 + 0.00393 × 55) = × 1.21615 → 4.1936 Ω
		expect(wireRunResistance({cross_section: 1e-6, length: 100, conductors: 2}, at75)).toBeCloseTo(4.1936, 3);
	});

	it('stays within the published maximum for 1.5 mm² solid copper', () => {
		// IEC 60228 Table 1, class 1 plain copper 1.5 mm²: at most 12.1 Ω/km at 20 °C (from memory)
		const perKilometre = wireRunResistance({cross_section: 1.5e-6, length: 1000, conductors: 1}, at20);
		expect(perKilometre).toBeLessThan(12.1);
		expect(perKilometre).toBeGreaterThan(12.1 * 0.9);
	});
});

describe('loop resistance', () => {
	it('adds every series contact and every run, and leaves out a bypass key contact', () => {
		const plan = makePlan({
			wire_temperature: '75 degC',
			input: {description: 'in', loop_voltage: '24 V', sense_current: '10 mA', closed_below: '100 ohm', response_time: '1 ms', disable_time: '1 ms', latches: true, wire_to_first: {awg: 14, length: '152.4 m'}},
			devices: [
				doorSwitch('door_switch', {contact_resistance: '0.5 ohm', wire_to_next: {awg: 14, length: '152.4 m'}}),
				{...doorSwitch('estop', {contact_resistance: '0.25 ohm'}), kind: 'emergency_stop'},
				{...doorSwitch('bypass', {contact_resistance: '7 ohm'}), kind: 'bypass_key', contact: 'normally_open', wiring: 'parallel', bypass: {owner: 'a', reason: 'b', time_limit: '1 h'}},
			],
		});
		const loop = loopResistance(plan);
		// NEC Chapter 9 Table 8: 14 AWG solid 3.07 Ω/kft at 75 °C; two runs of 0.5 kft × 2 conductors = 2 kft → 6.14 Ω
		expect(loop.wires).toBeCloseTo(6.14, 1);
		// hand arithmetic: 0.5 Ω + 0.25 Ω; the bypass key's 7 Ω is not in the series path
		expect(loop.contacts).toBeCloseTo(0.75, 12);
		expect(loop.total).toBeCloseTo(loop.wires + 0.75, 12);
		expect(loop.parts.map((part) => `${part.from}:${part.what}`)).toEqual(['input:wire', 'door_switch:contact', 'door_switch:wire', 'estop:contact']);
	});

	it.each([
		// hand arithmetic: 100 Ω less 20 % allows 80 Ω
		{name: 'just below the allowed 80 Ω', contact: '79.9 ohm', stop: false},
		{name: 'at the allowed 80 Ω', contact: '80 ohm', stop: false},
		{name: 'above the allowed 80 Ω', contact: '80.1 ohm', stop: true},
	])('the threshold less the margin: $name', ({contact, stop}) => {
		const analysis = analysePlan(makePlan({devices: [doorSwitch('door_switch', {contact_resistance: contact}), {...doorSwitch('estop'), kind: 'emergency_stop'}]}));
		expect(analysis.allowedResistance).toBeCloseTo(80, 12);
		const found = analysis.findings.filter((entry) => entry.code === 'interlock-loop-resistance');
		expect(found.length).toBe(stop ? 1 : 0);
		if (stop) expect(found[0]!.data).toMatchObject({resistance: '80.1 Ω', allowed: '80 Ω', threshold: '100 Ω', margin: '20 %'});
	});
});

describe('loop current and voltage against contact ratings', () => {
	it('takes the sense current, or else the loop voltage over the source resistance', () => {
		expect(loopCurrent(makePlan().input)).toBeCloseTo(0.01, 12);
		const input = {description: 'in', loop_voltage: '24 V', source_resistance: '1.2 kohm', closed_below: '100 ohm', response_time: '1 ms', disable_time: '1 ms', latches: true};
		// hand arithmetic: 24 V / 1200 Ω = 20 mA
		expect(loopCurrent(makePlan({input}).input)).toBeCloseTo(0.02, 12);
	});

	it('finds a contact rated below the loop current or voltage', () => {
		const devices = [doorSwitch('door_switch', {rated_current: '5 mA', rated_voltage: '12 V'}), {...doorSwitch('estop', {rated_current: '10 mA', rated_voltage: '24 V'}), kind: 'emergency_stop'}];
		const found = analysePlan(makePlan({devices})).findings.filter((entry) => entry.code.startsWith('interlock-contact'));
		expect(found.map((entry) => [entry.code, entry.subject, entry.severity])).toEqual([
			['interlock-contact-current', {kind: 'device', id: 'door_switch'}, 'stop'],
			['interlock-contact-voltage', {kind: 'device', id: 'door_switch'}, 'stop'],
		]);
		expect(found[0]!.data).toEqual({current: '10 mA', rating: '5 mA'});
	});
});

describe('missing wire runs', () => {
	it('advises on the input and each series device with no run, not on a bypass key', () => {
		const key = {...doorSwitch('bypass'), kind: 'bypass_key', contact: 'normally_open', wiring: 'parallel', bypass: {owner: 'a', reason: 'b', time_limit: '1 h'}};
		const devices = [doorSwitch('door_switch', {wire_to_next: {awg: 22, length: '1 m'}}), {...doorSwitch('estop'), kind: 'emergency_stop'}, key];
		const found = analysePlan(makePlan({devices})).findings.filter((entry) => entry.code === 'interlock-run-missing');
		expect(found.map((entry) => [entry.severity, entry.subject, entry.data['field']])).toEqual([
			['advise', {kind: 'input'}, 'input.wire_to_first'],
			['advise', {kind: 'device', id: 'estop'}, 'wire_to_next'],
		]);
	});
});
