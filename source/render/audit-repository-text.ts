import type {AuditReport} from '../audit/audit.js';
import {displayPath} from '../shared/display-path.js';
import type {Paint} from '../shared/paint.js';
import {oneLine} from '../shared/one-line.js';
import {wrap} from '../shared/wrap.js';

const flat = (text: string, max = 400) => oneLine(text, max);

/** What the audit read in a records repository's history, and each finding there, for a person. */
export function repositoryLines(repository: NonNullable<AuditReport['repositories']>[number], paint: Paint, width = 100): string[] {
	const out = [paint.bold(`Records repository ${flat(displayPath(repository.folder), 300)}`)];
	const indent = ' '.repeat(17);
	const row = (term: string, text: string) => {
		const lines = wrap(text, width, indent);
		lines[0] = `  ${term.padEnd(13)}  ${lines[0]!.trimStart()}`;
		return lines;
	};
	out.push(...row('History', `${repository.commits} commit${repository.commits === 1 ? '' : 's'} read${repository.remote === null ? '; not compared with a remote (audit --remote compares it)' : `; compared with ${flat(repository.remote, 200)}`}`));
	if (repository.findings.length === 0) out.push(...row('Findings', `${paint.pass('✓')} no record changed, deleted or left uncommitted${repository.remote === null ? '' : ', and the remote\'s history holds every commit this folder had from it'}`));
	repository.findings.forEach((found, index) => {
		const mark = found.kind === 'integrity' ? paint.fail('✗') : paint.advise('!');
		out.push(...row(index === 0 ? 'Findings' : '', `${mark} [${found.kind}] ${flat(found.text)}`));
	});
	return out;
}
