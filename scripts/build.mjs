// Bundles prelase into one ESM file started with plain node (start-up time is a feature).
import {build} from 'esbuild';
import {createHash} from 'node:crypto';
import {readFileSync} from 'node:fs';
import {parseDocument} from 'yaml';

const {version} = JSON.parse(readFileSync(new URL('../package.json', import.meta.url), 'utf8'));

// The shipped policy, parsed now so the program need not parse its YAML at every start.
// It is used only when rules/default.yaml still has exactly this text (same SHA-256).
const shippedText = readFileSync(new URL('../rules/default.yaml', import.meta.url), 'utf8');
const shippedDocument = parseDocument(shippedText, {uniqueKeys: true, strict: true});
if (shippedDocument.errors.length > 0) throw new Error(`rules/default.yaml: ${shippedDocument.errors[0].message}`);
const shipped = {sha256: createHash('sha256').update(shippedText).digest('hex'), data: shippedDocument.toJS()};

await build({
	entryPoints: ['source/main.ts'],
	outfile: 'dist/prelase.js',
	bundle: true,
	platform: 'node',
	format: 'esm',
	target: 'node20',
	// Whitespace and syntax only: names stay, so a bug report's stack trace still reads.
	minifyWhitespace: true,
	minifySyntax: true,
	legalComments: 'none',
	banner: {js: "#!/usr/bin/env node\nimport {createRequire as __cr} from 'node:module'; const require = __cr(import.meta.url);"},
	define: {'process.env.NODE_ENV': '"production"', PRELASE_VERSION: JSON.stringify(version), PRELASE_SHIPPED_RULES: JSON.stringify(JSON.stringify(shipped))},
	alias: {'react-devtools-core': './scripts/react-devtools-stub.mjs'},
	logLevel: 'warning',
});
