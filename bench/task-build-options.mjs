// The esbuild settings of the benchmarks' own in-process tasks (bundled from the sources, run with
// plain node): one ES module for Node 20, with a `require` for the CommonJS dependencies.
import {fileURLToPath} from 'node:url';

export const taskBuildOptions = {
	absWorkingDir: fileURLToPath(new URL('..', import.meta.url)),
	bundle: true,
	platform: 'node',
	format: 'esm',
	target: 'node20',
	banner: {js: "import {createRequire as __cr} from 'node:module'; const require = __cr(import.meta.url);"},
	logLevel: 'warning',
};
