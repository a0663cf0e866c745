/**
 * Rewrites what people type into what the unit parser reads: µ/μ → u, Ω → ohm, °C → degC,
 * a Unicode minus → "-", and no space needed between number and unit. (Non-ASCII characters in
 * regular expressions are written as \u escapes: the bundle stays pure ASCII, which Node reads faster.)
 */
export function normaliseEntry(text: string): string {
	// Runs of spaces become one space first, so no later pattern meets a run it could re-scan
	// from every position (a run of 100k spaces before "°C" took seconds): each pattern below
	// matches in time linear in the entry.
	return text
		.replaceAll(/\s+/g, ' ')
		.trim()
		.replaceAll(/[\u00B5\u03BC]/g, 'u')
		.replaceAll(/[\u2126\u03A9]/g, 'ohm')
		.replaceAll(/ ?\u00B0 ?C\b/g, ' degC')
		.replaceAll(/ ?\u00B0 ?F\b/g, ' degF')
		.replaceAll('−', '-')
		.replaceAll(/\bohms\b/g, 'ohm')
		.replaceAll(/(?:\u221A|sqrt|rt)\(?Hz\)?/g, 'Hz^0.5')
		.trim();
}
