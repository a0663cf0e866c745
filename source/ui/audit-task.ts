/** What the screens' audit needs: the records folder, the rule file in force, the settings folder (keys), the width. */
export type AuditTask = {task: 'prelase-audit'; folder: string; rulesFile: string; settingsFolder: string; columns: number};

/** Whether a worker thread's data is an audit task of the screens. */
export function isAuditTask(data: unknown): data is AuditTask {
	return typeof data === 'object' && data !== null && (data as {task?: unknown}).task === 'prelase-audit';
}
