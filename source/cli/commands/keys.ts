import {readFileSync} from 'node:fs';
import {createPublicKey} from 'node:crypto';
import {parseArgs} from 'node:util';
import {nameOperatorKey, operatorKey, ownFingerprint, publicKeyPem, readTrusted, writeTrusted} from '../../records/key-files.js';
import {fingerprint, rawPublicKey, shortFingerprint} from '../../records/key-material.js';
import {cleanKeyName, nameInPem} from '../../records/key-name.js';
import {isoWithOffset} from '../../shared/iso-time.js';
import {describeProblem, problem} from '../../shared/problems.js';
import {openSettings} from '../../services/settings.js';
import {UsageError, valueOrUsageError} from '../usage-error.js';
import {commandHelp, helpOption, parseOptions, type Command, type Io} from '../command.js';
import {findTrusted, trustProblem} from './keys-trust.js';
import {oneLine} from '../../shared/one-line.js';

const options = {
	name: {type: 'string', value: 'NAME', summary: 'Alone: your name, given to your key when it is made (or once, to a key made without one). With trust: the name the colleague\'s key is trusted under (the name in the file when not given)'},
	role: {type: 'string', value: 'ROLE', multiple: true, summary: 'With trust: a role the trust list grants the key (laser safety officer, supervisor...)'},
	from: {type: 'string', value: 'DATE', summary: 'With revoke: the date (YYYY-MM-DD) or time from which the key\'s signatures are findings'},
	'revoked-from': {type: 'string', value: 'DATE', summary: 'With trust: trust the key, revoked from DATE (as keys revoke --from)'},
	help: helpOption,
} as const;

const clean = (text: string) => cleanKeyName(text);

/** A date or a time with its offset, as --from takes it; undefined when it is neither. */
function revocationDate(text: string): string | undefined {
	const given = text.trim();
	if (/^\d{4}-\d{2}-\d{2}$/.test(given) && !Number.isNaN(Date.parse(`${given}T00:00:00Z`))) return given;
	if (/^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}(:\d{2})?(\.\d+)?(Z|[+-]\d{2}:\d{2})$/.test(given) && !Number.isNaN(Date.parse(given))) return given;
	return undefined;
}

