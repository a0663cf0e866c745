import {describe, expect, it} from 'vitest';
import {answersFromRecord} from '../../source/audit/audit-answers.js';
import type {RecordBody} from '../../source/records/record-schema.js';
import {readDemo, shippedRules} from '../rules/bench-answers.js';

const rules = shippedRules();
const demo = readDemo('bench3-808nm-clear.yaml');

/** A record body with only what answersFromRecord reads: the inputs as entered, no confirmations. */
const bodyWith = (inputs: Record<string, string>) => ({setup: {name: null, fingerprint: ''}, inputs, confirmations: {}}) as unknown as RecordBody;
const entered = Object.fromEntries(Object.entries(demo.inputs).map(([id, value]) => [id, typeof value === 'boolean' ? (value ? 'yes' : 'no') : String(value)]));

describe('a record from before ranges, read under the current rules', () => {
	it('reads its supply_tolerance as the tolerance of the supply range, not as an unknown input', () => {
		const read = answersFromRecord(rules, bodyWith({...entered, supply_nominal: '5 V', supply_tolerance: '3 %'}));
		expect(read.unknownInputs).toEqual([]);
		expect(read.refusedInputs).toEqual([]);
		const supply = read.answers.inputs.get('supply_nominal');
		expect(supply?.entered).toBe('5 V ± 3 %');
		// hand arithmetic: 5 V × (1 ∓ 0.03) = 4.85 V .. 5.15 V
		expect(supply?.kind === 'quantity' && supply.range?.low).toBeCloseTo(4.85, 12); // hand arithmetic in the comment above
		expect(supply?.kind === 'quantity' && supply.range?.high).toBeCloseTo(5.15, 12); // hand arithmetic in the comment above
	});

	it('a record since ranges is read as entered', () => {
		const read = answersFromRecord(rules, bodyWith(Object.fromEntries(Object.entries({...entered, supply_nominal: '11.5 V .. 12.5 V'}).filter(([id]) => id !== 'supply_tolerance'))));
		expect(read.answers.inputs.get('supply_nominal')?.entered).toBe('11.5 V .. 12.5 V');
	});
});
