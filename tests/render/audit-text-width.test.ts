import {mkdtempSync} from 'node:fs';
import {tmpdir} from 'node:os';
import {join} from 'node:path';
import {expect, it} from 'vitest';
import {runIn} from '../helpers/run-cli.js';

// The command line lays the audit out for 100 columns when its output is not a terminal (cli/commands/audit.ts).
const width = 100;

it('lays the records of an audit out within the width: a block per record when the table would not fit', {timeout: 60_000}, async () => {
	const home = mkdtempSync(join(tmpdir(), 'prelase-audit-width-'));
	const records = join(home, 'a-records-folder-with-a-long-name', 'bench-3');
	for (let index = 0; index < 3; index += 1) {
		const signed = await runIn(home, ['check', '--answers', 'docs/examples/bench3-808nm-clear.yaml', '--sign', 'Dana Whitlow', '--records', records]);
		expect(signed.code, signed.stderr).toBe(0);
	}
	const audit = await runIn(home, ['audit', records]);
	expect(audit.code, audit.stderr).toBe(1);
	// Every line that describes a record side by side (its outcome, integrity and findings) fits the width.
	const rows = audit.stdout.split('\n').filter((line) => /clear to energize/.test(line) && /authentic/.test(line));
	expect(rows).toHaveLength(3);
	for (const row of rows) expect([...row].length).toBeLessThanOrEqual(width);
	expect(audit.stdout).not.toContain('Outcome (recorded)');
	// Each record's file is listed whole (folded only where it is longer than a line).
	expect(audit.stdout.replaceAll(/\n {3}/g, '')).toContain(records);
});
