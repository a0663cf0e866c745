// Bundles prelase into one ESM file started with plain node (start-up time is a feature).
import {build} from 'esbuild';
import {readFileSync} from 'node:fs';

const {version} = JSON.parse(readFileSync(new URL('../package.json', import.meta.url), 'utf8'));

await build({
	entryPoints: ['source/main.ts'],
	outfile: 'dist/prelase.js',
	bundle: true,
	platform: 'node',
	format: 'esm',
	target: 'node20',
	minify: false,
	legalComments: 'none',
	banner: {js: "#!/usr/bin/env node\nimport {createRequire as __cr} from 'node:module'; const require = __cr(import.meta.url);"},
	define: {'process.env.NODE_ENV': '"production"', PRELASE_VERSION: JSON.stringify(version)},
	alias: {'react-devtools-core': './scripts/react-devtools-stub.mjs'},
	logLevel: 'warning',
});
