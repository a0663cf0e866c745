// Bundles bench/ink-hello.tsx into bench/out/ink-hello.js with the same esbuild settings
// as scripts/build.mjs, so the baseline pays exactly what a bundled prelase would pay.
// Run on its own (node bench/build-hello.mjs) or imported by bench/startup.mjs.
import {build} from 'esbuild';
import {fileURLToPath} from 'node:url';

export const repoRoot = fileURLToPath(new URL('..', import.meta.url));
export const helloOutfile = 'bench/out/ink-hello.js';

/** Builds the bare Ink bundle; paths are relative to the repository root. */
export async function buildHello() {
	await build({
		absWorkingDir: repoRoot,
		entryPoints: ['bench/ink-hello.tsx'],
		outfile: helloOutfile,
		bundle: true,
		platform: 'node',
		format: 'esm',
		target: 'node20',
		minifyWhitespace: true,
		minifySyntax: true,
		legalComments: 'none',
		banner: {js: "#!/usr/bin/env node\nimport {createRequire as __cr} from 'node:module'; const require = __cr(import.meta.url);"},
		define: {'process.env.NODE_ENV': '"production"'},
		alias: {'react-devtools-core': './scripts/react-devtools-stub.mjs'},
		logLevel: 'warning',
	});
	return helloOutfile;
}

if (process.argv[1] && fileURLToPath(import.meta.url) === process.argv[1]) await buildHello();
