import {Worker} from 'node:worker_threads';
import {listRecordFiles} from '../audit/audit-files.js';
import {auditRecords} from '../audit/audit.js';
import {ownFingerprint, readTrusted} from '../records/key-files.js';
import {auditText} from '../render/audit-text.js';
import {loadRules} from '../rules/load.js';
import {plain} from '../shared/paint.js';
import {formatProblem} from '../shared/problems.js';

import type {AuditTask} from './audit-task.js';

/** The audit's text for the screen, as lines (run in the worker). */
export function auditLines(task: AuditTask): string[] {
	const rules = loadRules(task.rulesFile);
	if (!rules.ok) return [`The rule file ${task.rulesFile} has problems:`, ...rules.errors.map(formatProblem)];
	const {files} = listRecordFiles([task.folder]);
	if (files.length === 0) return [`No records in ${task.folder} yet.`];
	const report = auditRecords(files, {current: rules.value, trust: {own: ownFingerprint(task.settingsFolder), trusted: readTrusted(task.settingsFolder)}});
	return auditText(report, plain, task.columns).split('\n');
}

/**
 * Runs the audit of the screens in a worker thread of the same program (`entry`, the bundle),
 * so the screens' thread stays free: a SIGTERM or Ctrl-C is honoured at once (the audit of
 * thousands of records takes seconds of synchronous work), and the worker ends with the process.
 */
export function auditInWorker(task: Omit<AuditTask, 'task'>, entry: string | URL): Promise<string[]> {
	return new Promise((resolve, reject) => {
		const worker = new Worker(entry, {workerData: {task: 'prelase-audit', ...task} satisfies AuditTask, stdout: true, stderr: true});
		worker.once('message', (message: {lines?: string[]; error?: string}) => (message.lines ? resolve(message.lines) : reject(new Error(message.error ?? 'no answer'))));
		worker.once('error', reject);
		worker.once('exit', (code) => reject(new Error(`the audit ended without an answer (status ${code})`)));
	});
}
