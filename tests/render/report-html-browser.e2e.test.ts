import {spawnSync} from 'node:child_process';
import {mkdtempSync, readFileSync, readdirSync, rmSync, writeFileSync} from 'node:fs';
import {tmpdir} from 'node:os';
import {join, resolve} from 'node:path';
import {afterAll, beforeAll, describe, expect, it} from 'vitest';
import {runIn} from '../helpers/run-cli.js';

// The HTML report in a real headless browser (Debian's chromium, which .ci/run installs): printed
// to PDF on Letter and on A4, the page count must be sane and the charts must be laid out (the
// browser tags each drawn chart in the PDF with its accessible name).
const browser = ['chromium', 'chromium-browser'].find((name) => spawnSync('sh', ['-c', `command -v ${name}`]).status === 0);
const required = process.env['PRELASE_REQUIRE_CHROMIUM'] === '1';
if (!browser && !required) console.warn('chromium is not installed: the headless-browser test of the HTML report is skipped (apt-get install chromium; .ci/run installs it and makes this test required)');

let folder: string;
let home: string;

/** Prints a page to PDF with the browser; returns the PDF's bytes as latin1 text. */
function printToPdf(html: string, name: string): string {
	const page = join(folder, `${name}.html`);
	const pdf = join(folder, `${name}.pdf`);
	writeFileSync(page, html);
	const run = spawnSync(browser!, ['--headless', '--no-sandbox', '--disable-gpu', '--no-pdf-header-footer', `--print-to-pdf=${pdf}`, `file://${page}`], {encoding: 'utf8', timeout: 60_000});
	if (run.status !== 0) throw new Error(`${browser} failed (${run.status}): ${run.stderr}`);
	return readFileSync(pdf, 'latin1');
}

function pageCount(pdf: string): number {
	const counts = [...pdf.matchAll(/\/Type\s*\/Pages\b[^>]*?\/Count\s+(\d+)/g)].map((match) => Number(match[1]));
	return Math.max(0, ...counts);
}

async function reportOf(records: string, ...extra: string[]): Promise<string> {
	const signed = await runIn(home, ['check', '--answers', resolve('docs/examples/bench6-chilled-mount-cold-power-fail.yaml'), '--sign', 'Test Person', '--records', records, ...extra]);
	if (!signed.stdout.includes('Record written')) throw new Error(signed.stderr);
	const record = join(records, readdirSync(records).find((file) => file.endsWith('.json'))!);
	const out = join(records, 'report.html');
	const written = await runIn(home, ['report', record, '--format', 'html', '--out', out]);
	if (written.code !== 0) throw new Error(written.stderr);
	return readFileSync(out, 'utf8');
}

describe.runIf(browser !== undefined || required)('the HTML report in a headless browser', () => {
	beforeAll(() => {
		folder = mkdtempSync(join(tmpdir(), 'prelase-browser-'));
		home = join(folder, 'home');
	});
	afterAll(() => rmSync(folder, {recursive: true, force: true}));

	it('is installed where it is required (CI)', () => {
		expect(browser, 'chromium must be installed in CI (.ci/run installs it)').toBeDefined();
	});

	it('prints a record signed with --what-if on Letter and A4 with both charts laid out', async () => {
		const html = await reportOf(join(folder, 'what-if'), '--what-if');
		expect(html).not.toMatch(/<(script|img|link)\b/);
		const letter = printToPdf(html, 'letter');
		const a4 = printToPdf(html.replace('</head>', '<style>@page { size: A4; }</style></head>'), 'a4');
		for (const pdf of [letter, a4]) {
			expect(pdf.startsWith('%PDF-')).toBe(true);
			// The bench 6 record with its flip points: caution, summary, charts, eight steps, signatures; a few pages, not one per line.
			expect(pageCount(pdf)).toBeGreaterThanOrEqual(4);
			expect(pageCount(pdf)).toBeLessThanOrEqual(20); // 14 on Letter when written
			expect(pdf).toContain('/Alt (Margin chart: each check\'s value against its limit, closest to failing first)');
			expect(pdf).toContain('/Alt (Tornado chart: how far each input may move before the verdict flips)');
		}
		expect(Math.abs(pageCount(letter) - pageCount(a4))).toBeLessThanOrEqual(3);
	}, 120_000);

	it('prints a record signed without it with the margin chart only', async () => {
		const pdf = printToPdf(await reportOf(join(folder, 'plain')), 'plain');
		expect(pdf).toContain('/Alt (Margin chart');
		expect(pdf).not.toContain('/Alt (Tornado chart');
	}, 120_000);
});
