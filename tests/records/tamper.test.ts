import {createHash} from 'node:crypto';
import {isDeepStrictEqual} from 'node:util';
import fc from 'fast-check';
import {beforeAll, describe, expect, it} from 'vitest';
import {fingerprint, generateKeyPair, rawPublicKey} from '../../source/records/key-material.js';
import {checkRecordText} from '../../source/records/read-record.js';
import type {BenchRecord} from '../../source/records/record-schema.js';
import {signRecord} from '../../source/records/sign.js';
import type {CompiledRules} from '../../source/rules/compile/compiled-rules.js';
import {sampleRecord, sampleRules, serialise, signerWith} from '../helpers/sample-record.js';

let rules: CompiledRules;
let record: BenchRecord;
let text: string;
let bytes: Buffer;
let original: unknown;
/** The byte range of the body's JSON text inside the serialised record. */
let bodyStart: number;
let bodyEnd: number;

beforeAll(() => {
	rules = sampleRules();
	record = sampleRecord({rules});
	text = serialise(record);
	bytes = Buffer.from(text, 'utf8');
	original = JSON.parse(text);
	bodyStart = bytes.indexOf('\n\t"body": ') + '\n\t"body": '.length;
	// The next name at the top level (one tab): the names are in canonical order, so what follows the body varies.
	bodyEnd = bytes.indexOf(',\n\t"', bodyStart);
});

/** A deep copy of the sample record, to alter. */
const copy = (): BenchRecord => structuredClone(record);

/** The serialised record with one byte replaced. */
function withByte(position: number, value: number): string {
	const changed = Buffer.from(bytes);
	changed[position] = value;
	return changed.toString('utf8');
}

/** What a change did to the data: broke the JSON, left the same data (spacing only), or changed it. */
function effect(changed: string): 'broken' | 'same' | 'changed' {
	let data: unknown;
	try {
		data = JSON.parse(changed);
	} catch {
		return 'broken';
	}
	return isDeepStrictEqual(data, original) ? 'same' : 'changed';
}

/** Recursively rebuilds objects with their keys in reverse order. */
function reverseKeys(value: unknown): unknown {
	if (Array.isArray(value)) return value.map(reverseKeys);
	if (value && typeof value === 'object') return Object.fromEntries(Object.entries(value).reverse().map(([key, item]) => [key, reverseKeys(item)]));
	return value;
}

describe('the sample record', () => {
	it('passes integrity as written, and the body range holds exactly the body', () => {
		expect(checkRecordText(text)).toMatchObject({ok: true, signatures: [{index: 0, valid: true}]});
		expect(bodyStart).toBeGreaterThan(0);
		expect(bodyEnd).toBeGreaterThan(bodyStart);
		expect(JSON.parse(bytes.subarray(bodyStart, bodyEnd).toString('utf8'))).toEqual(record.body);
		// The rule text is stored once beside the records, by its SHA-256 (the body names it, the signature covers the name).
		expect(record.body.rules.text).toBeUndefined();
		expect(record.body.rules.sha256).toBe(createHash('sha256').update(rules.text).digest('hex'));
	});
});

