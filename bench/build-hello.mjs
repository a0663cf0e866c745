// Bundles bench/ink-hello.tsx into bench/out/ink-hello.js with the same esbuild settings
// as scripts/build.mjs, so the baseline pays exactly what a bundled prelase would pay.
// Run on its own (node bench/build-hello.mjs) or imported by bench/startup.mjs.
import {build} from 'esbuild';
import {bundleOptions} from '../scripts/bundle-options.mjs';
import {fileURLToPath} from 'node:url';

export const repoRoot = fileURLToPath(new URL('..', import.meta.url));
export const helloOutfile = 'bench/out/ink-hello.js';

/** Builds the bare Ink bundle; paths are relative to the repository root. */
export async function buildHello() {
	await build({
		...bundleOptions,
		absWorkingDir: repoRoot,
		entryPoints: ['bench/ink-hello.tsx'],
		outfile: helloOutfile,
		define: {'process.env.NODE_ENV': '"production"'},
	});
	return helloOutfile;
}

if (process.argv[1] && fileURLToPath(import.meta.url) === process.argv[1]) await buildHello();
