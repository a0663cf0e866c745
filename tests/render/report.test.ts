import {describe, expect, it} from 'vitest';
import {deferral} from '../../source/shared/deferral.js';
import {buildRecordBody} from '../../source/records/build-body.js';
import {checkRecordText} from '../../source/records/read-record.js';
import {fingerprint, generateKeyPair, rawPublicKey, shortFingerprint} from '../../source/records/key-material.js';
import {confirmationList, type BenchRecord, type RecordBody} from '../../source/records/record-schema.js';
import {htmlText, reportHtml} from '../../source/render/report-html.js';
import {markdownText, reportMarkdown} from '../../source/render/report-markdown.js';
import {previousText, type SignatureStatus, type TrustInfo} from '../../source/render/report-model.js';
import {signRecord} from '../../source/records/sign.js';
import {terminalText} from '../../source/shared/terminal-text.js';
import {withValuesShown, withRuleWords} from '../../source/records/record-words.js';
import {evaluate} from '../../source/rules/evaluate/evaluate.js';
import {loadAnswers} from '../../source/rules/evaluate/load-answers.js';
import {loadRules, shippedRulesPath} from '../../source/rules/load.js';

const loaded = loadRules(shippedRulesPath());
if (!loaded.ok) throw new Error('the shipped rules must load');
const rules = loaded.value;
const operatorKey = generateKeyPair().privateKey;
const operatorFingerprint = fingerprint(rawPublicKey(operatorKey));
const now = new Date('2026-03-04T09:15:00Z');

/** A real body from one of the demo answers files, evaluated under the shipped rules. */
function demoBody(example: string): RecordBody {
	const answers = loadAnswers(`docs/examples/${example}.yaml`, rules);
	if (!answers.ok) throw new Error(`the demo ${example} must load`);
	return buildRecordBody({rules, answers: answers.value, evaluation: evaluate(rules, answers.value), operator: {name: 'Test Person', role: 'test engineer'}, now});
}

/** Signs a body as the operator and reads it back through the integrity check, as the command does. */
function signed(body: RecordBody): {record: BenchRecord; signatures: SignatureStatus[]} {
	const record = signRecord(body, [{signer: {name: 'Test Person', role: 'test engineer', meaning: 'performed'}, key: operatorKey}], now);
	const integrity = checkRecordText(JSON.stringify(record));
	if (!integrity.ok || integrity.record.body.kind !== 'bench-check') throw new Error('test setup: the record must verify as a bench check');
	// The report command reads the rule text stored with the records and puts its words back (titles, statements, caution).
	const read = integrity.record.body;
	return {record: {...integrity.record, body: withValuesShown(withRuleWords({...read, rules: {...read.rules, text: read.rules.text ?? rules.text}}, rules), rules)}, signatures: integrity.signatures};
}

const ownTrust: TrustInfo = {own: operatorFingerprint, trusted: []};
// The failing demo as the second record of its key in its folder: it names the first by the SHA-256 of its bytes.
const previous = {file: '2026-03-04-091000-fenwick-hollow-bench-6-fh-915-3-on-ld-5l-0a1b2c3d.json', sha256: 'ab'.repeat(32)};
const failing = signed({...demoBody('bench6-chilled-mount-cold-power-fail'), previous});

const formats = [
	{name: 'markdown', write: reportMarkdown, escape: (text: string) => markdownText(text)},
	{name: 'html', write: reportHtml, escape: htmlText},
] as const;

