import {dirname} from 'node:path';
import {parseArgs} from 'node:util';
import {ownFingerprint} from '../../records/key-files.js';
import {signerIdentity} from '../../services/git.js';
import {recordsFolder} from '../../services/records-folder.js';
import {initRecords} from '../../services/records-repository.js';
import {syncRecords} from '../../services/records-sync.js';
import {readSettings, settingsFile} from '../../services/settings.js';
import {UsageError, valueOrUsageError} from '../usage-error.js';
import {commandHelp, helpOption, parseOptions, type Command, type Io} from '../command.js';

const options = {
	records: {type: 'string', value: 'DIR', summary: 'The records folder (default: the recordsFolder setting, else records beside the settings file)'},
	remote: {type: 'string', value: 'URL', summary: 'With init: the site repository every bench pushes to (a path, ssh or https URL)'},
	help: helpOption,
} as const;

/** Exit status of `records sync` when the remote's history was rewritten (nothing taken, nothing pushed). */
export const syncRewritten = 3;
/** Exit status of `records sync` when the remote cannot be reached (the commits stay for the next sync). */
export const syncOffline = 4;
/** Exit status of `records sync` when git refused the rebase or the push (the commits stay). */
export const syncRefused = 5;

const commits = (count: number) => `${count} commit${count === 1 ? '' : 's'}`;

/** `prelase records init|sync`: returns the exit status. */
export function runRecords(args: string[], io: Io): number {
	const {values, positionals} = parseArgs({args, options: parseOptions(options), allowPositionals: true, strict: true});
	if (values.help) {
		io.stdout.write(`${commandHelp(recordsCommand)}\n`);
		return 0;
	}
	const [action, ...rest] = positionals;
	if (rest.length > 0) throw new UsageError(`unexpected ${rest.join(' ')} (prelase records --help)`);
	const folder = recordsFolder(io.env, values.records);
	const settings = readSettings(io.env);
	const identity = signerIdentity(settings.operator ?? 'prelase', ownFingerprint(dirname(settingsFile(io.env))) ?? '');
	switch (action) {
		case 'init': {
			const done = valueOrUsageError(initRecords(folder, values.remote, identity, io.env));
			const said = {
				created: `The records folder ${done.folder} is now a git repository${done.committed > 0 ? `; the ${done.committed} files already in it are its first commit` : ''}.`,
				adopted: `The records folder ${done.folder} already is a git repository; prelase commits to it from now on.`,
				cloned: `The records folder ${done.folder} is a clone of ${done.remote}.`,
			}[done.action];
			const remote = done.remote === null ? 'It has no remote yet: records stay on this bench (prelase records init --remote URL adds one).' : `Remote: ${done.remote}. Share records with: prelase records sync`;
			io.stdout.write(`${said}\nEvery record prelase writes here is committed at once, one commit per record.\n${remote}\n`);
			return 0;
		}
		case 'sync': {
			if (values.remote !== undefined) throw new UsageError('--remote goes with records init; sync uses the remote the repository has');
			const outcome = valueOrUsageError(syncRecords(folder, identity, io.env));
			switch (outcome.state) {
				case 'synced':
					io.stdout.write(`Synced ${folder} with ${outcome.remote}: took ${commits(outcome.pulled)}, pushed ${commits(outcome.pushed)}.\n`);
					if (outcome.uncommitted.length > 0) {
						const many = outcome.uncommitted.length > 1;
						io.stderr.write(`Not shared: ${outcome.uncommitted.length} record file${many ? 's' : ''} in ${folder} ${many ? 'are' : 'is'} in no commit: ${outcome.uncommitted.join(', ')}. Check ${many ? 'them' : 'it'} (prelase audit ${folder}), then commit ${many ? 'them' : 'it'} with git and sync again.\n`);
					}
					return 0;
				case 'offline':
					io.stderr.write(`Offline: cannot reach ${outcome.remote} (${outcome.detail}).\n${commits(outcome.unpushed)} stay here for the next prelase records sync; nothing is lost.\n`);
					return syncOffline;
				case 'rewritten':
					io.stderr.write(
						`REFUSED: the history of ${outcome.remote} was rewritten (a force-push). Commits this folder had from it are gone:\n${outcome.lost.map((lost) => `  ${lost.commit.slice(0, 12)} ${lost.subject}`).join('\n')}\nNothing was taken or pushed. Records may have been removed: tell the laser safety officer, and run prelase audit ${folder} --remote.\n`,
					);
					return syncRewritten;
				case 'refused':
					io.stderr.write(`Not synced: git refused (${outcome.detail}).\n${commits(outcome.unpushed)} stay here; run prelase audit ${folder} to see what changed.\n`);
					return syncRefused;
			}
			break;
		}
		default:
			throw new UsageError(action === undefined ? 'say what to do: prelase records init [--remote URL] or prelase records sync' : `unknown records action "${action}"; use init or sync (prelase records --help)`);
	}
	return 2;
}

export const recordsCommand: Command = {
	name: 'records',
	summary: 'Keep the records folder in a git repository that every bench shares',
	usage: 'prelase records init [--remote URL] [--records DIR] | sync [--records DIR]',
	options,
	help: {
		intro: `prelase records — one store of records for many benches

Usage:
  prelase records init [--remote URL]   Make the records folder a git repository: a new one (the
                                        records already there are its first commit), the clone of
                                        URL when the folder is empty, or the repository it already is
  prelase records sync                  Take the other benches' records from the remote, then push
                                        this bench's

A plain records folder stays the default and works without git. In a repository folder every
record prelase writes is committed at once: one commit per record, its message the setup and the
outcome, its author the signer (name, and the key's fingerprint as <16 hex digits>@prelase.invalid).
Record names are unique, so benches never change the same file. Nothing here ever force-pushes.
prelase audit FOLDER also reads the repository's history; with --remote it compares it with the
remote. The system git does the work: install it where a repository folder is used.`,
		notes: `Exit status:
  0  done (init), or synced (sync; a record file in no commit is named, and is not shared)
  2  bad usage, not a repository, no remote, or git missing
  3  sync refused: the remote's history was rewritten; nothing taken, nothing pushed
  4  sync: the remote cannot be reached (offline); the commits stay for the next sync
  5  sync: git refused the rebase or the push; the commits stay
  74 the records folder could not be made or written (disk full, read-only or denied folder)

Records are evidence for the laser safety officer; they never say a setup is safe. The laser
safety officer and the codes in force (IEC 60825 series, ANSI Z136 series, local law) decide.`,
	},
	run: runRecords,
};
