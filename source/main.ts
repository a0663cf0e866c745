import chalk from 'chalk';
import {main} from './cli/dispatch.js';
import {runWorkerTask} from './ui/worker-task.js';

// Ink's chalk ignores NO_COLOR; turn colour off for every chalk user before anything draws.
if (process.env['NO_COLOR'] !== undefined && process.env['NO_COLOR'] !== '') chalk.level = 0;

process.stdout.on('error', (error: NodeJS.ErrnoException) => {
	// A closed pipe (prelase check … | head) is not an error worth a stack trace.
	if (error.code === 'EPIPE') process.exit(0);
	throw error;
});

// A worker thread of this program (the screens' audit) runs its task instead of a command.
// (No top-level await: the bundle is CommonJS, see scripts/launcher.cjs.)
void runWorkerTask().then(async (isWorker) => {
	if (!isWorker) process.exitCode = await main(process.argv.slice(2), {stdout: process.stdout, stderr: process.stderr, env: process.env, stdin: process.stdin});
});
