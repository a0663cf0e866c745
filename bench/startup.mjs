// Start-up benchmark: is the non-interactive check at least as quick to finish as the
// smallest possible Ink program? Runs four commands round-robin (so machine noise lands
// on all of them alike) and compares medians. Expects dist/prelase.js to be built
// already; `npm run bench` does that first.
import {spawnSync} from 'node:child_process';
import {existsSync, readFileSync, statSync} from 'node:fs';
import {dirname, join, relative} from 'node:path';
import {parseArgs} from 'node:util';
import {buildHello, repoRoot} from './build-hello.mjs';

const WARMUP_ROUNDS = 3;
// Targets: the check takes at most 0.7x the bare Ink hello-world and at most 2.5x a bare `node -e 0`.
const TARGET_RATIO = 0.7;
const NODE_TARGET_RATIO = 2.5;
const ANSWERS = 'docs/examples/bench3-808nm-clear.yaml';

const {values} = parseArgs({
	options: {
		rounds: {type: 'string', default: '20'},
		strict: {type: 'boolean', default: false},
		help: {type: 'boolean', short: 'h', default: false},
	},
	allowPositionals: false,
	strict: true,
});
if (values.help) {
	process.stdout.write('usage: node bench/startup.mjs [--rounds N] [--strict]\n  --rounds N  measured rounds after 3 warm-up rounds (default 20)\n  --strict    also exit 1 when the target does not hold\n');
	process.exit(0);
}
const rounds = Number(values.rounds);
if (!Number.isInteger(rounds) || rounds < 1) fail(`--rounds wants a whole number of at least 1, not "${values.rounds}"`);

process.chdir(repoRoot);
if (!existsSync('dist/prelase.js')) fail('dist/prelase.js is missing; run `npm run bench` (it builds first) or `npm run build`');
const helloFile = await buildHello();

/** @typedef {{key: string, label: string, args: string[], mustSucceed: boolean, env?: Record<string, string>, verify?: (stdout: string) => string | undefined}} Subject */
/** @type {Subject[]} */
const subjects = [
	{key: 'a', label: 'node -e 0', args: ['-e', '0'], mustSucceed: true},
	{
		key: 'b',
		label: `node ${helloFile}`,
		args: [helloFile],
		mustSucceed: true,
		verify: (stdout) => (stdout.includes('hello from ink') ? undefined : 'did not print its line'),
	},
	{
		key: 'c',
		label: `node dist/prelase.js check --answers ${ANSWERS} --json`,
		args: ['dist/prelase.js', 'check', '--answers', ANSWERS, '--json'],
		mustSucceed: true,
		// The launcher's code cache in a folder of the bench's own: the warm-up rounds write it, as a user's first run does.
		env: {PRELASE_CODE_CACHE: join(repoRoot, 'bench', 'out', 'code-cache')},
		verify: checkVerdict,
	},
	{
		key: 'd',
		label: `PRELASE_CODE_CACHE=off node dist/prelase.js check --answers ${ANSWERS} --json`,
		args: ['dist/prelase.js', 'check', '--answers', ANSWERS, '--json'],
		mustSucceed: true,
		// Without the code cache: every start compiles the whole program, as the first run after an upgrade does.
		env: {PRELASE_CODE_CACHE: 'off'},
		verify: checkVerdict,
	},
];

function checkVerdict(stdout) {
	try {
		const outcome = JSON.parse(stdout).outcome;
		return outcome === 'clear_to_energize' ? undefined : `outcome is ${JSON.stringify(outcome)}, expected "clear_to_energize"`;
	} catch {
		return 'stdout is not JSON';
	}
}

