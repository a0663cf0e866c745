import type {Corner} from '../rules/evaluate/evaluation.js';
import {cornerWords} from '../rules/evaluate/worst-corner.js';
import {shownSi} from '../rules/evaluate/shown-value.js';
import {finding, type Finding} from '../records/findings.js';
import type {RecordBody} from '../records/record-schema.js';

type RecordedCorner = RecordBody['checks'][number]['corner'];

/** Equal SI numbers, allowing for the last bits of a different floating-point path. */
function sameNumber(a: number, b: number): boolean {
	return a === b || Math.abs(a - b) <= 1e-9 * Math.max(Math.abs(a), Math.abs(b));
}

/** The recorded corner in the words of a computed one, each end's number shown in SI (the record keeps no unit). */
function recordedWords(corner: NonNullable<RecordedCorner>, computed: Corner | undefined): string {
	const dimension = (id: string) => computed?.inputs.find((input) => input.id === id)?.value.dimension ?? 'number';
	return cornerWords({method: corner.method ?? 'corners', inputs: corner.inputs.map(({id, end, si}) => ({id, end, value: shownSi(si, dimension(id))}))});
}

/**
 * The point a check was judged at, as the record keeps it, against the one re-evaluation finds:
 * the same method, the same inputs in the same order, at the same ends and numbers. A record
 * from before ranges has no corner, and neither has its re-evaluation (no input was a range).
 */
export function cornerFinding(id: string, recorded: RecordedCorner, computed: Corner | undefined): Finding | undefined {
	if (!recorded && !computed) return undefined;
	const same =
		recorded !== undefined &&
		computed !== undefined &&
		(recorded.method ?? 'corners') === computed.method &&
		recorded.inputs.length === computed.inputs.length &&
		recorded.inputs.every((input, index) => {
			const other = computed.inputs[index]!;
			return input.id === other.id && input.end === other.end && sameNumber(input.si, other.value.si);
		});
	if (same) return undefined;
	return finding('consistency', 'audit-corner-mismatch', {id, recorded: recorded ? recordedWords(recorded, computed) : 'nowhere in particular (no corner)', computed: computed ? cornerWords(computed) : 'nowhere in particular (no corner)'});
}
