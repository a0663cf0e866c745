import {mkdirSync, mkdtempSync, readFileSync, rmSync, writeFileSync} from 'node:fs';
import {tmpdir} from 'node:os';
import {join, resolve} from 'node:path';
import {afterAll, beforeAll, describe, expect, it} from 'vitest';
import {ownFingerprint} from '../../source/records/key-files.js';
import type {BenchRecord, RecordBody} from '../../source/records/record-schema.js';
import {signRecord} from '../../source/records/sign.js';
import type {CompiledRules} from '../../source/rules/compile/compiled-rules.js';
import {loadRules, shippedRulesPath} from '../../source/rules/load.js';
import {auditBothWays} from '../helpers/audit-both-ways.js';
import {operatorPrivateKey} from '../helpers/operator-key.js';
import {runIn} from '../helpers/run-cli.js';

const clearDemo = resolve('docs/examples/bench3-808nm-clear.yaml');
let folder: string;
let home: string;
let shipped: CompiledRules;
let withSensitivity: BenchRecord;
let plainRecord: BenchRecord;

async function signed(records: string, ...extra: string[]): Promise<{path: string; record: BenchRecord}> {
	const run = await runIn(home, ['check', '--answers', clearDemo, '--sign', 'Test Person', '--role', 'test engineer', '--records', records, ...extra]);
	const path = /Record written: (.+)/.exec(run.stdout)?.[1];
	if (!path) throw new Error(`no record written: ${run.stdout}${run.stderr}`);
	return {path, record: JSON.parse(readFileSync(path, 'utf8')) as BenchRecord};
}

let counter = 0;
function writeRecordFile(record: BenchRecord): string {
	counter += 1;
	const dir = join(folder, `case-${counter}`);
	mkdirSync(dir, {recursive: true});
	const path = join(dir, 'record.json');
	writeFileSync(path, `${JSON.stringify(record, null, 2)}\n`);
	return path;
}

function resigned(change: (body: RecordBody) => void): BenchRecord {
	const body = structuredClone(withSensitivity.body);
	change(body);
	return signRecord(body, [{signer: {name: 'Test Person', role: 'test engineer', meaning: 'performed'}, key: operatorPrivateKey(home)}]);
}

function findingsOf(path: string) {
	return auditBothWays([path], {current: shipped, trust: {own: ownFingerprint(home), trusted: []}}).records[0]!.findings;
}

beforeAll(async () => {
	folder = mkdtempSync(join(tmpdir(), 'prelase-sensitivity-'));
	home = join(folder, 'home');
	const loaded = loadRules(shippedRulesPath());
	if (!loaded.ok) throw new Error('the shipped rules must load');
	shipped = loaded.value;
	withSensitivity = (await signed(join(folder, 'what-if'), '--what-if')).record;
	plainRecord = (await signed(join(folder, 'plain'))).record;
});

afterAll(() => {
	rmSync(folder, {recursive: true, force: true});
});

describe('the sensitivity section of a signed record', () => {
	it('keeps each flip point in SI, and only when signed with --what-if', () => {
		// Bench 3: ambient flip 125 °C − 100 K·6.7 W/10 W = 58 °C = 331.15 K (hand arithmetic, linear derating);
		// the ceiling 2.5 A·(1 − 10 %) = 2.25 A (hand arithmetic).
		const sensitivity = withSensitivity.body.sensitivity!;
		expect(Math.abs(sensitivity['dissipation_within_rating']!['ambient_max']![0]! - 331.15)).toBeLessThan(1e-8);
		expect(Math.abs(sensitivity['limit_below_diode_maximum']!['current_limit']![0]! - 2.25)).toBeLessThan(1e-9);
		expect(plainRecord.body).not.toHaveProperty('sensitivity');
	});

	it('audits clean as written (and a record without the section as before)', () => {
		expect(findingsOf(writeRecordFile(withSensitivity))).toEqual([]);
		expect(findingsOf(writeRecordFile(plainRecord))).toEqual([]);
	});

	it.each([
		['a flip point moved', (body: RecordBody) => (body.sensitivity!['limit_below_diode_maximum']!['current_limit'] = [2.4]), 'limit_below_diode_maximum', 'current_limit', '2.4'],
		['a flip point removed', (body: RecordBody) => delete body.sensitivity!['dissipation_within_rating']!['ambient_max'], 'dissipation_within_rating', 'ambient_max', 'no flip point'],
		['a flip point added', (body: RecordBody) => (body.sensitivity!['limit_within_driver']!['supply_nominal'] = [9]), 'limit_within_driver', 'supply_nominal', '9'],
	])('finds %s (signed again, so only the recomputation can tell)', (_label, change, id, input, recorded) => {
		const findings = findingsOf(writeRecordFile(resigned(change)));
		expect(findings).toEqual([expect.objectContaining({kind: 'consistency', code: 'audit-sensitivity-mismatch', data: expect.objectContaining({id, input, recorded})})]);
	});
});