/** Runs one subject once; returns wall time in ms, or stops the benchmark if the run went wrong. */
function runOnce(subject) {
	const started = process.hrtime.bigint();
	const result = spawnSync(process.execPath, subject.args, {
		cwd: repoRoot,
		stdio: ['ignore', 'pipe', 'pipe'],
		encoding: 'utf8',
		maxBuffer: 64 * 1024 * 1024,
		// NO_COLOR keeps the output identical whatever terminal started the bench.
		env: {...process.env, NO_COLOR: '1', ...subject.env},
	});
	const elapsed = Number(process.hrtime.bigint() - started) / 1e6;
	if (result.error) fail(`(${subject.key}) ${subject.label}: could not start: ${result.error.message}`);
	if (subject.mustSucceed && result.status !== 0) {
		const how = result.status === null ? `was killed by ${result.signal}` : `exited ${result.status}`;
		fail(`(${subject.key}) ${subject.label} ${how}, expected 0\n${result.stderr.trim()}`);
	}
	const problem = subject.verify?.(result.stdout);
	if (problem) fail(`(${subject.key}) ${subject.label}: ${problem}`);
	return elapsed;
}

/** @type {Map<string, number[]>} */
const times = new Map(subjects.map((s) => [s.key, []]));
for (let round = 0; round < WARMUP_ROUNDS + rounds; round++) {
	// Rotate the starting subject each round so none always runs first (or right after another).
	for (let i = 0; i < subjects.length; i++) {
		const subject = subjects[(round + i) % subjects.length];
		const ms = runOnce(subject);
		if (round >= WARMUP_ROUNDS) times.get(subject.key).push(ms);
	}
}

/** Linear-interpolated percentile (0–100) of unsorted samples. */
function percentile(samples, p) {
	const sorted = [...samples].sort((x, y) => x - y);
	const at = ((sorted.length - 1) * p) / 100;
	const low = Math.floor(at);
	const high = Math.ceil(at);
	return sorted[low] + (sorted[high] - sorted[low]) * (at - low);
}

const stats = new Map(
	subjects.map((s) => {
		const samples = times.get(s.key);
		return [s.key, {median: percentile(samples, 50), p10: percentile(samples, 10), p90: percentile(samples, 90)}];
	}),
);

const ms = (n) => n.toFixed(1);
const rows = [
	['', 'command', 'median ms', 'p10 ms', 'p90 ms'],
	...subjects.map((s) => {
		const {median, p10, p90} = stats.get(s.key);
		return [`(${s.key})`, s.label, ms(median), ms(p10), ms(p90)];
	}),
];
const widths = rows[0].map((_, column) => Math.max(...rows.map((row) => row[column].length)));
const numeric = new Set([2, 3, 4]);
const line = (row) => row.map((cell, column) => (numeric.has(column) ? cell.padStart(widths[column]) : cell.padEnd(widths[column]))).join('  ').trimEnd();

const out = [];
out.push(`node ${process.version} on ${process.platform}/${process.arch}; ${WARMUP_ROUNDS} warm-up rounds, ${rounds} measured rounds, round-robin`);
out.push('');
out.push(line(rows[0]));
out.push(line(widths.map((w) => '-'.repeat(w))));
for (const row of rows.slice(1)) out.push(line(row));
out.push('');

const ratioToInk = stats.get('c').median / stats.get('b').median;
const ratioToNode = stats.get('c').median / stats.get('a').median;
out.push(`median(c) / median(b) = ${ratioToInk.toFixed(2)}x  (check vs bare Ink hello-world)`);
out.push(`median(c) / median(a) = ${ratioToNode.toFixed(2)}x  (check vs bare node)`);
out.push(`median(d) / median(c) = ${(stats.get('d').median / stats.get('c').median).toFixed(2)}x  (check without the code cache vs with it; the targets are for (c), an everyday start)`);
out.push(`check path imports ink: ${inkOnCheckPath()}`);
const holdsInk = ratioToInk <= TARGET_RATIO;
const holdsNode = ratioToNode <= NODE_TARGET_RATIO;
const holds = holdsInk && holdsNode;
out.push(
	`target (check takes at most ${TARGET_RATIO.toFixed(1)}x the bare Ink hello-world): ${holdsInk ? 'HOLDS' : 'DOES NOT HOLD'} ` +
		`(${ms(stats.get('c').median)} ms vs ${ms(stats.get('b').median)} ms)`,
	`target (check takes at most ${NODE_TARGET_RATIO.toFixed(1)}x a bare node -e 0): ${holdsNode ? 'HOLDS' : 'DOES NOT HOLD'} ` +
		`(${ms(stats.get('c').median)} ms vs ${ms(stats.get('a').median)} ms)`,
);
process.stdout.write(`${out.join('\n')}\n`);
if (values.strict && !holds) process.exitCode = 1;

