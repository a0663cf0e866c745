// The program is bundled as CommonJS (so that its launcher can compile it with V8's code cache,
// see scripts/launcher.cjs), and CommonJS has no top-level await. Two dependencies of the screens
// use it; this esbuild plugin rewrites those few lines at bundle time (and one line of Yoga's
// loader that costs the first frame 50 ms). Each rewrite must match its
// text exactly once, else the build stops: an upgraded dependency is looked at, never guessed at.
import {readFile} from 'node:fs/promises';

const patches = [
	{
		// Yoga's WebAssembly is instantiated asynchronously. Its module now exports an object that is
		// filled once the instance is ready, and the promise of that moment (the screens await it
		// before the first render, source/ui/run.tsx; Ink reads Yoga only inside functions).
		file: /yoga-layout[\\/]dist[\\/]src[\\/]index\.js$/,
		replace: [['const Yoga = wrapAssembly(await loadYoga());', 'const Yoga = {};\nglobalThis.__prelaseYogaReady = loadYoga().then((lib) => { Object.assign(Yoga, wrapAssembly(lib)); });']],
	},
	{
		// Not top-level await, but the same kind of line: Yoga's WebAssembly is embedded as a base64
		// data: URL, and its loader reads it with fetch() when fetch exists, which in Node loads the
		// whole HTTP client (about 50 ms before the first frame). The loader's own base64 decoding is
		// used instead (what it does where fetch does not exist).
		file: /yoga-layout[\\/]dist[\\/]binaries[\\/]yoga-wasm-base64-esm\.js$/,
		replace: [
			['"function"!=typeof fetch?Promise.resolve()', 'true?Promise.resolve()'],
			// And that decoding is a loop over characters in JavaScript: Node's own base64 decoder does it at once.
			['var b=xa(a.slice(37)),c=new Uint8Array(b.length);for(a=0;a<b.length;++a)c[a]=b.charCodeAt(a);var d=c', 'var d=new Uint8Array(Buffer.from(a.slice(37),"base64"))'],
		],
	},
	{
		// Ink loads its developer tools and its own package.json only when DEV=true; the bundle has
		// neither (react-devtools-core is stubbed), so those branches become plain values.
		file: /ink[\\/]build[\\/]reconciler\.js$/,
		replace: [
			["await import('./devtools.js');", "void 0;"],
			['? await loadPackageJson()', '? { name: undefined, version: undefined }'],
		],
	},
];

export const topLevelAwaitPatches = {
	name: 'prelase-top-level-await-patches',
	setup(build) {
		const applied = new Map(patches.map((patch) => [patch, 0]));
		for (const patch of patches) {
			build.onLoad({filter: patch.file}, async ({path}) => {
				let text = await readFile(path, 'utf8');
				for (const [from, to] of patch.replace) {
					const count = text.split(from).length - 1;
					if (count !== 1) throw new Error(`${path}: expected the text ${JSON.stringify(from)} once, found it ${count} times; look at this dependency's upgrade before bundling it as CommonJS`);
					text = text.replace(from, to);
				}
				applied.set(patch, applied.get(patch) + 1);
				return {contents: text, loader: 'js'};
			});
		}
		build.onEnd((result) => {
			if (result.errors.length > 0) return;
			for (const [patch, count] of applied) if (count === 0) result.errors.push({text: `no file matched ${patch.file}: the patch for top-level await in that dependency was not applied`});
		});
	},
};
