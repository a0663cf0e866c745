import type {Corner} from '../rules/evaluate/evaluation.js';
import {cornerWords} from '../rules/evaluate/worst-corner.js';
import {finding, type Finding} from '../records/findings.js';
import {readRecordedCorner, recordedCornerText} from '../records/record-corner.js';

/** Equal SI numbers, allowing for the last bits of a different floating-point path. */
function sameNumber(a: number, b: number): boolean {
	return a === b || Math.abs(a - b) <= 1e-9 * Math.max(Math.abs(a), Math.abs(b));
}

const none = 'nowhere in particular (no corner)';

/**
 * The point a check was judged at, as the record keeps it (one line, records/record-corner.ts),
 * against the one re-evaluation finds: the same method, the same inputs whose end mattered, in the
 * same order, at the same ends (and, inside a range, the same number). A record from before ranges
 * has no corner, and neither has its re-evaluation (no input was a range).
 */
export function cornerFinding(id: string, recorded: string | undefined, computed: Corner | undefined): Finding | undefined {
	const expected = computed ? recordedCornerText({method: computed.method, inputs: computed.inputs.map(({id: input, end, value}) => ({id: input, end, si: value.si}))}) : undefined;
	if (recorded === undefined && expected === undefined) return undefined;
	const held = recorded === undefined ? undefined : readRecordedCorner(recorded);
	const wanted = expected === undefined ? undefined : readRecordedCorner(expected);
	const same =
		held !== undefined &&
		wanted !== undefined &&
		held.method === wanted.method &&
		held.inputs.length === wanted.inputs.length &&
		held.inputs.every((input, index) => {
			const other = wanted.inputs[index]!;
			return input.id === other.id && input.end === other.end && (input.si === undefined ? other.si === undefined : other.si !== undefined && sameNumber(input.si, other.si));
		});
	if (same) return undefined;
	return finding('consistency', 'audit-corner-mismatch', {id, recorded: recorded ?? none, computed: computed && expected !== undefined ? cornerWords(computed) : none});
}