/** `prelase keys [export|trust|list|forget|revoke]`: returns the exit status. */
export function runKeys(args: string[], io: Io): number {
	const {values, positionals} = parseArgs({args, options: parseOptions(options), allowPositionals: true, strict: true});
	if (values.help) {
		io.stdout.write(`${commandHelp(keysCommand)}\n`);
		return 0;
	}
	const [action = 'show', ...rest] = positionals;
	const settings = openSettings(io.env);
	if (action !== 'trust' && (values.role !== undefined || values['revoked-from'] !== undefined)) throw new UsageError('--role and --revoked-from go with: prelase keys trust FILE');
	if (action !== 'revoke' && values.from !== undefined) throw new UsageError('--from goes with: prelase keys revoke FINGERPRINT --from DATE');
	if (action !== 'show' && action !== 'trust' && values.name !== undefined) throw new UsageError('--name goes with prelase keys (your key) or prelase keys trust FILE');
	switch (action) {
		case 'show': {
			const given = values.name ?? settings.read().operator;
			const {privateKey, created, path, name} = valueOrUsageError(values.name === undefined ? operatorKey(settings.folder, true, given) : nameOperatorKey(settings.folder, values.name));
			const full = fingerprint(rawPublicKey(privateKey));
			io.stdout.write(`${created ? 'Created your signing key' : 'Your signing key'}: ${path}\nName: ${name === undefined ? '(none)' : name}\nFingerprint: ${shortFingerprint(full)} (${full})\n`);
			if (name === undefined) io.stdout.write(`${describeProblem(problem('key-unnamed', {path}))}\n`);
			return 0;
		}
		case 'export': {
			const {privateKey, name, path} = valueOrUsageError(operatorKey(settings.folder, false));
			if (name === undefined) throw new UsageError(describeProblem(problem('key-unnamed', {path})));
			io.stdout.write(publicKeyPem(privateKey, name));
			return 0;
		}
		case 'trust': {
			const [file] = rest;
			if (!file) throw new UsageError('usage: prelase keys trust FILE [--name NAME] [--role ROLE]... [--revoked-from DATE]');
			let raw: Buffer;
			let text: string;
			try {
				text = readFileSync(file, 'utf8');
				raw = rawPublicKey(createPublicKey(text));
			} catch (error) {
				throw new UsageError(`${file} is not a public key in PEM form (${(error as Error).message})`);
			}
			const name = clean(values.name ?? nameInPem(text) ?? '');
			if (!name) throw new UsageError(`${file} carries no name: give the one you trust it under with --name NAME`);
			const revokedFrom = values['revoked-from'] === undefined ? undefined : revocationDate(values['revoked-from']);
			if (values['revoked-from'] !== undefined && revokedFrom === undefined) throw new UsageError(`--revoked-from takes a date (YYYY-MM-DD) or a time with its offset, not "${values['revoked-from']}"`);
			const print = fingerprint(raw);
			const trusted = readTrusted(settings.folder);
			const refused = trustProblem(print, name, ownFingerprint(settings.folder), trusted);
			if (refused) throw new UsageError(refused);
			const roles = [...new Set((values.role ?? []).map(clean).filter(Boolean))];
			const keys = trusted.filter((key) => key.name !== name && key.fingerprint !== print);
			keys.push({name, publicKey: raw.toString('base64'), fingerprint: print, addedAt: isoWithOffset(new Date()), ...(roles.length > 0 ? {roles} : {}), ...(revokedFrom ? {revokedFrom} : {})});
			writeTrusted(settings.folder, keys);
			const named = nameInPem(text);
			io.stdout.write(
				`Trusting ${name}: ${shortFingerprint(print)}${roles.length > 0 ? `, granted: ${roles.join(', ')}` : ''}${revokedFrom ? `, revoked from ${revokedFrom}` : ''}\n` +
					(named !== undefined && named !== name ? `The key file names its holder "${named}"; signatures that state that name will be findings ("signed as ${named} by the key you trust as ${name}").\n` : '') +
					`Compare this fingerprint with ${name} in person or by phone before relying on it.\n`,
			);
			return 0;
		}
		case 'revoke': {
			const [wanted] = rest;
			if (!wanted || values.from === undefined) throw new UsageError('usage: prelase keys revoke FINGERPRINT --from DATE');
			const from = revocationDate(values.from);
			if (from === undefined) throw new UsageError(`--from takes a date (YYYY-MM-DD) or a time with its offset, not "${values.from}"`);
			const keys = readTrusted(settings.folder);
			const found = findTrusted(keys, wanted);
			if (typeof found === 'string') throw new UsageError(found);
			found.revokedFrom = from;
			writeTrusted(settings.folder, keys);
			io.stdout.write(`Revoked ${oneLine(found.name)} (${shortFingerprint(found.fingerprint)}) from ${from}: the audit reports signatures made with it from then on.\n`);
			return 0;
		}
		case 'list': {
			const own = ownFingerprint(settings.folder);
			io.stdout.write(`Your key: ${own ? shortFingerprint(own) : 'none yet (prelase keys --name NAME creates it)'}\n`);
			const keys = readTrusted(settings.folder);
			if (keys.length === 0) io.stdout.write('No trusted keys.\n');
			for (const key of keys) {
				const roles = key.roles && key.roles.length > 0 ? `  granted: ${key.roles.map((role) => oneLine(role)).join(', ')}` : '';
				io.stdout.write(`Trusted: ${oneLine(key.name)}  ${shortFingerprint(key.fingerprint)}  since ${oneLine(key.addedAt)}${roles}${key.revokedFrom ? `  revoked from ${oneLine(key.revokedFrom)}` : ''}\n`);
			}
			return 0;
		}
		case 'forget': {
			const [name] = rest;
			if (!name) throw new UsageError('usage: prelase keys forget NAME');
			const keys = readTrusted(settings.folder);
			const kept = keys.filter((key) => key.name !== name);
			if (kept.length === keys.length) throw new UsageError(`no trusted key named "${name}" (prelase keys list)`);
			writeTrusted(settings.folder, kept);
			io.stdout.write(`No longer trusting ${name}.\n`);
			return 0;
		}
		default:
			throw new UsageError(`unknown keys action "${action}"; use export, trust, revoke, list or forget (prelase keys --help)`);
	}
}

export const keysCommand: Command = {
	name: 'keys',
	summary: 'Your signing key, and the colleagues\' keys you trust',
	usage: 'prelase keys [--name NAME | export | trust FILE [--name NAME] [--role ROLE]... | revoke FINGERPRINT --from DATE | list | forget NAME]',
	options,
	help: {
		intro: `prelase keys — signing keys

Usage:
  prelase keys [--name NAME]            Show your key (create it on first use, under your name:
                                        --name, else the name in Settings; a key needs a name)
  prelase keys --name NAME              Name a key made by an earlier version without a name (once)
  prelase keys export                   Print your public key with your name (PEM) for colleagues
  prelase keys trust FILE [--name NAME] [--role ROLE]... [--revoked-from DATE]
                                        Trust a colleague's public key under a name (the name in
                                        the file when not given), granting roles
  prelase keys revoke FINGERPRINT --from DATE
                                        Signatures made with that key from DATE are findings
  prelase keys list                     List your key and the keys you trust, with their roles
  prelase keys forget NAME              Stop trusting a colleague's key

Keys live in the settings folder (PRELASE_HOME overrides it), readable only by you; a private
key file that others can read is refused. A signature's name is its key's name: signing under
another name is refused. Roles that carry authority (laser safety officer, supervisor, or the
rule file's signing.authority_roles) count in the audit only when your trust list grants them.
The same key is not trusted under two names, and your own key is not put in the list.`,
		notes: `Exit status:
  0  done
  2  bad usage or a refusal (no name for a new key, a key named differently, a file that is
     not a public key, your own key or a key already trusted under another name, an unknown
     fingerprint, a date that is not a date)
  74 a file could not be written (disk full, file size limit, read-only or denied folder);
     nothing was written and the file there before is unchanged
  70 an internal error (a bug in prelase)`,
	},
	run: runKeys,
};
