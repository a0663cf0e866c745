import {mkdtempSync, rmSync, writeFileSync} from 'node:fs';
import {tmpdir} from 'node:os';
import {join} from 'node:path';
import {afterAll, describe, expect, it} from 'vitest';
import {auditRecords} from '../../source/audit/audit.js';
import {setupFingerprint} from '../../source/records/build-body.js';
import {fingerprint, rawPublicKey} from '../../source/records/key-material.js';
import {storeRuleText} from '../../source/records/rule-texts.js';
import {recordBodySchema, type RecordBody} from '../../source/records/record-schema.js';
import {withRuleWords, withValuesShown} from '../../source/records/record-words.js';
import {signRecord} from '../../source/records/sign.js';
import {reportMarkdown} from '../../source/render/report-markdown.js';
import {evaluate} from '../../source/rules/evaluate/evaluate.js';
import {evaluationToJson} from '../../source/rules/evaluate/evaluation-json.js';
import {checkRecordText} from '../../source/records/read-record.js';
import {displayPath} from '../../source/shared/display-path.js';
import {sampleAnswers, sampleRecord, sampleRules, serialise, signerWith} from '../helpers/sample-record.js';
import {recordedCornerText} from '../../source/records/record-corner.js';
import type {CornerJson} from '../../source/rules/evaluate/corner-json.js';

/**
 * Records made before the lean body carried the words of their rule text (titles, explanations,
 * bases, statements, the caution), each input's SI value and unit, each derived value's text, each
 * margin's number and fraction, and the outcome in words. They must still verify, audit clean and
 * print; and a record of today's shape must print the same words from the stored rule text.
 */
const rules = sampleRules();
const answers = sampleAnswers(rules);
const folder = mkdtempSync(join(tmpdir(), 'prelase-record-shapes-'));
afterAll(() => rmSync(folder, {recursive: true, force: true}));
storeRuleText(folder, rules.text);
const operator = signerWith('Ada Operator', 'performed');
const trust = {trusted: [{name: 'Ada Operator', publicKey: rawPublicKey(operator.key).toString('base64'), fingerprint: fingerprint(rawPublicKey(operator.key)), addedAt: '2026-01-01T00:00:00+00:00'}]};

/** A body as prelase built it before the lean body: the evaluation's JSON as it stands, with the record's own fields. */
function fullBody(): RecordBody {
	const {tool, rules: _summary, setup, ...evaluated} = evaluationToJson(rules, answers, evaluate(rules, answers));
	// Fields that came after the lean body with ranges: a range's ends beside an input and a derived value's span are
	// the JSON output's only; a check's corner is kept, in the record's one-line form.
	for (const entry of Object.values(evaluated.inputs)) delete entry.range;
	for (const entry of Object.values(evaluated.derived) as Array<{span?: unknown}>) delete entry.span;
	for (const check of evaluated.checks as Array<{corner?: unknown}>) {
		const line = check.corner ? recordedCornerText(check.corner as CornerJson) : undefined;
		if (line === undefined) delete check.corner;
		else check.corner = line;
	}
	const body = {kind: 'bench-check', tool, createdAt: '2026-11-02T09:00:00+00:00', operator: {name: 'Ada Operator', role: 'bench operator'}, setup: {name: setup, ...setupFingerprint(rules, answers)}, rules: {name: rules.rules.name, file: displayPath(rules.file), sha256: rules.sha256}, ...evaluated, previous: null};
	return recordBodySchema.parse(JSON.parse(JSON.stringify(body)));
}

describe('a record of the shape made before the lean body', () => {
	const record = signRecord(fullBody(), [operator], new Date('2026-11-02T09:00:00Z'));
	const path = join(folder, 'before.json');
	writeFileSync(path, serialise(record));

	it('carries the words itself (the check titles and the caution are in the file)', () => {
		expect(record.body.checks[0]).toMatchObject({id: 'limit_below_diode_maximum', title: "Current limit below the diode's absolute maximum less the margin", severity: 'stop'});
		expect(record.body.caution).toMatch(/laser safety officer/);
	});

	it('verifies and audits with no finding', () => {
		expect(checkRecordText(serialise(record)).ok).toBe(true);
		const report = auditRecords([path], {current: rules, trust});
		expect(report.records[0]!.findings).toEqual([]);
		expect(report.status).toBe('authentic_and_consistent');
	});

	it('prints the same page as a record of today\'s shape with the words put back from the stored rule text', () => {
		const lean = sampleRecord({rules, answers, signers: [operator], now: new Date('2026-11-02T09:00:00Z'), operator: {name: 'Ada Operator', role: 'bench operator'}});
		const statuses = [{index: 0, valid: true}];
		const own = {own: trust.trusted[0]!.fingerprint, trusted: []};
		const before = reportMarkdown({...record, body: withValuesShown(withRuleWords(record.body, rules), rules)}, statuses, own).split('\n');
		const today = reportMarkdown({...lean, body: withValuesShown(withRuleWords(lean.body, rules), rules)}, statuses, own).split('\n');
		// The same setup, time, signer and key: the page is the same, word for word.
		expect(before.filter((line, index) => line !== today[index])).toEqual([]);
		expect(before.length).toBe(today.length);
		expect(before.join('\n')).toContain("Current limit below the diode's absolute maximum less the margin");
	});
});
