import type {TrustedKey} from '../../records/key-files.js';
import {shortFingerprint} from '../../records/key-material.js';
import {oneLine} from '../../shared/one-line.js';

/**
 * Why a key cannot be trusted under a name, or undefined: your own key needs no trust (the
 * audit knows it as yours), and one key under two names would let a record pass for either
 * person.
 */
export function trustProblem(print: string, name: string, own: string | undefined, trusted: readonly TrustedKey[]): string | undefined {
	if (print === own) {
		return `this is your own key (${shortFingerprint(print)}): the audit already knows your signatures as yours, and a trust list entry would let it pass under another name; give the file to colleagues instead`;
	}
	const other = trusted.find((key) => key.fingerprint === print && key.name !== name);
	if (other) return `this key (${shortFingerprint(print)}) is already trusted as "${oneLine(other.name)}"; one key is one person: prelase keys forget "${oneLine(other.name)}" first if the name was wrong`;
	return undefined;
}

/** The trusted key a fingerprint names (in full, or its first 16 hex digits, with or without spaces and `sha256:`), or why there is none. */
export function findTrusted(keys: TrustedKey[], wanted: string): TrustedKey | string {
	const hex = wanted.replace(/^sha256:/, '').replaceAll(/\s/g, '').toLowerCase();
	if (!/^[0-9a-f]{16,64}$/.test(hex)) return `"${wanted}" is not a fingerprint (16 to 64 hex digits, as prelase keys list shows)`;
	const matching = keys.filter((key) => key.fingerprint.replace(/^sha256:/, '').startsWith(hex));
	if (matching.length === 0) return `no trusted key has the fingerprint ${wanted} (prelase keys list)`;
	if (matching.length > 1) return `more than one trusted key starts with ${wanted}; give the whole fingerprint`;
	return matching[0]!;
}
