import fc from 'fast-check';
import {describe, expect, it} from 'vitest';
import {readRecordedCorner, recordedCornerText} from '../../source/records/record-corner.js';
import {recordBodySchema} from '../../source/records/record-schema.js';

type End = 'low' | 'high' | 'inside' | 'either';

describe('a corner as a record keeps it: one line', () => {
	it.each([
		[{method: 'corners', inputs: [{id: 'supply_nominal', end: 'low', si: 4.75}]}, 'supply_nominal low'],
		[{method: 'corners', inputs: [{id: 'supply_nominal', end: 'high', si: 5.25}, {id: 'ambient_max', end: 'high', si: 308.15}]}, 'supply_nominal high, ambient_max high'],
		[{method: 'searched', inputs: [{id: 'current_limit', end: 'inside', si: 0.42}]}, 'searched: current_limit inside 0.42'],
		[{method: 'capped', inputs: [{id: 'a', end: 'either', si: 1}, {id: 'b', end: 'low', si: 2}]}, 'capped: b low'],
		[{method: 'corners', inputs: [{id: 'supply_nominal', end: 'either', si: 4.75}]}, undefined],
	] as Array<[{method: 'corners' | 'searched' | 'capped'; inputs: Array<{id: string; end: End; si: number}>}, string | undefined]>)('%j is written %j', (corner, line) => {
		expect(recordedCornerText(corner)).toBe(line);
	});

	it('reads back what it writes, with the number inside a range exactly', () => {
		const id = fc.stringMatching(/^[a-z_][a-z0-9_]{0,20}$/);
		const input = fc.record({id, end: fc.constantFrom<End>('low', 'high', 'inside', 'either'), si: fc.double({noNaN: true, noDefaultInfinity: true})});
		fc.assert(
			fc.property(fc.constantFrom('corners', 'searched', 'capped') as fc.Arbitrary<'corners' | 'searched' | 'capped'>, fc.array(input, {minLength: 1, maxLength: 5}), (method, inputs) => {
				const line = recordedCornerText({method, inputs});
				const kept = inputs.filter((entry) => entry.end !== 'either');
				if (kept.length === 0) {
					expect(line).toBeUndefined();
					return;
				}
				expect(readRecordedCorner(line!)).toEqual({method, inputs: kept.map(({id: name, end, si}) => (end === 'inside' ? {id: name, end, si: Object.is(si, -0) ? 0 : si} : {id: name, end}))});
			}),
			{numRuns: 500},
		);
	});

	it.each(['', 'supply_nominal', 'supply_nominal middle', 'supply_nominal low,ambient_max high', 'supply_nominal inside', 'supply_nominal inside x', 'guessed: a low', 'a low, ', 'a\nlow', 'a low\u001b[2J'])('refuses %j, and so does the record schema', (line) => {
		expect(readRecordedCorner(line)).toBeUndefined();
		const check = recordBodySchema.shape.checks.element.shape.corner;
		expect(check.safeParse(line).success).toBe(false);
	});
});
