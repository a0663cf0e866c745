// Regenerates docs/calculations.md from the calculation registry.
import {build} from 'esbuild';
import {mkdtempSync, rmSync, writeFileSync} from 'node:fs';
import {tmpdir} from 'node:os';
import {join} from 'node:path';
import {pathToFileURL} from 'node:url';

const folder = mkdtempSync(join(tmpdir(), 'prelase-docs-'));
const outfile = join(folder, 'document.mjs');
try {
	await build({entryPoints: ['source/calculations/document.ts'], outfile, bundle: true, platform: 'node', format: 'esm', logLevel: 'warning'});
	const {calculationsMarkdown} = await import(pathToFileURL(outfile).href);
	writeFileSync('docs/calculations.md', calculationsMarkdown());
	console.log('wrote docs/calculations.md');
} finally {
	rmSync(folder, {recursive: true, force: true});
}