/**
 * The bundle is one file, so "the check does not load Ink" means Ink's module
 * initialisation never runs on the check path. esbuild runs every statically imported
 * module at start-up, while `import()` of a bundled module only runs it when called. So
 * walk the static imports from the entry point and from the check command: if none of
 * them reaches an Ink package, the check never initialises Ink. Type-only imports are
 * erased by the compiler and do not count.
 */
function inkOnCheckPath() {
	const roots = ['source/main.ts', 'source/cli/commands/check.ts'];
	const isInk = (specifier) => /^ink(-[\w-]+)?(\/|$)/.test(specifier);
	/** @type {Map<string, string | undefined>} module → the module that first imported it */
	const seen = new Map(roots.map((root) => [root, undefined]));
	const queue = [...roots];
	/** @type {string[]} */
	const lazy = [];
	while (queue.length > 0) {
		const file = queue.shift();
		const {statics, dynamics} = importsOf(readFileSync(file, 'utf8'));
		for (const specifier of dynamics) if (isInk(specifier) || specifier.startsWith('.')) lazy.push(`${file} → ${specifier}`);
		for (const specifier of statics) {
			if (isInk(specifier)) {
				const chain = [specifier, file];
				for (let at = seen.get(file); at !== undefined; at = seen.get(at)) chain.push(at);
				return `yes (${chain.reverse().join(' → ')})`;
			}
			if (!specifier.startsWith('.')) continue;
			const target = resolveSource(file, specifier);
			if (target && !seen.has(target)) {
				seen.set(target, file);
				queue.push(target);
			}
		}
	}
	const lazyNote = lazy.length > 0 ? `; lazy import() left out: ${lazy.join(', ')}` : '';
	return `no (static imports from ${roots.join(' and ')}: ${seen.size} modules${lazyNote})`;
}

/** Static and dynamic import specifiers of one TypeScript module (comments stripped first). */
function importsOf(text) {
	const code = text.replace(/\/\*[\s\S]*?\*\//g, '').replace(/(^|[^:'"`\\])\/\/.*$/gm, '$1');
	const statics = [];
	const dynamics = [];
	// import x from '…', import {a, type B} from '…', export {…} from '…', export * from '…' — possibly over several lines.
	for (const match of code.matchAll(/\b(import|export)\s+(type\s+)?([\w*${},\s]*?)\s*from\s*['"]([^'"]+)['"]/g)) {
		if (match[2] === undefined) statics.push(match[4]);
	}
	for (const match of code.matchAll(/\bimport\s+['"]([^'"]+)['"]/g)) statics.push(match[1]);
	for (const match of code.matchAll(/\bimport\s*\(\s*['"]([^'"]+)['"]\s*\)/g)) dynamics.push(match[1]);
	return {statics, dynamics};
}

/** Maps a relative specifier ('./x.js', '../ui') to the .ts/.tsx file it stands for. */
function resolveSource(from, specifier) {
	const base = join(dirname(from), specifier);
	const stem = base.replace(/\.(m|c)?jsx?$/, '');
	const candidates = [`${stem}.ts`, `${stem}.tsx`, `${stem}.mts`, base, join(base, 'index.ts'), join(base, 'index.tsx')];
	const found = candidates.find((candidate) => statSync(candidate, {throwIfNoEntry: false})?.isFile());
	return found ? relative('.', found) : undefined;
}

function fail(message) {
	process.stderr.write(`bench: ${message}\n`);
	process.exit(1);
}