describe.each(formats)('$name report of the failing demo', ({write, escape}) => {
	const page = write(failing.record, failing.signatures, ownTrust);
	const body = failing.record.body;

	it.each([
		{name: 'outcome in words', text: 'DO NOT ENERGIZE'},
		{name: 'the failing check', text: 'Optical power at the limit current, coldest case'},
		{name: 'its value', text: '2.62 W'}, // T0 model by hand: 1.05 W/A × (3 A − 0.6 A × exp(−20/110)) = 2.6247 W
		{name: 'its limit', text: '≤ 2.5 W'},
		{name: 'its margin, as a miss', text: 'over by 125 mW'},
		{name: 'its fraction', text: '4.99 %'},
		{name: 'its message', text: 'At the limit and 5 °C the diode would emit about 2.62 W, above its maximum 2.5 W.'},
		{name: 'a passing check with its margin', text: '150 mA'}, // 3.5 A × 0.9 − 3 A
		{name: 'an input as entered', text: '25 degC'},
		{name: 'the same input in SI', text: '298.15 K'},
		{name: 'a choice shown by its label', text: 'Class 4'},
		{name: 'a confirmation note', text: 'No bypass on bench 6.'},
		{name: 'the counts', text: '1 fail · 2 advise · 0 open · 19 pass · 7 skip'},
		{name: 'the rule file name', text: 'prelase bench policy (shipped default)'},
		{name: 'the rule file SHA-256', text: rules.sha256},
		{name: 'the setup fingerprint', text: body.setup.fingerprint},
		{name: 'the operator and role', text: 'Test Person, test engineer'},
		{name: 'the created time', text: body.createdAt},
		{name: 'the step title from the rule file', text: '2. Laser diode ratings'},
		{name: 'the corner a check was judged at', text: 'judged at supply_nominal 5.7 V (low end)'}, // 6 V − 5 % = 5.7 V, the supply's low end, worst for the headroom
		{name: 'the signature verified', text: '✓ verified'},
		{name: 'the signer key', text: shortFingerprint(operatorFingerprint)},
		{name: 'the signer key in full', text: operatorFingerprint},
		{name: 'the own key recognised', text: '✓ your own key'},
		{name: 'the signature purpose', text: 'operator'},
		{name: 'the chain link to the previous record of the key', text: `${previous.file} (SHA-256 of its bytes ${'ab'.repeat(32)})`},
	])('shows $name', ({text}) => {
		expect(page).toContain(escape(text));
	});

	it('shows the caution and the deferral before the summary', () => {
		const summary = page.indexOf('Summary');
		expect(body.caution!).toMatch(/laser safety officer/);
		expect(page.indexOf(escape(body.caution!))).toBeGreaterThan(0);
		expect(page.indexOf(escape(body.caution!))).toBeLessThan(summary);
		expect(page.indexOf(escape(deferral))).toBeLessThan(summary);
	});

	it('puts the failure first in the summary, before the advisory check and before the steps', () => {
		const fail = page.indexOf('Optical power at the limit current, coldest case');
		const advise = page.indexOf('Dissipation with the output shorted');
		expect(fail).toBeGreaterThan(page.indexOf('Summary'));
		expect(fail).toBeLessThan(advise);
		expect(advise).toBeLessThan(page.indexOf('1. Setup and authorisation'));
		// The same check appears again in its step.
		expect(page.indexOf('Optical power at the limit current, coldest case', page.indexOf('2. Laser diode ratings'))).toBeGreaterThan(0);
	});

	it('never calls the setup safe (outside the deferral that says so)', () => {
		expect(page).toMatch(/never says a setup is safe/);
		const rest = page.replaceAll(escape(deferral), '').replaceAll(escape(body.caution!), '');
		expect(rest).not.toMatch(/\bis safe\b|\bsafe to (energize|operate)\b/i);
	});
});

