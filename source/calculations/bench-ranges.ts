import {above, between, type InputRange} from './calculation.js';

const celsius = (degrees: number) => degrees + 273.15;

/**
 * Validity ranges shared by the bench calculations, in SI. They are generous on purpose: they
 * refuse typing mistakes and values where a model means nothing (a negative supply, copper
 * below −100 °C), not designs. Limits that protect a diode belong in the rule file.
 */
export const benchRanges = {
	/** Supply voltage: above 0 V, up to 1 kV. */
	supply: above(0, 1000),
	/** Forward, knee and dropout voltages, source amplitudes: 0 V to 100 V. */
	voltage: between(0, 100),
	/** Diode and driver currents: 0 A to 1 kA (bars and stacks included). */
	current: between(0, 1000),
	/** Series, cable and sense resistances and source impedances: 0 Ω to 1 MΩ. */
	resistance: between(0, 1e6),
	/** Supply tolerance each way: 0 to 50 % (above 100 % the supply would go negative). */
	tolerance: between(0, 0.5),
	/** Electrical or optical power: 0 W to 100 kW. */
	power: between(0, 1e5),
	/** Absolute temperatures of a bench, a case or a junction: −100 °C to 300 °C. */
	temperature: between(celsius(-100), celsius(300)),
	/** A frequency: 0 Hz to 1 THz. */
	frequency: between(0, 1e12),
	/** A bandwidth: above 0 Hz, up to 1 THz. */
	bandwidth: above(0, 1e12),
	/** Thermal resistance: 0 K/W to 10 kK/W. */
	thermalResistance: between(0, 1e4),
} satisfies Record<string, InputRange>;
