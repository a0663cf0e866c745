import type {Corner, CornerInput} from '../rules/evaluate/evaluation.js';

/**
 * The corner a check was judged at, as a record keeps it: one short line, so that a record stays
 * small however many of its checks depend on a range.
 *
 *     supply_nominal low
 *     supply_nominal high, ambient_max high
 *     searched: diode_series_resistance inside 0.42
 *
 * Each input at its end (`low` or `high`: the number follows from the range entered, which the
 * record keeps) or `inside` with its SI number (found by a search); `searched:` or `capped:` in
 * front when not every corner was tried. Inputs whose end did not matter to the check are left out,
 * and a check none of whose ranged inputs mattered keeps no corner.
 */
export type RecordedCorner = {method: Corner['method']; inputs: Array<{id: string; end: 'low' | 'high' | 'inside'; si?: number}>};

/** The line a record keeps for a corner (as JSON gives it, each end with its SI number); undefined when no ranged input's end mattered. */
export function recordedCornerText(corner: {method: Corner['method']; inputs: ReadonlyArray<{id: string; end: CornerInput['end']; si: number}>}): string | undefined {
	const inputs = corner.inputs.filter((input) => input.end !== 'either');
	if (inputs.length === 0) return undefined;
	const items = inputs.map(({id, end, si}) => (end === 'inside' ? `${id} inside ${String(si)}` : `${id} ${end}`));
	return `${corner.method === 'corners' ? '' : `${corner.method}: `}${items.join(', ')}`;
}

const item = /^([A-Za-z_][A-Za-z0-9_]*) (?:(low|high)|inside (-?(?:\d+\.?\d*|\.\d+)(?:[eE][-+]?\d+)?))$/;

/** Reads a recorded corner line; undefined when it is not one (the record schema refuses such a record). */
export function readRecordedCorner(text: string): RecordedCorner | undefined {
	if (text.length > 2000) return undefined;
	const method = /^(searched|capped): /.exec(text)?.[1] as 'searched' | 'capped' | undefined;
	const rest = method ? text.slice(method.length + 2) : text;
	const inputs: RecordedCorner['inputs'] = [];
	for (const part of rest.split(', ')) {
		const match = item.exec(part);
		if (!match) return undefined;
		const si = match[3] === undefined ? undefined : Number(match[3]);
		if (si !== undefined && !Number.isFinite(si)) return undefined;
		inputs.push({id: match[1]!, end: match[2] === undefined ? 'inside' : (match[2] as 'low' | 'high'), ...(si === undefined ? {} : {si})});
	}
	return {method: method ?? 'corners', inputs};
}

/** Whether a line is a recorded corner (for the record schema and the quick record check). */
export function isRecordedCornerText(value: unknown): value is string {
	return typeof value === 'string' && readRecordedCorner(value) !== undefined;
}