describe.each([
	{name: 'clear demo', example: 'bench3-808nm-clear', outcome: 'CLEAR TO ENERGIZE', summary: /0 fail · 2 advise · 0 open · 22 pass · 5 skip/},
	{name: 'incomplete demo', example: 'bench3-808nm-incomplete', outcome: 'INCOMPLETE', summary: /Inputs not given: (<code>|`)photodiode_responsivity(<\/code>|`), (<code>|`)brownout_trip/},
])('$name', ({example, outcome, summary}) => {
	const {record, signatures} = signed(demoBody(example));
	it.each(formats)('$name: outcome and summary', ({write}) => {
		const page = write(record, signatures, ownTrust);
		expect(page).toContain(outcome);
		expect(page).toMatch(summary);
		expect(page).toContain(record.body.caution!.slice(0, 40));
	});
});

describe('signature status', () => {
	const colleague = {name: 'Dana Example', publicKey: failing.record.signatures[0]!.publicKey, fingerprint: operatorFingerprint, addedAt: '2026-01-01T00:00:00+00:00'};
	const other = {...colleague, name: 'Someone Else', fingerprint: `sha256:${'0'.repeat(64)}`};
	it.each([
		{name: 'own key', trust: {own: operatorFingerprint, trusted: []}, valid: true, expected: ['✓ verified', '✓ your own key', '1, all verified']},
		{name: 'trusted colleague', trust: {trusted: [colleague]}, valid: true, expected: ['✓ verified', '✓ trusted as Dana Example']},
		{name: 'unknown key', trust: {trusted: [other]}, valid: true, expected: ['✓ verified', '! not among your trusted keys']},
		{name: 'signature that fails', trust: {trusted: []}, valid: false, expected: ['✗ NOT VERIFIED: altered', '1 NOT VERIFIED']},
	])('$name', ({trust, valid, expected}) => {
		const statuses = [valid ? {index: 0, valid: true} : {index: 0, valid: false, reason: 'altered'}];
		for (const write of [reportMarkdown, reportHtml]) {
			const page = write(failing.record, statuses, trust);
			for (const text of expected) expect(page).toContain(text);
			if (!valid) expect(page).not.toContain('✓ verified');
		}
	});
});

describe('hostile text from a record', () => {
	const hostileNote = 'ok <script>alert(1)</script>\u001b[2J\u202eevil " onload=\'x\' | cell\nnext line';
	const body = structuredClone(failing.record.body);
	body.confirmations = confirmationList(body).map((entry, index) => (index === 0 ? {...entry, note: hostileNote} : entry));
	body.setup.name = '<img src=x onerror=alert(2)>';
	const {record, signatures} = signed(body);
	// As the page reaches the terminal or the --out file: through the output boundary, which removes control characters.
	const html = terminalText(reportHtml(record, signatures, ownTrust));
	const markdown = terminalText(reportMarkdown(record, signatures, ownTrust));

	it.each([
		{name: 'html', page: html},
		{name: 'markdown', page: markdown},
	])('$name: no markup, no escape sequence, no bidirectional override', ({page}) => {
		expect(page).not.toContain('<script');
		expect(page).not.toContain('<img');
		expect(page).not.toContain('\u001b');
		expect(page).not.toContain('\u202e');
		expect(page).toContain('&lt;script&gt;alert(1)&lt;/script&gt;');
		expect(page).toContain('[2Jevil');
	});

	it('html: quotes are escaped too, so no attribute can be opened', () => {
		expect(html).toContain('&quot; onload=&#39;x&#39;');
		expect(html).toContain('&lt;img src=x onerror=alert(2)&gt;');
		expect(html).not.toMatch(/<[^>]*\son\w+=/i);
	});

	it('markdown: a pipe or a newline in a note cannot break its table row', () => {
		const row = markdown.split('\n').find((line) => line.includes('alert(1)'))!;
		expect(row).toContain('\\| cell<br>next line');
		const cells = row.replaceAll('\\|', '').split('|').length;
		expect(cells).toBe('| Answer | Confirmation | Note |'.split('|').length);
	});
});

describe('html is one self-contained printable file', () => {
	const html = reportHtml(failing.record, failing.signatures, ownTrust);
	it.each([
		{name: 'no scripts', pattern: /<script/i},
		{name: 'no external files', pattern: /\s(src|href)=|@import|url\(/i},
		{name: 'no font files', pattern: /@font-face/i},
	])('$name', ({pattern}) => {
		expect(html).not.toMatch(pattern);
	});

	it.each([
		{name: 'a page rule with margins', text: '@page { margin: 16mm 15mm 17mm 15mm;'},
		{name: 'check rows kept whole', text: 'tbody.check, tbody.signature { break-inside: avoid; }'},
		{name: 'a content policy that forbids scripts', text: `content="default-src 'none'; style-src 'unsafe-inline'"`},
		{name: 'a footer on each page with setup and outcome', text: `content: "prelase record · setup ${shortFingerprint(failing.record.body.setup.fingerprint)} · DO NOT ENERGIZE"`},
		{name: 'verdict classes for the failing row', text: '<tbody class="check verdict-fail"><tr><td class="verdict">✗ FAIL</td>'},
		{name: 'header cells with scope', text: '<th scope="col">Verdict</th>'},
	])('has $name', ({text}) => {
		expect(html).toContain(text);
	});
});

describe('amendments and unreadable rule text', () => {
	it('shows what an amendment corrects and why', () => {
		const body = {...structuredClone(failing.record.body), amends: {record: '2026-03-01-old.json', bodySha256: 'a'.repeat(64), reason: 'supply was 24 V, not 28 V'}};
		const {record, signatures} = signed(body);
		for (const page of [reportMarkdown(record, signatures, ownTrust), reportHtml(record, signatures, ownTrust)]) {
			expect(page).toContain('2026-03-01-old.json');
			expect(page).toContain('a'.repeat(64));
			expect(page).toContain('supply was 24 V, not 28 V');
		}
	});

	it('falls back to step ids when the embedded rule text cannot be read', () => {
		const body = structuredClone(failing.record.body);
		body.rules.text = 'steps: [unclosed';
		const {record, signatures} = signed(body);
		const page = reportMarkdown(record, signatures, ownTrust);
		expect(page).toContain('## 1. driver');
		expect(page).toContain('2.62 W');
		expect(page).not.toContain('Driver dissipation\n');
	});
});

describe('escaping helpers', () => {
	it.each([
		{name: 'html: all five', input: `& < > " '`, html: '&amp; &lt; &gt; &quot; &#39;', markdown: '& &lt; &gt; " \''},
		{name: 'markdown: emphasis, code, links, pipes', input: '*a* `b` [c](d) e|f ~g~', html: '*a* `b` [c](d) e|f ~g~', markdown: '\\*a\\* \\`b\\` \\[c\\](d) e\\|f \\~g\\~'},
		{name: 'markdown: underscores only at word edges', input: 'diode_max _x_', html: 'diode_max _x_', markdown: 'diode_max \\_x\\_'},
		{name: 'markdown: entity-like text', input: '&lt; & amp', html: '&amp;lt; &amp; amp', markdown: '&amp;lt; & amp'},
		{name: 'markdown: newlines become spaces outside cells', input: 'a\n# b', html: 'a\n# b', markdown: 'a # b'},
	])('$name', ({input, html, markdown}) => {
		expect(htmlText(input)).toBe(html);
		expect(markdownText(input)).toBe(markdown);
	});

	it('markdown cells keep line breaks as <br>', () => {
		expect(markdownText('a\r\nb\nc', true)).toBe('a<br>b<br>c');
	});
});

describe('the chain link in words', () => {
	it.each([
		{name: 'a record made before the chain', previous: undefined, text: 'not stated (the record was made before records were chained)'},
		{name: 'the first record of its key', previous: null, text: 'none: the first record of this key in its records folder'},
		{name: 'a later record', previous: {file: 'a.json', sha256: 'cd'.repeat(32)}, text: `a.json (SHA-256 of its bytes ${'cd'.repeat(32)})`},
	])('$name', ({previous: link, text}) => {
		expect(previousText(link)).toBe(text);
	});
});
