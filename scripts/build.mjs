// Bundles prelase into one file started with plain node (start-up time is a feature): a small
// launcher and the program, compiled with V8's code cache (scripts/launcher.cjs).
import {build} from 'esbuild';
import {bundleOptions} from './bundle-options.mjs';
import {createHash} from 'node:crypto';
import {mkdirSync, readFileSync, writeFileSync} from 'node:fs';
import {topLevelAwaitPatches} from './top-level-await-patches.mjs';
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

// The program, as CommonJS: V8's code cache (the launcher's) takes only a classic script.
const program = await build({
	...bundleOptions,
	format: 'cjs',
	banner: {},
	entryPoints: ['source/main.ts'],
	write: false,
	outfile: 'dist/prelase.js',
	plugins: [topLevelAwaitPatches],
	define: {'process.env.NODE_ENV': '"production"', 'import.meta.url': '__prelaseUrl', PRELASE_VERSION: JSON.stringify(version), PRELASE_SHIPPED_RULES: JSON.stringify(JSON.stringify(shipped))},
});
const programText = program.outputFiles[0].text;

// Node decodes a pure-ASCII file on a fast path (about 20 ms less at every start for this
// bundle), and the launcher reads the program back as Latin-1. esbuild escapes non-ASCII text in
// strings, but not in regular expression literals: write those characters as \u escapes in the source.
const wide = programText.search(/[^\x00-\x7f]/);
if (wide !== -1) {
	throw new Error(`the program is not pure ASCII at character ${wide}: …${programText.slice(Math.max(0, wide - 60), wide + 20)}… (write the character as a \\u escape in the source)`);
}

// dist/prelase.js: the launcher, then the program in a comment (the launcher reads it back and
// compiles it with the code cache; V8 skips a comment at almost no cost). A "*/" in the program
// would end the comment: it is written "* /" and the launcher takes the space out again.
const starSlash = [];
for (let at = programText.indexOf('*/'); at !== -1; at = programText.indexOf('*/', at + 2)) starSlash.push(at + 1 + starSlash.length);
const launcher = readFileSync(new URL('./launcher.cjs', import.meta.url), 'utf8')
	.replace('__PROGRAM_KEY__', createHash('sha256').update(programText).digest('hex').slice(0, 16))
	.replace('__STAR_SLASH__', starSlash.join(','));
mkdirSync(new URL('../dist/', import.meta.url), {recursive: true});
writeFileSync(new URL('../dist/prelase.js', import.meta.url), `#!/usr/bin/env node\n${launcher}\n/*prelase-program\n${programText.replaceAll('*/', '* /')}\n*/\n`, {mode: 0o755});
// The repository's package.json says "type": "module"; the program in dist/ is CommonJS.
writeFileSync(new URL('../dist/package.json', import.meta.url), '{"type": "commonjs"}\n');
