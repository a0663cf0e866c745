import {existsSync} from 'node:fs';
import {draftPath} from '../services/drafts/draft-store.js';
import {planDraftPath} from '../services/drafts/plan-draft-store.js';

/**
 * The one line printed after the screens close: where the check draft and the plan draft are
 * kept (each written after every change, so nothing typed is lost), or that nothing was pending.
 */
export function exitLine(settingsFolder: string, how: 'Ctrl-C' | 'Quit', planFile?: string): string {
	const kept: string[] = [];
	const check = draftPath(settingsFolder);
	if (existsSync(check)) kept.push(`the check draft is saved in ${check} (the next start offers to resume it)`);
	const plan = planFile === undefined ? undefined : planDraftPath(settingsFolder, planFile);
	if (plan !== undefined && existsSync(plan)) kept.push(`the plan edits not saved to ${planFile} are kept in ${plan} (opening the plan again restores them)`);
	return `prelase: ${how === 'Ctrl-C' ? 'left with Ctrl-C' : 'closed'}; ${kept.length > 0 ? kept.join('; ') : 'nothing was pending'}`;
}
