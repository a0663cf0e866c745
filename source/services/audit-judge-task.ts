import type {Trust} from '../audit/audit-trust.js';

/** What a judging worker of the audit needs: the current rule file (it loads it itself: compiled rules do not cross threads), the trust list and the audit's time. */
export type JudgeTask = {task: 'prelase-audit-judge'; rulesFile: string; trust: Trust; now: string};

/** Whether a worker thread's data is a judging task of the audit (kept apart, so the program's entry need not load the audit to ask). */
export function isJudgeTask(data: unknown): data is JudgeTask {
	return typeof data === 'object' && data !== null && (data as {task?: unknown}).task === 'prelase-audit-judge';
}

/** Records above which a summarised audit is judged in worker threads by default: starting a worker (loading the program) costs about as much as judging a few hundred records. */
export const parallelAbove = 2000;
