// Bundles prelase into one ESM file started with plain node (start-up time is a feature).
import {build} from 'esbuild';
import {bundleOptions} from './bundle-options.mjs';
import {createHash} from 'node:crypto';
import {readFileSync} from 'node:fs';
import {isDeepStrictEqual} from 'node:util';
import {parseDocument} from 'yaml';

const {version} = JSON.parse(readFileSync(new URL('../package.json', import.meta.url), 'utf8'));

// The shipped policy, parsed now so the program need not parse its YAML at every start.
// It is used only when rules/default.yaml still has exactly this text (same SHA-256).
const shippedText = readFileSync(new URL('../rules/default.yaml', import.meta.url), 'utf8');
const shippedDocument = parseDocument(shippedText, {uniqueKeys: true, strict: true});
if (shippedDocument.errors.length > 0) throw new Error(`rules/default.yaml: ${shippedDocument.errors[0].message}`);
const shipped = {sha256: createHash('sha256').update(shippedText).digest('hex'), data: shippedDocument.toJS()};

// The shipped policy as the rule-file schema reads it, checked now with the program's own schema,
// so a start with the shipped policy need not build the schema and check it again. Kept only when
// it survives JSON unchanged (no value JSON cannot hold); else the program checks it at start.
const schemaModule = await build({...bundleOptions, banner: {}, entryPoints: ['source/rules/file/schema.ts'], write: false, minifyWhitespace: false});
const {ruleFileSchema} = await import(`data:text/javascript;base64,${Buffer.from(schemaModule.outputFiles[0].text).toString('base64')}`);
const checked = ruleFileSchema.safeParse(structuredClone(shipped.data));
if (!checked.success) throw new Error(`rules/default.yaml does not pass the rule-file schema: ${checked.error.issues[0]?.message}`);
if (isDeepStrictEqual(JSON.parse(JSON.stringify(checked.data)), checked.data)) shipped.validated = checked.data;

await build({
	...bundleOptions,
	entryPoints: ['source/main.ts'],
	outfile: 'dist/prelase.js',
	define: {'process.env.NODE_ENV': '"production"', PRELASE_VERSION: JSON.stringify(version), PRELASE_SHIPPED_RULES: JSON.stringify(JSON.stringify(shipped))},
});

// Node decodes a pure-ASCII file on a fast path (about 20 ms less at every start for this
// bundle). esbuild escapes non-ASCII text in strings, but not in regular expression literals:
// write those characters as \u escapes in the source.
const bundled = readFileSync(new URL('../dist/prelase.js', import.meta.url));
const wide = bundled.findIndex((byte) => byte > 0x7f);
if (wide !== -1) {
	const context = bundled.subarray(Math.max(0, wide - 60), wide + 20).toString('utf8');
	throw new Error(`dist/prelase.js is not pure ASCII at byte ${wide}: …${context}… (write the character as a \\u escape in the source)`);
}
