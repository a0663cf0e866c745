import {describeProblem, type Problem} from '../shared/problems.js';

/**
 * The line said after a record is written into a records repository: its commit, or why it was
 * not committed. Empty for a plain folder.
 */
export function commitNote(stored: {commit?: string | Problem}): string {
	if (stored.commit === undefined) return '';
	if (typeof stored.commit === 'string') return `Committed to the records repository as ${stored.commit.slice(0, 12)}; share it with: prelase records sync\n`;
	return `NOT committed to the records repository: ${describeProblem(stored.commit)}. The record is written; the audit reports it as not committed until it is.\n`;
}
