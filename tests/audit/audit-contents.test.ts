import {describe, expect, it} from 'vitest';
import {conclusionMembers} from '../../source/audit/audit-contents.js';
import {conclusionParts} from '../../source/audit/audit-consistency.js';
import type {RecordBody} from '../../source/records/record-schema.js';
import {sampleRecord, sampleRules} from '../helpers/sample-record.js';

describe('the memo of the audit of a record\'s contents', () => {
	it('keys records by the same body members that the comparison reads', () => {
		const {body} = sampleRecord({rules: sampleRules()});
		const named = conclusionMembers.map((name) => (body as unknown as Record<string, unknown>)[name]);
		expect(named).toEqual(conclusionParts(body as RecordBody));
		// Each of them is a member of a bench-check body (a misspelt name would key every record alike).
		for (const name of conclusionMembers) expect(Object.keys(body)).toContain(name);
	});
});
