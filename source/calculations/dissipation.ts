import type {Calculation} from './calculation.js';
import {benchRanges} from './bench-ranges.js';

/**
 * Worst-case internal dissipation of a linear driver over 0…limit. With V_F(I) = knee + R_s·I,
 * P(I) = (supply − knee − R_s·I)·I peaks at I* = (supply − knee)/(2·R_s) when that lies
 * inside the range, so the worst case is not always at the limit.
 */
export const dissipation: Calculation = {
	name: 'dissipation',
	summary: 'Worst-case internal dissipation of a linear driver over 0…limit, and with the output shorted',
	inputs: {
		supply: {dimension: 'voltage', description: 'Supply voltage (use the high tolerance for the worst case)', range: benchRanges.supply},
		knee: {dimension: 'voltage', description: 'Knee voltage of the diode', range: benchRanges.voltage},
		series_resistance: {dimension: 'resistance', description: 'Series resistance of the diode', range: benchRanges.resistance},
		limit: {dimension: 'current', description: 'Current limit of the driver', range: benchRanges.current},
	},
	outputs: {
		worst_power: {dimension: 'power', description: 'Largest dissipation in the driver for any current from 0 to the limit'},
		worst_current: {dimension: 'current', description: 'Current at which that largest dissipation occurs'},
		fault_power: {dimension: 'power', description: 'Dissipation with the output shorted at the limit (supply × limit)'},
	},
	main: 'worst_power',
	formula: 'P(I) = (V_supply − V_knee − R_s·I)·I; maximum at I* = (V_supply − V_knee)/(2·R_s) if 0 < I* < I_limit, else at I_limit; fault: V_supply × I_limit',
	basis: ['Linear pass-element dissipation (V_supply − V_load)·I: common practice; maximum found by setting dP/dI = 0'],
	compute: ({supply, knee, series_resistance, limit}) => {
		const powerAt = (current: number) => Math.max(0, (supply! - knee! - series_resistance! * current) * current);
		let worstCurrent = limit!;
		if (series_resistance! > 0) {
			const peak = (supply! - knee!) / (2 * series_resistance!);
			if (peak > 0 && peak < limit!) worstCurrent = peak;
		}
		return {worst_power: powerAt(worstCurrent), worst_current: worstCurrent, fault_power: supply! * limit!};
	},
};