describe('single-byte changes inside the body', () => {
	it('every change is an integrity failure unless the data is unchanged (property over position and byte)', () => {
		const seen = {broken: 0, same: 0, changed: 0};
		fc.assert(
			fc.property(fc.integer({min: 0, max: Number.MAX_SAFE_INTEGER}), fc.integer({min: 1, max: 255}), (where, delta) => {
				const position = bodyStart + (where % (bodyEnd - bodyStart));
				const changed = withByte(position, (bytes[position]! + delta) & 0xff);
				const kind = effect(changed);
				seen[kind] += 1;
				const result = checkRecordText(changed);
				// Only a change that leaves the same data (e.g. one blank for another between tokens) may still verify.
				expect(result.ok, `byte ${position} (${JSON.stringify(text.slice(Math.max(0, position - 20), position + 20))}) +${delta}: ${kind}`).toBe(kind === 'same');
			}),
			{numRuns: 300},
		);
		// Most changes land inside strings and still parse: the signature check, not JSON.parse, must catch them.
		expect(seen.changed).toBeGreaterThan(100);
	});

	it('every 97th byte of the body, with its lowest bit flipped, is an integrity failure', () => {
		const stride = 97;
		let parsed = 0;
		const survivors: number[] = [];
		for (let position = bodyStart; position < bodyEnd; position += stride) {
			const changed = withByte(position, bytes[position]! ^ 0x01);
			const kind = effect(changed);
			if (kind !== 'broken') parsed += 1;
			if (kind !== 'same' && checkRecordText(changed).ok) survivors.push(position);
		}
		expect(survivors).toEqual([]);
		expect(parsed).toBeGreaterThan((bodyEnd - bodyStart) / stride / 2);
	});

	it('a number written in exponent form (4.5E-1 for 0.45) is the same data and still verifies (canonical form)', () => {
		// 0.45 written as 4.5E-1: other bytes, the same number.
		const at = text.indexOf('"si":0.45,');
		expect(at).toBeGreaterThan(bodyStart);
		expect(at).toBeLessThan(bodyEnd);
		const changed = text.replace('"si":0.45,', '"si":4.5E-1,');
		expect(effect(changed)).toBe('same');
		expect(checkRecordText(changed).ok).toBe(true);
	});

	it('a digit changed in a recorded value, or a letter in the setup name, is an integrity failure', () => {
		const digit = bytes.indexOf('"si":0.45,');
		expect(digit).toBeGreaterThan(bodyStart);
		expect(checkRecordText(withByte(digit + '"si":0.4'.length, '4'.charCodeAt(0)))).toMatchObject({ok: false, reason: expect.stringMatching(/^signature 1 \(Ada Operator\): the signature does not match the content/)});
		const name = bytes.indexOf('Fenwick Hollow bench 3');
		expect(name).toBeGreaterThan(bodyStart);
		expect(checkRecordText(withByte(name, 'f'.charCodeAt(0))).ok).toBe(false);
	});
});

describe('changes to the record as data', () => {
	it('a swapped public key (with its own fingerprint) is an integrity failure', () => {
		const raw = rawPublicKey(generateKeyPair().publicKey);
		const tampered = copy();
		tampered.signatures[0]!.publicKey = raw.toString('base64');
		tampered.signatures[0]!.fingerprint = fingerprint(raw);
		const result = checkRecordText(serialise(tampered));
		expect(result.ok).toBe(false);
		expect(result.ok ? '' : result.reason).toMatch(/the signature does not match the content/);
	});

	it('a swapped public key that keeps the old fingerprint is an integrity failure naming the fingerprint', () => {
		const tampered = copy();
		tampered.signatures[0]!.publicKey = rawPublicKey(generateKeyPair().publicKey).toString('base64');
		const result = checkRecordText(serialise(tampered));
		expect(result).toMatchObject({ok: false, reason: expect.stringContaining('the stated fingerprint does not match the public key')});
	});

	it('a removed signature is reported as unsigned', () => {
		const tampered = copy();
		tampered.signatures = [];
		expect(checkRecordText(serialise(tampered))).toMatchObject({ok: false, reason: 'the record is unsigned'});
		const {signatures: _dropped, ...withoutList} = copy();
		expect(checkRecordText(serialise(withoutList))).toMatchObject({ok: false, reason: 'the record is unsigned'});
	});

	it('a changed embedded rule-file text (a record made before the store) is an integrity failure, even with its SHA-256 updated to match', () => {
		const legacy = structuredClone(record.body);
		legacy.rules.text = rules.text;
		const older = signRecord(legacy, [signerWith('Ada Operator', 'performed')]);
		expect(checkRecordText(serialise(older)).ok).toBe(true);
		const tampered = structuredClone(older);
		tampered.body.rules.text = rules.text.replace('stop', 'advise');
		expect(tampered.body.rules.text).not.toBe(rules.text);
		expect(checkRecordText(serialise(tampered)).ok).toBe(false);
		tampered.body.rules.sha256 = createHash('sha256').update(tampered.body.rules.text).digest('hex');
		expect(checkRecordText(serialise(tampered)).ok).toBe(false);
	});

	it('a signature taken from another record over a different body is an integrity failure', () => {
		const key = generateKeyPair().privateKey;
		const first = sampleRecord({rules, signers: [signerWith('Ada Operator', 'performed', key)], now: new Date('2026-03-01T10:00:00Z')});
		const second = sampleRecord({rules, signers: [signerWith('Ada Operator', 'performed', key)], now: new Date('2026-03-02T10:00:00Z')});
		expect(checkRecordText(serialise(first)).ok).toBe(true);
		expect(checkRecordText(serialise({...first, signatures: second.signatures})).ok).toBe(false);
	});

	it('an added "__proto__" entry in the body\'s inputs is an integrity failure', () => {
		const added = text.replace('\n\t\t"inputs": {\n', '\n\t\t"inputs": {\n\t\t\t"__proto__": "9 A",\n');
		expect(added).not.toBe(text);
		expect(Object.keys((JSON.parse(added) as {body: {inputs: object}}).body.inputs)).toContain('__proto__');
		expect(checkRecordText(added).ok).toBe(false);
	});

	it('a duplicated key in the body (a forged outcome before the signed one) is an integrity failure', () => {
		const duplicated = text.replace('\n\t\t"outcome": "clear_to_energize",', '\n\t\t"outcome": "do_not_energize",\n\t\t"outcome": "clear_to_energize",');
		expect(duplicated).not.toBe(text);
		expect(checkRecordText(duplicated).ok).toBe(false);
	});

	it('keys in another order still verify (the signature covers the canonical form)', () => {
		const reordered = JSON.stringify(reverseKeys(record), null, 2);
		expect(reordered).not.toBe(text.trimEnd());
		expect(reordered.indexOf('"deferral"')).toBeLessThan(reordered.indexOf('"kind"'));
		expect(checkRecordText(reordered)).toMatchObject({ok: true});
	});

	it('other whitespace between tokens still verifies (compact, tabs, CRLF line ends)', () => {
		for (const spaced of [JSON.stringify(record), JSON.stringify(record, null, '\t'), text.replaceAll('\n', '\r\n'), `\n\n${text.replaceAll(/^(\s*"[^"\\]*"): /gm, '$1 :  ')}  `]) {
			expect(spaced).not.toBe(text);
			expect(checkRecordText(spaced).ok).toBe(true);
		}
	});
});

