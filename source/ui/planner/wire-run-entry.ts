/** The wire run form's three entries, as typed: size (AWG or mm²), length, conductors. */
export type RunEntries = {size: string; length: string; conductors: string};

/** The entries of the wire run form, the one in focus (3 is the Apply line), and what was refused, at which entry. */
export type RunForm = {entries: RunEntries; /** The entries as the form opened: a change is what differs from them. */ opened: RunEntries; focus: number; message?: string; /** Esc was pressed with the entries changed: the form asks whether to discard them. */ asking?: boolean};

/** The entries in the order of the form, with their labels and hints. */
export const runFields: ReadonlyArray<{key: keyof RunEntries; label: string; hint: string}> = [
	{key: 'size', label: 'Wire size (AWG or mm²)', hint: 'the copper size: AWG 24, or a cross-section such as 0.5 mm²'},
	{key: 'length', label: 'Length to the next device', hint: 'the cable length with its unit, e.g. 1.5 m (the last device: back to the input)'},
	{key: 'conductors', label: 'Conductors carrying the loop', hint: 'a whole number; empty: 2, out and back'},
];

/** A wire run as the plan file holds it (flow map keys), or the reason it cannot be one and at which entry. */
export type RunParse = {ok: true; run: Record<string, unknown> | undefined} | {ok: false; at: number; message: string};

const awgPattern = /^(?:awg\s*#?\s*(\d{1,2})|#?(\d{1,2})\s*awg|(\d{1,2}))$/i;
const areaPattern = /^(\d+(?:\.\d+)?|\.\d+)\s*mm(?:\u00B2|\^2|2)$/;

/** The size entry as the file writes it: {awg: 26} or {cross_section: "0.5 mm^2"}; undefined when it is neither. */
export function parseWireSize(entry: string): {awg: number} | {cross_section: string} | undefined {
	const text = entry.trim();
	const awg = awgPattern.exec(text);
	if (awg) return {awg: Number(awg[1] ?? awg[2] ?? awg[3])};
	const area = areaPattern.exec(text);
	return area ? {cross_section: `${area[1]} mm^2`} : undefined;
}

/** How a wire run is shown in one line: "AWG 22 · 1.5 m", with the conductors when not the usual two. */
export function runSummary(run: Record<string, unknown> | undefined): string {
	if (!run || (run['awg'] === undefined && run['cross_section'] === undefined && run['length'] === undefined)) return '(none)';
	const size = run['awg'] !== undefined ? `AWG ${String(run['awg'])}` : String(run['cross_section'] ?? '?');
	const conductors = run['conductors'] !== undefined && Number(run['conductors']) !== 2 ? ` · ${String(run['conductors'])} conductors` : '';
	return `${size} · ${String(run['length'] ?? '?')}${conductors}`;
}

/** The entries a run in the file opens the form with. */
export function runEntries(run: Record<string, unknown> | undefined): RunEntries {
	if (!run) return {size: '', length: '', conductors: ''};
	const size = run['awg'] !== undefined ? `AWG ${String(run['awg'])}` : run['cross_section'] !== undefined ? String(run['cross_section']) : '';
	return {size, length: run['length'] === undefined ? '' : String(run['length']), conductors: run['conductors'] === undefined ? '' : String(run['conductors'])};
}

/** Why an entry cannot be what its field asks for, or undefined; the length's unit is checked by the plan itself. */
export function entryProblem(key: keyof RunEntries, entry: string): string | undefined {
	const text = entry.trim();
	if (key === 'size' && !parseWireSize(text)) return `wire size: give the gauge as AWG 26, or the cross-section as 0.5 mm²${text === '' ? '' : ` ("${text}" is neither)`}`;
	if (key === 'length' && text === '') return 'length to the next device: give the cable length with its unit, e.g. 1.5 m';
	if (key === 'conductors' && text !== '' && !/^\d+$/.test(text)) return `conductors carrying the loop: a whole number such as 2 ("${text}" is not)`;
	return undefined;
}

/** The entries as one wire run: all empty removes the run; size and length are both needed, each refused in words when missing. */
export function parseRun(entries: RunEntries): RunParse {
	if (runFields.every(({key}) => entries[key].trim() === '')) return {ok: true, run: undefined};
	for (const [at, {key}] of runFields.entries()) {
		const message = entryProblem(key, entries[key]);
		if (message) return {ok: false, at, message};
	}
	const conductors = entries.conductors.trim();
	return {ok: true, run: {...parseWireSize(entries.size), length: entries.length.trim(), ...(conductors === '' ? {} : {conductors: Number(conductors)})}};
}
