import {availableParallelism} from 'node:os';
import type {MessagePort} from 'node:worker_threads';
import {Worker} from 'node:worker_threads';
import {AuditRun, judgeForSummary, runContext, type AuditOptions, type AuditReport, type JudgedShort} from '../audit/audit.js';
import {loadRules} from '../rules/load.js';
import {formatProblem} from '../shared/problems.js';
import type {JudgeTask} from './audit-judge-task.js';
export {parallelAbove} from './audit-judge-task.js';


/** The worker threads an audit uses by default: one a core, at most four (each loads the program, about 25 MB). */
export function defaultJobs(): number {
	return Math.max(1, Math.min(4, availableParallelism()));
}

type Ask = {start: number; files: string[]} | {stop: true};
type Answer = {start: number; results: JudgedShort[]} | {error: string};

/** In a worker thread: judges the files the audit's thread sends, in order, and posts each batch's short forms back. */
export function runJudgeWorker(task: JudgeTask, port: MessagePort): void {
	const rules = loadRules(task.rulesFile);
	if (!rules.ok) {
		port.postMessage({error: `the current rule file ${task.rulesFile} has problems: ${rules.errors.map(formatProblem).join('; ')}`} satisfies Answer);
		return;
	}
	const context = runContext({current: rules.value, trust: task.trust, now: new Date(task.now), listing: 'summary'});
	port.on('message', (ask: Ask) => {
		if ('stop' in ask) {
			port.close();
			return;
		}
		try {
			port.postMessage({start: ask.start, results: ask.files.map((file, offset) => judgeForSummary(file, ask.start + offset, context))} satisfies Answer);
		} catch (error) {
			port.postMessage({error: error instanceof Error ? (error.stack ?? error.message) : String(error)} satisfies Answer);
		}
	});
}

/** Batches kept in flight for each worker (so it never waits for the next). */
const inFlight = 2;

/**
 * A summarised audit with the records judged in `jobs` worker threads of the program's own
 * file (`entry`, the bundle): the same report as auditRecords with `listing: 'summary'`. Each
 * worker reads, verifies and judges a batch of files and posts back each record's short form;
 * this thread takes them in the order of the files (the chain and the history are built in
 * that order), then relates them. Memory stays bounded: a batch is sent only when one comes
 * back, so at most `jobs × inFlight` batches wait here.
 */
export function auditInParallel(files: readonly string[], options: Omit<AuditOptions, 'listing'>, rulesFile: string, jobs: number, entry: URL): Promise<AuditReport> {
	const run = new AuditRun(files, {...options, listing: 'summary'});
	// Files sent to a worker at a time: at most 250, and small enough that every worker gets several batches.
	const batch = Math.max(1, Math.min(250, Math.ceil(files.length / (jobs * 8))));
	const task: JudgeTask = {task: 'prelase-audit-judge', rulesFile, trust: {...options.trust, trusted: [...options.trust.trusted]}, now: run.context.now.toISOString()};
	return new Promise((resolve, reject) => {
		const workers = new Map<Worker, Set<number>>();
		const waiting = new Map<number, JudgedShort[]>();
		let here: ReturnType<typeof runContext> | undefined;
		let sent = 0;
		let accepted = 0;
		let settled = false;
		const end = (error?: Error) => {
			if (settled) return;
			settled = true;
			// The records are related only once the workers have ended and their memory is given back: the peak of the run is then this thread's alone.
			void Promise.allSettled([...workers.keys()].map((worker) => worker.terminate())).then(() => {
				if (error) return reject(error);
				try {
					resolve(run.finish());
				} catch (thrown) {
					reject(thrown as Error);
				}
			});
		};
		const drain = () => {
			for (let next = waiting.get(accepted); next !== undefined; next = waiting.get(accepted)) {
				waiting.delete(accepted);
				for (const judged of next) run.accept(judged);
				accepted += next.length;
			}
			if (accepted >= files.length) end();
		};
		/** Judges a batch in this thread: the batches of a worker that ended without answering (out of memory on a huge record, say), and the rest when none is left. */
		const judgeHere = (start: number) => {
			here ??= runContext({...options, listing: 'summary'});
			const context = here;
			waiting.set(start, files.slice(start, start + batch).map((file, offset) => judgeForSummary(file, start + offset, context)));
		};
		const send = (worker: Worker) => {
			if (sent >= files.length) return;
			workers.get(worker)!.add(sent);
			worker.postMessage({start: sent, files: files.slice(sent, sent + batch)} satisfies Ask);
			sent += batch;
		};
		const lost = (worker: Worker) => {
			const batches = workers.get(worker);
			if (settled || !batches) return;
			workers.delete(worker);
			try {
				for (const start of batches) judgeHere(start);
				if (workers.size === 0) for (; sent < files.length; sent += batch) judgeHere(sent);
				drain();
			} catch (error) {
				end(error as Error);
			}
		};
		for (let count = 0; count < Math.min(jobs, Math.ceil(files.length / batch)); count += 1) {
			// Bounded heaps: with the defaults the workers' heaps grew to 435 MB in all at 100,000 records; with these, 288 MB. A worker that runs out (a huge record) is not an error: see lost().
			const worker = new Worker(entry, {workerData: task, resourceLimits: {maxYoungGenerationSizeMb: 8, maxOldGenerationSizeMb: 64}});
			workers.set(worker, new Set());
			worker.on('message', (answer: Answer) => {
				if ('error' in answer) return end(new Error(answer.error));
				workers.get(worker)?.delete(answer.start);
				waiting.set(answer.start, answer.results);
				send(worker);
				drain();
			});
			worker.on('error', () => lost(worker));
			worker.on('exit', () => lost(worker));
			for (let queued = 0; queued < inFlight; queued += 1) send(worker);
		}
	});
}