describe('a record with a second signer', () => {
	let cosigned: BenchRecord;

	beforeAll(() => {
		cosigned = sampleRecord({rules, signers: [signerWith('Ada Operator', 'performed'), signerWith('Lin Verifier', 'verified', undefined, 'laser safety officer')]});
	});

	it('verifies both signatures', () => {
		expect(cosigned.signatures.map((signature) => signature.purpose)).toEqual(['operator', 'witness']); // signed as performed and verified, which stand for these purposes
		expect(cosigned.signatures[0]!.publicKey).not.toBe(cosigned.signatures[1]!.publicKey);
		expect(checkRecordText(serialise(cosigned))).toMatchObject({ok: true, signatures: [{index: 0, valid: true}, {index: 1, valid: true}]});
	});

	it('a changed purpose of the second signature is an integrity failure of that signature', () => {
		const tampered = structuredClone(cosigned);
		tampered.signatures[1]!.purpose = 'approval';
		const result = checkRecordText(serialise(tampered));
		expect(result).toMatchObject({ok: false, reason: expect.stringMatching(/^signature 2 \(Lin Verifier\): the signature does not match/)});
		expect(result.ok ? [] : result.signatures?.map((entry) => entry.valid)).toEqual([true, false]);
	});

	it('a changed name, role or time of the second signer is an integrity failure', () => {
		const changes: Array<(record: BenchRecord) => void> = [
			(changed) => (changed.signatures[1]!.signer.name = 'Someone Else'),
			(changed) => (changed.signatures[1]!.signer.role = 'bench operator'),
			(changed) => (changed.signatures[1]!.signedAt = '1999-01-01T00:00:00+00:00'),
		];
		for (const change of changes) {
			const tampered = structuredClone(cosigned);
			change(tampered);
			expect(checkRecordText(serialise(tampered)).ok).toBe(false);
		}
	});

	it('the second signature moved onto the first signer\'s statement is an integrity failure', () => {
		const tampered = structuredClone(cosigned);
		tampered.signatures[0]!.value = cosigned.signatures[1]!.value;
		expect(checkRecordText(serialise(tampered)).ok).toBe(false);
	});
});
