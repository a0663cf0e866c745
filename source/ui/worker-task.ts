import {isMainThread, parentPort, workerData} from 'node:worker_threads';

import {isAuditTask} from './audit-task.js';
import {isJudgeTask} from '../services/audit-judge-task.js';

/**
 * In a worker thread started by the screens (auditInWorker): runs its task and posts the
 * answer; false in the main thread, which runs a command. Kept small: the program's entry
 * imports it, and the audit itself is loaded only in the worker.
 */
export async function runWorkerTask(): Promise<boolean> {
	if (isMainThread) return false;
	if (isJudgeTask(workerData) && parentPort) {
		// A worker of the command-line audit: judges the records it is sent until told to stop.
		const {runJudgeWorker} = await import('../services/audit-parallel.js');
		runJudgeWorker(workerData, parentPort);
		return true;
	}
	if (!isAuditTask(workerData)) return false;
	try {
		const {auditLines} = await import('./audit-worker.js');
		parentPort?.postMessage({lines: auditLines(workerData)});
	} catch (error) {
		parentPort?.postMessage({error: error instanceof Error ? error.message : String(error)});
	}
	return true;
}
