// The esbuild settings prelase is bundled with; the start-up benchmark's Ink baseline uses the
// same ones, so it pays exactly what a bundled prelase pays.
export const bundleOptions = {
	bundle: true,
	platform: 'node',
	format: 'esm',
	target: 'node20',
	// Whitespace and syntax only: names stay, so a bug report's stack trace still reads.
	minifyWhitespace: true,
	minifySyntax: true,
	legalComments: 'none',
	banner: {js: "#!/usr/bin/env node\nimport {createRequire as __cr} from 'node:module'; const require = __cr(import.meta.url);"},
	alias: {'react-devtools-core': './scripts/react-devtools-stub.mjs'},
	logLevel: 'warning',
};
