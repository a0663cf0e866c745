/**
 * Table edges of the optical calculations (wavelength bands, duration breakpoints, aperture
 * regimes). Whatever double a spelling of a value gives (700 nm, 0.7 µm, 7e-7 m), a value within
 * a tiny relative distance of an edge is taken as exactly on it, and where the table is
 * discontinuous there, both adjoining rows are evaluated and the safer one is used.
 */

/**
 * Relative distance within which a value is on an edge. Decimal unit conversions are off by
 * about 1e-16; no real wavelength or duration is typed to ten significant figures.
 */
export const edgeTolerance = 1e-10;

/** How far on either side of an edge a probe looks to pick the adjoining row (relative). */
const probeOffset = 1e-6;

/** A value snapped onto an edge when it lies within the tolerance of one. */
export type Snapped = {
	/** The value, or the edge itself when it lies on one. */
	value: number;
	/** The edge it lies on, if any. */
	edge?: number;
};

/** Snaps a value onto the first edge it lies within `edgeTolerance` of. */
export function snapToEdge(value: number, edges: readonly number[]): Snapped {
	for (const edge of edges) if (Math.abs(value - edge) <= edgeTolerance * Math.abs(edge)) return {value: edge, edge};
	return {value};
}

/**
 * The values a table's row choice should be probed at: the value itself, and, on an edge, a value
 * just below and just above, so that both a `<` and a `≤` comparison see both adjoining rows.
 */
export function probes(snapped: Snapped): number[] {
	if (snapped.edge === undefined) return [snapped.value];
	return [snapped.edge * (1 - probeOffset), snapped.edge, snapped.edge * (1 + probeOffset)];
}

/** Formats an edge for a limit text: "700 nm", "1 ms", "13 µs", "10⁻¹¹ s". */
export function edgeText(value: number, unit: 'nm' | 's'): string {
	const plain = (x: number) => Number(x.toPrecision(6));
	if (unit === 'nm' || value >= 1) return `${plain(value)} ${unit}`;
	if (value >= 1e-3) return `${plain(value * 1e3)} ms`;
	if (value >= 1e-6) return `${plain(value * 1e6)} µs`;
	if (value >= 1e-9) return `${plain(value * 1e9)} ns`;
	const exponent = Math.round(Math.log10(value));
	const superscript = String(exponent).replace(/[-0-9]/g, (c) => '⁻⁰¹²³⁴⁵⁶⁷⁸⁹'['-0123456789'.indexOf(c)]!);
	return 10 ** exponent === value ? `10${superscript} s` : `${plain(value)} s`;
}

/** Metres to nanometres, the unit the optical tables are written in. */
export function nanometres(metres: number): number {
	return metres * 1e9;
}
