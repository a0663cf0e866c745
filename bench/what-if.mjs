// What-if benchmark: the full what-if analysis of a demo setup (every flip point of every judged
// check) against a single evaluation of the same setup, in one process and one run.
// Target: the analysis under 300 ms. Bundles bench/what-if-task.ts into bench/out/ first.
import {build} from 'esbuild';
import {spawnSync} from 'node:child_process';
import {join} from 'node:path';
import {fileURLToPath} from 'node:url';
import {parseArgs} from 'node:util';
import {taskBuildOptions} from './task-build-options.mjs';

const repoRoot = fileURLToPath(new URL('..', import.meta.url));
const TARGET_MS = 300;
const {values} = parseArgs({options: {rounds: {type: 'string', default: '15'}, strict: {type: 'boolean', default: false}}, allowPositionals: false, strict: true});

const outfile = join(repoRoot, 'bench/out/what-if-task.mjs');
await build({...taskBuildOptions, entryPoints: ['bench/what-if-task.ts'], outfile});

let holds = true;
process.stdout.write('What-if analysis against one evaluation (medians, ms; p10–p90)\n');
for (const demo of ['docs/examples/bench3-808nm-clear.yaml', 'docs/examples/bench6-chilled-mount-cold-power-fail.yaml']) {
	const run = spawnSync(process.execPath, [outfile, demo, values.rounds], {cwd: repoRoot, encoding: 'utf8'});
	if (run.status !== 0) {
		process.stderr.write(run.stderr);
		process.exit(1);
	}
	const result = JSON.parse(run.stdout);
	const ratio = result.whatIf.median / result.single.median;
	const ok = result.whatIf.median < TARGET_MS;
	holds &&= ok;
	process.stdout.write(
		`  ${demo}\n` +
			`    one evaluation   ${result.single.median.toFixed(3)} (${result.single.p10.toFixed(3)}–${result.single.p90.toFixed(3)})\n` +
			`    what-if          ${result.whatIf.median.toFixed(1)} (${result.whatIf.p10.toFixed(1)}–${result.whatIf.p90.toFixed(1)}): ${result.checks} checks, ${result.flips} flip points, ${ratio.toFixed(0)}× one evaluation\n` +
			`    target under ${TARGET_MS} ms: ${ok ? 'HOLDS' : 'DOES NOT HOLD'}\n`,
	);
}
if (values.strict && !holds) process.exit(1);
