import type {RecordBody} from '../records/record-schema.js';
import {sensitivityView} from './report-sensitivity.js';

/**
 * The what-if section of a record's Markdown report (a record signed with --what-if): the closest
 * calls and every flip point in words. `escape` is the page's Markdown escape (the page writer
 * passes its own, so every text goes through one). Empty for a record without the section.
 */
export function sensitivityMarkdown(body: RecordBody, escape: (text: string, inCell?: boolean) => string): string[] {
	const view = sensitivityView(body);
	if (!view) return [];
	const out = ['## What would flip each verdict', '', escape('Each input moved on its own, everything else as recorded, within its allowed range; figures rounded toward the passing side. A flip point is arithmetic on the rule file, not a safe operating limit.'), ''];
	view.closest.forEach((call, index) => out.push(`${index + 1}. ${escape(call.title)}: ${escape(call.words)}`));
	if (view.closest.length > 0) out.push('');
	out.push('| Check | Flip points |', '|---|---|');
	for (const entry of view.flips) out.push(`| ${escape(`${entry.verdict}: ${entry.title}`, true)} (\`${entry.check}\`) | ${entry.words.map((words) => escape(words, true)).join('<br>')} |`);
	out.push('');
	return out;
}
