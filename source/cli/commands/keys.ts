import {readFileSync} from 'node:fs';
import {createPublicKey} from 'node:crypto';
import {parseArgs} from 'node:util';
import {operatorKey, ownFingerprint, publicKeyPem, readTrusted, writeTrusted} from '../../records/key-files.js';
import {fingerprint, rawPublicKey, shortFingerprint} from '../../records/key-material.js';
import {isoWithOffset} from '../../shared/iso-time.js';
import {openSettings} from '../../services/settings.js';
import {stripControl} from '../../shared/text.js';
import {UsageError, valueOrUsageError} from '../usage-error.js';
import {commandHelp, helpOption, parseOptions, type Command, type Io} from '../command.js';

const options = {
	name: {type: 'string', value: 'NAME', summary: 'With trust: the name the colleague\'s key is trusted under'},
	help: helpOption,
} as const;

/** `prelase keys [export|trust|list|forget]`: returns the exit status. */
export function runKeys(args: string[], io: Io): number {
	const {values, positionals} = parseArgs({args, options: parseOptions(options), allowPositionals: true, strict: true});
	if (values.help) {
		io.stdout.write(`${commandHelp(keysCommand)}\n`);
		return 0;
	}
	const [action = 'show', ...rest] = positionals;
	const settings = openSettings(io.env);
	switch (action) {
		case 'show': {
			const {privateKey, created, path} = valueOrUsageError(operatorKey(settings.folder, true));
			io.stdout.write(`${created ? 'Created your signing key' : 'Your signing key'}: ${path}\nFingerprint: ${shortFingerprint(fingerprint(rawPublicKey(privateKey)))} (${fingerprint(rawPublicKey(privateKey))})\n`);
			return 0;
		}
		case 'export': {
			const {privateKey} = valueOrUsageError(operatorKey(settings.folder, true));
			io.stdout.write(publicKeyPem(privateKey));
			return 0;
		}
		case 'trust': {
			const [file] = rest;
			if (!file || !values.name) throw new UsageError('usage: prelase keys trust FILE --name NAME');
			let raw: Buffer;
			try {
				raw = rawPublicKey(createPublicKey(readFileSync(file)));
			} catch (error) {
				throw new UsageError(`${file} is not a public key in PEM form (${(error as Error).message})`);
			}
			const name = stripControl(values.name).trim();
			const keys = readTrusted(settings.folder).filter((key) => key.name !== name);
			keys.push({name, publicKey: raw.toString('base64'), fingerprint: fingerprint(raw), addedAt: isoWithOffset(new Date())});
			writeTrusted(settings.folder, keys);
			io.stdout.write(`Trusting ${name}: ${shortFingerprint(fingerprint(raw))}\nCompare this fingerprint with ${name} in person or by phone before relying on it.\n`);
			return 0;
		}
		case 'list': {
			const own = ownFingerprint(settings.folder);
			io.stdout.write(`Your key: ${own ? shortFingerprint(own) : 'none yet (prelase keys creates it)'}\n`);
			const keys = readTrusted(settings.folder);
			if (keys.length === 0) io.stdout.write('No trusted keys.\n');
			for (const key of keys) io.stdout.write(`Trusted: ${stripControl(key.name)}  ${shortFingerprint(key.fingerprint)}  since ${key.addedAt}\n`);
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
			throw new UsageError(`unknown keys action "${action}"; use export, trust, list or forget (prelase keys --help)`);
	}
}

export const keysCommand: Command = {
	name: 'keys',
	summary: 'Your signing key, and the colleagues\' keys you trust',
	usage: 'prelase keys [export | trust FILE --name NAME | list | forget NAME]',
	options,
	help: {
		intro: `prelase keys — signing keys

Usage:
  prelase keys                          Show your key's fingerprint (create the key on first use)
  prelase keys export                   Print your public key (PEM) to give to colleagues
  prelase keys trust FILE --name NAME   Trust a colleague's public key (PEM file)
  prelase keys list                     List your key and the keys you trust
  prelase keys forget NAME              Stop trusting a colleague's key

Keys live in the settings folder (PRELASE_HOME overrides it), readable only by you; a private
key file that others can read is refused.`,
	},
	run: runKeys,
};
