import {stripControl} from '../shared/text.js';

/**
 * A key's holder's name travels with the key as one line of text before the PEM block:
 * `Name: Alex Newcomer`. RFC 7468 §2 allows text before the encapsulation boundary, and
 * Node's PEM reader (OpenSSL) skips it, so a named key file is still a plain PEM key file.
 */
const nameLine = /^Name: (.+)$/m;

/** The holder's name a PEM key file carries, or undefined for a key made without one. */
export function nameInPem(text: string): string | undefined {
	const head = text.slice(0, Math.max(0, text.indexOf('-----BEGIN')));
	const found = nameLine.exec(head)?.[1];
	const name = found === undefined ? '' : cleanKeyName(found);
	return name === '' ? undefined : name;
}

/** A PEM key text with the holder's name before it (an earlier name line is replaced). */
export function pemWithName(pem: string, name: string): string {
	const start = pem.indexOf('-----BEGIN');
	return `Name: ${cleanKeyName(name)}\n${start >= 0 ? pem.slice(start) : pem}`;
}

/** A name as a key holds it: one line, without control characters, trimmed. */
export function cleanKeyName(name: string): string {
	return stripControl(name).replace(/\s+/g, ' ').trim();
}

/** Whether a stated signer's name is the key's name: compared after trimming and folding runs of blanks, case and all. */
export function sameName(stated: string, keyName: string): boolean {
	return cleanKeyName(stated) === cleanKeyName(keyName);
}
