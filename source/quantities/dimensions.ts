/**
 * A physical dimension the rules and calculations know, with its coherent SI unit and
 * the unit values of that dimension are shown in.
 */
export type DimensionInfo = {
	/** Coherent SI unit, as mathjs writes it; values are stored as numbers in this unit. */
	si: string;
	/** Unit used for display; SI prefixes are chosen for it when `prefixed` is true. */
	display: string;
	/** Whether the display unit takes an engineering prefix (m, k, µ…). */
	prefixed: boolean;
	/** Words for error messages: "a current", "a temperature"… */
	noun: string;
	/** Example entries shown in help and errors. */
	example: string;
};

/** Every dimension a rule file or calculation may name. */
export const dimensions = {
	current: {si: 'A', display: 'A', prefixed: true, noun: 'a current', example: '250 mA'},
	voltage: {si: 'V', display: 'V', prefixed: true, noun: 'a voltage', example: '2.1 V'},
	power: {si: 'W', display: 'W', prefixed: true, noun: 'a power', example: '1.5 W'},
	resistance: {si: 'ohm', display: 'Ω', prefixed: true, noun: 'a resistance', example: '1.2 ohm'},
	temperature: {si: 'K', display: '°C', prefixed: false, noun: 'a temperature', example: '25 degC'},
	temperature_difference: {si: 'K', display: 'K', prefixed: false, noun: 'a temperature difference', example: '60 K'},
	time: {si: 's', display: 's', prefixed: true, noun: 'a time', example: '3 s'},
	frequency: {si: 'Hz', display: 'Hz', prefixed: true, noun: 'a frequency', example: '1 MHz'},
	length: {si: 'm', display: 'm', prefixed: true, noun: 'a length', example: '905 nm'},
	area: {si: 'm^2', display: 'mm^2', prefixed: false, noun: 'an area', example: '0.5 mm^2'},
	angle: {si: 'rad', display: 'rad', prefixed: true, noun: 'an angle', example: '2 mrad'},
	thermal_resistance: {si: 'K/W', display: 'K/W', prefixed: false, noun: 'a thermal resistance', example: '3 K/W'},
	responsivity: {si: 'A/W', display: 'A/W', prefixed: false, noun: 'a responsivity (current per optical power)', example: '0.4 A/W'},
	slope_efficiency: {si: 'W/A', display: 'W/A', prefixed: false, noun: 'a slope efficiency (optical power per current)', example: '1.1 W/A'},
	transconductance: {si: 'A/V', display: 'A/V', prefixed: false, noun: 'a transfer gain (current per voltage)', example: '0.5 A/V'},
	irradiance: {si: 'W/m^2', display: 'mW/cm^2', prefixed: false, noun: 'an irradiance', example: '1 mW/cm^2'},
	radiant_exposure: {si: 'J/m^2', display: 'J/m^2', prefixed: false, noun: 'a radiant exposure', example: '18 J/m^2'},
	current_noise_density: {si: 'A/Hz^0.5', display: 'A/√Hz', prefixed: true, noun: 'a current noise density', example: '10 nA/rtHz'},
	energy: {si: 'J', display: 'J', prefixed: true, noun: 'an energy', example: '5 mJ'},
	ratio: {si: '', display: '%', prefixed: false, noun: 'a fraction or percentage', example: '10 %'},
	number: {si: '', display: '', prefixed: false, noun: 'a plain number', example: '4.5'},
} as const satisfies Record<string, DimensionInfo>;

/** Name of a known dimension. */
export type Dimension = keyof typeof dimensions;

/** All dimension names, for schemas and help. */
export const dimensionNames = Object.keys(dimensions) as [Dimension, ...Dimension[]];

/** The noun and example of a dimension, to fill entry messages. */
export function dimensionWords(dimension: keyof typeof dimensions) {
	return {noun: dimensions[dimension].noun, example: dimensions[dimension].example};
}
