/**
 * Rewrites what people type into what the unit parser reads: µ/μ → u, Ω → ohm, °C → degC,
 * a Unicode minus → "-", and no space needed between number and unit.
 */
export function normaliseEntry(text: string): string {
	return text
		.trim()
		.replaceAll(/[µμ]/g, 'u')
		.replaceAll(/[ΩΩ]/g, 'ohm')
		.replaceAll(/\s*°\s*C\b/g, ' degC')
		.replaceAll(/\s*°\s*F\b/g, ' degF')
		.replaceAll('−', '-')
		.replaceAll(/\bohms\b/g, 'ohm')
		.replaceAll(/(?:√|sqrt|rt)\(?Hz\)?/g, 'Hz^0.5')
		.replaceAll(/\s+/g, ' ')
		.trim();
}
