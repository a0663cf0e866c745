// A small program the write-fault test bundles and runs under `ulimit -f`: it saves one of
// the files only the screens write (a bench-check draft, a plan, the settings) with the code
// the screens use, then exits 0, or prints what a command would print for the failure and
// exits with the status the command line would give (74 the machine refused, 70 a bug).
import {join} from 'node:path';
import {machineFailure} from '../../source/shared/machine-failure.js';
import {writePlanFile} from '../../source/interlock/plan/save-plan.js';
import {saveDraft} from '../../source/services/drafts/draft-store.js';
import {openSettings} from '../../source/services/settings.js';

const [kind, folder, sizeText] = process.argv.slice(2);
const size = Number(sizeText);
const filler = 'x'.repeat(size);
try {
	if (kind === 'draft') {
		saveDraft(folder!, {rulesFile: 'rules.yaml', rulesSha256: '0'.repeat(64), setup: filler, entries: {}, confirmations: {}, step: 0, savedAt: '2026-01-01T00:00:00.000Z'});
	} else if (kind === 'plan') {
		writePlanFile(join(folder!, 'plan.yaml'), `# ${filler}\nname: plan of ${size}\n`);
	} else if (kind === 'settings') {
		openSettings({PRELASE_HOME: folder}).write({operator: filler});
	} else throw new Error(`unknown kind ${kind}`);
	process.exitCode = 0;
} catch (error) {
	const message = machineFailure(error);
	process.stderr.write(message === undefined ? `internal error: ${(error as Error).stack}\n` : `prelase: ${message}\n`);
	process.exitCode = message === undefined ? 70 : 74;
}
