import fc from 'fast-check';
import {describe, expect, it} from 'vitest';
import {isLeanBenchRecord} from '../../source/records/lean-record-check.js';
import {recordSchema} from '../../source/records/record-schema.js';
import {sampleRecord, sampleRules, serialise} from '../helpers/sample-record.js';

// The quick check may only ever say yes to what the record schema accepts unchanged: the schema
// is the reference. Records as prelase writes them must take the quick path (else it gains nothing).
const rules = sampleRules();
const written = [sampleRecord({rules}), sampleRecord({rules, now: new Date(Date.UTC(2026, 5, 1))}), sampleRecord({rules, withWhatIf: true})].map((record) => JSON.parse(serialise(record)) as unknown);

type Json = null | boolean | number | string | Json[] | {[name: string]: Json};

/** Every path to a value in the data (names and indexes). */
function paths(value: unknown, at: Array<string | number> = [], out: Array<Array<string | number>> = []): Array<Array<string | number>> {
	out.push(at);
	if (Array.isArray(value)) value.forEach((item, index) => paths(item, [...at, index], out));
	else if (value && typeof value === 'object') for (const [name, item] of Object.entries(value)) paths(item, [...at, name], out);
	return out;
}

const replacement = fc.oneof(
	fc.constantFrom<Json>(null, true, false, 0, -1, 1.5, 2, '', 'x', 'pass', 'yes', 'bench-check', 'Ed25519', [], {}, ['a'], {si: 1, text: '1 A'}, {open: ['a']}, {error: 'e'}, {status: 'yes'}, 'a'.repeat(64), `sha256:${'b'.repeat(64)}`),
	fc.string({maxLength: 8}),
	fc.double({noNaN: true, noDefaultInfinity: true}),
);

/** A mutation: replace a value, remove a name or item, or add a name. */
const mutation = fc.record({kind: fc.constantFrom('replace', 'remove', 'add'), at: fc.nat(), name: fc.constantFrom('extra', 'id', 'text', 'si', 'status', 'note', 'unit', 'fraction', 'entered', 'meaning'), value: replacement});

function mutate(data: unknown, changes: ReadonlyArray<{kind: string; at: number; name: string; value: Json}>): unknown {
	const copy = structuredClone(data) as {[name: string]: unknown};
	for (const change of changes) {
		const all = paths(copy);
		const path = all[change.at % all.length]!;
		if (path.length === 0) continue;
		const parent = path.slice(0, -1).reduce<unknown>((node, key) => (node as Record<string | number, unknown>)[key], copy) as Record<string | number, unknown> | unknown[];
		const last = path.at(-1)!;
		if (change.kind === 'replace') (parent as Record<string | number, unknown>)[last] = change.value;
		else if (change.kind === 'remove') {
			if (Array.isArray(parent)) parent.splice(Number(last), 1);
			else delete (parent as Record<string, unknown>)[last];
		} else {
			const target = (parent as Record<string | number, unknown>)[last];
			if (target && typeof target === 'object' && !Array.isArray(target)) (target as Record<string, unknown>)[change.name] = change.value;
		}
	}
	return copy;
}

describe('isLeanBenchRecord: a quick yes only where the record schema says yes', () => {
	it('takes records as prelase writes them', () => {
		for (const data of written) {
			expect(recordSchema.safeParse(data).success).toBe(true);
			expect(isLeanBenchRecord(data)).toBe(true);
		}
	});

	it('says yes to a mutated record only when the schema accepts it, and returns it unchanged', () => {
		fc.assert(
			fc.property(fc.constantFrom(...written), fc.array(mutation, {minLength: 1, maxLength: 3}), (data, changes) => {
				const changed = mutate(data, changes);
				if (!isLeanBenchRecord(changed)) return;
				const parsed = recordSchema.safeParse(changed);
				expect(parsed.success).toBe(true);
				expect(parsed.data).toEqual(changed);
			}),
			{numRuns: 3000},
		);
	});

	it.each([
		['an embedded rule text (a record made before the store)', (data: any) => (data.body.rules.text = 'rules: {}')],
		['inputs kept with what they were read as (before the lean body)', (data: any) => (data.body.inputs[Object.keys(data.body.inputs)[0]!] = {entered: '2 A', si: 2})],
		['confirmations as a list (before the lean body)', (data: any) => (data.body.confirmations = [])],
		['a margin with its SI number (before the lean body)', (data: any) => (data.body.checks[0].margin = {si: 1, unit: 'A', text: '1 A', fraction: 0.1})],
		['an unknown name in a check', (data: any) => (data.body.checks[0].extra = 1)],
		['no signatures', (data: any) => (data.signatures = [])],
		['a flip point that is not a number', (data: any) => (data.body.sensitivity = {a_check: {an_input: ['2 A']}})],
		['a signature count past the safe integers (found by this property at seed 735308053)', (data: any) => (data.signatures[0].count = 2 ** 53)],
		['a fingerprint in capitals', (data: any) => (data.signatures[0].fingerprint = data.signatures[0].fingerprint.toUpperCase())],
	])('leaves to the schema: %s', (_label, change) => {
		const data = structuredClone(written[0]) as any;
		change(data);
		expect(isLeanBenchRecord(data)).toBe(false);
	});
});
